package dev.numafit.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.demand.Demand;
import dev.numafit.demand.LabelExpression;
import dev.numafit.demand.NodeRules;
import dev.numafit.demand.NodeTerm;
import dev.numafit.demand.PlacementRules;
import dev.numafit.demand.Taint;
import dev.numafit.demand.Toleration;
import dev.numafit.demand.Workload;
import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.TreeMap;
import java.util.TreeSet;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * No placement the pool planner produces breaks a nodeSelector, a required node-affinity term, a
 * NoSchedule/NoExecute taint or a worker's capacity, and the first-eligible-pool rule holds. The
 * checker here is written apart from {@link dev.numafit.demand.NodeFit}, from the rules of
 * "Assigning Pods to Nodes" and "Taints and Tolerations" (kubernetes.io).
 */
class PoolPlannerProperties {
  static final long MI = 1L << 20;
  static final List<String> KEYS = List.of("a", "b", "c");
  static final List<String> VALUES = List.of("x", "y", "3");
  static final List<Taint> TAINTS =
      List.of(
          new Taint("k1", "v1", Taint.Effect.NO_SCHEDULE),
          new Taint("k2", "", Taint.Effect.NO_EXECUTE),
          new Taint("k3", "v3", Taint.Effect.PREFER_NO_SCHEDULE));
  static final List<Toleration> TOLERATIONS =
      List.of(
          Toleration.EVERYTHING,
          new Toleration("k1", false, "v1", Optional.of(Taint.Effect.NO_SCHEDULE)),
          new Toleration("k1", false, "v2", Optional.empty()),
          new Toleration("k1", true, "", Optional.empty()),
          new Toleration("k2", true, "", Optional.of(Taint.Effect.NO_EXECUTE)),
          new Toleration("k2", true, "", Optional.of(Taint.Effect.NO_SCHEDULE)),
          new Toleration("", false, "", Optional.empty()));

  Arbitrary<TreeMap<String, String>> labelSets() {
    return Combinators.combine(
            Arbitraries.of(KEYS).list().ofMaxSize(3), Arbitraries.of(VALUES).list().ofSize(3))
        .as(
            (ks, vs) -> {
              TreeMap<String, String> m = new TreeMap<>();
              for (int i = 0; i < ks.size(); i++) {
                m.put(ks.get(i), vs.get(i));
              }
              return m;
            });
  }

  Arbitrary<LabelExpression> expressions() {
    return Combinators.combine(
            Arbitraries.of(KEYS),
            Arbitraries.of(LabelExpression.Operator.values()),
            Arbitraries.of(VALUES).list().ofMinSize(1).ofMaxSize(2))
        .as(
            (k, op, vs) ->
                new LabelExpression(
                    k,
                    op,
                    switch (op) {
                      case EXISTS, DOES_NOT_EXIST -> List.of();
                      case GT, LT -> List.of("2");
                      default -> vs;
                    }));
  }

  Arbitrary<PlacementRules> rules() {
    Arbitrary<NodeTerm> term = expressions().list().ofMinSize(1).ofMaxSize(2).map(NodeTerm::new);
    return Combinators.combine(
            labelSets(),
            term.list().ofMaxSize(2),
            Arbitraries.of(TOLERATIONS).list().ofMaxSize(2))
        .as(
            (sel, terms, tols) ->
                new PlacementRules(new TreeSet<>(), List.of(), new TreeMap<>(sel), List.of())
                    .withNode(new NodeRules(terms, tols)));
  }

  @Provide
  Arbitrary<List<Workload>> workloads() {
    Arbitrary<Workload> w =
        Combinators.combine(
                Arbitraries.integers().between(0, 6),
                Arbitraries.longs().between(0, 3000),
                Arbitraries.longs().between(0, 8000),
                Arbitraries.of(false, false, false, true),
                rules())
            .as(
                (replicas, cpu, memMi, daemon, rules) ->
                    PlannerTest.workload(
                            daemon ? "DaemonSet" : "Deployment",
                            "w" + cpu + "-" + memMi + "-" + replicas,
                            replicas,
                            Resources.of("cpu", cpu, "memory", memMi * MI),
                            0,
                            daemon)
                        .withRules(rules));
    return w.list().ofMaxSize(10).uniqueElements(x -> x.id());
  }

  @Provide
  Arbitrary<List<WorkerPool>> pools() {
    Arbitrary<WorkerPool> p =
        Combinators.combine(labelSets(), Arbitraries.of(TAINTS).list().ofMaxSize(2).uniqueElements())
            .as(
                (labels, taints) ->
                    new WorkerPool(
                        "p", labels, taints,
                        new PlanInput(Optional.empty(), PlannerTest.WORKER,
                            PlannerTest.ALLOCATABLE.with("pods", 20L), OptionalInt.of(2),
                            List.of(), Resources.EMPTY, 0, 100, BigDecimal.ONE, true, List.of(),
                            List.of())));
    return p.list().ofMinSize(1).ofMaxSize(3)
        .map(
            list -> {
              List<WorkerPool> named = new ArrayList<>();
              for (int i = 0; i < list.size(); i++) {
                WorkerPool x = list.get(i);
                named.add(new WorkerPool("pool-" + i, x.labels(), x.taints(), x.input()));
              }
              return named;
            });
  }

  /** The well-known labels every pool carries besides its own (docs/pools.md). */
  static Map<String, String> nodeLabels(WorkerPool p) {
    Map<String, String> m = new HashMap<>(p.labels());
    m.putIfAbsent("kubernetes.io/os", "linux");
    return m;
  }

  static boolean holds(LabelExpression x, Map<String, String> labels) {
    String v = labels.get(x.key());
    switch (x.operator()) {
      case IN:
        return v != null && x.values().contains(v);
      case NOT_IN:
        return v == null || !x.values().contains(v);
      case EXISTS:
        return v != null;
      case DOES_NOT_EXIST:
        return v == null;
      default:
        if (v == null || !v.matches("-?[0-9]+")) {
          return false;
        }
        int have = Integer.parseInt(v);
        int want = Integer.parseInt(x.values().get(0));
        return x.operator() == LabelExpression.Operator.GT ? have > want : have < want;
    }
  }

  static boolean tolerated(Taint t, List<Toleration> tols) {
    for (Toleration o : tols) {
      boolean effect = o.effect().isEmpty() || o.effect().get() == t.effect();
      boolean key =
          o.key().isEmpty() ? o.exists() : o.key().equals(t.key()) && (o.exists() || o.value().equals(t.value()));
      if (effect && key) {
        return true;
      }
    }
    return false;
  }

  /** The scheduler's node rules, checked here on their own. */
  static boolean allowed(Workload w, WorkerPool p) {
    Map<String, String> labels = nodeLabels(p);
    for (var e : w.rules().nodeSelector().entrySet()) {
      if (!e.getValue().equals(labels.get(e.getKey()))) {
        return false;
      }
    }
    List<NodeTerm> terms = w.rules().node().required();
    if (!terms.isEmpty()
        && terms.stream().noneMatch(t -> t.expressions().stream().allMatch(x -> holds(x, labels)))) {
      return false;
    }
    for (Taint t : p.taints()) {
      if (t.effect() != Taint.Effect.PREFER_NO_SCHEDULE
          && !tolerated(t, w.rules().node().tolerations())) {
        return false;
      }
    }
    return true;
  }

  @Property(tries = 300)
  void plan_placementsKeepNodeRulesAndCapacity(
      @ForAll("workloads") List<Workload> ws, @ForAll("pools") List<WorkerPool> pools) {
    PoolPlanning planning =
        new PoolPlanner(new Planner())
            .plan(new Demand(ws, List.of(), new TreeMap<>(), List.of()), pools);
    Map<String, Resources> requests = new HashMap<>();
    ws.forEach(w -> requests.put(w.id().toString(), w.pod().requests().with("pods", 1L)));
    List<String> unplaceable = planning.unplaceable().stream().map(Unplaceable::workload).toList();
    for (Workload w : ws) {
      String id = w.id().toString();
      int first = -1;
      for (int i = 0; i < pools.size() && first < 0; i++) {
        if (allowed(w, pools.get(i))) {
          first = i;
        }
      }
      for (int i = 0; i < pools.size(); i++) {
        PoolPlan pp = planning.pools().get(i);
        if (w.perWorker()) {
          assertEquals(allowed(w, pools.get(i)), pp.daemonSets().contains(id), id + " in " + i);
        } else {
          assertEquals(i == first, pp.workloads().contains(id), id + " in pool " + i);
        }
      }
      boolean listed = unplaceable.contains(id);
      assertEquals(first < 0 && (w.perWorker() || w.replicas().peak() > 0), listed, id);
    }
    for (int i = 0; i < pools.size(); i++) {
      PoolPlan pp = planning.pools().get(i);
      Plan p = pp.plan();
      for (WorkerPlacement wp : p.placement().orElseThrow()) {
        Resources load = Resources.EMPTY;
        for (String pod : wp.pods()) {
          String id = pod.substring(0, pod.indexOf('#'));
          assertTrue(pp.workloads().contains(id), pod + " packed outside its pool");
          load = load.plus(requests.get(id));
        }
        assertTrue(load.fitsIn(p.room()), wp.worker() + " " + load + " > " + p.room());
      }
      // DaemonSets counted are exactly those that match: one pod slot each.
      assertEquals(pp.daemonSets().size(), p.perWorkerDemand().get("pods"));
      assertFalse(pp.workloads().stream().anyMatch(unplaceable::contains));
    }
  }
}
