package dev.numafit.report.html;

import static dev.numafit.report.html.Html.esc;
import static dev.numafit.report.html.Html.n;

import dev.numafit.host.HostProfile;
import dev.numafit.host.MemoryChannel;
import dev.numafit.host.NumaNode;
import dev.numafit.plan.Plan;
import dev.numafit.report.PlanHost;
import dev.numafit.report.Units;
import dev.numafit.shape.HostLayout;
import dev.numafit.shape.ShapeDeriver;
import dev.numafit.shape.WorkerShape;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * Draws one host as inline SVG: sockets as rows, NUMA nodes as boxes with a CPU bar and a memory
 * bar (the hypervisor's share hatched, each worker VM a labelled segment, what is left dashed) and
 * the node's memory channels with their DIMMs (an empty channel cross-hatched and labelled).
 * Every node is one {@code g.numa-node} and every worker VM one {@code g.worker}, so a test can
 * count them; labels and patterns carry the meaning without colour.
 */
final class TopologySvg {
  private static final int WIDTH = 920;
  private static final int MARGIN = 10;
  private static final int SOCKET_PAD = 12;
  private static final int SOCKET_HEAD = 22;
  private static final int NODE_GAP = 10;
  private static final int NODE_HEIGHT = 176;
  private static final int MAX_COLUMNS = 4;
  private static final int BAR_HEIGHT = 18;

  private TopologySvg() {}

  /** Where a node box sits. */
  private record Box(double x, double y, double w) {
    double barX() {
      return x + 58;
    }

    double barW() {
      return w - 66;
    }

    double cpuY() {
      return y + 44;
    }

    double memY() {
      return y + 72;
    }
  }

  /** Scale of a node's two bars: units per full bar, and what is already used from the left. */
  private static final class NodeScale {
    double cpuUnits;
    double memUnits;
    double cpuUsed;
    double memUsed;
  }

  static String draw(String id, PlanHost host, Plan plan) {
    return draw(id, host, plan.worker());
  }

  /** {@code host} with its layout's worker VMs, each of {@code shape}. */
  static String draw(String id, PlanHost host, WorkerShape shape) {
    HostProfile p = host.profile();
    HostLayout layout = host.layout();
    int[] reservedCores = ShapeDeriver.reservedCoresPerNode(p);
    int nodeCount = p.nodes().size();
    double hvShare = nodeCount == 0 ? 0 : (double) p.hypervisorMemoryBytes() / nodeCount;

    // Lay out: one row band per socket, its nodes in rows of up to four.
    Map<Integer, List<NumaNode>> bySocket = new TreeMap<>();
    for (NumaNode node : p.nodes()) {
      bySocket.computeIfAbsent(node.socket(), k -> new ArrayList<>()).add(node);
    }
    Map<Integer, Box> boxes = new TreeMap<>();
    List<double[]> sockets = new ArrayList<>();
    double y = MARGIN;
    for (var e : bySocket.entrySet()) {
      List<NumaNode> nodes = e.getValue();
      int cols = Math.min(MAX_COLUMNS, nodes.size());
      int rows = (nodes.size() + cols - 1) / cols;
      double inner = WIDTH - 2 * MARGIN - 2 * SOCKET_PAD;
      double w = (inner - (cols - 1) * NODE_GAP) / cols;
      for (int i = 0; i < nodes.size(); i++) {
        double x = MARGIN + SOCKET_PAD + (i % cols) * (w + NODE_GAP);
        double ny = y + SOCKET_HEAD + (i / cols) * (NODE_HEIGHT + NODE_GAP);
        boxes.put(nodes.get(i).id(), new Box(x, ny, w));
      }
      double h = SOCKET_HEAD + rows * NODE_HEIGHT + (rows - 1) * NODE_GAP + SOCKET_PAD;
      sockets.add(new double[] {e.getKey(), y, h});
      y += h + NODE_GAP;
    }
    double legendY = y + 4;
    double height = legendY + 30;

    // Per node: how many vCPUs and bytes the bars stand for, so nothing overflows.
    Map<Integer, NodeScale> scales = new TreeMap<>();
    for (int i = 0; i < nodeCount; i++) {
      NumaNode node = p.nodes().get(i);
      HostLayout.Group g = layout.groupOf(node.id());
      int span = g.nodes().size();
      NodeScale s = new NodeScale();
      double vcpus = reservedCores[i] + (double) g.workers() * shape.vcpus() / span;
      double mem =
          hvShare + (double) g.workers() * (shape.memoryBytes() + p.perVmOverheadBytes()) / span;
      s.cpuUnits = Math.max(Math.max(node.cores(), vcpus), 1);
      s.memUnits = Math.max(Math.max(node.memoryBytes(), mem), 1);
      scales.put(node.id(), s);
    }

    StringBuilder sb = new StringBuilder();
    String title = "Topology of host profile " + p.name();
    sb.append("<svg class=\"topology\" xmlns=\"http://www.w3.org/2000/svg\" role=\"img\"")
        .append(" data-profile=\"").append(esc(p.name())).append('"')
        .append(" viewBox=\"0 0 ").append(WIDTH).append(' ').append(n(height)).append('"')
        .append(" width=\"").append(WIDTH).append("\" height=\"").append(n(height)).append('"')
        .append(" aria-labelledby=\"").append(id).append("-t ").append(id).append("-d\">\n");
    sb.append("<title id=\"").append(id).append("-t\">").append(esc(title)).append("</title>\n");
    sb.append("<desc id=\"").append(id).append("-d\">")
        .append(esc(describe(p, layout, shape)))
        .append("</desc>\n");
    Patterns.defs(sb, id);

    for (double[] s : sockets) {
      sb.append("<g class=\"socket\" data-socket=\"").append((int) s[0]).append("\">")
          .append("<rect x=\"").append(MARGIN).append("\" y=\"").append(n(s[1]))
          .append("\" width=\"").append(WIDTH - 2 * MARGIN).append("\" height=\"").append(n(s[2]))
          .append("\" class=\"socket-box\"/>")
          .append("<text x=\"").append(MARGIN + SOCKET_PAD).append("\" y=\"").append(n(s[1] + 16))
          .append("\" class=\"label strong\">Socket ").append((int) s[0]).append("</text></g>\n");
    }

    for (int i = 0; i < nodeCount; i++) {
      NumaNode node = p.nodes().get(i);
      node(sb, id, p, node, boxes.get(node.id()), scales.get(node.id()), reservedCores[i], hvShare);
    }

    // Worker VMs: one group each, with a segment in every node it covers.
    int workerNo = 0;
    for (HostLayout.Group g : layout.groups()) {
      int span = g.nodes().size();
      for (int k = 0; k < g.workers(); k++) {
        workerNo++;
        String label = "W" + workerNo;
        String where =
            span == 1 ? "on NUMA node " + g.nodes().get(0) : "split over NUMA nodes " + g.nodes();
        sb.append("<g class=\"worker\" data-worker=\"").append(workerNo).append("\"><title>")
            .append(esc("Worker VM " + workerNo + ": " + shape.vcpus() + " vCPU, "
                + Units.bytes(shape.memoryBytes()) + " memory, " + where))
            .append("</title>");
        for (int nodeId : g.nodes()) {
          Box b = boxes.get(nodeId);
          NodeScale s = scales.get(nodeId);
          double cpu = (double) shape.vcpus() / span;
          double mem = (double) (shape.memoryBytes() + p.perVmOverheadBytes()) / span;
          segment(sb, b.barX() + b.barW() * s.cpuUsed / s.cpuUnits, b.cpuY(),
              b.barW() * cpu / s.cpuUnits, "worker-seg", null, label);
          segment(sb, b.barX() + b.barW() * s.memUsed / s.memUnits, b.memY(),
              b.barW() * mem / s.memUnits, "worker-seg", null, label);
          s.cpuUsed += cpu;
          s.memUsed += mem;
        }
        sb.append("</g>\n");
      }
    }
    // What no worker uses, dashed.
    for (NumaNode node : p.nodes()) {
      Box b = boxes.get(node.id());
      NodeScale s = scales.get(node.id());
      double cpuLeft = s.cpuUnits - s.cpuUsed;
      if (cpuLeft > 1e-9) {
        segment(sb, b.barX() + b.barW() * s.cpuUsed / s.cpuUnits, b.cpuY(),
            b.barW() * cpuLeft / s.cpuUnits, "unused", null, "free");
      }
      double memLeft = s.memUnits - s.memUsed;
      if (memLeft > 1e-9) {
        segment(sb, b.barX() + b.barW() * s.memUsed / s.memUnits, b.memY(),
            b.barW() * memLeft / s.memUnits, "unused", null, "free");
      }
    }

    legend(sb, id, legendY);
    sb.append("</svg>\n");
    return sb.toString();
  }

  private static void node(
      StringBuilder sb,
      String id,
      HostProfile p,
      NumaNode node,
      Box b,
      NodeScale s,
      int reservedCores,
      double hvShare) {
    sb.append("<g class=\"numa-node\" data-node=\"").append(node.id()).append("\"><title>")
        .append(esc("NUMA node " + node.id() + ": " + node.cores() + " cores, "
            + node.threads() + " threads, " + Units.bytes(node.memoryBytes()) + " memory, "
            + (node.channelsConfirmed()
                ? node.populatedChannels() + " of " + node.channels().size() + " channels populated"
                : "channel population unconfirmed")))
        .append("</title>");
    sb.append("<rect class=\"node-box\" x=\"").append(n(b.x())).append("\" y=\"").append(n(b.y()))
        .append("\" width=\"").append(n(b.w())).append("\" height=\"").append(NODE_HEIGHT)
        .append("\"/>");
    text(sb, b.x() + 8, b.y() + 16, "label strong", "NUMA node " + node.id());
    text(sb, b.x() + 8, b.y() + 32, "label small",
        node.cores() + " cores × " + node.threadsPerCore() + ", "
            + Units.bytes(node.memoryBytes()));
    text(sb, b.x() + 8, b.cpuY() + 13, "label small", "CPU");
    text(sb, b.x() + 8, b.memY() + 13, "label small", "Memory");
    if (reservedCores > 0) {
      segment(sb, b.barX(), b.cpuY(), b.barW() * reservedCores / s.cpuUnits, "hypervisor",
          "url(#" + id + "-hv)", "hv " + reservedCores);
      s.cpuUsed = reservedCores;
    }
    if (hvShare > 0) {
      segment(sb, b.barX(), b.memY(), b.barW() * hvShare / s.memUnits, "hypervisor",
          "url(#" + id + "-hv)", "hv");
      s.memUsed = hvShare;
    }
    channels(sb, id, node, b);
    sb.append("</g>\n");
  }

  private static void channels(StringBuilder sb, String id, NumaNode node, Box b) {
    double top = b.y() + 100;
    text(sb, b.x() + 8, top + 12, "label small", "DIMMs");
    if (!node.channelsConfirmed() || node.channels().isEmpty()) {
      text(sb, b.barX(), top + 12, "label small", "not listed (memory given directly)");
      return;
    }
    int count = node.channels().size();
    double gap = 4;
    double cw = (b.barW() - (count - 1) * gap) / count;
    double h = NODE_HEIGHT - (top - b.y()) - 8;
    for (int c = 0; c < count; c++) {
      MemoryChannel ch = node.channels().get(c);
      double x = b.barX() + c * (cw + gap);
      sb.append("<g class=\"channel").append(ch.populated() ? "" : " empty-channel")
          .append("\"><title>")
          .append(esc("channel " + ch.name() + ": " + (ch.populated()
              ? ch.dimmBytes().size() + " DIMM(s), " + Units.bytes(ch.totalBytes())
              : "empty (no DIMM): this node loses the channel's bandwidth")))
          .append("</title>");
      sb.append("<rect x=\"").append(n(x)).append("\" y=\"").append(n(top)).append("\" width=\"")
          .append(n(cw)).append("\" height=\"").append(n(h)).append("\" class=\"channel-box\"")
          .append(ch.populated() ? "" : " fill=\"url(#" + id + "-empty)\"").append("/>");
      if (ch.populated()) {
        int dimms = ch.dimmBytes().size();
        double dh = Math.min(16, (h - 4 - 2 * (dimms - 1)) / dimms);
        for (int d = 0; d < dimms; d++) {
          double dy = top + 2 + d * (dh + 2);
          sb.append("<rect class=\"dimm\" x=\"").append(n(x + 2)).append("\" y=\"").append(n(dy))
              .append("\" width=\"").append(n(cw - 4)).append("\" height=\"").append(n(dh))
              .append("\"/>");
          if (cw > 34 && dh >= 10) {
            text(sb, x + cw / 2, dy + dh - 3, "label tiny mid on-dark",
                Units.bytes(ch.dimmBytes().get(d)));
          }
        }
      } else {
        text(sb, x + cw / 2, top + h / 2 + 4, "label small mid strong", "empty");
      }
      sb.append("</g>");
    }
  }

  /** A bar segment; its label is drawn inside when there is room. */
  private static void segment(
      StringBuilder sb, double x, double y, double w, String cls, String fill, String label) {
    if (w <= 0) {
      return;
    }
    sb.append("<rect class=\"").append(cls).append("\" x=\"").append(n(x)).append("\" y=\"")
        .append(n(y)).append("\" width=\"").append(n(Math.max(w, 0.5))).append("\" height=\"")
        .append(BAR_HEIGHT).append('"');
    if (fill != null) {
      sb.append(" fill=\"").append(fill).append('"');
    }
    sb.append("/>");
    if (label != null && w >= label.length() * 6.5 + 4) {
      String textClass = cls.equals("worker-seg") ? "label small mid on-dark" : "label small mid";
      text(sb, x + w / 2, y + 13, textClass + (cls.equals("hypervisor") ? " boxed" : ""), label);
    }
  }

  private static void text(StringBuilder sb, double x, double y, String cls, String s) {
    sb.append("<text x=\"").append(n(x)).append("\" y=\"").append(n(y)).append("\" class=\"")
        .append(cls).append("\">").append(esc(s)).append("</text>");
  }

  private static void legend(StringBuilder sb, String id, double y) {
    double x = MARGIN;
    sb.append("<g class=\"legend\">");
    x = legendItem(sb, x, y, "worker-seg", null, "W1… worker VM");
    x = legendItem(sb, x, y, "hypervisor", "url(#" + id + "-hv)", "hv: hypervisor's share");
    x = legendItem(sb, x, y, "unused", null, "free: not used by a worker");
    x = legendItem(sb, x, y, "dimm", null, "DIMM");
    legendItem(sb, x, y, "channel-box", "url(#" + id + "-empty)", "empty channel");
    sb.append("</g>\n");
  }

  private static double legendItem(
      StringBuilder sb, double x, double y, String cls, String fill, String label) {
    sb.append("<rect class=\"").append(cls).append("\" x=\"").append(n(x)).append("\" y=\"")
        .append(n(y)).append("\" width=\"22\" height=\"14\"")
        .append(fill == null ? "" : " fill=\"" + fill + "\"").append("/>");
    text(sb, x + 28, y + 11, "label small", label);
    return x + 40 + label.length() * 6.6;
  }

  /** The picture in words, for screen readers. */
  static String describe(HostProfile p, HostLayout layout, WorkerShape shape) {
    StringBuilder sb = new StringBuilder();
    sb.append(p.sockets()).append(p.sockets() == 1 ? " socket, " : " sockets, ")
        .append(p.nodes().size()).append(" NUMA nodes. ");
    sb.append(layout.workers()).append(" worker VMs of ").append(shape.vcpus()).append(" vCPU and ")
        .append(Units.bytes(shape.memoryBytes())).append(" per host");
    sb.append(layout.spanning() ? ", each split over " + layout.groups().get(0).nodes().size()
        + " nodes. " : ". ");
    sb.append("Hypervisor keeps ").append(Units.bytes(p.hypervisorMemoryBytes()))
        .append(" of memory and ").append(p.hypervisorCores())
        .append(p.hypervisorCores() == 1 ? " core." : " cores.");
    for (NumaNode node : p.nodes()) {
      long empty = node.channels().size() - node.populatedChannels();
      if (node.channelsConfirmed() && empty > 0) {
        sb.append(" Node ").append(node.id()).append(" has ").append(empty)
            .append(empty == 1 ? " empty memory channel." : " empty memory channels.");
      }
    }
    return sb.toString();
  }
}
