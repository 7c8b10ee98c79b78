package dev.numafit.fit;

import dev.numafit.demand.WorkloadId;
import dev.numafit.plan.Oversize;
import dev.numafit.resource.Resources;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import java.util.SortedMap;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * Finds the pods that do not fit a one-node worker, and for each the smallest spanning worker that
 * would hold it.
 *
 * <p>A pod fits when, for every checked resource, its request is at most the room (the scheduler's
 * rule, FACTS A7: equality fits), and the whole CPUs it pins under the static CPU manager are at
 * most {@code floor(room cpu / 1000)}. A pod also takes one of the worker's {@code pods}. Only
 * resources with a capacity are checked: a resource the room does not name at all (no capacity
 * given, e.g. ephemeral-storage without a figure, or hugepages the profile does not pre-allocate)
 * is collected as unchecked instead of making every pod that requests it oversize.
 */
public final class OversizeCheck {
  /** Label used when not even the largest spanning worker holds the pod. */
  public static final String NONE = "none";

  private OversizeCheck() {}

  /**
   * One pod to check.
   *
   * @param requests effective pod requests without the {@code pods} count
   * @param exclusiveCpus whole CPUs the pod pins (0 when none)
   */
  public record PodRequest(WorkloadId workload, Resources requests, long exclusiveCpus) {
    public PodRequest {
      Objects.requireNonNull(workload, "workload");
      Objects.requireNonNull(requests, "requests");
      if (exclusiveCpus < 0) {
        throw new IllegalArgumentException("exclusiveCpus must be >= 0");
      }
    }
  }

  /**
   * What the check found.
   *
   * @param oversize pods that do not fit, sorted by workload
   * @param unchecked resources requested that have no capacity, sorted
   * @param exclusiveCpus workloads whose pods pin whole CPUs, with the count, sorted
   */
  public record Result(
      List<Oversize> oversize,
      SortedSet<String> unchecked,
      SortedMap<WorkloadId, Long> exclusiveCpus) {
    public Result {
      oversize = List.copyOf(oversize);
      unchecked = Collections.unmodifiableSortedSet(new TreeSet<>(unchecked));
      exclusiveCpus = Collections.unmodifiableSortedMap(new TreeMap<>(exclusiveCpus));
    }
  }

  /**
   * Checks each pod against the one-node room.
   *
   * @param pods one entry per workload
   * @param checked the resources that have a capacity (their names); others are unchecked
   * @param room per checked resource, what one worker has left for a pod ({@code pods} included);
   *     a checked resource absent from {@code room} has room 0
   * @param spanning spanning workers' rooms, smallest first; same meaning of {@code checked}
   */
  public static Result check(
      List<PodRequest> pods,
      SortedSet<String> checked,
      Resources room,
      List<Option> spanning) {
    List<Oversize> oversize = new ArrayList<>();
    SortedSet<String> unchecked = new TreeSet<>();
    SortedMap<WorkloadId, Long> exclusive = new TreeMap<>();
    for (PodRequest pod : pods) {
      for (String r : pod.requests().names()) {
        if (!checked.contains(r)) {
          unchecked.add(r);
        }
      }
      if (pod.exclusiveCpus() > 0) {
        exclusive.put(pod.workload(), pod.exclusiveCpus());
      }
      Resources over = exceeds(pod, checked, room);
      if (over.isEmpty()) {
        continue;
      }
      String smallest = NONE;
      for (Option s : spanning) {
        if (exceeds(pod, checked, s.room()).isEmpty()) {
          smallest = s.label();
          break;
        }
      }
      oversize.add(new Oversize(pod.workload(), over, smallest));
    }
    oversize.sort(Comparator.comparing(Oversize::workload));
    return new Result(oversize, unchecked, exclusive);
  }

  /**
   * A spanning option's room for one pod: the spanning worker's allocatable less DaemonSets and
   * per-worker demand.
   *
   * @param label {@code 2-nodes}, {@code socket} or {@code host}
   */
  public record Option(String label, Resources room) {
    public Option {
      Objects.requireNonNull(label, "label");
      Objects.requireNonNull(room, "room");
    }
  }

  /** Per checked resource, how far the pod's request (plus one pod) is over the room. */
  static Resources exceeds(PodRequest pod, SortedSet<String> checked, Resources room) {
    TreeMap<String, Long> over = new TreeMap<>();
    Resources demand = pod.requests().with(Resources.PODS, 1L);
    for (String r : checked) {
      long excess = demand.get(r) - Math.max(0, room.get(r));
      if (r.equals(Resources.CPU) && pod.exclusiveCpus() > 0) {
        // The static CPU manager hands out whole CPUs only: a pod pinning more CPUs than the
        // room's whole CPUs cannot start even if its millicores would fit.
        long wholeCpus = Math.max(0, room.get(r)) / 1000;
        excess = Math.max(excess, (pod.exclusiveCpus() - wholeCpus) * 1000);
      }
      if (excess > 0) {
        over.put(r, excess);
      }
    }
    return Resources.of(over);
  }
}
