package dev.numafit.report;

import dev.numafit.demand.Workload;
import dev.numafit.resource.Resources;
import java.util.List;
import java.util.Map;

/**
 * {@code demand -o text}: a table of workloads with per-pod requests, a details block per workload
 * (source, where the peak count came from, limits, QoS, exclusive CPUs, flags), totals at peak, and
 * what was skipped. Warnings are not part of it: the CLI prints them to standard error.
 */
public final class DemandTextWriter implements ReportWriter<DemandReport> {
  @Override
  public String render(DemandReport report) {
    StringBuilder sb = new StringBuilder();
    List<Workload> ws = report.demand().workloads();
    sb.append("Workloads: ").append(ws.size()).append(" (requests per pod)\n");
    if (!ws.isEmpty()) {
      sb.append(table(ws).render("  "));
      sb.append("\nDetails:\n");
      for (Workload w : ws) {
        sb.append(details(w));
      }
    }
    DemandTotals t = DemandTotals.of(report.demand());
    sb.append('\n');
    sb.append(
        TextSupport.wrap(
            "",
            "  ",
            "At peak: "
                + t.podsAtPeak()
                + " pods requesting "
                + Units.vector(t.requestsAtPeak())
                + "."));
    if (t.perWorkerPods() > 0) {
      sb.append(
          TextSupport.wrap(
              "",
              "  ",
              "On every worker: "
                  + t.perWorkerPods()
                  + (t.perWorkerPods() == 1 ? " pod" : " pods")
                  + " (DaemonSets) requesting "
                  + Units.vector(t.perWorkerRequests())
                  + "."));
    }
    List<Workload> custom = report.demand().unsizedCustom();
    if (!custom.isEmpty()) {
      sb.append("\nCustom workloads not sized (use --include-custom to size them, as a guess):\n");
      sb.append(table(custom).render("  "));
    }
    Map<String, Integer> skipped = report.demand().skippedByKind();
    if (!skipped.isEmpty()) {
      sb.append('\n').append(skippedLine(skipped));
    }
    return sb.toString();
  }

  static String skippedLine(Map<String, Integer> skipped) {
    int total = skipped.values().stream().mapToInt(i -> i).sum();
    List<String> kinds = new java.util.ArrayList<>();
    skipped.forEach((k, n) -> kinds.add(k + " " + n));
    kinds.set(kinds.size() - 1, kinds.get(kinds.size() - 1) + ".");
    return TextSupport.wrapItems(
        "Skipped "
            + total
            + (total == 1 ? " object" : " objects")
            + " of "
            + skipped.size()
            + (skipped.size() == 1 ? " kind" : " kinds")
            + " that run no pods: ",
        "  ",
        kinds);
  }

  private static TextTable table(List<Workload> ws) {
    TextTable t = new TextTable("WORKLOAD", ">REPLICAS", ">PEAK", ">CPU", ">MEMORY", "QOS");
    for (Workload w : ws) {
      Resources r = w.pod().requests();
      t.row(
          w.id().toString(),
          w.perWorker() ? "-" : Integer.toString(w.replicas().declared()),
          w.perWorker() ? "each" : Integer.toString(w.replicas().peak()),
          Units.cpu(r.get(Resources.CPU)),
          Units.bytes(r.get(Resources.MEMORY)),
          w.pod().qos().label());
    }
    return t;
  }

  private static String details(Workload w) {
    StringBuilder d = new StringBuilder();
    d.append("from ").append(w.source());
    if (w.perWorker()) {
      d.append("; one pod on every worker");
    } else {
      d.append("; peak ")
          .append(w.replicas().peak())
          .append(" from ")
          .append(w.replicas().peakSource());
    }
    Resources other =
        w.pod().requests().without(Resources.CPU).without(Resources.MEMORY);
    if (!other.isEmpty()) {
      d.append("; also requests ").append(Units.vector(other));
    }
    d.append("; limits ")
        .append(w.pod().limits().isEmpty() ? "none" : Units.vector(w.pod().limits()));
    if (w.pod().exclusiveCpus() > 0) {
      d.append("; pins ").append(w.pod().exclusiveCpus()).append(" exclusive CPUs");
    }
    List<String> flags = DemandJsonWriter.flags(w);
    if (!flags.isEmpty()) {
      d.append("; flags: ").append(String.join(", ", flags));
    }
    if (w.guess()) {
      d.append("; a guess");
    }
    return TextSupport.wrap("  " + w.id() + ": ", "      ", d + ".");
  }
}
