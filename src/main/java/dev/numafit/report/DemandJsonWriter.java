package dev.numafit.report;

import dev.numafit.demand.Workload;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;

/**
 * {@code demand -o json}: {@code schemaVersion}, {@code workloads}, {@code customNotSized}, {@code
 * skipped}, {@code totals}, {@code warnings}; schema in docs/schema/demand.schema.json.
 */
public final class DemandJsonWriter implements ReportWriter<DemandReport> {
  @Override
  public String render(DemandReport report) {
    Map<String, Object> root = JsonSupport.object();
    root.put("schemaVersion", JsonSupport.SCHEMA_VERSION);
    root.put("workloads", workloads(report.demand().workloads()));
    root.put("customNotSized", workloads(report.demand().unsizedCustom()));
    Map<String, Object> skipped = JsonSupport.object();
    skipped.put("byKind", new java.util.TreeMap<>(report.demand().skippedByKind()));
    skipped.put(
        "total", report.demand().skippedByKind().values().stream().mapToInt(i -> i).sum());
    root.put("skipped", skipped);
    DemandTotals t = DemandTotals.of(report.demand());
    Map<String, Object> totals = JsonSupport.object();
    totals.put("podsAtPeak", t.podsAtPeak());
    totals.put("requestsAtPeak", JsonSupport.resources(t.requestsAtPeak()));
    totals.put("perWorkerPods", t.perWorkerPods());
    totals.put("perWorkerRequests", JsonSupport.resources(t.perWorkerRequests()));
    root.put("totals", totals);
    root.put("warnings", JsonSupport.diagnostics(report.warnings()));
    return JsonSupport.write(root);
  }

  static List<Object> workloads(List<Workload> ws) {
    List<Object> out = new ArrayList<>();
    for (Workload w : ws) {
      Map<String, Object> m = JsonSupport.object();
      m.put("workload", w.id().toString());
      m.put("kind", w.id().kind());
      m.put("namespace", w.id().namespace());
      m.put("name", w.id().name());
      Map<String, Object> src = JsonSupport.object();
      src.put("file", w.source().file());
      src.put("line", w.source().line());
      m.put("source", src);
      Map<String, Object> rep = JsonSupport.object();
      rep.put("declared", w.replicas().declared());
      rep.put("peak", w.replicas().peak());
      rep.put("peakSource", w.replicas().peakSource());
      m.put("replicas", rep);
      m.put("requests", JsonSupport.resources(w.pod().requests()));
      m.put("limits", JsonSupport.resources(w.pod().limits()));
      m.put("qos", w.pod().qos().label());
      m.put("exclusiveCpus", w.pod().exclusiveCpus());
      m.put("flags", flags(w));
      m.put("perWorker", w.perWorker());
      m.put("guess", w.guess());
      out.add(m);
    }
    return out;
  }

  /** Workload and pod flags together, sorted and without duplicates. */
  static List<String> flags(Workload w) {
    TreeSet<String> f = new TreeSet<>(w.flags());
    f.addAll(w.pod().flags());
    return new ArrayList<>(f);
  }
}
