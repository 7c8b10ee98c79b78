package dev.numafit.report.html;

import static dev.numafit.report.html.Html.esc;
import static dev.numafit.report.html.Html.figure;
import static dev.numafit.report.html.Html.pointer;

import dev.numafit.report.Caution;
import dev.numafit.report.PlanHost;
import dev.numafit.report.ReportWriter;
import dev.numafit.report.Units;
import dev.numafit.report.WorkerFill;
import dev.numafit.review.DrainPlan;
import dev.numafit.review.HostFailureCheck;
import dev.numafit.review.NodeFill;
import dev.numafit.review.PendingPod;
import dev.numafit.review.Removal;
import dev.numafit.review.Review;
import dev.numafit.review.SpanningNode;
import dev.numafit.shape.WorkerShape;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.TreeSet;

/**
 * {@code review -o html}: the pool-resize review as one self-contained page (no scripts, no
 * external styles, fonts or images; opens from a file:// URL and prints to PDF): the summary, the
 * resize proposal before and after, the pool's fill node by node before and after (stacked bars,
 * or a histogram for large pools, DaemonSet pods striped apart), what the review found, the
 * scale-down order and drain, and the host's topology when a host profile was given. A table
 * beside every picture holds the same numbers.
 *
 * <p>Every figure that {@code review -o json} also has sits in a cell marked {@code data-json}
 * (the JSON pointer) and {@code data-value} (the JSON value), so a test can hold the page to the
 * JSON. Every string from input (pool, node, pod and workload names, messages) is escaped.
 */
public final class ReviewHtmlWriter implements ReportWriter<Review> {
  /** Rows of a list (pending pods, drain pods) shown before the rest is only counted. */
  static final int LIST_LIMIT = 200;

  private final Optional<PlanHost> host;
  private final Optional<WorkerShape> shape;
  private final boolean shapeGiven;

  /**
   * @param host the host profile and where workers of {@code shape} sit on it, when a profile was
   *     given
   * @param shape the worker VM drawn on the host: the after-shape, or the host's one-node worker
   * @param shapeGiven whether {@code shape} is the after-shape the user asked for (otherwise it is
   *     the one-node worker, the size no node of the pool should exceed)
   */
  public ReviewHtmlWriter(Optional<PlanHost> host, Optional<WorkerShape> shape,
      boolean shapeGiven) {
    this.host = Objects.requireNonNull(host, "host");
    this.shape = Objects.requireNonNull(shape, "shape");
    this.shapeGiven = shapeGiven;
  }

  /** A writer that draws no host. */
  public ReviewHtmlWriter() {
    this(Optional.empty(), Optional.empty(), false);
  }

  @Override
  public String render(Review r) {
    StringBuilder sb = new StringBuilder();
    String title = "Review of pool " + r.pool();
    sb.append("<h1>").append(esc(title)).append("</h1>\n");
    sb.append("<p class=\"caution\" role=\"note\"><strong>").append(esc(Caution.TEXT))
        .append("</strong></p>\n");
    contents(sb, r);
    summary(sb, r);
    proposal(sb, r);
    fill(sb, r);
    findings(sb, r);
    scaleDown(sb, r);
    if (host.isPresent() && shape.isPresent()) {
      sb.append("<section id=\"topology\" data-profile=\"")
          .append(esc(host.get().profile().name())).append("\">\n<h2>Host</h2>\n<p>")
          .append(esc(shapeGiven
              ? "The host of profile " + host.get().profile().name() + " with worker VMs of the"
                  + " new shape."
              : "The host of profile " + host.get().profile().name() + " with its one-node"
                  + " workers: the largest VM that fits one NUMA node, which no node of the pool"
                  + " should exceed."))
          .append("</p>\n");
      PlanHtmlWriter.topology(sb, host.get(), shape.get(), "review-topo");
      sb.append("</section>\n");
    }
    sb.append("<footer><p>").append(esc(Caution.TEXT)).append("</p></footer>\n");
    return HtmlPage.page(title, sb.toString());
  }

  private void contents(StringBuilder sb, Review r) {
    sb.append("<nav aria-label=\"Contents\"><ul>\n")
        .append("<li><a href=\"#summary\">Summary</a></li>\n")
        .append("<li><a href=\"#proposal\">The resize, before and after</a></li>\n")
        .append("<li><a href=\"#fill\">Node fill</a></li>\n")
        .append("<li><a href=\"#findings\">What the review found</a></li>\n");
    if (!r.removals().isEmpty() || !r.drain().rounds().isEmpty()
        || !r.drain().blocked().isEmpty()) {
      sb.append("<li><a href=\"#scale-down\">Scale-down and drain</a></li>\n");
    }
    if (host.isPresent() && shape.isPresent()) {
      sb.append("<li><a href=\"#topology\">Host</a></li>\n");
    }
    sb.append("</ul></nav>\n");
  }

  private static void summary(StringBuilder sb, Review r) {
    sb.append("<section id=\"summary\">\n<h2>Summary</h2>\n")
        .append("<p class=\"verdict\"><strong>")
        .append(r.fits() ? "FITS" : "DOES NOT FIT").append("</strong>: ")
        .append(esc(verdict(r))).append("</p>\n")
        .append("<table class=\"kv summary\">\n")
        .append("<tr><th scope=\"row\">Pool</th>").append(text("/pool", r.pool(), r.pool()))
        .append("</tr>\n<tr><th scope=\"row\">Fits</th>")
        .append(text("/fits", r.fits(), r.fits() ? "yes" : "no"))
        .append("</tr>\n<tr><th scope=\"row\">Pods from</th>")
        .append(text("/from", r.from().label(), r.from().label()))
        .append("</tr>\n<tr><th scope=\"row\">Pods considered (DaemonSets apart)</th>")
        .append(figure("/podsConsidered", r.podsConsidered(), "" + r.podsConsidered()))
        .append("</tr>\n<tr><th scope=\"row\">Host profile</th>")
        .append(r.hostProfile().isPresent()
            ? text("/hostProfile", r.hostProfile().get(), r.hostProfile().get())
            : "<td>none given (no NUMA check)</td>")
        .append("</tr>\n</table>\n</section>\n");
  }

  private static String verdict(Review r) {
    List<String> why = new ArrayList<>();
    if (!r.pending().isEmpty()) {
      why.add(r.pending().size() + " pods would be pending");
    }
    if (!r.drain().blocked().isEmpty()) {
      why.add(r.drain().blocked().size() + " pods are blocked by disruption budgets");
    }
    r.hostFailures().filter(h -> !h.fits()).ifPresent(h -> why.add(h.pending().size()
        + " pods find no node after losing " + h.failures() + " host"
        + (h.failures() == 1 ? "" : "s")));
    String nodes = r.nodesBefore() + " → " + r.nodesAfter() + " nodes"
        + r.shapeAfter().map(s -> " of shape " + s).orElse("");
    return nodes + (why.isEmpty() ? ", every pod finds a node." : "; " + String.join("; ", why)
        + ".");
  }

  private static void proposal(StringBuilder sb, Review r) {
    sb.append("<section id=\"proposal\">\n<h2>The resize, before and after</h2>\n");
    TreeSet<String> names = new TreeSet<>(r.utilizationBefore().keySet());
    names.addAll(r.utilizationAfter().keySet());
    List<String> shown = new ArrayList<>();
    for (String n : WorkerFill.SHOWN) {
      if (names.contains(n)) {
        shown.add(n);
      }
    }
    sb.append("<div class=\"pair\">");
    if (!shown.isEmpty()) {
      List<Charts.Panel> panels = new ArrayList<>();
      for (String n : shown) {
        Double b = r.utilizationBefore().get(n);
        Double a = r.utilizationAfter().get(n);
        panels.add(new Charts.Panel("Utilization: " + n, List.of(b == null ? 0 : b,
            a == null ? 0 : a), List.of(pct(b), pct(a))));
      }
      sb.append("<figure>")
          .append(Charts.comparison("util", List.of("before (" + r.nodesBefore() + " nodes)",
              "after (" + r.nodesAfter() + " nodes)"), panels, "Utilization before and after",
              "Requested over allocatable of the whole pool, before and after the resize, for "
                  + String.join(", ", shown) + "."))
          .append("<figcaption>Each bar is labelled with its value; solid: before, dotted:")
          .append(" after.</figcaption></figure>\n");
    }
    sb.append("<table class=\"proposal\">\n<caption>The pool before and after</caption>\n")
        .append("<thead><tr><th scope=\"col\"></th><th scope=\"col\">Before</th>")
        .append("<th scope=\"col\">After</th></tr></thead>\n<tbody>\n")
        .append("<tr><th scope=\"row\">Nodes</th>")
        .append(figure("/nodes/before", r.nodesBefore(), "" + r.nodesBefore()))
        .append(figure("/nodes/after", r.nodesAfter(), "" + r.nodesAfter())).append("</tr>\n")
        .append("<tr><th scope=\"row\">Node shape</th><td>as today</td>")
        .append(r.shapeAfter().isPresent()
            ? text("/shapeAfter", r.shapeAfter().get(), r.shapeAfter().get())
            : "<td>as today</td>")
        .append("</tr>\n");
    for (String n : names) {
      Double b = r.utilizationBefore().get(n);
      Double a = r.utilizationAfter().get(n);
      String p = pointer(n);
      sb.append("<tr><th scope=\"row\">Utilization: ").append(esc(n)).append("</th>")
          .append(b == null ? "<td>–</td>"
              : figure("/utilization/before/" + p, PlanHtmlWriter.fraction(b), pct(b)))
          .append(a == null ? "<td>–</td>"
              : figure("/utilization/after/" + p, PlanHtmlWriter.fraction(a), pct(a)))
          .append("</tr>\n");
    }
    sb.append("</tbody></table></div>\n");
    sb.append("<h3>Nodes the same pods need</h3>\n");
    if (r.nodesNeeded().isPresent()) {
      sb.append("<table class=\"kv needed\">\n<tr><th scope=\"row\">Nodes of the ")
          .append(r.shapeAfter().isPresent() ? "new" : "current")
          .append(" shape, packed tight (node constraints ignored)</th>")
          .append(figure("/nodesNeeded", r.nodesNeeded().getAsInt(),
              "" + r.nodesNeeded().getAsInt()))
          .append("</tr>\n<tr><th scope=\"row\">No packing can use fewer than</th>")
          .append(figure("/lowerBound", r.lowerBound().getAsInt(),
              "" + r.lowerBound().getAsInt()))
          .append("</tr>\n");
      for (var e : r.roomPerNode().asMap().entrySet()) {
        sb.append("<tr><th scope=\"row\">Room per node after DaemonSets: ").append(esc(e.getKey()))
            .append("</th>")
            .append(figure("/roomPerNode/" + pointer(e.getKey()), e.getValue(),
                Units.amount(e.getKey(), e.getValue())))
            .append("</tr>\n");
      }
      sb.append("</table>\n");
    } else {
      sb.append("<p>No pods to place.</p>\n");
    }
    sb.append("</section>\n");
  }

  private static String pct(Double f) {
    return f == null ? "–" : Units.percent(f);
  }

  private static void fill(StringBuilder sb, Review r) {
    sb.append("<section id=\"fill\">\n<h2>Node fill</h2>\n");
    if (r.fillBefore().isEmpty() && r.fillAfter().isEmpty()) {
      sb.append("<p>Not available.</p>\n</section>\n");
      return;
    }
    fillOne(sb, "before", "Today (" + r.fillBefore().size() + " nodes)", r.fillBefore());
    fillOne(sb, "after", "After the resize (" + r.fillAfter().size() + " nodes)",
        r.fillAfter());
    sb.append("</section>\n");
  }

  private static void fillOne(StringBuilder sb, String key, String heading,
      List<NodeFill> nodes) {
    sb.append("<h3>").append(esc(heading)).append("</h3>\n");
    if (nodes.isEmpty()) {
      sb.append("<p>No nodes.</p>\n");
      return;
    }
    List<WorkerFill> fills = new ArrayList<>();
    for (NodeFill f : nodes) {
      fills.add(new WorkerFill(f.node(), f.pods(), f.daemonSets(), f.allocatable()));
    }
    boolean histogram = fills.size() > WorkerFill.HISTOGRAM_ABOVE;
    String id = "fill-" + key;
    if (histogram) {
      sb.append("<div class=\"pair\"><figure>")
          .append(Charts.histogram(id, fills, "Nodes by fill (" + key + ")", "nodes"))
          .append("<figcaption>Nodes counted by fill, per resource.</figcaption></figure>\n");
      PlanHtmlWriter.histogramTable(sb, "Nodes by fill (" + key + ")", fills);
      sb.append("</div>\n<details><summary>Every node</summary>\n");
    } else {
      sb.append("<figure>")
          .append(Charts.fill(id, fills, "Node fill (" + key + ")",
              fills.size() + " nodes; per node the cpu, memory and pods requested against"
                  + " allocatable, DaemonSet pods shown apart from the other pods.",
              "DaemonSet pods", "other pods"))
          .append("<figcaption>Striped: DaemonSet pods; solid: the other pods; the outlined bar")
          .append(" is allocatable.</figcaption></figure>\n");
    }
    sb.append("<div class=\"scroll\"><table class=\"fill-table\" data-fill=\"").append(key)
        .append("\">\n<caption>Requested against allocatable, per node (").append(key)
        .append(")</caption>\n<thead><tr><th scope=\"col\" rowspan=\"2\">Node</th>");
    for (String res : WorkerFill.SHOWN) {
      sb.append("<th scope=\"colgroup\" colspan=\"4\">").append(res).append("</th>");
    }
    sb.append("</tr>\n<tr>");
    for (int k = 0; k < WorkerFill.SHOWN.size(); k++) {
      sb.append("<th scope=\"col\">DaemonSets</th><th scope=\"col\">Other pods</th>")
          .append("<th scope=\"col\">Allocatable</th><th scope=\"col\">Fill</th>");
    }
    sb.append("</tr></thead>\n<tbody>\n");
    for (int i = 0; i < nodes.size(); i++) {
      NodeFill f = nodes.get(i);
      WorkerFill w = fills.get(i);
      String k = "/fill/" + key + "/" + i + "/";
      sb.append("<tr class=\"fill-row\"><th scope=\"row\">")
          .append("<span").append(marked(k + "node", f.node())).append('>').append(esc(f.node()))
          .append("</span></th>");
      for (String res : WorkerFill.SHOWN) {
        String p = pointer(res);
        sb.append(figure(k + "daemonSets/" + p, f.daemonSets().get(res),
                Units.amount(res, f.daemonSets().get(res))))
            .append(figure(k + "pods/" + p, f.pods().get(res),
                Units.amount(res, f.pods().get(res))))
            .append(figure(k + "allocatable/" + p, f.allocatable().get(res),
                Units.amount(res, f.allocatable().get(res))))
            .append("<td class=\"num\">").append(esc(Units.percent(w.fraction(res))))
            .append("</td>");
      }
      sb.append("</tr>\n");
    }
    sb.append("</tbody></table></div>\n").append(histogram ? "</details>\n" : "");
  }

  private static void findings(StringBuilder sb, Review r) {
    sb.append("<section id=\"findings\">\n<h2>What the review found</h2>\n");
    List<String[]> rows = new ArrayList<>();
    List<String> pointers = new ArrayList<>();
    for (int i = 0; i < r.spanning().size(); i++) {
      SpanningNode s = r.spanning().get(i);
      List<String> over = new ArrayList<>();
      for (SpanningNode.Excess e : s.over()) {
        over.add(e.resource() + " " + Units.amount(e.resource(), e.capacity()) + " against "
            + Units.amount(e.resource(), e.oneNode()) + ", over by "
            + Units.amount(e.resource(), e.over()));
      }
      rows.add(new String[] {"node spans NUMA nodes", s.node(), String.join("; ", over)});
      pointers.add("/spanning/" + i + "/node");
    }
    int shown = Math.min(LIST_LIMIT, r.pending().size());
    for (int i = 0; i < shown; i++) {
      PendingPod p = r.pending().get(i);
      rows.add(new String[] {"pod pending after the resize", p.pod(),
          p.workload() + ": " + p.reason()});
      pointers.add("/pending/" + i + "/pod");
    }
    for (int i = 0; i < r.drain().blocked().size(); i++) {
      DrainPlan.Blocked b = r.drain().blocked().get(i);
      rows.add(new String[] {"pod blocked by a disruption budget", b.pod(),
          b.workload() + ": " + String.join(", ", b.budgets())});
      pointers.add("/drain/blocked/" + i + "/pod");
    }
    for (int i = 0; i < r.tooLarge().size(); i++) {
      rows.add(new String[] {"pod larger than an empty node of the shape", r.tooLarge().get(i),
          "it cannot run on any node of this shape"});
      pointers.add("/tooLarge/" + i);
    }
    if (r.hostFailures().isPresent()) {
      HostFailureCheck h = r.hostFailures().get();
      int n = Math.min(LIST_LIMIT, h.pending().size());
      for (int i = 0; i < n; i++) {
        PendingPod p = h.pending().get(i);
        rows.add(new String[] {"pod with no node after losing " + h.failures() + " host"
            + (h.failures() == 1 ? "" : "s"), p.pod(), p.workload() + ": " + p.reason()});
        pointers.add("/hostFailures/pending/" + i + "/pod");
      }
    }
    if (r.hostProfile().isEmpty()) {
      sb.append("<p>NUMA check not made: no host profile given.</p>\n");
    } else if (r.spanning().isEmpty()) {
      sb.append("<p>Every node of today's pool fits one NUMA node of the host.</p>\n");
    }
    if (rows.isEmpty()) {
      sb.append("<p>Nothing stands in the way: every pod finds a node.</p>\n");
    } else {
      sb.append("<table class=\"findings\">\n<caption>Findings</caption>\n<thead><tr>")
          .append("<th scope=\"col\">Finding</th><th scope=\"col\">Node, pod or workload</th>")
          .append("<th scope=\"col\">Detail</th></tr></thead>\n<tbody>\n");
      for (int i = 0; i < rows.size(); i++) {
        String[] row = rows.get(i);
        sb.append("<tr><td>").append(esc(row[0])).append("</td>")
            .append(text(pointers.get(i), row[1], row[1]))
            .append("<td>").append(esc(row[2])).append("</td></tr>\n");
      }
      sb.append("</tbody></table>\n");
      if (r.pending().size() > LIST_LIMIT) {
        sb.append("<p>… and ").append(r.pending().size() - LIST_LIMIT)
            .append(" more pending pods (-o json lists them all).</p>\n");
      }
    }
    if (r.hostFailures().isPresent()) {
      HostFailureCheck h = r.hostFailures().get();
      sb.append("<h3>After losing ").append(h.failures()).append(" host")
          .append(h.failures() == 1 ? "" : "s").append("</h3>\n<table class=\"kv\">\n")
          .append("<tr><th scope=\"row\">Hosts lost (").append(esc(h.grouping()))
          .append(")</th><td>").append(esc(String.join(", ", h.hostsLost())))
          .append("</td></tr>\n<tr><th scope=\"row\">Host failures asked for</th>")
          .append(figure("/hostFailures/failures", h.failures(), "" + h.failures()))
          .append("</tr>\n<tr><th scope=\"row\">Every pod finds another node</th>")
          .append(text("/hostFailures/fits", h.fits(), h.fits() ? "yes" : "no"))
          .append("</tr>\n</table>\n");
    }
    List<String> other = r.warnings();
    if (!other.isEmpty()) {
      sb.append("<h3>Warnings</h3>\n<ul class=\"warnings\">\n");
      for (String w : other) {
        sb.append("<li>").append(esc(w)).append("</li>\n");
      }
      sb.append("</ul>\n");
    }
    sb.append("</section>\n");
  }

  private static void scaleDown(StringBuilder sb, Review r) {
    if (r.removals().isEmpty() && r.drain().rounds().isEmpty()
        && r.drain().blocked().isEmpty()) {
      return;
    }
    sb.append("<section id=\"scale-down\">\n<h2>Scale-down and drain</h2>\n");
    if (!r.removals().isEmpty()) {
      sb.append("<table class=\"scale-down\">\n<caption>Nodes to remove, in order</caption>\n")
          .append("<thead><tr><th scope=\"col\">#</th><th scope=\"col\">Node</th>")
          .append("<th scope=\"col\">Pods to move</th><th scope=\"col\">Safe</th></tr></thead>\n")
          .append("<tbody>\n");
      for (int i = 0; i < r.removals().size(); i++) {
        Removal x = r.removals().get(i);
        String k = "/scaleDown/" + i + "/";
        sb.append("<tr><td class=\"num\">").append(i + 1).append("</td>")
            .append(text(k + "node", x.node(), x.node()))
            .append(figure(k + "moves", x.moves(), "" + x.moves()))
            .append(text(k + "safe", x.safe(), x.safe() ? "yes"
                : "no: " + x.unplaced().size() + (x.unplaced().size() == 1 ? " pod has"
                    : " pods have") + " nowhere to go"))
            .append("</tr>\n");
      }
      sb.append("</tbody></table>\n");
    }
    if (!r.drain().rounds().isEmpty()) {
      sb.append("<table class=\"drain\">\n<caption>Drain in rounds under PodDisruptionBudgets")
          .append(" (each waits for the previous round's pods to run again)</caption>\n")
          .append("<thead><tr><th scope=\"col\">Round</th><th scope=\"col\">Pods</th>")
          .append("<th scope=\"col\">Which</th></tr></thead>\n<tbody>\n");
      for (int i = 0; i < r.drain().rounds().size(); i++) {
        List<String> round = r.drain().rounds().get(i);
        List<String> names = round.subList(0, Math.min(LIST_LIMIT, round.size()));
        sb.append("<tr><td class=\"num\">").append(i + 1).append("</td><td class=\"num\">")
            .append(round.size()).append("</td><td>").append(esc(String.join(", ", names)))
            .append(round.size() > names.size() ? esc(", … " + (round.size() - names.size())
                + " more") : "")
            .append("</td></tr>\n");
      }
      sb.append("</tbody></table>\n");
    }
    if (!r.drain().blocked().isEmpty()) {
      sb.append("<p>").append(r.drain().blocked().size())
          .append(" pods cannot be moved without breaking a budget (listed under findings).")
          .append("</p>\n");
    }
    sb.append("</section>\n");
  }

  /** {@code data-json} and {@code data-value} attributes, as {@link Html#figure} writes them. */
  private static String marked(String key, Object jsonValue) {
    return " data-json=\"" + esc(key) + "\" data-value=\"" + esc(String.valueOf(jsonValue))
        + "\"";
  }

  /** A text cell (not a number) holding a value the JSON report has at {@code key}. */
  private static String text(String key, Object jsonValue, String shown) {
    return "<td" + marked(key, jsonValue) + ">" + esc(shown) + "</td>";
  }
}
