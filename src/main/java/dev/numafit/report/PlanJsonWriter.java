package dev.numafit.report;

import dev.numafit.plan.Oversize;
import dev.numafit.plan.Plan;
import dev.numafit.plan.PlanComparison;
import dev.numafit.plan.PoolPlan;
import dev.numafit.plan.Unplaceable;
import dev.numafit.plan.WorkerPlacement;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SortedMap;

/**
 * {@code plan -o json}: {@code schemaVersion}, {@code plans}, {@code comparison}, {@code
 * warnings}, and {@code pools} (with a pools file) and {@code unplaceable} (when not empty); schema in docs/schema/plan.schema.json. Integers are millicores for cpu and bytes or
 * counts for everything else; utilization is a fraction with 4 decimals.
 */
public final class PlanJsonWriter implements ReportWriter<PlanReport> {
  @Override
  public String render(PlanReport report) {
    Map<String, Object> root = JsonSupport.object();
    root.put("schemaVersion", JsonSupport.SCHEMA_VERSION);
    List<Object> plans = new ArrayList<>();
    for (Plan p : report.plans()) {
      plans.add(plan(p));
    }
    root.put("plans", plans);
    if (report.comparison().isEmpty()) {
      root.put("comparison", null);
    } else {
      List<Object> rows = new ArrayList<>();
      for (PlanComparison.Row r : report.comparison().get().rows()) {
        rows.add(row(r));
      }
      root.put("comparison", rows);
    }
    root.put("warnings", JsonSupport.diagnostics(report.warnings()));
    if (!report.pools().isEmpty()) {
      List<Object> pools = new ArrayList<>();
      for (PoolPlan pp : report.pools()) {
        Map<String, Object> pm = JsonSupport.object();
        pm.put("name", pp.name());
        Map<String, Object> labels = JsonSupport.object();
        pp.labels().forEach(labels::put);
        pm.put("labels", labels);
        pm.put("taints", pp.taints().stream().map(Object::toString).toList());
        pm.put("workloads", pp.workloads());
        pm.put("daemonSets", pp.daemonSets());
        pools.add(pm);
      }
      root.put("pools", pools);
    }
    if (!report.unplaceable().isEmpty()) {
      List<Object> list = new ArrayList<>();
      for (Unplaceable u : report.unplaceable()) {
        Map<String, Object> um = JsonSupport.object();
        um.put("workload", u.workload());
        um.put("daemonSet", u.daemonSet());
        um.put("reason", u.reason());
        list.add(um);
      }
      root.put("unplaceable", list);
    }
    return JsonSupport.write(root);
  }

  private static Map<String, Object> plan(Plan p) {
    Map<String, Object> m = JsonSupport.object();
    m.put("hostProfile", p.hostProfile().orElse(null));
    Map<String, Object> worker = JsonSupport.object();
    worker.put("kind", p.worker().kind().label());
    worker.put("vcpus", p.worker().vcpus());
    worker.put("memoryBytes", p.worker().memoryBytes());
    worker.put("nodesSpanned", p.worker().nodesSpanned());
    worker.put("capacity", JsonSupport.resources(p.worker().capacity()));
    worker.put("allocatable", JsonSupport.resources(p.allocatable()));
    m.put("worker", worker);
    m.put("perWorkerDemand", JsonSupport.resources(p.perWorkerDemand()));
    m.put("room", JsonSupport.resources(p.room()));
    m.put("workersPerHost", p.workersPerHost().isPresent() ? p.workersPerHost().getAsInt() : null);
    m.put("workersNeeded", p.workersNeeded());
    m.put("lowerBound", p.lowerBound());
    p.exact().ifPresent(
        e -> {
          Map<String, Object> x = JsonSupport.object();
          x.put("provedOptimal", e.provedOptimal());
          x.put("nodes", e.nodes());
          x.put("lowerBound", e.lowerBound());
          m.put("exact", x);
        });
    m.put("hostsNeeded", p.hostsNeeded().isPresent() ? p.hostsNeeded().getAsInt() : null);
    if (p.hostsNeededWithoutFailures().isPresent()) {
      m.put("hostsNeededWithoutFailures", p.hostsNeededWithoutFailures().getAsInt());
    }
    List<Object> over = new ArrayList<>();
    for (Oversize o : p.oversize()) {
      Map<String, Object> om = JsonSupport.object();
      om.put("workload", o.workload().toString());
      om.put("exceeds", JsonSupport.resources(o.exceeds()));
      om.put("smallestShape", o.smallestShape());
      over.add(om);
    }
    m.put("oversize", over);
    m.put("utilization", fractions(p.utilization()));
    m.put("bindingResource", p.bindingResource());
    m.put("unchecked", p.unchecked());
    m.put("notes", p.notes());
    if (p.placement().isPresent()) {
      List<Object> placed = new ArrayList<>();
      for (WorkerPlacement w : p.placement().get()) {
        Map<String, Object> wm = JsonSupport.object();
        wm.put("worker", w.worker());
        wm.put("pods", w.pods());
        placed.add(wm);
      }
      m.put("placement", placed);
    }
    return m;
  }

  private static Map<String, Object> row(PlanComparison.Row r) {
    Map<String, Object> m = JsonSupport.object();
    m.put("hostProfile", r.hostProfile().orElse(null));
    m.put("vcpus", r.vcpus());
    m.put("memoryBytes", r.memoryBytes());
    m.put("workersPerHost", r.workersPerHost().isPresent() ? r.workersPerHost().getAsInt() : null);
    m.put("workersNeeded", r.workersNeeded());
    m.put("hostsNeeded", r.hostsNeeded().isPresent() ? r.hostsNeeded().getAsInt() : null);
    m.put("oversizeCount", r.oversizeCount());
    m.put("utilization", fractions(r.utilization()));
    m.put("relativeCost", r.relativeCost().orElse(null));
    m.put("totalCost", r.relativeCostTotal().orElse(null));
    return m;
  }

  /** Fractions rounded half up to 4 decimals, as the schema promises. */
  static Map<String, Object> fractions(SortedMap<String, Double> u) {
    Map<String, Object> m = JsonSupport.object();
    u.forEach(
        (k, v) -> m.put(k, BigDecimal.valueOf(v).setScale(4, RoundingMode.HALF_UP)));
    return m;
  }
}
