package dev.numafit.report;

import dev.numafit.plan.Oversize;
import dev.numafit.plan.Plan;
import dev.numafit.plan.PlanComparison;
import dev.numafit.plan.PoolPlan;
import dev.numafit.plan.Unplaceable;
import dev.numafit.plan.WorkerPlacement;
import dev.numafit.shape.WorkerShape;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;

/**
 * {@code plan -o text}: per plan the worker shape, its allocatable, what every worker carries
 * anyway, workers and hosts needed, utilization, oversize pods and notes; then a comparison table
 * when there are several plans, and the caution line. Warnings are printed by the CLI to standard
 * error.
 */
public final class PlanTextWriter implements ReportWriter<PlanReport> {
  private final TextStyle style;

  /** Plain text at 80 columns, for files and pipes. */
  public PlanTextWriter() {
    this(TextStyle.PLAIN);
  }

  /** Text fitted to {@code style}'s width, with colour when it allows. */
  public PlanTextWriter(TextStyle style) {
    this.style = java.util.Objects.requireNonNull(style, "style");
  }

  @Override
  public String render(PlanReport report) {
    StringBuilder sb = new StringBuilder();
    DemandTotals t = DemandTotals.of(report.demand());
    sb.append(
        TextSupport.wrap(
            style.width(),
            "",
            "  ",
            "Demand: "
                + report.demand().workloads().size()
                + " workloads, "
                + t.podsAtPeak()
                + " pods at peak requesting "
                + Units.vector(t.requestsAtPeak())
                + "."));
    if (!report.demand().unsizedCustom().isEmpty()) {
      sb.append(
          TextSupport.wrap(
              style.width(),
              "",
              "  ",
              "Not sized: "
                  + report.demand().unsizedCustom().size()
                  + (report.demand().unsizedCustom().size() == 1 ? " custom workload" : " custom"
                      + " workloads")
                  + " (see numafit demand; --include-custom sizes them as a guess)."));
    }
    if (!report.demand().skippedByKind().isEmpty()) {
      sb.append(DemandTextWriter.skippedLine(report.demand().skippedByKind()));
    }
    for (Plan p : report.plans()) {
      sb.append('\n').append(plan(p, report));
    }
    if (!report.pools().isEmpty()) {
      sb.append('\n').append(pools(report));
    }
    if (!report.unplaceable().isEmpty()) {
      sb.append('\n').append(unplaceable(report));
    }
    if (!report.comparison().isEmpty()) {
      sb.append('\n').append(comparison(report));
    }
    sb.append('\n').append(TextSupport.wrap(style.width(), "", "", TextSupport.CAUTION));
    return sb.toString();
  }

  private String plan(Plan p, PlanReport report) {
    StringBuilder sb = new StringBuilder();
    java.util.Optional<PoolPlan> pool = report.poolOf(p);
    String title =
        pool.isPresent()
            ? "Pool " + pool.get().name()
                + p.hostProfile().map(n -> " on host profile " + n).orElse(" of the given worker")
            : p.hostProfile().map(n -> "Plan for host profile " + n)
                .orElse("Plan for the given worker");
    sb.append(style.paint("1", title)).append('\n');
    WorkerShape w = p.worker();
    kv(sb, "Worker", List.of(shape(w)));
    if (pool.isPresent()) {
      PoolPlan pp = pool.get();
      List<String> labels = new ArrayList<>();
      pp.labels().forEach((k, v) -> labels.add(k + "=" + v));
      kv(sb, "Labels", labels);
      kv(sb, "Taints", pp.taints().stream().map(Object::toString).toList());
      kv(sb, "Workloads", pp.workloads());
      kv(sb, "DaemonSets", pp.daemonSets());
    }
    kv(sb, "Allocatable", Units.items(p.allocatable()));
    kv(sb, "On every worker", Units.items(p.perWorkerDemand()));
    kv(sb, "Room for pods", Units.items(p.room()));
    if (p.workersPerHost().isPresent()) {
      kv(sb, "Workers per host", List.of(Integer.toString(p.workersPerHost().getAsInt())));
    }
    kv(
        sb,
        "Workers needed",
        List.of(p.workersNeeded() + " (no packing can use fewer than " + p.lowerBound() + ")"));
    p.exact().ifPresent(
        e -> kv(sb, "Exact search", List.of(
            (e.provedOptimal() ? "proved optimal" : "best found within the effort limit")
                + " (" + e.nodes() + " search nodes)")));
    if (p.hostsNeeded().isPresent()) {
      String hostsLine = Integer.toString(p.hostsNeeded().getAsInt());
      if (p.hostsNeededWithoutFailures().isPresent()) {
        hostsLine += " (" + p.hostsNeededWithoutFailures().getAsInt() + " without failures)";
      }
      kv(sb, "Hosts needed", List.of(hostsLine));
    }
    List<String> util = new ArrayList<>();
    p.utilization().forEach((k, v) -> util.add(k + " " + Units.percent(v)));
    kv(sb, "Utilization", util);
    if (!p.bindingResource().isEmpty()) {
      kv(sb, "Runs out first", List.of(p.bindingResource()));
    }
    if (p.oversize().isEmpty()) {
      sb.append("  Oversize pods: none\n");
    } else {
      sb.append("  Oversize pods (not packed; each needs a worker wider than one NUMA node):\n");
      for (Oversize x : p.oversize()) {
        String fits =
            !x.smallestShape().equals("none")
                ? "smallest shape that holds it: " + x.smallestShape()
                : p.hostProfile().isPresent()
                    ? "larger than a whole host"
                    : "no larger shape known (give a --host-profile to compare)";
        sb.append(
            TextSupport.wrap(
                style.width(),
                "    " + x.workload() + ": ",
                "      ",
                "over by " + Units.vector(x.exceeds()) + "; " + fits + "."));
      }
    }
    if (!p.unchecked().isEmpty()) {
      sb.append(
          TextSupport.wrap(
              style.width(),
              "  ",
              "    ",
              "Not checked: " + String.join(", ", p.unchecked()) + ", no capacity given."));
    }
    for (String note : p.notes()) {
      sb.append(TextSupport.wrap(style.width(), "  Note: ", "    ", note));
    }
    report.hostOf(p).ifPresent(h -> sb.append(HostDiagram.render(h, p, style)));
    if (p.placement().isPresent()) {
      sb.append("  Placement:\n");
      for (WorkerPlacement wp : p.placement().get()) {
        sb.append(
            TextSupport.wrap(
                style.width(),
                "    " + wp.worker() + ": ",
                "      ",
                wp.pods().isEmpty() ? "(empty)" : String.join(" ", wp.pods())));
      }
    }
    return sb.toString();
  }

  /** The pools side by side. */
  private String pools(PlanReport report) {
    StringBuilder sb = new StringBuilder("Pools:\n");
    TextTable t =
        new TextTable("POOL", ">VCPU", ">MEMORY", ">WORKERS", ">HOSTS", ">WORKLOADS",
            ">DAEMONSETS");
    for (PoolPlan pp : report.pools()) {
      Plan p = pp.plan();
      t.row(
          pp.name(),
          Long.toString(p.worker().vcpus()),
          Units.bytes(p.worker().memoryBytes()),
          Integer.toString(p.workersNeeded()),
          p.hostsNeeded().isPresent() ? Integer.toString(p.hostsNeeded().getAsInt()) : "-",
          Integer.toString(pp.workloads().size()),
          Integer.toString(pp.daemonSets().size()));
    }
    sb.append(t.render("  "));
    sb.append(TextSupport.wrap(style.width(), "  ", "  ", "Each workload is placed in the first"
        + " pool it may run on; the scheduler may spread it over every such pool."));
    return sb.toString();
  }

  /** Workloads no pool takes, each with its reason. */
  private String unplaceable(PlanReport report) {
    StringBuilder sb =
        new StringBuilder("Unplaceable (node rules no pool satisfies; not packed):\n");
    for (Unplaceable u : report.unplaceable()) {
      sb.append(
          TextSupport.wrap(
              style.width(),
              "  " + u.workload() + ": ",
              "    ",
              (u.daemonSet() ? "DaemonSet runs on no worker: " : "") + u.reason() + "."));
    }
    return sb.toString();
  }

  private static final int LABEL = 18;

  /** One {@code label  value} line, the value's items wrapped under each other. */
  private void kv(StringBuilder sb, String label, List<String> items) {
    String first = "  " + label + " ".repeat(LABEL - label.length());
    sb.append(
        TextSupport.wrapItems(
            style.width(),
            first, " ".repeat(first.length()), items.isEmpty() ? List.of("none") : items));
  }

  private static String shape(WorkerShape w) {
    String where =
        switch (w.kind()) {
          case ONE_NODE -> "one per NUMA node";
          case SPLIT_NODE -> w.workersPerNode() + " per NUMA node";
          case TWO_NODES -> "spans 2 NUMA nodes";
          case SOCKET -> "spans a socket";
          case HOST -> "spans the host";
          case EXPLICIT -> "as given";
        };
    return w.vcpus() + " vCPU, " + Units.bytes(w.memoryBytes()) + " memory (" + where + ")";
  }

  private String comparison(PlanReport report) {
    StringBuilder sb = new StringBuilder("Comparison:\n");
    TextTable t =
        new TextTable(
            "PROFILE", ">VCPU", ">MEMORY", ">PER HOST", ">WORKERS", ">HOSTS", ">OVERSIZE", ">COST");
    for (PlanComparison.Row r : report.comparison().get().rows()) {
      t.row(
          r.hostProfile().orElse("(--worker)"),
          Long.toString(r.vcpus()),
          Units.bytes(r.memoryBytes()),
          r.workersPerHost().isPresent() ? Integer.toString(r.workersPerHost().getAsInt()) : "-",
          Integer.toString(r.workersNeeded()),
          r.hostsNeeded().isPresent() ? Integer.toString(r.hostsNeeded().getAsInt()) : "-",
          Integer.toString(r.oversizeCount()),
          r.relativeCostTotal().map(BigDecimal::toPlainString).orElse("-"));
    }
    sb.append(t.render("  "));
    boolean anyCost =
        report.comparison().get().rows().stream()
            .anyMatch(r -> r.relativeCostTotal().isPresent());
    if (anyCost) {
      sb.append("  COST is the profile's relative cost per host times hosts needed.\n");
    }
    return sb.toString();
  }
}
