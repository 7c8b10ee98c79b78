package dev.numafit.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedWriter;
import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The hostile inputs in a separate JVM with a small heap (-Xmx192m) and a deadline: a 50 MB
 * manifest generated here (one YAML document, not committed, refused before it is read), the alias bomb and the 10,000-deep
 * document from the corpus. Each ends in its message; the valid manifest of the same run is still
 * sized; nothing runs out of memory.
 */
class BoundedResourcesTest {
  @TempDir Path tmp;

  static Path corpus(String name) throws URISyntaxException {
    return Path.of(BoundedResourcesTest.class.getResource("/bad-input/" + name).toURI());
  }

  /** One Deployment list of about {@code bytes} bytes, as one YAML document. */
  static Path bigManifest(Path dir, long bytes) throws IOException {
    Path f = dir.resolve("big.yaml");
    try (BufferedWriter w = Files.newBufferedWriter(f, StandardCharsets.UTF_8)) {
      w.write("apiVersion: v1\nkind: List\nitems:\n");
      long written = 0;
      for (int i = 0; written < bytes; i++) {
        String item = "- apiVersion: v1\n  kind: Pod\n  metadata:\n    name: ledger-" + i
            + "\n    namespace: billing\n  spec:\n    containers:\n    - name: c\n"
            + "      image: registry.example/ledger:1\n      resources:\n"
            + "        requests: {cpu: 100m, memory: 64Mi}\n";
        w.write(item);
        written += item.length();
      }
    }
    return f;
  }

  static Processes.Result numafit(Path dir, String... args) throws Exception {
    List<String> cmd = new java.util.ArrayList<>(List.of(
        Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-Xmx192m",
        "-XX:TieredStopAtLevel=1", "-cp", System.getProperty("java.class.path"),
        "dev.numafit.cli.Main"));
    cmd.addAll(List.of(args));
    return Processes.run(cmd, dir, Map.of(), Duration.ofMinutes(4));
  }

  @Test
  void demand_fiftyMegabytesAliasBombAndDeepNesting_refusedInBoundedMemory() throws Exception {
    Path big = bigManifest(tmp, 50L << 20);
    assertTrue(Files.size(big) >= 50L << 20);
    Path good = corpus("valid/storefront-web.yaml");
    Processes.Result r = numafit(tmp, "demand", "-f", big.toString(),
        "-f", corpus("manifest/alias-bomb.yaml").toString(),
        "-f", corpus("manifest/deep-nesting-10000.yaml").toString(),
        "-f", good.toString(), "--skip-invalid");
    String err = r.stderr();
    assertEquals(0, r.exitCode(), err);
    // The limit is 32Mi characters per input (ManifestReader.DEFAULT_MAX_DOCUMENT_CHARS).
    assertTrue(err.contains("big.yaml:1: error: this file is " + Files.size(big) + " bytes, more"
        + " than numafit reads from one input (33554432 characters); raise the limit with"
        + " --max-document-size"), err);
    assertTrue(err.contains("alias-bomb.yaml:6: error: YAML aliases in this document copy more"
        + " than 100000 values"), err);
    assertTrue(err.contains("deep-nesting-10000.yaml:3: error: nested deeper than 500 levels"),
        err);
    assertFalse(err.contains("OutOfMemoryError") || err.contains("\tat "), err);
    assertTrue(r.stdout().contains("storefront/Deployment/web"), r.stdout());
  }

  @Test
  void demand_documentAboveTheLimitWithRaisedLimit_read() throws Exception {
    // About 3 MB in one document: refused under a 2Mi limit, read under 4Mi, in the small heap.
    Path big = bigManifest(tmp, 3L << 20);
    Processes.Result refused = numafit(tmp, "demand", "--max-document-size", "2Mi", "-f",
        big.toString(), "-o", "json");
    assertEquals(2, refused.exitCode(), refused.stderr());
    assertTrue(refused.stderr().contains("big.yaml:1: error: this file is " + Files.size(big)
        + " bytes"), refused.stderr());
    Processes.Result read = numafit(tmp, "demand", "--max-document-size", "4Mi", "-f",
        big.toString(), "-o", "json");
    assertEquals(0, read.exitCode(), read.stderr());
    assertTrue(read.stdout().contains("\"name\": \"ledger-0\""), read.stdout().substring(0, 200));
  }
}
