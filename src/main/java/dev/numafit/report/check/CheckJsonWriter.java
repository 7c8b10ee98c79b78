package dev.numafit.report.check;

import dev.numafit.check.CheckReport;
import dev.numafit.check.Finding;
import dev.numafit.diag.Diagnostic;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * {@code check -o json}: {@code schemaVersion}, {@code result} ({@code pass}/{@code fail}), {@code
 * failing}, {@code worker}, {@code capacity}, {@code findings}, {@code resolved}, {@code unchecked}
 * and {@code warnings}; documented in docs/check-rules.md. Amounts are integers: cpu in
 * millicores, the rest in bytes or counts.
 */
public final class CheckJsonWriter implements CheckWriter {
  /** The version of this document's layout. */
  public static final int SCHEMA_VERSION = 1;

  @Override
  public String render(CheckReport r) {
    Map<String, Object> root = Json.object();
    root.put("schemaVersion", SCHEMA_VERSION);
    root.put("result", r.passed() ? "pass" : "fail");
    root.put("failing", r.failingCount());
    root.put("worker", r.worker());
    Map<String, Object> cap = Json.object();
    cap.put("workers", r.head().workers());
    cap.put("hosts", r.head().hosts().isPresent() ? r.head().hosts().getAsInt() : null);
    cap.put("baseWorkers", r.base().map(b -> (Object) b.workers()).orElse(null));
    cap.put("baseHosts", r.base().flatMap(b -> b.hosts().isPresent()
        ? java.util.Optional.of((Object) b.hosts().getAsInt()) : java.util.Optional.empty())
        .orElse(null));
    cap.put("workersDelta", r.workersDelta().isPresent() ? r.workersDelta().getAsInt() : null);
    cap.put("hostsDelta", r.hostsDelta().isPresent() ? r.hostsDelta().getAsInt() : null);
    cap.put("fleetHosts", r.fleetHosts().isPresent() ? r.fleetHosts().getAsInt() : null);
    root.put("capacity", cap);
    root.put("baseline", r.baselineGiven());
    List<Object> findings = new ArrayList<>();
    for (CheckReport.Entry e : r.findings()) {
      Map<String, Object> m = finding(e.finding());
      m.put("new", e.isNew());
      m.put("failing", e.failing());
      findings.add(m);
    }
    root.put("findings", findings);
    List<Object> resolved = new ArrayList<>();
    r.resolved().forEach(f -> resolved.add(finding(f)));
    root.put("resolved", resolved);
    root.put("unchecked", r.unchecked());
    List<Object> warnings = new ArrayList<>();
    for (Diagnostic d : r.warnings()) {
      Map<String, Object> m = Json.object();
      m.put("severity", d.severity().label());
      m.put("file", d.source().map(s -> s.file()).orElse(null));
      m.put("line", d.source().map(s -> s.line() > 0 ? (Object) s.line() : null).orElse(null));
      m.put("message", d.message());
      warnings.add(m);
    }
    root.put("warnings", warnings);
    return Json.write(root);
  }

  private static Map<String, Object> finding(Finding f) {
    Map<String, Object> m = Json.object();
    m.put("rule", f.rule().id());
    m.put("severity", f.severity().label());
    m.put("workload", f.workload().map(Object::toString).orElse(null));
    m.put("file", f.location().file());
    m.put("line", f.location().line() > 0 ? f.location().line() : null);
    m.put("message", f.message());
    Map<String, Object> amounts = Json.object();
    f.amounts().asMap().forEach(amounts::put);
    m.put("amounts", amounts);
    return m;
  }
}
