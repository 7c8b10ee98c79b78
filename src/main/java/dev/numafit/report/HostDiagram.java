package dev.numafit.report;

import dev.numafit.host.HostProfile;
import dev.numafit.host.NumaNode;
import dev.numafit.plan.Plan;
import dev.numafit.shape.HostLayout;
import dev.numafit.shape.ShapeDeriver;
import dev.numafit.shape.WorkerShape;
import java.util.ArrayList;
import java.util.List;

/**
 * The text report's compact picture of one host: per socket, one row per NUMA node with a CPU bar
 * and a memory bar, each filled with the hypervisor's share ({@code h}), the worker VMs ({@code #}
 * and {@code =} in turn, so neighbours stay apart) and what is free ({@code .}). Characters carry
 * the meaning; colour, where the terminal allows it, only repeats it.
 */
final class HostDiagram {
  private static final char HYPERVISOR = 'h';
  private static final char FREE = '.';
  private static final char[] WORKER = {'#', '='};

  private HostDiagram() {}

  /** One cell run of a bar: how many units of what. */
  record Part(char mark, double units) {}

  static String render(PlanHost host, Plan plan, TextStyle style) {
    HostProfile p = host.profile();
    HostLayout layout = host.layout();
    WorkerShape shape = plan.worker();
    int[] reserved = ShapeDeriver.reservedCoresPerNode(p);
    double hvShare = p.nodes().isEmpty() ? 0 : (double) p.hypervisorMemoryBytes() / p.nodes().size();
    // "      node 12  cpu [" + bar + "]  mem [" + bar + "]  " + up to 19 columns of text.
    int bar = Math.max(5, Math.min(40, (style.width() - 50) / 2));

    // Worker numbers by node, in layout order, so a split worker keeps its mark on every node.
    List<List<Integer>> workersOn = new ArrayList<>();
    for (int i = 0; i < p.nodes().size(); i++) {
      workersOn.add(new ArrayList<>());
    }
    int number = 0;
    for (HostLayout.Group g : layout.groups()) {
      for (int k = 0; k < g.workers(); k++) {
        for (int id : g.nodes()) {
          workersOn.get(indexOf(p, id)).add(number);
        }
        number++;
      }
    }

    StringBuilder sb = new StringBuilder();
    sb.append(TextSupport.wrap(style.width(), "  ", "    ",
        "Host layout, one host: " + layout.workers() + (layout.workers() == 1 ? " worker" : " workers")
            + " (" + WORKER[0] + " and " + WORKER[1] + " worker VMs, " + HYPERVISOR
            + " hypervisor, " + FREE + " free):"));
    int socket = -1;
    for (int i = 0; i < p.nodes().size(); i++) {
      NumaNode node = p.nodes().get(i);
      if (node.socket() != socket) {
        socket = node.socket();
        sb.append("    socket ").append(socket).append('\n');
      }
      HostLayout.Group g = layout.groupOf(node.id());
      int span = g.nodes().size();
      List<Part> cpu = new ArrayList<>();
      List<Part> mem = new ArrayList<>();
      cpu.add(new Part(HYPERVISOR, reserved[i]));
      mem.add(new Part(HYPERVISOR, hvShare));
      for (int w : workersOn.get(i)) {
        cpu.add(new Part(WORKER[w % 2], (double) shape.vcpus() / span));
        mem.add(new Part(WORKER[w % 2],
            (double) (shape.memoryBytes() + p.perVmOverheadBytes()) / span));
      }
      double cpuUsed = cpu.stream().mapToDouble(Part::units).sum();
      double memUsed = mem.stream().mapToDouble(Part::units).sum();
      cpu.add(new Part(FREE, Math.max(0, node.cores() - cpuUsed)));
      mem.add(new Part(FREE, Math.max(0, node.memoryBytes() - memUsed)));
      String label = String.format("node %-2d", node.id());
      int here = workersOn.get(i).size();
      String count = (here == 1 ? "1 worker" : here + " workers")
          + (span > 1 ? " on " + span + " nodes" : "");
      sb.append("      ").append(label).append("  cpu [").append(bar(cpu, bar, style))
          .append("]  mem [").append(bar(mem, bar, style)).append("]  ").append(count)
          .append('\n');
    }
    return sb.toString();
  }

  private static int indexOf(HostProfile p, int id) {
    for (int i = 0; i < p.nodes().size(); i++) {
      if (p.nodes().get(i).id() == id) {
        return i;
      }
    }
    throw new IllegalArgumentException("no node " + id);
  }

  /**
   * {@code parts} drawn in {@code width} cells: each part ends at the cell nearest its running
   * total, so the cells add up to the width; a part too small for a cell of its own still gets
   * one, taken from the largest part, so a thin hypervisor share does not vanish.
   */
  static String bar(List<Part> parts, int width, TextStyle style) {
    double total = parts.stream().mapToDouble(Part::units).sum();
    int[] cells = new int[parts.size()];
    double running = 0;
    int drawn = 0;
    for (int i = 0; i < parts.size(); i++) {
      running += parts.get(i).units();
      int end = total <= 0 ? 0 : (int) Math.round(running / total * width);
      cells[i] = Math.max(0, end - drawn);
      drawn += cells[i];
    }
    for (int i = 0; i < parts.size(); i++) {
      if (cells[i] == 0 && parts.get(i).units() > 0) {
        int largest = 0;
        for (int j = 1; j < cells.length; j++) {
          if (cells[j] > cells[largest]) {
            largest = j;
          }
        }
        if (cells[largest] > 1) {
          cells[largest]--;
          cells[i] = 1;
        }
      }
    }
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < parts.size(); i++) {
      String run = String.valueOf(parts.get(i).mark()).repeat(cells[i]);
      sb.append(switch (parts.get(i).mark()) {
        case HYPERVISOR -> style.paint("90", run);
        case FREE -> run;
        default -> style.paint("34", run);
      });
    }
    int totalCells = java.util.Arrays.stream(cells).sum();
    if (totalCells < width) {
      sb.append(String.valueOf(FREE).repeat(width - totalCells));
    }
    return sb.toString();
  }
}
