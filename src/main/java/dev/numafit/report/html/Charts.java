package dev.numafit.report.html;

import static dev.numafit.report.html.Html.esc;
import static dev.numafit.report.html.Html.n;

import dev.numafit.report.Units;
import dev.numafit.report.WorkerFill;
import java.util.List;

/**
 * The report's bar charts as inline SVG: worker fill (one row of stacked bars per worker, or a
 * histogram for large plans), profile comparison panels, and oversize pods against the room of
 * the one-node worker. Every bar carries its value as text, so the picture reads without colour;
 * the tables beside each chart hold the same figures.
 */
final class Charts {
  private static final int WIDTH = 920;

  private Charts() {}

  private static String open(String cls, String id, double height, String title, String desc) {
    StringBuilder sb = new StringBuilder();
    sb.append("<svg class=\"").append(cls).append("\" xmlns=\"http://www.w3.org/2000/svg\"")
        .append(" role=\"img\" viewBox=\"0 0 ").append(WIDTH).append(' ').append(n(height))
        .append("\" width=\"").append(WIDTH).append("\" height=\"").append(n(height))
        .append("\" aria-labelledby=\"").append(id).append("-t ").append(id).append("-d\">\n")
        .append("<title id=\"").append(id).append("-t\">").append(esc(title)).append("</title>\n")
        .append("<desc id=\"").append(id).append("-d\">").append(esc(desc)).append("</desc>\n");
    Patterns.defs(sb, id);
    return sb.toString();
  }

  private static void text(StringBuilder sb, double x, double y, String cls, String s) {
    sb.append("<text x=\"").append(n(x)).append("\" y=\"").append(n(y)).append("\" class=\"")
        .append(cls).append("\">").append(esc(s)).append("</text>");
  }

  private static void rect(
      StringBuilder sb, double x, double y, double w, double h, String cls, String fill) {
    sb.append("<rect class=\"").append(cls).append("\" x=\"").append(n(x)).append("\" y=\"")
        .append(n(y)).append("\" width=\"").append(n(Math.max(0, w))).append("\" height=\"")
        .append(n(h)).append('"');
    if (fill != null) {
      sb.append(" fill=\"").append(fill).append('"');
    }
    sb.append("/>");
  }

  /**
   * Per worker three stacked bars (cpu, memory, pods): what every worker carries (DaemonSets,
   * striped) then the packed pods (solid), against allocatable (the outlined full bar).
   */
  static String fill(String id, List<WorkerFill> fills) {
    return fill(id, fills, "Worker fill",
        fills.size() + " workers; per worker the cpu, memory and pods requested against"
            + " allocatable, DaemonSets and per-worker demand shown apart from packed pods.",
        "DaemonSets and per-worker demand", "packed pods");
  }

  /**
   * {@link #fill(String, List)} with the words of another report: the picture's title and
   * description, and the legend of the striped and the solid segment.
   */
  static String fill(String id, List<WorkerFill> fills, String title, String desc,
      String stripedLegend, String solidLegend) {
    double labelW = 120;
    double barX = labelW + 70;
    double barW = WIDTH - barX - 90;
    double bar = 12;
    double rowH = 3 * (bar + 3) + 10;
    double height = 10 + fills.size() * rowH + 30;
    StringBuilder sb = new StringBuilder(open("fill", id, height, title, desc));
    double y = 10;
    for (WorkerFill f : fills) {
      sb.append("<g class=\"worker-fill\" data-worker=\"").append(esc(f.worker())).append("\">");
      text(sb, 4, y + 2 * (bar + 3) - 2, "label strong", f.worker());
      for (int k = 0; k < WorkerFill.SHOWN.size(); k++) {
        String r = WorkerFill.SHOWN.get(k);
        double by = y + k * (bar + 3);
        long alloc = f.allocatable().get(r);
        double scale = alloc <= 0 ? 0 : barW / Math.max(alloc, f.used(r));
        text(sb, labelW, by + bar - 2, "label small", r);
        rect(sb, barX, by, alloc * scale, bar, "alloc", null);
        double dsW = f.everyWorker().get(r) * scale;
        rect(sb, barX, by, dsW, bar, "daemon", "url(#" + id + "-ds)");
        rect(sb, barX + dsW, by, f.packed().get(r) * scale, bar, "packed", null);
        text(sb, barX + barW + 6, by + bar - 2, "label small",
            Units.percent(f.fraction(r)));
      }
      sb.append("</g>\n");
      y += rowH;
    }
    double lx = 4;
    rect(sb, lx, y, 22, 12, "daemon", "url(#" + id + "-ds)");
    text(sb, lx + 28, y + 10, "label small", stripedLegend);
    lx += 260;
    rect(sb, lx, y, 22, 12, "packed", null);
    text(sb, lx + 28, y + 10, "label small", solidLegend);
    lx += 130;
    rect(sb, lx, y, 22, 12, "alloc", null);
    text(sb, lx + 28, y + 10, "label small", "allocatable (full bar)");
    sb.append("</svg>\n");
    return sb.toString();
  }

  /** Workers counted per 10% fill bucket, three bars per bucket (cpu, memory, pods). */
  static String histogram(String id, List<WorkerFill> fills) {
    return histogram(id, fills, "Workers by fill", "workers");
  }

  /** {@link #histogram(String, List)} with another title and word for what is counted. */
  static String histogram(String id, List<WorkerFill> fills, String title, String rows) {
    int[][] counts = new int[WorkerFill.SHOWN.size()][];
    int max = 1;
    for (int k = 0; k < counts.length; k++) {
      counts[k] = WorkerFill.histogram(fills, WorkerFill.SHOWN.get(k));
      for (int c : counts[k]) {
        max = Math.max(max, c);
      }
    }
    double top = 20;
    double plotH = 200;
    double left = 40;
    double slot = (WIDTH - left - 20) / 10.0;
    double bw = (slot - 14) / 3;
    double height = top + plotH + 60;
    StringBuilder sb = new StringBuilder(open("fill-histogram", id, height, title,
        fills.size() + " " + rows + " counted by how full they are, in steps of 10% of"
            + " allocatable, for cpu, memory and pods."));
    String[] fillsOf = {null, "url(#" + id + "-dots)", "url(#" + id + "-ds)"};
    String[] classes = {"packed", "series2", "daemon"};
    for (int b = 0; b < 10; b++) {
      double x0 = left + b * slot + 7;
      for (int k = 0; k < counts.length; k++) {
        int c = counts[k][b];
        double h = plotH * c / max;
        double x = x0 + k * bw;
        sb.append("<g class=\"bucket\" data-resource=\"").append(WorkerFill.SHOWN.get(k))
            .append("\" data-bucket=\"").append(b).append("\"><title>")
            .append(esc(WorkerFill.SHOWN.get(k) + " " + b * 10 + "–" + (b + 1) * 10 + "%: " + c
                + " " + rows))
            .append("</title>");
        rect(sb, x, top + plotH - h, bw - 1, h, classes[k], fillsOf[k]);
        text(sb, x + bw / 2, top + plotH - h - 3, "label tiny mid", Integer.toString(c));
        sb.append("</g>");
      }
      text(sb, x0 + 1.5 * bw, top + plotH + 14, "label small mid", b * 10 + "–" + (b + 1) * 10 + "%");
    }
    sb.append("<line class=\"axis\" x1=\"").append(n(left)).append("\" y1=\"")
        .append(n(top + plotH)).append("\" x2=\"").append(n(WIDTH - 20)).append("\" y2=\"")
        .append(n(top + plotH)).append("\"/>");
    double ly = top + plotH + 30;
    double lx = left;
    for (int k = 0; k < counts.length; k++) {
      rect(sb, lx, ly, 22, 12, classes[k], fillsOf[k]);
      text(sb, lx + 28, ly + 10, "label small", WorkerFill.SHOWN.get(k));
      lx += 110;
    }
    sb.append("</svg>\n");
    return sb.toString();
  }

  /** One panel of a comparison: a horizontal bar per profile, the value written beside it. */
  record Panel(String title, List<Double> values, List<String> shown) {}

  static String comparison(String id, List<String> profiles, List<Panel> panels) {
    return comparison(id, profiles, panels, "Host profiles compared",
        profiles.size() + " host profiles side by side: hosts and workers needed, utilization per"
            + " resource and relative cost.");
  }

  /** Panels of horizontal bars, one bar per entry of {@code profiles}, with a title and desc. */
  static String comparison(String id, List<String> profiles, List<Panel> panels, String title,
      String desc) {
    double labelW = 200;
    double barW = WIDTH - labelW - 120;
    double bar = 14;
    double panelH = 24 + profiles.size() * (bar + 6) + 10;
    double height = panels.size() * panelH + 10;
    StringBuilder sb = new StringBuilder(open("comparison", id, height, title, desc));
    double y = 10;
    for (Panel p : panels) {
      sb.append("<g class=\"panel\">");
      text(sb, 4, y + 12, "label strong", p.title());
      double max = 0;
      for (double v : p.values()) {
        max = Math.max(max, v);
      }
      double yy = y + 22;
      for (int i = 0; i < profiles.size(); i++) {
        text(sb, 12, yy + bar - 3, "label small", profiles.get(i));
        double w = max <= 0 ? 0 : barW * p.values().get(i) / max;
        rect(sb, labelW, yy, w, bar, i % 2 == 0 ? "packed" : "series2",
            i % 2 == 0 ? null : "url(#" + id + "-dots)");
        text(sb, labelW + w + 6, yy + bar - 3, "label small", p.shown().get(i));
        yy += bar + 6;
      }
      sb.append("</g>\n");
      y += panelH;
    }
    sb.append("</svg>\n");
    return sb.toString();
  }

  /** One oversize pod's resource: its request against the room of the one-node worker. */
  record Over(String workload, String resource, long request, long room, long over) {}

  static String oversize(String id, List<Over> rows) {
    double labelW = 330;
    double barW = WIDTH - labelW - 20;
    double bar = 16;
    double rowH = bar + 26;
    double height = 14 + rows.size() * rowH + 24;
    StringBuilder sb = new StringBuilder(open("oversize", id, height,
        "Oversize pods",
        rows.size() + " resource requests of pods larger than the room of a one-node worker; the"
            + " line marks that room."));
    double y = 14;
    for (Over o : rows) {
      sb.append("<g class=\"oversize-pod\"><title>")
          .append(esc(o.workload() + ": " + o.resource() + " request "
              + Units.amount(o.resource(), o.request()) + ", room "
              + Units.amount(o.resource(), o.room()) + ", over by "
              + Units.amount(o.resource(), o.over())))
          .append("</title>");
      text(sb, 4, y + bar - 4, "label small", o.workload());
      text(sb, 4, y + bar + 10, "label tiny", o.resource());
      double full = Math.max(1, Math.max(o.request(), o.room() + o.over()));
      double roomW = barW * o.room() / full;
      double overW = barW * o.over() / full;
      rect(sb, labelW, y, roomW, bar, "packed", null);
      rect(sb, labelW + roomW, y, overW, bar, "over", "url(#" + id + "-over)");
      sb.append("<line class=\"limit\" x1=\"").append(n(labelW + roomW)).append("\" y1=\"")
          .append(n(y - 4)).append("\" x2=\"").append(n(labelW + roomW)).append("\" y2=\"")
          .append(n(y + bar + 4)).append("\"/>");
      text(sb, labelW + 4, y + bar + 14, "label tiny",
          "room " + Units.amount(o.resource(), o.room()) + " | over by "
              + Units.amount(o.resource(), o.over()));
      sb.append("</g>\n");
      y += rowH;
    }
    rect(sb, 4, y, 22, 12, "packed", null);
    text(sb, 32, y + 10, "label small", "up to the one-node worker's room");
    rect(sb, 260, y, 22, 12, "over", "url(#" + id + "-over)");
    text(sb, 288, y + 10, "label small", "past it");
    sb.append("</svg>\n");
    return sb.toString();
  }
}
