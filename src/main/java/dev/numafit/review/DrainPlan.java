package dev.numafit.review;

import java.util.List;

/**
 * Evictions of the removed nodes' pods in rounds under the PodDisruptionBudgets: each round
 * evicts every pod whose budgets still allow a disruption; its pods are assumed running again on
 * their new node before the next round starts.
 *
 * @param rounds pod ids evicted in each round, in order
 * @param blocked pods no round can evict without breaking a budget, each with the budgets that
 *     block it
 */
public record DrainPlan(List<List<String>> rounds, List<Blocked> blocked) {
  /** A pod no round can evict. */
  public record Blocked(String pod, String workload, List<String> budgets) {
    public Blocked {
      budgets = List.copyOf(budgets);
    }
  }

  /** No node is removed. */
  public static final DrainPlan NONE = new DrainPlan(List.of(), List.of());

  public DrainPlan {
    rounds = rounds.stream().map(List::copyOf).toList();
    blocked = List.copyOf(blocked);
  }
}
