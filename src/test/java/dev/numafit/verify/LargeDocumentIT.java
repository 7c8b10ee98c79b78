package dev.numafit.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A 50 MB manifest that is one YAML document (a {@code kind: List} of about 230,000 Pods,
 * generated here, not committed), read to the end with {@code --max-document-size 64Mi} in a
 * separate JVM with a bounded heap. Prints the time and the peak heap seen by the collector (from
 * its log) for docs/verification.md; those figures are recorded, not asserted (speed targets live
 * in benchmarks).
 */
class LargeDocumentIT {
  /** Heap of the child JVM: the JSON report of 230,000 workloads is itself about 100 MB. */
  static final String HEAP = "-Xmx2g";

  @TempDir Path tmp;

  @Test
  void demand_fiftyMegabyteListWithRaisedLimit_readToTheEnd() throws Exception {
    Path big = BoundedResourcesTest.bigManifest(tmp, 50L << 20);
    long size = Files.size(big);
    long pods = Files.lines(big).filter(l -> l.startsWith("- apiVersion: v1")).count();
    Path gcLog = tmp.resolve("gc.log");
    Path out = tmp.resolve("demand.json");
    List<String> cmd = new ArrayList<>(List.of(
        Path.of(System.getProperty("java.home"), "bin", "java").toString(), HEAP,
        "-Xlog:gc:file=" + gcLog, "-cp", System.getProperty("java.class.path"),
        "dev.numafit.cli.Main", "demand", "-f", big.toString(), "--max-document-size", "64Mi",
        "-o", "json", "--out", out.toString()));
    long start = System.nanoTime();
    Processes.Result r = Processes.run(cmd, tmp, Map.of(), Duration.ofMinutes(20));
    double seconds = (System.nanoTime() - start) / 1e9;
    assertEquals(0, r.exitCode(), r.stderr());
    assertFalse(r.stderr().contains("error:") || r.stderr().contains("\tat "), r.stderr());
    String report = Files.readString(out, StandardCharsets.UTF_8);
    // Every Pod is sized: the first and the last one generated are in the report.
    assertTrue(report.contains("\"name\": \"ledger-0\""), report.substring(0, 300));
    assertTrue(report.contains("\"name\": \"ledger-" + (pods - 1) + "\""),
        "last pod ledger-" + (pods - 1) + " missing");
    System.out.printf(java.util.Locale.ROOT,
        "large document: %d bytes, %d pods in one YAML document, read and sized in %.0f s,"
            + " peak heap %d MB (%s, from the GC log; load average %s)%n",
        size, pods, seconds, peakHeapMb(gcLog), HEAP, loadAverage());
  }

  /** The one-minute load average where the system shows it (timings here are noisy). */
  static String loadAverage() {
    try {
      return Files.readString(Path.of("/proc/loadavg")).split(" ")[0];
    } catch (java.io.IOException | RuntimeException ex) {
      return "unknown";
    }
  }

  /** The largest heap occupancy before a collection in a {@code -Xlog:gc} log, in MB. */
  static long peakHeapMb(Path gcLog) throws java.io.IOException {
    Pattern used = Pattern.compile("(\\d+)M->(\\d+)M\\(");
    long peak = 0;
    for (String line : Files.readAllLines(gcLog)) {
      Matcher m = used.matcher(line);
      if (m.find()) {
        peak = Math.max(peak, Long.parseLong(m.group(1)));
      }
    }
    return peak;
  }
}
