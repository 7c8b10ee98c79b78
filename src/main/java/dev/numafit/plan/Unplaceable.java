package dev.numafit.plan;

import java.util.Objects;

/**
 * A workload whose node rules no pool satisfies: its pods are not packed.
 *
 * @param workload the workload's printed id
 * @param daemonSet true for a DaemonSet (it then runs on no worker)
 * @param reason which nodeSelector entry, affinity term or taint keeps it off each pool
 */
public record Unplaceable(String workload, boolean daemonSet, String reason)
    implements Comparable<Unplaceable> {
  public Unplaceable {
    Objects.requireNonNull(workload, "workload");
    Objects.requireNonNull(reason, "reason");
  }

  @Override
  public int compareTo(Unplaceable o) {
    return workload.compareTo(o.workload);
  }
}
