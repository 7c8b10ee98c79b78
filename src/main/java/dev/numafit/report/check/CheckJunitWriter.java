package dev.numafit.report.check;

import dev.numafit.check.CheckReport;
import dev.numafit.check.Finding;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

/**
 * {@code check -o junit}: JUnit XML as the Ant JUnit task writes it (a {@code testsuite} root with
 * {@code properties}, {@code testcase}s, {@code system-out} and {@code system-err}), which CI test
 * reporters read. One test case per workload, plus {@code (fleet)} when {@code --fleet-hosts} is
 * given; a test case fails when it has a finding that fails the gate, and its failure lists those
 * findings. Every finding, failing or not, is also in {@code system-out}.
 *
 * <p>Attributes the format requires but that would change from run to run get fixed values, so the
 * same change gives the same bytes: {@code timestamp="1970-01-01T00:00:00"}, {@code
 * hostname="localhost"}, {@code time="0"}.
 */
public final class CheckJunitWriter implements CheckWriter {
  /** The fixed timestamp of every report. */
  public static final String TIMESTAMP = "1970-01-01T00:00:00";

  /** The fixed hostname of every report ("localhost", as the schema suggests when unknown). */
  public static final String HOSTNAME = "localhost";

  /** The fixed duration, in seconds, of the suite and each case. */
  public static final String TIME = "0";

  private static final String FLEET = "(fleet)";

  @Override
  public String render(CheckReport r) {
    Map<String, List<CheckReport.Entry>> byCase = new TreeMap<>();
    for (String w : r.workloads()) {
      byCase.put(w, new ArrayList<>());
    }
    if (r.fleetHosts().isPresent()) {
      byCase.put(FLEET, new ArrayList<>());
    }
    for (CheckReport.Entry e : r.findings()) {
      byCase.computeIfAbsent(e.finding().subject(), k -> new ArrayList<>()).add(e);
    }
    int failures = 0;
    for (List<CheckReport.Entry> list : byCase.values()) {
      if (list.stream().anyMatch(CheckReport.Entry::failing)) {
        failures++;
      }
    }
    StringBuilder b = new StringBuilder();
    b.append("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n");
    b.append("<testsuite name=\"numafit check\" timestamp=\"").append(TIMESTAMP)
        .append("\" hostname=\"").append(HOSTNAME).append("\" tests=\"").append(byCase.size())
        .append("\" failures=\"").append(failures).append("\" errors=\"0\" skipped=\"0\" time=\"")
        .append(TIME).append("\">\n");
    b.append("  <properties>\n");
    property(b, "result", r.passed() ? "pass" : "fail");
    property(b, "capacity", CheckText.capacity(r));
    property(b, "worker", r.worker());
    b.append("  </properties>\n");
    for (Map.Entry<String, List<CheckReport.Entry>> c : byCase.entrySet()) {
      String name = c.getKey();
      b.append("  <testcase name=\"").append(attr(name)).append("\" classname=\"")
          .append(attr(classname(name))).append("\" time=\"").append(TIME).append('"');
      List<CheckReport.Entry> failing =
          c.getValue().stream().filter(CheckReport.Entry::failing).toList();
      if (failing.isEmpty()) {
        b.append("/>\n");
        continue;
      }
      b.append(">\n");
      List<String> rules = new ArrayList<>();
      StringBuilder body = new StringBuilder();
      for (CheckReport.Entry e : failing) {
        Finding f = e.finding();
        if (!rules.contains(f.rule().id())) {
          rules.add(f.rule().id());
        }
        body.append(line(f)).append('\n');
      }
      b.append("    <failure message=\"").append(attr(failing.get(0).finding().message()))
          .append("\" type=\"").append(attr(String.join(",", rules))).append("\">")
          .append(text(body.toString())).append("</failure>\n");
      b.append("  </testcase>\n");
    }
    StringBuilder out = new StringBuilder();
    for (CheckReport.Entry e : r.findings()) {
      out.append(line(e.finding())).append('\n');
    }
    out.append("Result: ").append(CheckText.verdict(r)).append('\n');
    b.append("  <system-out>").append(text(out.toString())).append("</system-out>\n");
    b.append("  <system-err></system-err>\n");
    b.append("</testsuite>\n");
    return b.toString();
  }

  private static String line(Finding f) {
    return f.location() + ": " + f.severity().label() + ": " + f.subject() + ": " + f.message()
        + " [" + f.rule().id() + "]";
  }

  /** {@code ns/Kind/name} → {@code numafit.ns.Kind}: reporters group cases by class name. */
  private static String classname(String workload) {
    String[] parts = workload.split("/");
    return parts.length == 3 ? "numafit." + parts[0] + "." + parts[1] : "numafit.fleet";
  }

  private static void property(StringBuilder b, String name, String value) {
    b.append("    <property name=\"").append(attr(name)).append("\" value=\"").append(attr(value))
        .append("\"/>\n");
  }

  private static String attr(String s) {
    return text(s).replace("\"", "&quot;").replace("\n", "&#10;");
  }

  /** XML character data: markup escaped, characters XML 1.0 cannot hold dropped. */
  private static String text(String s) {
    StringBuilder b = new StringBuilder(s.length());
    s.codePoints().forEach(cp -> {
      switch (cp) {
        case '&' -> b.append("&amp;");
        case '<' -> b.append("&lt;");
        case '>' -> b.append("&gt;");
        default -> {
          boolean legal = cp == 0x9 || cp == 0xA || cp == 0xD
              || (cp >= 0x20 && cp <= 0xD7FF) || (cp >= 0xE000 && cp <= 0xFFFD)
              || cp >= 0x10000;
          if (legal) {
            b.appendCodePoint(cp);
          }
        }
      }
    });
    return b.toString();
  }
}
