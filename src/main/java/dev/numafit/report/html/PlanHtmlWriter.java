package dev.numafit.report.html;

import static dev.numafit.report.html.Html.esc;
import static dev.numafit.report.html.Html.figure;
import static dev.numafit.report.html.Html.pointer;

import dev.numafit.demand.Workload;
import dev.numafit.diag.Diagnostic;
import dev.numafit.host.HostFacts;
import dev.numafit.host.HostProfile;
import dev.numafit.host.NodeFacts;
import dev.numafit.host.NumaNode;
import dev.numafit.plan.Oversize;
import dev.numafit.plan.Plan;
import dev.numafit.plan.PlanComparison;
import dev.numafit.plan.PoolPlan;
import dev.numafit.plan.Unplaceable;
import dev.numafit.report.Caution;
import dev.numafit.report.DemandTotals;
import dev.numafit.report.PlanHost;
import dev.numafit.report.PlanReport;
import dev.numafit.report.ReportWriter;
import dev.numafit.report.TopologyWords;
import dev.numafit.report.Units;
import dev.numafit.report.WorkerFill;
import dev.numafit.resource.Resources;
import dev.numafit.shape.ShapeDeriver;
import dev.numafit.shape.WorkerShape;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * {@code plan -o html}: one self-contained HTML page (no scripts, no external styles, fonts or
 * images, so it opens from a file:// URL and prints to PDF) with inline SVG pictures drawn here —
 * each host's topology with its worker VMs, worker fill, the comparison of host profiles, oversize
 * pods against the one-node worker — and a table beside every picture with the same numbers.
 *
 * <p>Every figure that the JSON report also has sits in a cell marked {@code data-json} (the JSON
 * pointer into {@code plan -o json}) and {@code data-value} (the JSON value), so a test can hold
 * the page to the JSON. Every string from input is escaped.
 */
public final class PlanHtmlWriter implements ReportWriter<PlanReport> {
  @Override
  public String render(PlanReport report) {
    StringBuilder sb = new StringBuilder();
    sb.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
        .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
        .append("<title>")
        .append(esc(title(report)))
        .append("</title>\n<style>\n")
        .append(Style.CSS)
        .append("</style>\n</head>\n<body>\n<main>\n");
    sb.append("<h1>").append(esc(title(report))).append("</h1>\n");
    sb.append("<p class=\"caution\" role=\"note\"><strong>")
        .append(esc(Caution.TEXT))
        .append("</strong></p>\n");
    contents(sb, report);
    demand(sb, report);
    if (report.comparison().isPresent()) {
      comparison(sb, report.comparison().get());
    }
    if (!report.pools().isEmpty()) {
      pools(sb, report);
    }
    if (!report.unplaceable().isEmpty()) {
      unplaceable(sb, report);
    }
    for (int i = 0; i < report.plans().size(); i++) {
      plan(sb, report, i);
    }
    warnings(sb, report.warnings());
    sb.append("<footer><p>").append(esc(Caution.TEXT)).append("</p></footer>\n");
    sb.append("</main>\n</body>\n</html>\n");
    return sb.toString();
  }

  private static String title(PlanReport report) {
    return "Sizing plan: " + report.plans().size()
        + (report.plans().size() == 1 ? " plan" : " plans");
  }

  private static String planTitle(PlanReport report, Plan p) {
    java.util.Optional<PoolPlan> pool = report.poolOf(p);
    if (pool.isPresent()) {
      return "Pool " + pool.get().name()
          + p.hostProfile().map(n -> " on host profile " + n).orElse(" of the given worker");
    }
    return p.hostProfile().map(n -> "Plan for host profile " + n).orElse("Plan for the given worker");
  }

  /** The pools side by side: shape, workers, hosts, labels, taints, workloads, DaemonSets. */
  private static void pools(StringBuilder sb, PlanReport report) {
    sb.append("<section id=\"pools\">\n<h2>Worker pools</h2>\n<p>Each workload is placed in the"
        + " first pool it may run on; the scheduler may spread it over every such pool.</p>\n");
    sb.append("<table>\n<caption>Pools</caption>\n<thead><tr><th scope=\"col\">Pool</th>"
        + "<th scope=\"col\">vCPU</th><th scope=\"col\">Memory</th>"
        + "<th scope=\"col\">Workers</th><th scope=\"col\">Hosts</th>"
        + "<th scope=\"col\">Labels</th><th scope=\"col\">Taints</th>"
        + "<th scope=\"col\">Workloads</th><th scope=\"col\">DaemonSets</th></tr></thead>\n"
        + "<tbody>\n");
    for (int i = 0; i < report.pools().size(); i++) {
      PoolPlan pp = report.pools().get(i);
      Plan p = pp.plan();
      List<String> labels = new ArrayList<>();
      pp.labels().forEach((key, v) -> labels.add(key + "=" + v));
      sb.append("<tr><th scope=\"row\">").append(esc(pp.name())).append("</th>")
          // Plain cells: the plan's own section holds these figures with their JSON pointers.
          .append("<td class=\"num\">").append(p.worker().vcpus()).append("</td>")
          .append("<td class=\"num\">").append(esc(Units.bytes(p.worker().memoryBytes())))
          .append("</td><td class=\"num\">").append(p.workersNeeded()).append("</td>")
          .append("<td class=\"num\">")
          .append(p.hostsNeeded().isPresent() ? "" + p.hostsNeeded().getAsInt() : "–")
          .append("</td>")
          .append("<td>").append(esc(listOrNone(labels))).append("</td>")
          .append("<td>").append(esc(listOrNone(pp.taints().stream().map(Object::toString)
              .toList()))).append("</td>")
          .append("<td>").append(esc(listOrNone(pp.workloads()))).append("</td>")
          .append("<td>").append(esc(listOrNone(pp.daemonSets()))).append("</td></tr>\n");
    }
    sb.append("</tbody>\n</table>\n</section>\n");
  }

  /** Workloads whose node rules no pool satisfies. */
  private static void unplaceable(StringBuilder sb, PlanReport report) {
    sb.append("<section id=\"unplaceable\">\n<h2>Unplaceable workloads</h2>\n<p>Node rules no"
        + " pool satisfies; their pods are not packed.</p>\n<table>\n<thead><tr>"
        + "<th scope=\"col\">Workload</th><th scope=\"col\">Kind</th>"
        + "<th scope=\"col\">Reason</th></tr></thead>\n<tbody>\n");
    for (Unplaceable u : report.unplaceable()) {
      sb.append("<tr><th scope=\"row\">").append(esc(u.workload())).append("</th><td>")
          .append(u.daemonSet() ? "DaemonSet (runs on no worker)" : "workload")
          .append("</td><td>").append(esc(u.reason())).append("</td></tr>\n");
    }
    sb.append("</tbody>\n</table>\n</section>\n");
  }

  private static String listOrNone(List<String> items) {
    return items.isEmpty() ? "none" : String.join(", ", items);
  }

  private static void contents(StringBuilder sb, PlanReport report) {
    sb.append("<nav aria-label=\"Contents\"><ul>\n<li><a href=\"#demand\">Demand</a></li>\n");
    if (report.comparison().isPresent()) {
      sb.append("<li><a href=\"#comparison\">Host profiles compared</a></li>\n");
    }
    if (!report.pools().isEmpty()) {
      sb.append("<li><a href=\"#pools\">Worker pools</a></li>\n");
    }
    if (!report.unplaceable().isEmpty()) {
      sb.append("<li><a href=\"#unplaceable\">Unplaceable workloads</a></li>\n");
    }
    for (int i = 0; i < report.plans().size(); i++) {
      sb.append("<li><a href=\"#plan-").append(i).append("\">")
          .append(esc(planTitle(report, report.plans().get(i)))).append("</a></li>\n");
    }
    sb.append("<li><a href=\"#warnings\">Warnings and notes</a></li>\n</ul></nav>\n");
  }

  private static void demand(StringBuilder sb, PlanReport report) {
    DemandTotals t = DemandTotals.of(report.demand());
    sb.append("<section id=\"demand\">\n<h2>Demand</h2>\n<table class=\"kv\">\n");
    sb.append("<tr><th scope=\"row\">Workloads</th><td class=\"num\">")
        .append(report.demand().workloads().size()).append("</td></tr>\n");
    sb.append("<tr><th scope=\"row\">Pods at peak</th><td class=\"num\">")
        .append(t.podsAtPeak()).append("</td></tr>\n");
    for (var e : t.requestsAtPeak().asMap().entrySet()) {
      sb.append("<tr><th scope=\"row\">Requests at peak: ").append(esc(e.getKey()))
          .append("</th><td class=\"num\">").append(esc(Units.amount(e.getKey(), e.getValue())))
          .append("</td></tr>\n");
    }
    if (t.perWorkerPods() > 0) {
      sb.append("<tr><th scope=\"row\">DaemonSet pods on every worker</th><td class=\"num\">")
          .append(t.perWorkerPods()).append("</td></tr>\n");
    }
    sb.append("</table>\n");
    if (!report.demand().unsizedCustom().isEmpty()) {
      sb.append("<p>Not sized: ").append(report.demand().unsizedCustom().size())
          .append(" custom workload(s) (see <code>numafit demand</code>; --include-custom sizes")
          .append(" them as a guess).</p>\n");
    }
    if (!report.demand().skippedByKind().isEmpty()) {
      sb.append("<p>Skipped objects that run no pods: ");
      List<String> parts = new ArrayList<>();
      report.demand().skippedByKind().forEach((k, v) -> parts.add(esc(k) + " " + v));
      sb.append(String.join(", ", parts)).append(".</p>\n");
    }
    sb.append("<h3>Workloads</h3>\n<details><summary>Every workload (").append(report.demand().workloads().size())
        .append(")</summary>\n<table>\n<thead><tr><th scope=\"col\">Workload</th>")
        .append("<th scope=\"col\">Source</th><th scope=\"col\">Pods at peak</th>")
        .append("<th scope=\"col\">Requests per pod</th></tr></thead>\n<tbody>\n");
    for (Workload w : report.demand().workloads()) {
      sb.append("<tr><td>").append(esc(w.id().toString())).append("</td><td>")
          .append(esc(w.source().toString())).append("</td><td class=\"num\">")
          .append(w.perWorker() ? "1 per worker" : Long.toString(w.replicas().peak()))
          .append("</td><td>").append(esc(Units.vector(w.pod().requests()))).append("</td></tr>\n");
    }
    sb.append("</tbody></table></details>\n</section>\n");
  }

  private static void comparison(StringBuilder sb, PlanComparison c) {
    List<String> names = new ArrayList<>();
    List<Double> hosts = new ArrayList<>();
    List<String> hostsShown = new ArrayList<>();
    List<Double> workers = new ArrayList<>();
    List<String> workersShown = new ArrayList<>();
    List<Double> cost = new ArrayList<>();
    List<String> costShown = new ArrayList<>();
    SortedSet<String> resources = new TreeSet<>();
    for (PlanComparison.Row r : c.rows()) {
      names.add(r.hostProfile().orElse("(--worker)"));
      hosts.add((double) (r.hostsNeeded().isPresent() ? r.hostsNeeded().getAsInt() : 0));
      hostsShown.add(r.hostsNeeded().isPresent() ? "" + r.hostsNeeded().getAsInt() : "–");
      workers.add((double) r.workersNeeded());
      workersShown.add(Integer.toString(r.workersNeeded()));
      cost.add(r.relativeCostTotal().map(BigDecimal::doubleValue).orElse(0.0));
      costShown.add(r.relativeCostTotal().map(BigDecimal::toPlainString).orElse("not given"));
      resources.addAll(r.utilization().keySet());
    }
    List<Charts.Panel> panels = new ArrayList<>();
    panels.add(new Charts.Panel("Hosts needed", hosts, hostsShown));
    panels.add(new Charts.Panel("Workers needed", workers, workersShown));
    for (String res : List.of(Resources.CPU, Resources.MEMORY)) {
      if (!resources.contains(res)) {
        continue;
      }
      List<Double> u = new ArrayList<>();
      List<String> us = new ArrayList<>();
      for (PlanComparison.Row r : c.rows()) {
        Double v = r.utilization().get(res);
        u.add(v == null ? 0 : v);
        us.add(v == null ? "–" : Units.percent(v));
      }
      panels.add(new Charts.Panel("Utilization: " + res, u, us));
    }
    panels.add(new Charts.Panel("Relative cost (per host × hosts)", cost, costShown));

    sb.append("<section id=\"comparison\">\n<h2>Host profiles compared</h2>\n<div class=\"pair\">")
        .append("<figure>").append(Charts.comparison("cmp", names, panels))
        .append("<figcaption>Each bar is labelled with its value.</figcaption></figure>\n");
    sb.append("<div class=\"scroll\"><table class=\"comparison-table\">\n<caption>Host profiles compared</caption>\n")
        .append("<thead><tr><th scope=\"col\">Host profile</th><th scope=\"col\">vCPU</th>")
        .append("<th scope=\"col\">Memory</th><th scope=\"col\">Workers per host</th>")
        .append("<th scope=\"col\">Workers</th><th scope=\"col\">Hosts</th>")
        .append("<th scope=\"col\">Oversize</th>");
    for (String res : resources) {
      sb.append("<th scope=\"col\">Util. ").append(esc(res)).append("</th>");
    }
    sb.append("<th scope=\"col\">Cost per host</th><th scope=\"col\">Cost total</th></tr></thead>\n")
        .append("<tbody>\n");
    for (int i = 0; i < c.rows().size(); i++) {
      PlanComparison.Row r = c.rows().get(i);
      String k = "/comparison/" + i + "/";
      sb.append("<tr><th scope=\"row\">").append(esc(names.get(i))).append("</th>")
          .append(figure(k + "vcpus", r.vcpus(), Long.toString(r.vcpus())))
          .append(figure(k + "memoryBytes", r.memoryBytes(), Units.bytes(r.memoryBytes())))
          .append(optionalInt(k + "workersPerHost", r.workersPerHost()))
          .append(figure(k + "workersNeeded", r.workersNeeded(), "" + r.workersNeeded()))
          .append(optionalInt(k + "hostsNeeded", r.hostsNeeded()))
          .append(figure(k + "oversizeCount", r.oversizeCount(), "" + r.oversizeCount()));
      for (String res : resources) {
        Double v = r.utilization().get(res);
        sb.append(v == null ? "<td>–</td>"
            : figure(k + "utilization/" + pointer(res), fraction(v), Units.percent(v)));
      }
      sb.append(r.relativeCost().isPresent()
              ? figure(k + "relativeCost", r.relativeCost().get().toPlainString(),
                  r.relativeCost().get().toPlainString())
              : "<td>not given</td>")
          .append(r.relativeCostTotal().isPresent()
              ? figure(k + "totalCost", r.relativeCostTotal().get().toPlainString(),
                  r.relativeCostTotal().get().toPlainString())
              : "<td>not given</td>")
          .append("</tr>\n");
    }
    sb.append("</tbody></table></div></div>\n<p>Cost total is the profile's relative cost per host")
        .append(" times hosts needed.</p>\n</section>\n");
  }

  private static String optionalInt(String key, java.util.OptionalInt v) {
    return v.isPresent()
        ? figure(key, v.getAsInt(), Integer.toString(v.getAsInt()))
        : "<td>–</td>";
  }

  /** A fraction as the JSON report writes it: 4 decimals, half up. */
  static String fraction(double v) {
    return BigDecimal.valueOf(v).setScale(4, RoundingMode.HALF_UP).toPlainString();
  }

  private static void plan(StringBuilder sb, PlanReport report, int i) {
    Plan p = report.plans().get(i);
    String k = "/plans/" + i + "/";
    sb.append("<section class=\"plan\" id=\"plan-").append(i).append("\" data-profile=\"")
        .append(esc(p.hostProfile().orElse(""))).append("\">\n<h2>")
        .append(esc(planTitle(report, p))).append("</h2>\n");
    sb.append("<table class=\"kv summary\">\n<caption>Summary</caption>\n");
    sb.append("<tr><th scope=\"row\">Worker vCPUs</th>")
        .append(figure(k + "worker/vcpus", p.worker().vcpus(), "" + p.worker().vcpus()))
        .append("</tr>\n<tr><th scope=\"row\">Worker memory</th>")
        .append(figure(k + "worker/memoryBytes", p.worker().memoryBytes(),
            Units.bytes(p.worker().memoryBytes())))
        .append("</tr>\n<tr><th scope=\"row\">Worker kind</th>")
        .append(figure(k + "worker/kind", p.worker().kind().label(), p.worker().kind().label()))
        .append("</tr>\n");
    if (p.workersPerHost().isPresent()) {
      sb.append("<tr><th scope=\"row\">Workers per host</th>")
          .append(optionalInt(k + "workersPerHost", p.workersPerHost())).append("</tr>\n");
    }
    sb.append("<tr><th scope=\"row\">Workers needed</th>")
        .append(figure(k + "workersNeeded", p.workersNeeded(), "" + p.workersNeeded()))
        .append("</tr>\n<tr><th scope=\"row\">No packing can use fewer than</th>")
        .append(figure(k + "lowerBound", p.lowerBound(), "" + p.lowerBound())).append("</tr>\n");
    p.exact().ifPresent(
        e -> sb.append("<tr><th scope=\"row\">Exact search</th>")
            .append(figure(k + "exact/provedOptimal", e.provedOptimal(),
                e.provedOptimal() ? "proved optimal" : "best found within the effort limit"))
            .append("</tr>\n<tr><th scope=\"row\">Search nodes</th>")
            .append(figure(k + "exact/nodes", e.nodes(), "" + e.nodes()))
            .append("</tr>\n"));
    if (p.hostsNeeded().isPresent()) {
      sb.append("<tr><th scope=\"row\">Hosts needed</th>")
          .append(optionalInt(k + "hostsNeeded", p.hostsNeeded())).append("</tr>\n");
    }
    sb.append("<tr><th scope=\"row\">Runs out first</th>")
        .append(figure(k + "bindingResource", p.bindingResource(), p.bindingResource()))
        .append("</tr>\n</table>\n");
    resources(sb, p, k);

    report.hostOf(p).ifPresent(h -> topology(sb, h, p, i));

    List<WorkerFill> fills = WorkerFill.of(report.demand(), p);
    if (!fills.isEmpty()) {
      fill(sb, fills, i);
    }
    oversize(sb, report, p, i);
    if (!p.unchecked().isEmpty()) {
      sb.append("<p>Not checked: ").append(esc(String.join(", ", p.unchecked())))
          .append(", no capacity given.</p>\n");
    }
    if (!p.notes().isEmpty()) {
      sb.append("<h3>Notes</h3>\n<ul class=\"notes\">\n");
      for (String note : p.notes()) {
        sb.append("<li>").append(esc(note)).append("</li>\n");
      }
      sb.append("</ul>\n");
    }
    sb.append("</section>\n");
  }

  private static void resources(StringBuilder sb, Plan p, String k) {
    SortedSet<String> names = new TreeSet<>(p.allocatable().names());
    names.addAll(p.perWorkerDemand().names());
    names.addAll(p.room().names());
    names.addAll(p.utilization().keySet());
    sb.append("<h3>Per worker, by resource</h3>\n<table class=\"resources\">\n")
        .append("<thead><tr><th scope=\"col\">Resource</th><th scope=\"col\">Allocatable</th>")
        .append("<th scope=\"col\">On every worker</th><th scope=\"col\">Room for pods</th>")
        .append("<th scope=\"col\">Utilization</th></tr></thead>\n<tbody>\n");
    for (String r : names) {
      String pr = pointer(r);
      sb.append("<tr><th scope=\"row\">").append(esc(r)).append("</th>")
          .append(amountCell(k + "worker/allocatable/" + pr, p.allocatable(), r))
          .append(amountCell(k + "perWorkerDemand/" + pr, p.perWorkerDemand(), r))
          .append(amountCell(k + "room/" + pr, p.room(), r));
      Double u = p.utilization().get(r);
      sb.append(u == null ? "<td>–</td>"
          : figure(k + "utilization/" + pr, fraction(u), Units.percent(u)));
      sb.append("</tr>\n");
    }
    sb.append("</tbody></table>\n");
  }

  private static String amountCell(String key, Resources r, String name) {
    if (!r.names().contains(name)) {
      return "<td>–</td>";
    }
    long v = r.get(name);
    return figure(key, v, Units.amount(name, v));
  }

  private static void topology(StringBuilder sb, PlanHost h, Plan p, int i) {
    topology(sb, h, p.worker(), "p" + i + "-topo");
  }

  /**
   * The host's picture with {@code shape}'s worker VMs placed as {@code h.layout()} says, the
   * table of its NUMA nodes beside it, and the distance matrix when the profile has one.
   */
  static void topology(StringBuilder sb, PlanHost h, WorkerShape shape, String id) {
    HostProfile hp = h.profile();
    sb.append("<h3>Host topology</h3>\n<p>")
        .append(esc(TopologyWords.summary(hp)))
        .append("</p>\n<figure>")
        .append(TopologySvg.draw(id, h, shape))
        .append("<figcaption>")
        .append(esc(TopologySvg.describe(hp, h.layout(), shape)))
        .append("</figcaption></figure>\n");
    HostFacts facts = HostFacts.of(hp);
    int[] reserved = ShapeDeriver.reservedCoresPerNode(hp);
    long share = hp.nodes().isEmpty() ? 0 : hp.hypervisorMemoryBytes() / hp.nodes().size();
    sb.append("<div class=\"scroll\"><table class=\"nodes\">\n<caption>NUMA nodes of ").append(esc(hp.name()))
        .append("</caption>\n<thead><tr><th scope=\"col\">Node</th><th scope=\"col\">Socket</th>")
        .append("<th scope=\"col\">Cores</th><th scope=\"col\">Threads</th>")
        .append("<th scope=\"col\">Hypervisor cores</th><th scope=\"col\">Memory</th>")
        .append("<th scope=\"col\">Hypervisor memory</th><th scope=\"col\">Channels used</th>")
        .append("<th scope=\"col\">DIMMs</th><th scope=\"col\">Peak bandwidth</th>")
        .append("<th scope=\"col\">Worker VMs</th></tr></thead>\n<tbody>\n");
    for (int n = 0; n < hp.nodes().size(); n++) {
      NumaNode node = hp.nodes().get(n);
      NodeFacts f = facts.nodes().get(n);
      String workers = TopologyWords.workers(h.layout(), node.id());
      sb.append("<tr class=\"node-row\" data-node=\"").append(node.id()).append("\"><th scope=\"row\">")
          .append(node.id()).append("</th><td class=\"num\">").append(node.socket())
          .append("</td><td class=\"num\">").append(node.cores())
          .append("</td><td class=\"num\">").append(node.threads())
          .append("</td><td class=\"num\">").append(reserved[n])
          .append("</td><td class=\"num\">").append(esc(Units.bytes(node.memoryBytes())))
          .append("</td><td class=\"num\">").append(esc(Units.bytes(share)))
          .append("</td><td class=\"num\">")
          .append(node.channelsConfirmed()
              ? f.populatedChannels() + " of " + f.channels()
              : "unconfirmed")
          .append("</td><td>").append(esc(TopologyWords.dimms(node)))
          .append("</td><td class=\"num\">")
          .append(f.peakBandwidthBytesPerSecond().isPresent()
              ? esc(TopologyWords.gbps(f.peakBandwidthBytesPerSecond().getAsLong()))
              : "unknown")
          .append("</td><td class=\"num workers\">").append(esc(workers)).append("</td></tr>\n");
    }
    sb.append("</tbody></table></div>\n");
    hp.distances().ifPresent(d -> distances(sb, hp, d));
  }

  private static void distances(StringBuilder sb, HostProfile hp, List<List<Integer>> d) {
    int max = 10;
    for (List<Integer> row : d) {
      for (int v : row) {
        if (v != 255) {
          max = Math.max(max, v);
        }
      }
    }
    sb.append("<h3>NUMA distances</h3>\n<table class=\"heat\">\n<caption>Relative distance")
        .append(" between NUMA nodes (10 = local; 255 = unreachable), from the profile</caption>\n")
        .append("<thead><tr><th scope=\"col\">From \\ to</th>");
    for (NumaNode node : hp.nodes()) {
      sb.append("<th scope=\"col\">").append(node.id()).append("</th>");
    }
    sb.append("</tr></thead>\n<tbody>\n");
    for (int r = 0; r < d.size(); r++) {
      sb.append("<tr><th scope=\"row\">").append(hp.nodes().get(r).id()).append("</th>");
      for (int v : d.get(r)) {
        String cls = v == 255 ? "unreachable"
            : max == 10 ? "h0" : "h" + Math.round(4.0 * (v - 10) / (max - 10));
        sb.append("<td class=\"num ").append(cls).append("\">").append(v).append("</td>");
      }
      sb.append("</tr>\n");
    }
    sb.append("</tbody></table>\n");
  }

  /**
   * The table beside a fill histogram: per tenth of fill (0–10% … 90–100%), how many workers or
   * nodes reach it in each shown resource. {@code caption} is plain text of our own (no input).
   */
  static void histogramTable(StringBuilder sb, String caption, List<WorkerFill> fills) {
    sb.append("<table class=\"histogram\">\n<caption>").append(caption)
        .append("</caption>\n<thead><tr><th scope=\"col\">Fill</th>");
    for (String r : WorkerFill.SHOWN) {
      sb.append("<th scope=\"col\">").append(r).append("</th>");
    }
    sb.append("</tr></thead>\n<tbody>\n");
    List<int[]> counts = new ArrayList<>();
    for (String r : WorkerFill.SHOWN) {
      counts.add(WorkerFill.histogram(fills, r));
    }
    for (int b = 0; b < 10; b++) {
      sb.append("<tr><th scope=\"row\">").append(b * 10).append("–").append((b + 1) * 10)
          .append("%</th>");
      for (int[] c : counts) {
        sb.append("<td class=\"num\">").append(c[b]).append("</td>");
      }
      sb.append("</tr>\n");
    }
    sb.append("</tbody></table>");
  }

  private static void fill(StringBuilder sb, List<WorkerFill> fills, int i) {
    sb.append("<h3>Worker fill</h3>\n");
    boolean histogram = fills.size() > WorkerFill.HISTOGRAM_ABOVE;
    if (histogram) {
      sb.append("<div class=\"pair\"><figure>")
          .append(Charts.histogram("p" + i + "-hist", fills))
          .append("<figcaption>Workers counted by fill, per resource.</figcaption></figure>\n");
      histogramTable(sb, "Workers by fill", fills);
      sb.append("</div>\n");
    } else {
      sb.append("<figure>").append(Charts.fill("p" + i + "-fill", fills))
          .append("<figcaption>Striped: DaemonSets and per-worker demand, on every worker; solid:")
          .append(" pods packed onto the worker; the outlined bar is allocatable.</figcaption>")
          .append("</figure>\n");
    }
    sb.append(histogram ? "<details><summary>Every worker</summary>\n" : "")
        .append("<table class=\"fill-table\">\n<caption>Requested against allocatable, per")
        .append(" worker</caption>\n<thead><tr><th scope=\"col\">Worker</th><th scope=\"col\">")
        .append("Pods packed</th>");
    for (String r : WorkerFill.SHOWN) {
      sb.append("<th scope=\"col\">").append(r).append(" (every worker + packed / allocatable)")
          .append("</th>");
    }
    sb.append("</tr></thead>\n<tbody>\n");
    for (WorkerFill f : fills) {
      sb.append("<tr><th scope=\"row\">").append(esc(f.worker())).append("</th><td class=\"num\">")
          .append(f.packed().get(Resources.PODS)).append("</td>");
      for (String r : WorkerFill.SHOWN) {
        sb.append("<td class=\"num\">")
            .append(esc(Units.amount(r, f.everyWorker().get(r)) + " + "
                + Units.amount(r, f.packed().get(r)) + " / "
                + Units.amount(r, f.allocatable().get(r)) + " ("
                + Units.percent(f.fraction(r)) + ")"))
            .append("</td>");
      }
      sb.append("</tr>\n");
    }
    sb.append("</tbody></table>\n").append(histogram ? "</details>\n" : "");
  }

  private static void oversize(StringBuilder sb, PlanReport report, Plan p, int i) {
    sb.append("<h3>Oversize pods</h3>\n");
    if (p.oversize().isEmpty()) {
      sb.append("<p>None: every pod fits the one-node worker.</p>\n");
      return;
    }
    Map<String, Resources> requests = new TreeMap<>();
    for (Workload w : report.demand().workloads()) {
      requests.put(w.id().toString(), w.pod().requests().with(Resources.PODS, 1L));
    }
    List<Charts.Over> rows = new ArrayList<>();
    for (Oversize o : p.oversize()) {
      Resources req = requests.getOrDefault(o.workload().toString(), Resources.EMPTY);
      for (var e : o.exceeds().asMap().entrySet()) {
        rows.add(new Charts.Over(o.workload().toString(), e.getKey(), req.get(e.getKey()),
            p.room().get(e.getKey()), e.getValue()));
      }
    }
    sb.append("<p>Not packed: each needs a worker wider than one NUMA node.</p>\n<figure>")
        .append(Charts.oversize("p" + i + "-over", rows))
        .append("<figcaption>Each pod's request against the room of the one-node worker.")
        .append("</figcaption></figure>\n");
    sb.append("<table class=\"oversize-table\">\n<caption>Oversize pods</caption>\n<thead><tr>")
        .append("<th scope=\"col\">Workload</th><th scope=\"col\">Resource</th>")
        .append("<th scope=\"col\">Pod request</th><th scope=\"col\">Room</th>")
        .append("<th scope=\"col\">Over by</th><th scope=\"col\">Smallest shape that holds it</th>")
        .append("</tr></thead>\n<tbody>\n");
    for (int j = 0; j < p.oversize().size(); j++) {
      Oversize o = p.oversize().get(j);
      String k = "/plans/" + i + "/oversize/" + j + "/";
      Resources req = requests.getOrDefault(o.workload().toString(), Resources.EMPTY);
      for (var e : o.exceeds().asMap().entrySet()) {
        String r = e.getKey();
        sb.append("<tr>")
            .append(figure(k + "workload", o.workload().toString(), o.workload().toString()))
            .append("<td>").append(esc(r)).append("</td><td class=\"num\">")
            .append(esc(Units.amount(r, req.get(r)))).append("</td><td class=\"num\">")
            .append(esc(Units.amount(r, p.room().get(r)))).append("</td>")
            .append(figure(k + "exceeds/" + pointer(r), e.getValue(), Units.amount(r, e.getValue())))
            .append(figure(k + "smallestShape", o.smallestShape(), shapeWords(p, o)))
            .append("</tr>\n");
      }
    }
    sb.append("</tbody></table>\n");
  }

  private static String shapeWords(Plan p, Oversize o) {
    if (!o.smallestShape().equals("none")) {
      return o.smallestShape();
    }
    return p.hostProfile().isPresent() ? "none (larger than a whole host)"
        : "none (no larger shape known)";
  }

  private static void warnings(StringBuilder sb, List<Diagnostic> warnings) {
    sb.append("<section id=\"warnings\">\n<h2>Warnings and notes</h2>\n");
    if (warnings.isEmpty()) {
      sb.append("<p>None.</p>\n</section>\n");
      return;
    }
    sb.append("<table>\n<thead><tr><th scope=\"col\">Where</th><th scope=\"col\">Severity</th>")
        .append("<th scope=\"col\">Message</th></tr></thead>\n<tbody>\n");
    for (Diagnostic d : warnings) {
      sb.append("<tr><td>").append(esc(d.source().map(Object::toString).orElse("")))
          .append("</td><td>").append(esc(d.severity().label())).append("</td><td>")
          .append(esc(d.message())).append("</td></tr>\n");
    }
    sb.append("</tbody></table>\n</section>\n");
  }
}
