package dev.numafit.report;

import dev.numafit.review.DrainPlan;
import dev.numafit.review.HostFailureCheck;
import dev.numafit.review.NodeFill;
import dev.numafit.review.PendingPod;
import dev.numafit.review.Removal;
import dev.numafit.review.Review;
import dev.numafit.review.SpanningNode;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SortedMap;

/**
 * {@code numafit review -o json}: {@code fits}, {@code pending} [{pod, workload, reason}],
 * {@code spanning}, {@code utilization} {before, after}, {@code scaleDown}, {@code drain},
 * {@code fill} {before, after: [{node, pods, daemonSets, allocatable}]} and the rest, keys sorted (schema in docs/review.md). Integers: cpu in millicores, others in bytes or
 * counts; fractions with 4 decimals.
 */
public final class ReviewJsonWriter implements ReportWriter<Review> {
  private static final String NOT_READ = "not read: ";

  @Override
  public String render(Review r) {
    Map<String, Object> root = JsonSupport.object();
    root.put("schemaVersion", JsonSupport.SCHEMA_VERSION);
    root.put("pool", r.pool());
    root.put("from", r.from().label());
    root.put("hostProfile", r.hostProfile().orElse(null));
    root.put("fits", r.fits());
    Map<String, Object> nodes = JsonSupport.object();
    nodes.put("before", r.nodesBefore());
    nodes.put("after", r.nodesAfter());
    root.put("nodes", nodes);
    root.put("shapeAfter", r.shapeAfter().orElse(null));
    root.put("pending", pending(r.pending()));
    List<Object> spanning = new ArrayList<>();
    for (SpanningNode s : r.spanning()) {
      Map<String, Object> m = JsonSupport.object();
      m.put("node", s.node());
      Map<String, Object> over = JsonSupport.object();
      for (SpanningNode.Excess e : s.over()) {
        Map<String, Object> x = JsonSupport.object();
        x.put("capacity", e.capacity());
        x.put("oneNode", e.oneNode());
        x.put("over", e.over());
        over.put(e.resource(), x);
      }
      m.put("over", over);
      spanning.add(m);
    }
    root.put("spanning", spanning);
    Map<String, Object> util = JsonSupport.object();
    util.put("before", fractions(r.utilizationBefore()));
    util.put("after", fractions(r.utilizationAfter()));
    root.put("utilization", util);
    List<Object> removals = new ArrayList<>();
    for (Removal x : r.removals()) {
      Map<String, Object> m = JsonSupport.object();
      m.put("node", x.node());
      m.put("moves", x.moves());
      m.put("safe", x.safe());
      m.put("unplaced", x.unplaced());
      removals.add(m);
    }
    root.put("scaleDown", removals);
    Map<String, Object> drain = JsonSupport.object();
    drain.put("rounds", r.drain().rounds());
    List<Object> blocked = new ArrayList<>();
    for (DrainPlan.Blocked b : r.drain().blocked()) {
      Map<String, Object> m = JsonSupport.object();
      m.put("pod", b.pod());
      m.put("workload", b.workload());
      m.put("budgets", b.budgets());
      blocked.add(m);
    }
    drain.put("blocked", blocked);
    root.put("drain", drain);
    root.put("nodesNeeded", r.nodesNeeded().isPresent() ? r.nodesNeeded().getAsInt() : null);
    root.put("lowerBound", r.lowerBound().isPresent() ? r.lowerBound().getAsInt() : null);
    root.put("roomPerNode", JsonSupport.resources(r.roomPerNode()));
    root.put("tooLarge", r.tooLarge());
    root.put("podsConsidered", r.podsConsidered());
    if (r.hostFailures().isPresent()) {
      HostFailureCheck h = r.hostFailures().get();
      Map<String, Object> m = JsonSupport.object();
      m.put("failures", h.failures());
      m.put("grouping", h.grouping());
      m.put("hostsLost", h.hostsLost());
      m.put("fits", h.fits());
      m.put("pending", pending(h.pending()));
      root.put("hostFailures", m);
    } else {
      root.put("hostFailures", null);
    }
    Map<String, Object> fill = JsonSupport.object();
    fill.put("before", fill(r.fillBefore()));
    fill.put("after", fill(r.fillAfter()));
    root.put("fill", fill);
    root.put("missing", r.warnings().stream().filter(w -> w.startsWith(NOT_READ))
        .map(w -> w.substring(NOT_READ.length())).toList());
    root.put("warnings", r.warnings());
    return JsonSupport.write(root);
  }

  private static List<Object> pending(List<PendingPod> ps) {
    List<Object> out = new ArrayList<>();
    for (PendingPod p : ps) {
      Map<String, Object> m = JsonSupport.object();
      m.put("pod", p.pod());
      m.put("workload", p.workload());
      m.put("reason", p.reason());
      out.add(m);
    }
    return out;
  }

  private static List<Object> fill(List<NodeFill> nodes) {
    List<Object> out = new ArrayList<>();
    for (NodeFill f : nodes) {
      Map<String, Object> m = JsonSupport.object();
      m.put("node", f.node());
      m.put("pods", JsonSupport.resources(f.pods()));
      m.put("daemonSets", JsonSupport.resources(f.daemonSets()));
      m.put("allocatable", JsonSupport.resources(f.allocatable()));
      out.add(m);
    }
    return out;
  }

  private static Map<String, Object> fractions(SortedMap<String, Double> f) {
    Map<String, Object> m = JsonSupport.object();
    f.forEach((k, v) -> m.put(k, new java.math.BigDecimal(v.toString())
        .setScale(4, java.math.RoundingMode.HALF_UP)));
    return m;
  }
}
