package dev.numafit.review;

import java.util.List;

/**
 * Headroom after losing whole hosts: the hosts carrying the most requested CPU are taken away and
 * their pods placed on the rest.
 *
 * @param hostsLost the lost hosts, each named by its host label value or by its nodes
 * @param pending pods that would then find no node
 */
public record HostFailureCheck(int failures, String grouping, List<String> hostsLost,
    List<PendingPod> pending) {
  public HostFailureCheck {
    hostsLost = List.copyOf(hostsLost);
    pending = List.copyOf(pending);
  }

  public boolean fits() {
    return pending.isEmpty();
  }
}
