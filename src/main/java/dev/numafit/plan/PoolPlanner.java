package dev.numafit.plan;

import dev.numafit.demand.Demand;
import dev.numafit.demand.NodeFit;
import dev.numafit.demand.Workload;
import dev.numafit.pack.Progress;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.TreeMap;

/**
 * Splits a demand over worker pools by the scheduler's node rules and sizes each pool with
 * {@link Planner}.
 *
 * <p>The rules:
 *
 * <ol>
 *   <li>A workload's pods go to the first pool, in the order given, whose workers satisfy its
 *       nodeSelector and required node affinity and whose {@code NoSchedule} and {@code NoExecute}
 *       taints it tolerates ({@link NodeFit}). The real scheduler may spread a workload over every
 *       pool it is allowed on; putting it all in one pool is a choice of this plan.
 *   <li>A DaemonSet runs one pod on every worker of every pool it matches, and costs nothing in the
 *       pools it does not match.
 *   <li>A workload (or DaemonSet) no pool takes is listed as unplaceable with the reason for each
 *       pool, and its pods are not packed anywhere. A workload that runs no pods is not listed.
 *   <li>Each pool is then planned on its own, as a plan without pools is: shape, packing under the
 *       placement rules, DaemonSets and failure headroom.
 * </ol>
 *
 * <p>Requirements on labels whose value a plan does not fix (hostname, zone, host, architecture)
 * and PreferNoSchedule taints are noted in the pool's plan.
 */
public final class PoolPlanner {
  private final Planner planner;

  /** A pool planner that sizes each pool with {@code planner}. */
  public PoolPlanner(Planner planner) {
    this.planner = Objects.requireNonNull(planner, "planner");
  }

  /** Places the demand's workloads in the pools and plans each pool. */
  public PoolPlanning plan(Demand demand, List<WorkerPool> pools) {
    return plan(demand, pools, Progress.NONE);
  }

  /** {@link #plan(Demand, List)} telling {@code progress} how each pool's planning goes. */
  public PoolPlanning plan(Demand demand, List<WorkerPool> pools, Progress progress) {
    if (pools.isEmpty()) {
      throw new IllegalArgumentException("at least one pool is needed");
    }
    TreeMap<String, Workload> byId = new TreeMap<>();
    for (Workload w : demand.workloads()) {
      byId.put(w.id().toString(), w);
    }
    List<List<Workload>> members = new ArrayList<>();
    List<List<String>> placed = new ArrayList<>();
    List<List<String>> daemons = new ArrayList<>();
    List<List<String>> notes = new ArrayList<>();
    for (int p = 0; p < pools.size(); p++) {
      members.add(new ArrayList<>());
      placed.add(new ArrayList<>());
      daemons.add(new ArrayList<>());
      notes.add(new ArrayList<>());
    }
    List<Unplaceable> unplaceable = new ArrayList<>();
    for (Workload w : byId.values()) {
      String id = w.id().toString();
      List<String> refusals = new ArrayList<>();
      boolean anywhere = false;
      for (int p = 0; p < pools.size(); p++) {
        WorkerPool pool = pools.get(p);
        NodeFit fit = NodeFit.of(w.rules(), pool.nodeLabels(), pool.taints());
        if (!fit.fits()) {
          refusals.add(pools.size() == 1 ? fit.refusal().get()
              : "pool " + pool.name() + ": " + fit.refusal().get());
          continue;
        }
        anywhere = true;
        members.get(p).add(w);
        for (String a : fit.assumed()) {
          notes.get(p).add(id + ": " + a);
        }
        if (w.perWorker()) {
          daemons.get(p).add(id);
        } else {
          placed.get(p).add(id);
          break;
        }
      }
      if (!anywhere && (w.perWorker() || w.replicas().peak() > 0)) {
        unplaceable.add(new Unplaceable(id, w.perWorker(), String.join("; ", refusals)));
      }
    }
    List<PoolPlan> plans = new ArrayList<>();
    for (int p = 0; p < pools.size(); p++) {
      WorkerPool pool = pools.get(p);
      Demand part =
          new Demand(
              members.get(p), demand.unsizedCustom(), demand.skippedByKind(), demand.diagnostics());
      PlanInput in = pool.input();
      if (!notes.get(p).isEmpty()) {
        List<String> all = new ArrayList<>(in.notes());
        all.addAll(notes.get(p));
        in = withNotes(in, all);
      }
      plans.add(
          new PoolPlan(
              pool.name(),
              pool.labels(),
              pool.taints(),
              planner.plan(part, in, progress),
              placed.get(p),
              daemons.get(p)));
    }
    return new PoolPlanning(plans, unplaceable);
  }

  private static PlanInput withNotes(PlanInput in, List<String> notes) {
    return new PlanInput(
        in.hostProfile(),
        in.worker(),
        in.allocatable(),
        in.workersPerHost(),
        in.spanning(),
        in.perWorkerExtra(),
        in.hostFailures(),
        in.maxUtilizationPct(),
        in.growth(),
        in.placement(),
        notes,
        in.warnings(),
        in.placementOptions());
  }
}
