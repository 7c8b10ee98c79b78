package dev.numafit.report.check;

import dev.numafit.check.CheckReport;
import dev.numafit.check.Finding;
import dev.numafit.check.Rule;
import dev.numafit.diag.Severity;
import dev.numafit.diag.SourceRef;
import java.net.URI;
import java.net.URISyntaxException;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * {@code check -o sarif}: a SARIF 2.1.0 log (OASIS Static Analysis Results Interchange Format) with
 * one run. The driver lists every {@link Rule} with its id, title and help; each finding is a
 * result with its rule, level ({@code error}, {@code warning}, {@code note} from the rule's
 * severity), message, a physical location (file as a relative URI, start line) and, with a
 * baseline, a {@code baselineState} of {@code new} or {@code unchanged}. A fingerprint of workload
 * and rule lets code-scanning views follow a finding when its line moves.
 */
public final class CheckSarifWriter implements CheckWriter {
  /** Where the SARIF 2.1.0 schema is published. */
  public static final String SCHEMA_URI =
      "https://docs.oasis-open.org/sarif/sarif/v2.1.0/errata01/os/schemas/sarif-schema-2.1.0.json";

  @Override
  public String render(CheckReport r) {
    Map<String, Object> root = Json.object();
    root.put("$schema", SCHEMA_URI);
    root.put("version", "2.1.0");
    Map<String, Object> driver = Json.object();
    driver.put("name", "numafit");
    List<Object> rules = new ArrayList<>();
    for (Rule rule : Rule.values()) {
      Map<String, Object> d = Json.object();
      d.put("id", rule.id());
      d.put("name", camel(rule.id()));
      d.put("shortDescription", text(rule.title()));
      d.put("fullDescription", text(rule.help()));
      d.put("help", text(rule.help() + " See docs/check-rules.md."));
      Map<String, Object> config = Json.object();
      config.put("level", level(rule.severity()));
      d.put("defaultConfiguration", config);
      rules.add(d);
    }
    driver.put("rules", rules);
    Map<String, Object> tool = Json.object();
    tool.put("driver", driver);
    List<Object> results = new ArrayList<>();
    for (CheckReport.Entry e : r.findings()) {
      Finding f = e.finding();
      Map<String, Object> res = Json.object();
      res.put("ruleId", f.rule().id());
      res.put("ruleIndex", f.rule().ordinal());
      res.put("level", level(f.severity()));
      res.put("message", text(f.subject() + ": " + f.message()));
      location(f.location()).ifPresent(l -> res.put("locations", List.of(l)));
      Map<String, Object> fp = Json.object();
      fp.put("numafitFindingKey/v1", f.key().workload() + "|" + f.rule().id());
      res.put("partialFingerprints", fp);
      if (r.baselineGiven()) {
        res.put("baselineState", e.isNew() ? "new" : "unchanged");
      }
      Map<String, Object> props = Json.object();
      props.put("workload", f.workload().map(Object::toString).orElse(null));
      props.put("failsGate", e.failing());
      Map<String, Object> amounts = Json.object();
      f.amounts().asMap().forEach(amounts::put);
      props.put("amounts", amounts);
      res.put("properties", props);
      results.add(res);
    }
    Map<String, Object> run = Json.object();
    run.put("tool", tool);
    run.put("results", results);
    run.put("columnKind", "unicodeCodePoints");
    Map<String, Object> runProps = Json.object();
    runProps.put("result", r.passed() ? "pass" : "fail");
    runProps.put("capacity", CheckText.capacity(r));
    runProps.put("worker", r.worker());
    run.put("properties", runProps);
    root.put("runs", List.of(run));
    return Json.write(root);
  }

  static String level(Severity s) {
    return switch (s) {
      case ERROR -> "error";
      case WARNING -> "warning";
      case NOTE -> "note";
    };
  }

  private static Map<String, Object> text(String s) {
    Map<String, Object> m = Json.object();
    m.put("text", s);
    return m;
  }

  /** {@code pod-exceeds-worker} → {@code PodExceedsWorker}, SARIF's customary rule name. */
  private static String camel(String id) {
    StringBuilder b = new StringBuilder();
    for (String part : id.split("-")) {
      b.append(Character.toUpperCase(part.charAt(0))).append(part.substring(1));
    }
    return b.toString();
  }

  /** A physical location for a file and line; none for a place that is not a file. */
  private static java.util.Optional<Map<String, Object>> location(SourceRef at) {
    if (at.file().startsWith("(") || at.file().equals("<stdin>")) {
      return java.util.Optional.empty();
    }
    String uri;
    try {
      String path = at.file().replace('\\', '/');
      uri = path.startsWith("/")
          ? new URI("file", "", path, null).toASCIIString()
          : new URI(null, null, path, null).toASCIIString();
    } catch (URISyntaxException ex) {
      return java.util.Optional.empty();
    }
    Map<String, Object> artifact = Json.object();
    artifact.put("uri", uri);
    Map<String, Object> physical = Json.object();
    physical.put("artifactLocation", artifact);
    if (at.line() > 0) {
      Map<String, Object> region = Json.object();
      region.put("startLine", at.line());
      physical.put("region", region);
    }
    Map<String, Object> loc = Json.object();
    loc.put("physicalLocation", physical);
    return java.util.Optional.of(loc);
  }
}
