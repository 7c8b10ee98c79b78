package dev.numafit.report;

import dev.numafit.plan.Plan;
import dev.numafit.plan.PoolPlan;
import java.util.List;

/**
 * Workers and hosts of all pools together. Pools never share a host (each pool's hosts are
 * counted for that pool alone), so the totals are plain sums; the host total is known only when
 * every pool counts hosts (a pool sized from a worker without a host profile counts workers only).
 *
 * @param workers workers over all pools
 * @param hosts hosts over all pools, or -1 when some pool counts no hosts
 */
record PoolTotals(long workers, long hosts) {

  static PoolTotals of(List<PoolPlan> pools) {
    long workers = 0;
    long hosts = 0;
    for (PoolPlan pp : pools) {
      Plan p = pp.plan();
      workers += p.workersNeeded();
      if (hosts >= 0 && p.hostsNeeded().isPresent()) {
        hosts += p.hostsNeeded().getAsInt();
      } else {
        hosts = -1;
      }
    }
    return new PoolTotals(workers, hosts);
  }

  /** One sentence for the text and Markdown reports. */
  String sentence() {
    return "All pools: " + workers + (workers == 1 ? " worker" : " workers")
        + (hosts >= 0
            ? " on " + hosts + (hosts == 1 ? " host" : " hosts") + " (pools do not share hosts)."
            : "; hosts are not counted for every pool.");
  }
}
