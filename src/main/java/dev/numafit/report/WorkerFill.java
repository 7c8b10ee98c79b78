package dev.numafit.report;

import dev.numafit.demand.Demand;
import dev.numafit.demand.Workload;
import dev.numafit.plan.Plan;
import dev.numafit.plan.WorkerPlacement;
import dev.numafit.resource.Resources;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * How full one worker of a plan is: the pods packed onto it and what every worker carries anyway
 * (DaemonSet pods and {@code --per-worker} demand), against the kubelet's allocatable. Amounts in
 * millicores for cpu, bytes for memory, a count for {@code pods}.
 *
 * @param worker the worker's name in the plan's placement
 * @param packed the summed requests of the pods packed onto this worker, {@code pods} = their count
 * @param everyWorker DaemonSets and per-worker demand, the same on every worker
 * @param allocatable the kubelet's allocatable of the worker
 */
public record WorkerFill(
    String worker, Resources packed, Resources everyWorker, Resources allocatable) {
  /** The resources the fill charts show, in this order. */
  public static final List<String> SHOWN = List.of(Resources.CPU, Resources.MEMORY, Resources.PODS);

  /** Workers above this count are shown as a histogram of fill instead of one bar each. */
  public static final int HISTOGRAM_ABOVE = 40;

  public WorkerFill {
    Objects.requireNonNull(worker, "worker");
    Objects.requireNonNull(packed, "packed");
    Objects.requireNonNull(everyWorker, "everyWorker");
    Objects.requireNonNull(allocatable, "allocatable");
  }

  /** Requested on this worker in all: packed pods plus what every worker carries. */
  public long used(String resource) {
    return Math.addExact(packed.get(resource), everyWorker.get(resource));
  }

  /** {@link #used} as a fraction of allocatable; 0 when allocatable is 0. */
  public double fraction(String resource) {
    long a = allocatable.get(resource);
    return a <= 0 ? 0 : (double) used(resource) / a;
  }

  /**
   * One entry per worker of the plan's placement, in placement order; empty when the plan has no
   * placement. Pod ids name their workload ({@code namespace/Kind/name#index}), whose per-pod
   * requests come from {@code demand}.
   */
  public static List<WorkerFill> of(Demand demand, Plan plan) {
    if (plan.placement().isEmpty()) {
      return List.of();
    }
    Map<String, Resources> perPod = new HashMap<>();
    for (Workload w : demand.workloads()) {
      perPod.put(w.id().toString(), w.pod().requests().with(Resources.PODS, 1L));
    }
    List<WorkerFill> out = new ArrayList<>();
    for (WorkerPlacement wp : plan.placement().get()) {
      Resources sum = Resources.EMPTY;
      for (String pod : wp.pods()) {
        int hash = pod.lastIndexOf('#');
        Resources r = perPod.get(hash < 0 ? pod : pod.substring(0, hash));
        if (r == null) {
          throw new IllegalArgumentException("placement names a pod of no known workload: " + pod);
        }
        sum = sum.plus(r);
      }
      out.add(new WorkerFill(wp.worker(), sum, plan.perWorkerDemand(), plan.allocatable()));
    }
    return out;
  }

  /**
   * Workers counted by fill of {@code resource} in ten buckets of 10 percentage points (the last
   * one also holds exactly 100%): bucket {@code i} holds fills in {@code [i×10%, (i+1)×10%)}.
   */
  public static int[] histogram(List<WorkerFill> fills, String resource) {
    int[] buckets = new int[10];
    for (WorkerFill f : fills) {
      long a = f.allocatable().get(resource);
      // Integer arithmetic so a fill of exactly 30% falls in the 30–40% bucket, not below.
      int b = a <= 0 ? 0 : (int) Math.min(9, Math.max(0, f.used(resource) * 10 / a));
      buckets[b]++;
    }
    return buckets;
  }
}
