package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.cluster.SnapshotFile;
import dev.numafit.review.ReviewerTest;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * {@code numafit review} reading numafit.yaml like plan and check: its own options from the file,
 * paths relative to the file, flags over the file, the other commands' keys passed over, unknown
 * keys refused with file:line. The snapshot is the ten-worker shop of {@link ReviewerTest}.
 */
class ReviewConfigTest {
  @TempDir Path dir;

  private void files(String config) throws Exception {
    Files.createDirectories(dir.resolve("cluster"));
    Files.writeString(dir.resolve("cluster/shop.json"),
        SnapshotFile.toText(ReviewerTest.tenWorkers().model()));
    Files.writeString(dir.resolve("numafit.yaml"), config);
  }

  private static JsonNode json(String out) {
    return JsonMapper.builder().build().readTree(out);
  }

  @Test
  void review_optionsFromNumafitYaml_usedWithPathsRelativeToTheFile() throws Exception {
    // A file shared with plan: filename and max-utilization are plan's, passed over by review.
    files("""
        filename: [deploy/]
        max-utilization: 85
        snapshot: cluster/shop.json
        pool: pool=general
        nodes: 7
        output: json
        """);
    Path elsewhere = Files.createDirectories(dir.resolve("sub"));
    CliRun r = CliRun.in(elsewhere, "", "review", "--config", "../numafit.yaml");
    // Ten to seven nodes leaves the three ledger pods pending (ReviewerTest): exit 1.
    assertEquals(1, r.code(), r.err());
    JsonNode doc = json(r.out());
    assertEquals(7, doc.get("nodes").get("after").asInt());
    assertEquals(3, doc.get("pending").size());
  }

  @Test
  void review_flagOverridesTheFile() throws Exception {
    files("""
        snapshot: cluster/shop.json
        pool: pool=general
        nodes: 7
        output: json
        """);
    CliRun r = CliRun.in(dir, "", "review", "--nodes", "10");
    // Ten nodes as today: every pod stays where it runs (ReviewerTest's scenario fits today).
    assertEquals(0, r.code(), r.err());
    assertEquals(10, json(r.out()).get("nodes").get("after").asInt());
  }

  @Test
  void review_unknownKey_errorWithFileAndLine() throws Exception {
    files("""
        snapshot: cluster/shop.json
        node-pools: pool=general
        """);
    CliRun r = CliRun.in(dir, "", "review", "--pool", "pool=general");
    assertEquals(2, r.code());
    assertTrue(r.err().startsWith("numafit.yaml:2: error: unknown option \"node-pools\" for numafit"
        + " review"), r.err());
  }

  @Test
  void review_noPoolAnywhere_usageError() throws Exception {
    files("""
        snapshot: cluster/shop.json
        """);
    CliRun r = CliRun.in(dir, "", "review");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("missing --pool KEY=VALUE"), r.err());
  }

  @Test
  void plan_reviewKeysInTheSharedFile_passedOver() throws Exception {
    files("""
        snapshot: cluster/shop.json
        pool: pool=general
        worker: cpu=4,memory=16Gi
        """);
    Files.writeString(dir.resolve("app.yaml"), """
        apiVersion: apps/v1
        kind: Deployment
        metadata: {name: web, namespace: shop}
        spec:
          replicas: 2
          template:
            spec:
              containers:
                - name: web
                  resources: {requests: {cpu: "1", memory: 1Gi}}
        """);
    CliRun r = CliRun.in(dir, "", "plan", "-f", dir.resolve("app.yaml").toString(), "-o",
        "json");
    assertEquals(0, r.code(), r.err());
    // Two pods of 1 CPU fit one 4-vCPU worker (allocatable after the default reserve).
    assertEquals(1, json(r.out()).get("plans").get(0).get("workersNeeded").asInt());
  }
}
