package dev.numafit.cluster;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.numafit.cluster.model.ClusterModel;
import dev.numafit.diag.InputException;
import org.junit.jupiter.api.Test;

/** Snapshot files that are not what numafit wrote are refused with file:line and the reason. */
class SnapshotFileTest {
  private static String error(String text) {
    InputException ex = assertThrows(InputException.class,
        () -> SnapshotFile.parse(text, "snap.json"));
    return ex.diagnostics().get(0).format();
  }

  @Test
  void parse_otherSchemaVersion_refusedNamingTheVersion() {
    assertEquals("snap.json:1: error: schemaVersion 2 is not supported (expected 1; write the"
        + " snapshot again with this numafit)",
        error("{\"schemaVersion\":2,\"kind\":\"ClusterSnapshot\",\"server\":\"x\"}"));
  }

  @Test
  void parse_notJson_refusedWithTheLine() {
    assertEquals("snap.json:2: error: not valid JSON: Unexpected character ('}' (code 125)):"
        + " expected a value",
        error("{\"schemaVersion\":1,\n\"server\":}"));
  }

  @Test
  void parse_podWithoutWorkload_refusedWithThePodsLine() {
    String text = "{\"schemaVersion\":1,\"kind\":\"ClusterSnapshot\",\"server\":\"x\",\n"
        + "\"pods\":[\n{\"namespace\":\"a\",\"name\":\"p\",\"phase\":\"Running\",\"requests\":{}}\n]}";
    assertEquals("snap.json:3: error: missing field \"workload\" (expected a string)",
        error(text));
  }

  @Test
  void parse_noSchemaVersion_refused() {
    assertEquals("snap.json:1: error: missing schemaVersion (expected 1; is this a numafit"
        + " snapshot?)", error("{\"server\":\"x\"}"));
  }

  @Test
  void parse_minimalSnapshot_emptyModel() throws Exception {
    ClusterModel m = SnapshotFile.parse(
        "{\"schemaVersion\":1,\"kind\":\"ClusterSnapshot\",\"server\":\"https://x\"}", "s");
    assertEquals("https://x", m.server());
    assertEquals(0, m.pods().size());
  }
}
