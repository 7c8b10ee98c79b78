package dev.numafit.report;

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
import dev.numafit.resource.Resources;
import dev.numafit.shape.ShapeDeriver;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.OptionalInt;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * {@code plan -o markdown}: the sections of the HTML report as GitHub-flavoured Markdown tables,
 * without the pictures — demand, the comparison of host profiles, and per plan its summary,
 * per-resource figures, the host's NUMA nodes and distances, worker fill, oversize pods and notes;
 * then warnings and the caution. Text from input is escaped so it cannot break a table or turn
 * into markup.
 */
public final class PlanMarkdownWriter implements ReportWriter<PlanReport> {
  @Override
  public String render(PlanReport report) {
    StringBuilder sb = new StringBuilder();
    sb.append("# Sizing plan\n\n> **").append(Caution.TEXT).append("**\n\n");
    demand(sb, report);
    report.comparison().ifPresent(c -> comparison(sb, c));
    if (!report.pools().isEmpty()) {
      pools(sb, report);
    }
    if (!report.unplaceable().isEmpty()) {
      sb.append("## Unplaceable workloads\n\nNode rules no pool satisfies; their pods are not"
          + " packed.\n\n");
      Table t = new Table("Workload", "Kind", "Reason");
      for (Unplaceable u : report.unplaceable()) {
        t.row(u.workload(), u.daemonSet() ? "DaemonSet (runs on no worker)" : "workload",
            u.reason());
      }
      sb.append(t.render()).append('\n');
    }
    for (Plan p : report.plans()) {
      plan(sb, report, p);
    }
    sb.append("## Warnings and notes\n\n");
    if (report.warnings().isEmpty()) {
      sb.append("None.\n\n");
    } else {
      Table t = new Table("Where", "Severity", "Message");
      for (Diagnostic d : report.warnings()) {
        t.row(d.source().map(Object::toString).orElse(""), d.severity().label(), d.message());
      }
      sb.append(t.render()).append('\n');
    }
    sb.append("---\n\n").append(Caution.TEXT).append('\n');
    return sb.toString();
  }

  /**
   * {@code s} safe inside a table cell: backslash-escapes the characters Markdown would read as
   * formatting or a cell border, and writes angle brackets as entities so no HTML gets through.
   */
  static String esc(String s) {
    StringBuilder sb = new StringBuilder(s.length() + 8);
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      switch (c) {
        case '<' -> sb.append("&lt;");
        case '>' -> sb.append("&gt;");
        case '&' -> sb.append("&amp;");
        case '\n', '\r' -> sb.append(' ');
        case '\\', '|', '*', '_', '`', '[', ']', '#', '~' -> sb.append('\\').append(c);
        default -> sb.append(c);
      }
    }
    return sb.toString();
  }

  /** A GitHub-flavoured table; a title starting with {@code >} is right-aligned. */
  private static final class Table {
    private final List<String> titles = new ArrayList<>();
    private final List<Boolean> right = new ArrayList<>();
    private final List<List<String>> rows = new ArrayList<>();

    Table(String... titles) {
      for (String t : titles) {
        right.add(t.startsWith(">"));
        this.titles.add(t.startsWith(">") ? t.substring(1) : t);
      }
    }

    void row(String... cells) {
      List<String> r = new ArrayList<>();
      for (String c : cells) {
        r.add(esc(c));
      }
      rows.add(r);
    }

    String render() {
      StringBuilder sb = new StringBuilder("|");
      for (String t : titles) {
        sb.append(' ').append(esc(t)).append(" |");
      }
      sb.append("\n|");
      for (boolean r : right) {
        sb.append(r ? " ---: |" : " --- |");
      }
      sb.append('\n');
      for (List<String> row : rows) {
        sb.append('|');
        for (String c : row) {
          sb.append(' ').append(c).append(" |");
        }
        sb.append('\n');
      }
      return sb.toString();
    }
  }

  private static void demand(StringBuilder sb, PlanReport report) {
    DemandTotals t = DemandTotals.of(report.demand());
    sb.append("## Demand\n\n");
    Table table = new Table("Figure", ">Value");
    table.row("Workloads", Integer.toString(report.demand().workloads().size()));
    table.row("Pods at peak", Long.toString(t.podsAtPeak()));
    t.requestsAtPeak().asMap().forEach(
        (k, v) -> table.row("Requests at peak: " + k, Units.amount(k, v)));
    if (t.perWorkerPods() > 0) {
      table.row("DaemonSet pods on every worker", Long.toString(t.perWorkerPods()));
    }
    sb.append(table.render()).append('\n');
    if (!report.demand().unsizedCustom().isEmpty()) {
      sb.append("Not sized: ").append(report.demand().unsizedCustom().size())
          .append(" custom workload(s) (see `numafit demand`; --include-custom sizes them as a")
          .append(" guess).\n\n");
    }
    if (!report.demand().skippedByKind().isEmpty()) {
      List<String> parts = new ArrayList<>();
      report.demand().skippedByKind().forEach((k, v) -> parts.add(esc(k) + " " + v));
      sb.append("Skipped objects that run no pods: ").append(String.join(", ", parts))
          .append(".\n\n");
    }
    Table w = new Table("Workload", "Source", ">Pods at peak", "Requests per pod");
    for (Workload wl : report.demand().workloads()) {
      w.row(wl.id().toString(), wl.source().toString(),
          wl.perWorker() ? "1 per worker" : Long.toString(wl.replicas().peak()),
          Units.vector(wl.pod().requests()));
    }
    sb.append("### Workloads\n\n").append(w.render()).append('\n');
  }

  private static void comparison(StringBuilder sb, PlanComparison c) {
    SortedSet<String> resources = new TreeSet<>();
    c.rows().forEach(r -> resources.addAll(r.utilization().keySet()));
    List<String> titles = new ArrayList<>(List.of("Host profile", ">vCPU", ">Memory",
        ">Workers per host", ">Workers", ">Hosts", ">Oversize"));
    resources.forEach(r -> titles.add(">Util. " + r));
    titles.add(">Cost per host");
    titles.add(">Cost total");
    Table t = new Table(titles.toArray(String[]::new));
    for (PlanComparison.Row r : c.rows()) {
      List<String> cells = new ArrayList<>(List.of(
          r.hostProfile().orElse("(--worker)"), Long.toString(r.vcpus()),
          Units.bytes(r.memoryBytes()), optional(r.workersPerHost()),
          Integer.toString(r.workersNeeded()), optional(r.hostsNeeded()),
          Integer.toString(r.oversizeCount())));
      for (String res : resources) {
        Double v = r.utilization().get(res);
        cells.add(v == null ? "–" : Units.percent(v));
      }
      cells.add(r.relativeCost().map(BigDecimal::toPlainString).orElse("not given"));
      cells.add(r.relativeCostTotal().map(BigDecimal::toPlainString).orElse("not given"));
      t.row(cells.toArray(String[]::new));
    }
    sb.append("## Host profiles compared\n\n").append(t.render())
        .append("\nCost total is the profile's relative cost per host times hosts needed.\n\n");
  }

  private static String optional(OptionalInt v) {
    return v.isPresent() ? Integer.toString(v.getAsInt()) : "–";
  }

  /** The pools side by side, with their labels, taints, workloads and DaemonSets. */
  private static void pools(StringBuilder sb, PlanReport report) {
    sb.append("## Worker pools\n\nEach workload is placed in the first pool it may run on; the"
        + " scheduler may spread it over every such pool.\n\n");
    Table t = new Table("Pool", "Host profile", ">vCPU", ">Memory", ">Workers", ">Hosts",
        "Labels", "Taints", "Workloads", "DaemonSets");
    for (PoolPlan pp : report.pools()) {
      Plan p = pp.plan();
      List<String> labels = new ArrayList<>();
      pp.labels().forEach((k, v) -> labels.add(k + "=" + v));
      t.row(pp.name(), p.hostProfile().orElse("–"), Long.toString(p.worker().vcpus()),
          Units.bytes(p.worker().memoryBytes()), Integer.toString(p.workersNeeded()),
          optional(p.hostsNeeded()), listOrNone(labels),
          listOrNone(pp.taints().stream().map(Object::toString).toList()),
          listOrNone(pp.workloads()), listOrNone(pp.daemonSets()));
    }
    sb.append(t.render()).append('\n');
  }

  private static String listOrNone(List<String> items) {
    return items.isEmpty() ? "none" : String.join(", ", items);
  }

  private static void plan(StringBuilder sb, PlanReport report, Plan p) {
    java.util.Optional<PoolPlan> pool = report.poolOf(p);
    String title =
        pool.isPresent()
            ? "Pool " + pool.get().name()
                + p.hostProfile().map(n -> " on host profile " + n).orElse(" of the given worker")
            : p.hostProfile().map(n -> "Plan for host profile " + n)
                .orElse("Plan for the given worker");
    sb.append("## ").append(esc(title)).append("\n\n");
    Table s = new Table("Figure", ">Value");
    s.row("Worker vCPUs", Long.toString(p.worker().vcpus()));
    s.row("Worker memory", Units.bytes(p.worker().memoryBytes()));
    s.row("Worker kind", p.worker().kind().label());
    if (p.workersPerHost().isPresent()) {
      s.row("Workers per host", optional(p.workersPerHost()));
    }
    s.row("Workers needed", Integer.toString(p.workersNeeded()));
    s.row("No packing can use fewer than", Integer.toString(p.lowerBound()));
    p.exact().ifPresent(
        e -> s.row("Exact search",
            (e.provedOptimal() ? "proved optimal" : "best found within the effort limit")
                + " (" + e.nodes() + " search nodes)"));
    if (p.hostsNeeded().isPresent()) {
      s.row("Hosts needed", optional(p.hostsNeeded()));
    }
    s.row("Runs out first", p.bindingResource());
    sb.append(s.render()).append('\n');

    SortedSet<String> names = new TreeSet<>(p.allocatable().names());
    names.addAll(p.perWorkerDemand().names());
    names.addAll(p.room().names());
    names.addAll(p.utilization().keySet());
    Table r = new Table("Resource", ">Allocatable", ">On every worker", ">Room for pods",
        ">Utilization");
    for (String n : names) {
      Double u = p.utilization().get(n);
      r.row(n, amount(p.allocatable(), n), amount(p.perWorkerDemand(), n), amount(p.room(), n),
          u == null ? "–" : Units.percent(u));
    }
    sb.append("### Per worker, by resource\n\n").append(r.render()).append('\n');

    report.hostOf(p).ifPresent(h -> topology(sb, h));
    List<WorkerFill> fills = WorkerFill.of(report.demand(), p);
    if (!fills.isEmpty()) {
      fill(sb, fills);
    }
    oversize(sb, report, p);
    if (!p.unchecked().isEmpty()) {
      sb.append("Not checked: ").append(esc(String.join(", ", p.unchecked())))
          .append(", no capacity given.\n\n");
    }
    if (!p.notes().isEmpty()) {
      sb.append("### Notes\n\n");
      for (String note : p.notes()) {
        sb.append("- ").append(esc(note)).append('\n');
      }
      sb.append('\n');
    }
  }

  private static String amount(Resources r, String name) {
    return r.names().contains(name) ? Units.amount(name, r.get(name)) : "–";
  }

  private static void topology(StringBuilder sb, PlanHost h) {
    HostProfile hp = h.profile();
    HostFacts facts = HostFacts.of(hp);
    int[] reserved = ShapeDeriver.reservedCoresPerNode(hp);
    long share = hp.nodes().isEmpty() ? 0 : hp.hypervisorMemoryBytes() / hp.nodes().size();
    sb.append("### Host topology\n\n")
        .append(esc(TopologyWords.summary(hp))).append("\n\n");
    Table t = new Table(">Node", ">Socket", ">Cores", ">Threads", ">Hypervisor cores", ">Memory",
        ">Hypervisor memory", ">Channels used", "DIMMs", ">Peak bandwidth", ">Worker VMs");
    for (int n = 0; n < hp.nodes().size(); n++) {
      NumaNode node = hp.nodes().get(n);
      NodeFacts f = facts.nodes().get(n);
      t.row(Integer.toString(node.id()), Integer.toString(node.socket()),
          Integer.toString(node.cores()), Integer.toString(node.threads()),
          Integer.toString(reserved[n]), Units.bytes(node.memoryBytes()), Units.bytes(share),
          node.channelsConfirmed() ? f.populatedChannels() + " of " + f.channels() : "unconfirmed",
          TopologyWords.dimms(node),
          f.peakBandwidthBytesPerSecond().isPresent()
              ? TopologyWords.gbps(f.peakBandwidthBytesPerSecond().getAsLong())
              : "unknown",
          TopologyWords.workers(h.layout(), node.id()));
    }
    sb.append(t.render()).append('\n');
    if (hp.distances().isPresent()) {
      List<String> titles = new ArrayList<>(List.of("From \\ to"));
      hp.nodes().forEach(node -> titles.add(">" + node.id()));
      Table d = new Table(titles.toArray(String[]::new));
      List<List<Integer>> m = hp.distances().get();
      for (int i = 0; i < m.size(); i++) {
        List<String> cells = new ArrayList<>(List.of(Integer.toString(hp.nodes().get(i).id())));
        m.get(i).forEach(v -> cells.add(Integer.toString(v)));
        d.row(cells.toArray(String[]::new));
      }
      sb.append("### NUMA distances\n\nRelative distance between NUMA nodes (10 = local; 255 =")
          .append(" unreachable), from the profile.\n\n").append(d.render()).append('\n');
    }
  }

  private static void fill(StringBuilder sb, List<WorkerFill> fills) {
    sb.append("### Worker fill\n\n");
    if (fills.size() > WorkerFill.HISTOGRAM_ABOVE) {
      List<String> titles = new ArrayList<>(List.of("Fill"));
      WorkerFill.SHOWN.forEach(r -> titles.add(">" + r));
      Table h = new Table(titles.toArray(String[]::new));
      List<int[]> counts = new ArrayList<>();
      WorkerFill.SHOWN.forEach(r -> counts.add(WorkerFill.histogram(fills, r)));
      for (int b = 0; b < 10; b++) {
        List<String> cells = new ArrayList<>(List.of(b * 10 + "–" + (b + 1) * 10 + "%"));
        for (int[] c : counts) {
          cells.add(Integer.toString(c[b]));
        }
        h.row(cells.toArray(String[]::new));
      }
      sb.append(fills.size()).append(" workers, counted by fill.\n\n").append(h.render())
          .append('\n');
      return;
    }
    List<String> titles = new ArrayList<>(List.of("Worker", ">Pods packed"));
    WorkerFill.SHOWN.forEach(r -> titles.add(">" + r + " (every worker + packed / allocatable)"));
    Table t = new Table(titles.toArray(String[]::new));
    for (WorkerFill f : fills) {
      List<String> cells = new ArrayList<>(List.of(f.worker(),
          Long.toString(f.packed().get(Resources.PODS))));
      for (String r : WorkerFill.SHOWN) {
        cells.add(Units.amount(r, f.everyWorker().get(r)) + " + "
            + Units.amount(r, f.packed().get(r)) + " / " + Units.amount(r, f.allocatable().get(r))
            + " (" + Units.percent(f.fraction(r)) + ")");
      }
      t.row(cells.toArray(String[]::new));
    }
    sb.append(t.render()).append('\n');
  }

  private static void oversize(StringBuilder sb, PlanReport report, Plan p) {
    sb.append("### Oversize pods\n\n");
    if (p.oversize().isEmpty()) {
      sb.append("None: every pod fits the one-node worker.\n\n");
      return;
    }
    Map<String, Resources> requests = new TreeMap<>();
    for (Workload w : report.demand().workloads()) {
      requests.put(w.id().toString(), w.pod().requests().with(Resources.PODS, 1L));
    }
    Table t = new Table("Workload", "Resource", ">Pod request", ">Room", ">Over by",
        "Smallest shape that holds it");
    for (Oversize o : p.oversize()) {
      Resources req = requests.getOrDefault(o.workload().toString(), Resources.EMPTY);
      for (var e : o.exceeds().asMap().entrySet()) {
        String r = e.getKey();
        t.row(o.workload().toString(), r, Units.amount(r, req.get(r)),
            Units.amount(r, p.room().get(r)), Units.amount(r, e.getValue()),
            !o.smallestShape().equals("none") ? o.smallestShape()
                : p.hostProfile().isPresent() ? "none (larger than a whole host)"
                    : "none (no larger shape known)");
      }
    }
    sb.append("Not packed: each needs a worker wider than one NUMA node.\n\n").append(t.render())
        .append('\n');
  }
}
