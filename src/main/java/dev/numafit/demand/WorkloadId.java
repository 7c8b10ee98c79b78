package dev.numafit.demand;

import java.util.Objects;

/** A workload's identity: printed {@code namespace/Kind/name}, the key used everywhere. */
public record WorkloadId(String namespace, String kind, String name)
    implements Comparable<WorkloadId> {
  public WorkloadId {
    Objects.requireNonNull(namespace, "namespace");
    Objects.requireNonNull(kind, "kind");
    Objects.requireNonNull(name, "name");
  }

  @Override
  public String toString() {
    return namespace + "/" + kind + "/" + name;
  }

  @Override
  public int compareTo(WorkloadId o) {
    return toString().compareTo(o.toString());
  }
}
