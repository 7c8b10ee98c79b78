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
import java.util.TreeSet;

/**
 * {@code numafit review} as text for an 80-column terminal, or as Markdown ({@code -o markdown},
 * for a change ticket). Types that could not be read come first; other warnings go to standard
 * error in text and into a section in Markdown.
 */
public final class ReviewTextWriter implements ReportWriter<Review> {
  /** Pending pods and drain pods listed by name before the rest is only counted. */
  static final int LIST_LIMIT = 20;

  private final boolean markdown;

  /** @param markdown headings and tables in Markdown instead of plain text */
  public ReviewTextWriter(boolean markdown) {
    this.markdown = markdown;
  }

  @Override
  public String render(Review r) {
    StringBuilder b = new StringBuilder();
    heading(b, 1, "Review of pool " + r.pool());
    List<String> missing = r.warnings().stream().filter(w -> w.startsWith("not read: ")).toList();
    if (!missing.isEmpty()) {
      line(b, "Incomplete read, these types are missing:");
      missing.forEach(m -> bullet(b, m.substring("not read: ".length())));
      b.append('\n');
    }
    line(b, (r.fits() ? "FITS" : "DOES NOT FIT") + ": " + r.nodesBefore() + " → "
        + r.nodesAfter() + " nodes"
        + r.shapeAfter().map(s -> " of shape " + s).orElse("") + ", pods "
        + r.from().label() + " (" + r.podsConsidered() + " pods, DaemonSets apart)");
    String verdict = verdict(r);
    if (!verdict.isEmpty()) {
      line(b, verdict);
    }
    b.append('\n');

    heading(b, 2, "NUMA check of today's pool"
        + r.hostProfile().map(h -> " (host profile " + h + ")").orElse(""));
    if (r.hostProfile().isEmpty()) {
      line(b, "Not checked: no --host-profile given.");
    } else if (r.spanning().isEmpty()) {
      line(b, "Every node fits one NUMA node of the host.");
    } else {
      line(b, r.spanning().size() + " of " + r.nodesBefore()
          + " nodes are larger than the host's one-node worker (they span NUMA nodes):");
      List<String[]> rows = new ArrayList<>();
      for (SpanningNode s : r.spanning()) {
        for (SpanningNode.Excess e : s.over()) {
          rows.add(new String[] {s.node(), e.resource(), Units.amount(e.resource(), e.capacity()),
              Units.amount(e.resource(), e.oneNode()), Units.amount(e.resource(), e.over())});
        }
      }
      table(b, new String[] {"node", "resource", "capacity", "one-node", "over by"}, rows);
    }
    b.append('\n');

    heading(b, 2, "Utilization (requested / allocatable)");
    List<String[]> util = new ArrayList<>();
    TreeSet<String> names = new TreeSet<>(r.utilizationBefore().keySet());
    names.addAll(r.utilizationAfter().keySet());
    for (String n : names) {
      util.add(new String[] {n, pct(r.utilizationBefore().get(n)),
          pct(r.utilizationAfter().get(n))});
    }
    table(b, new String[] {"resource", "before", "after"}, util);
    b.append('\n');
    if (markdown) {
      fill(b, "Node fill today", r.fillBefore());
      fill(b, "Node fill after the resize", r.fillAfter());
    }

    heading(b, 2, "Pending after the resize");
    if (r.pending().isEmpty()) {
      line(b, "None: every pod finds a node.");
    } else {
      List<String[]> rows = new ArrayList<>();
      for (PendingPod p : r.pending().subList(0, Math.min(LIST_LIMIT, r.pending().size()))) {
        rows.add(new String[] {p.pod(), p.workload(), p.reason()});
      }
      table(b, new String[] {"pod", "workload", "reason"}, rows);
      more(b, r.pending().size());
    }
    b.append('\n');

    if (!r.removals().isEmpty()) {
      heading(b, 2, "Scale-down order");
      List<String[]> rows = new ArrayList<>();
      int i = 1;
      for (Removal x : r.removals()) {
        rows.add(new String[] {Integer.toString(i++), x.node(), Integer.toString(x.moves()),
            x.safe() ? "yes" : "no: " + x.unplaced().size()
                + (x.unplaced().size() == 1 ? " pod has" : " pods have") + " nowhere to go"});
      }
      table(b, new String[] {"#", "node", "pods to move", "safe"}, rows);
      b.append('\n');
    }
    if (!r.drain().rounds().isEmpty() || !r.drain().blocked().isEmpty()) {
      heading(b, 2, "Drain under PodDisruptionBudgets");
      line(b, r.drain().rounds().size() + " round" + (r.drain().rounds().size() == 1 ? "" : "s")
          + " (each waits for the previous round's pods to run again):");
      int i = 1;
      for (List<String> round : r.drain().rounds()) {
        bullet(b, "round " + i++ + ": " + round.size() + " pod" + (round.size() == 1 ? "" : "s")
            + ": " + names(round));
      }
      if (!r.drain().blocked().isEmpty()) {
        line(b, "No round can move these without breaking a budget:");
        for (DrainPlan.Blocked x : r.drain().blocked()) {
          bullet(b, x.pod() + " (" + x.workload() + "): " + String.join(", ", x.budgets()));
        }
      }
      b.append('\n');
    }
    heading(b, 2, "Nodes of the " + (r.shapeAfter().isPresent() ? "new" : "current")
        + " shape the same pods need");
    if (r.nodesNeeded().isPresent()) {
      line(b, r.nodesNeeded().getAsInt() + " nodes (lower bound " + r.lowerBound().getAsInt()
          + "), packed tight with the plan's packer, node constraints ignored; room per node"
          + " after DaemonSets: " + Units.vector(r.roomPerNode()) + ".");
    } else {
      line(b, "No pods to place.");
    }
    if (!r.tooLarge().isEmpty()) {
      line(b, "Pods too large for an empty node of this shape: " + String.join(", ",
          r.tooLarge()));
    }
    b.append('\n');
    if (r.hostFailures().isPresent()) {
      HostFailureCheck h = r.hostFailures().get();
      heading(b, 2, "After losing " + h.failures() + " host" + (h.failures() == 1 ? "" : "s"));
      line(b, "Hosts lost (" + h.grouping() + "): " + String.join(", ", h.hostsLost()) + ".");
      line(b, h.fits() ? "Every pod of those hosts finds another node."
          : h.pending().size() + " pods find no node, e.g. " + h.pending().get(0).pod() + ": "
              + h.pending().get(0).reason());
      b.append('\n');
    }
    if (markdown) {
      List<String> other = r.warnings().stream().filter(w -> !w.startsWith("not read: "))
          .toList();
      if (!other.isEmpty()) {
        heading(b, 2, "Warnings");
        other.forEach(w -> bullet(b, w));
        b.append('\n');
      }
    }
    line(b, TextSupport.CAUTION);
    return b.toString();
  }

  /**
   * Markdown only: per node, DaemonSet pods + other pods / allocatable (fill) for cpu, memory and
   * pods, as the HTML report's fill table; above {@link WorkerFill#HISTOGRAM_ABOVE} nodes, nodes
   * counted by fill in steps of 10% instead.
   */
  private void fill(StringBuilder b, String title, List<NodeFill> nodes) {
    if (nodes.isEmpty()) {
      return;
    }
    heading(b, 2, title + " (DaemonSets + other pods / allocatable)");
    List<WorkerFill> fills = new ArrayList<>();
    for (NodeFill f : nodes) {
      fills.add(new WorkerFill(f.node(), f.pods(), f.daemonSets(), f.allocatable()));
    }
    List<String> head = new ArrayList<>();
    List<String[]> rows = new ArrayList<>();
    if (fills.size() > WorkerFill.HISTOGRAM_ABOVE) {
      head.add("fill");
      head.addAll(WorkerFill.SHOWN);
      List<int[]> counts = new ArrayList<>();
      WorkerFill.SHOWN.forEach(res -> counts.add(WorkerFill.histogram(fills, res)));
      for (int k = 0; k < 10; k++) {
        String[] row = new String[1 + counts.size()];
        row[0] = k * 10 + "–" + (k + 1) * 10 + "%";
        for (int c = 0; c < counts.size(); c++) {
          row[c + 1] = Integer.toString(counts.get(c)[k]);
        }
        rows.add(row);
      }
      line(b, fills.size() + " nodes counted by fill:");
    } else {
      head.add("node");
      head.addAll(WorkerFill.SHOWN);
      for (WorkerFill f : fills) {
        String[] row = new String[1 + WorkerFill.SHOWN.size()];
        row[0] = f.worker();
        for (int c = 0; c < WorkerFill.SHOWN.size(); c++) {
          String res = WorkerFill.SHOWN.get(c);
          row[c + 1] = Units.amount(res, f.everyWorker().get(res)) + " + "
              + Units.amount(res, f.packed().get(res)) + " / "
              + Units.amount(res, f.allocatable().get(res)) + " ("
              + Units.percent(f.fraction(res)) + ")";
        }
        rows.add(row);
      }
    }
    table(b, head.toArray(String[]::new), rows);
    b.append('\n');
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
    return String.join("; ", why) + (why.isEmpty() ? "" : ".");
  }

  private static String names(List<String> pods) {
    if (pods.size() <= 3) {
      return String.join(", ", pods);
    }
    return String.join(", ", pods.subList(0, 3)) + ", …";
  }

  private void more(StringBuilder b, int total) {
    if (total > LIST_LIMIT) {
      line(b, "… and " + (total - LIST_LIMIT) + " more (-o json lists them all).");
    }
  }

  private static String pct(Double f) {
    return f == null ? "-" : Units.percent(f);
  }

  private void heading(StringBuilder b, int level, String text) {
    if (markdown) {
      b.append("#".repeat(level)).append(' ').append(text).append("\n\n");
    } else {
      b.append(text).append('\n');
      if (level == 1) {
        b.append("=".repeat(Math.min(TextSupport.WIDTH, text.length()))).append('\n');
      }
    }
  }

  private void line(StringBuilder b, String text) {
    b.append(markdown ? text + "\n" : TextSupport.wrap("", "", text));
  }

  private void bullet(StringBuilder b, String text) {
    b.append(markdown ? "- " + text + "\n" : TextSupport.wrap("  - ", "    ", text));
  }

  private void table(StringBuilder b, String[] head, List<String[]> rows) {
    if (markdown) {
      b.append("| ").append(String.join(" | ", head)).append(" |\n|");
      b.append(" --- |".repeat(head.length)).append('\n');
      for (String[] r : rows) {
        b.append("| ").append(String.join(" | ", escape(r))).append(" |\n");
      }
      return;
    }
    int[] w = new int[head.length];
    for (int i = 0; i < head.length; i++) {
      w[i] = head[i].length();
      for (String[] r : rows) {
        if (i < head.length - 1) {
          w[i] = Math.max(w[i], r[i].length());
        }
      }
    }
    appendRow(b, head, w);
    for (String[] r : rows) {
      appendRow(b, r, w);
    }
  }

  private static void appendRow(StringBuilder b, String[] cells, int[] w) {
    StringBuilder row = new StringBuilder("  ");
    for (int i = 0; i < cells.length; i++) {
      row.append(i < cells.length - 1 ? pad(cells[i], w[i]) + "  " : cells[i]);
    }
    String s = row.toString();
    int indent = s.length() - cells[cells.length - 1].length();
    if (s.length() > TextSupport.WIDTH && indent < TextSupport.WIDTH - 20) {
      b.append(TextSupport.wrap(s.substring(0, indent), " ".repeat(indent),
          cells[cells.length - 1]));
    } else {
      b.append(s.stripTrailing()).append('\n');
    }
  }

  private static String[] escape(String[] r) {
    String[] out = new String[r.length];
    for (int i = 0; i < r.length; i++) {
      out[i] = r[i].replace("|", "\\|");
    }
    return out;
  }

  private static String pad(String s, int w) {
    return s + " ".repeat(Math.max(0, w - s.length()));
  }
}
