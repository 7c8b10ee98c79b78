package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.cluster.SnapshotFile;
import dev.numafit.review.Pools;
import dev.numafit.review.ReviewerTest;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** {@code numafit review} end to end through Main on snapshot files (no cluster, no client). */
class ReviewCommandTest {
  @TempDir Path dir;

  /** The ten-worker scenario of {@link ReviewerTest#tenWorkers()} as a snapshot file. */
  private Path snapshot(Optional<String> namespace) throws Exception {
    Pools p = ReviewerTest.tenWorkers();
    p.namespace = namespace;
    Path f = dir.resolve("shop.json");
    Files.writeString(f, SnapshotFile.toText(p.model()));
    return f;
  }

  @Test
  void review_tenToSevenAsJson_exitOneAndTheLedgerPodsPending() throws Exception {
    CliRun r = CliRun.of("review", "--snapshot", snapshot(Optional.empty()).toString(),
        "--pool", "pool=general", "--nodes", "7", "-o", "json");
    assertEquals(1, r.code(), r.err());
    JsonNode doc = JsonMapper.builder().build().readTree(r.out());
    assertFalse(doc.get("fits").asBoolean());
    assertEquals(3, doc.get("pending").size());
    for (JsonNode p : doc.get("pending")) {
      assertEquals("shop/Deployment/ledger", p.get("workload").asString());
      assertTrue(p.get("pod").asString().startsWith("shop/ledger-"));
      assertEquals("0/7 nodes are available: 7 Insufficient cpu.", p.get("reason").asString());
    }
    assertEquals("w08", doc.get("scaleDown").get(0).get("node").asString());
    // (14 × 1950 + 3 × 2000 + 10 × 100) / 40000, see ReviewerTest.
    assertEquals("0.8575", doc.get("utilization").get("before").get("cpu").toString());
    assertEquals(1, doc.get("schemaVersion").asInt());
  }

  @Test
  void review_sameSnapshotTwice_sameBytes() throws Exception {
    Path s = snapshot(Optional.empty());
    CliRun a = CliRun.of("review", "--snapshot", s.toString(), "--pool", "pool=general",
        "--nodes", "7", "-o", "json");
    CliRun b = CliRun.of("review", "--snapshot", s.toString(), "--pool", "pool=general",
        "--nodes", "7", "-o", "json");
    assertEquals(a.out(), b.out());
  }

  @Test
  void review_text_verdictTablesAndCaution() throws Exception {
    CliRun r = CliRun.of("review", "--snapshot", snapshot(Optional.empty()).toString(),
        "--pool", "pool=general", "--nodes", "7");
    assertEquals(1, r.code(), r.err());
    assertTrue(r.out().contains("DOES NOT FIT: 10 → 7 nodes, pods running (17 pods,"
        + " DaemonSets apart)"), r.out());
    assertTrue(r.out().contains("3 pods would be pending."), r.out());
    assertTrue(r.out().contains("Caution: sized from declared requests."), r.out());
    for (String line : r.out().split("\n")) {
      assertTrue(line.length() <= 80, "80 columns: " + line);
    }
  }

  @Test
  void review_markdown_tablesForAChangeTicket() throws Exception {
    CliRun r = CliRun.of("review", "--snapshot", snapshot(Optional.empty()).toString(),
        "--pool", "pool=general", "--nodes", "7", "-o", "markdown");
    assertEquals(1, r.code(), r.err());
    assertTrue(r.out().startsWith("# Review of pool pool=general\n"), r.out());
    assertTrue(r.out().contains("| pod | workload | reason |"), r.out());
  }

  @Test
  void review_sameCount_fitsWithExitZero() throws Exception {
    CliRun r = CliRun.of("review", "--snapshot", snapshot(Optional.empty()).toString(),
        "--pool", "pool=general");
    assertEquals(0, r.code(), r.err() + r.out());
    assertTrue(r.out().contains("FITS: 10 → 10 nodes"), r.out());
  }

  @Test
  void review_namespaceLimitedSnapshot_warnsOnStandardError() throws Exception {
    CliRun r = CliRun.of("review", "--snapshot", snapshot(Optional.of("shop")).toString(),
        "--pool", "pool=general");
    assertTrue(r.err().contains("warning: the read was limited to namespace shop: pods of other"
        + " namespaces on the pool's nodes are not counted"), r.err());
  }

  @Test
  void review_hostProfile_nodesWiderThanOneNumaNodeListed() throws Exception {
    CliRun r = CliRun.of("review", "--snapshot", snapshot(Optional.empty()).toString(),
        "--pool", "pool=general", "-o", "json", "--host-profile",
        "host-profiles/two-socket-one-node-per-socket.yaml");
    assertEquals(0, r.code(), r.err());
    JsonNode doc = JsonMapper.builder().build().readTree(r.out());
    assertEquals("two-socket-32c", doc.get("hostProfile").asString());
    // One-node worker of that profile: 30 vCPUs (32 cores less 2 reserved on node 0), far
    // above these 4-CPU nodes: none spans.
    assertEquals(0, doc.get("spanning").size());
  }

  @Test
  void review_badOptions_usageErrorsTogether() throws Exception {
    CliRun r = CliRun.of("review", "--snapshot", snapshot(Optional.empty()).toString(),
        "--pool", "general", "--from", "yesterday", "-o", "yaml");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("error: --pool general: expected KEY=VALUE"), r.err());
    assertTrue(r.err().contains("error: --from yesterday: expected running or declared"),
        r.err());
    assertTrue(r.err().contains("unknown output format \"yaml\""), r.err());
  }

  @Test
  void review_unknownPool_inputError() throws Exception {
    CliRun r = CliRun.of("review", "--snapshot", snapshot(Optional.empty()).toString(),
        "--pool", "pool=gpu");
    assertEquals(2, r.code());
    assertEquals("error: --pool pool=gpu: no node has this label (10 nodes read)\n", r.err());
  }

  @Test
  void review_brokenSnapshot_fileAndLine() throws Exception {
    Path f = dir.resolve("broken.json");
    Files.writeString(f, "{\"schemaVersion\":1,\"kind\":\"ClusterSnapshot\",\n\"server\":\"x\",\n"
        + "\"nodes\":[\n{\"name\":\"w1\",\"capacity\":{\"cpu\":\"four\"},\"allocatable\":{}}\n]}\n");
    CliRun r = CliRun.of("review", "--snapshot", f.toString(), "--pool", "pool=general");
    assertEquals(2, r.code());
    assertEquals(f + ":4: error: capacity.cpu is \"four\" (expected an integer: cpu in"
        + " millicores, others in bytes or counts)\n", r.err());
  }

  @Test
  void review_partialSnapshot_statesTheMissingTypesAtTheTop() throws Exception {
    Pools p = ReviewerTest.tenWorkers();
    dev.numafit.cluster.model.ClusterModel m = p.model();
    Path f = dir.resolve("partial.json");
    Files.writeString(f, SnapshotFile.toText(new dev.numafit.cluster.model.ClusterModel(
        m.server(), m.namespace(), m.nodes(), m.pods(), m.budgets(), m.workloads(),
        java.util.List.of("policy/poddisruptionbudgets: 403 Forbidden (the drain plan ignores"
            + " disruption budgets)"), java.util.List.of())));
    CliRun text = CliRun.of("review", "--snapshot", f.toString(), "--pool", "pool=general");
    String[] lines = text.out().split("\n");
    assertEquals("Incomplete read, these types are missing:", lines[2]);
    assertEquals("  - policy/poddisruptionbudgets: 403 Forbidden (the drain plan ignores", lines[3]);
    CliRun json = CliRun.of("review", "--snapshot", f.toString(), "--pool", "pool=general",
        "-o", "json");
    JsonNode doc = JsonMapper.builder().build().readTree(json.out());
    assertEquals(1, doc.get("missing").size());
  }
}
