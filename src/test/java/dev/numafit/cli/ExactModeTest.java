package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code plan --exact} through {@link Main#run}: a published vector instance run as pods, the
 * wording of each report, and the inputs it refuses.
 */
class ExactModeTest {
  static final String PARCEL = "manifests-examples/parcel-delivery";
  static final String PROFILE = "host-profiles/two-socket-one-node-per-socket.yaml";

  @TempDir Path dir;

  /** class7_40_3_1 (bench/SOURCE.md in the test resources) as pods; see {@link PublishedAsPods}. */
  private Path publishedInstanceAsManifest() throws IOException {
    return PublishedAsPods.write(dir, "class7_40_3_1.vbp");
  }

  private CliRun planExact(Path manifest, String... more) {
    String[] base = {
      "plan", "-f", manifest.toString(), "--worker",
      "cpu=150,memory=150Gi,example.com/slots=150", "--kubelet-reserve", "none", "--max-pods",
      "1000", "--exact"
    };
    String[] args = new String[base.length + more.length];
    System.arraycopy(base, 0, args, 0, base.length);
    System.arraycopy(more, 0, args, base.length, more.length);
    return CliRun.of(args);
  }

  @Test
  void plan_exactOnPublishedInstance_provesPublishedOptimum() throws IOException {
    CliRun r = planExact(publishedInstanceAsManifest());
    assertEquals(0, r.code(), r.err());
    // Proven optimum 17: OPT column of results_data/Panigrahy_summary_known.csv, repository
    // Vectorpack/experiments_vector_paper (bench/SOURCE.md).
    assertTrue(r.out().contains("(no packing can use fewer than 17)"), r.out());
    assertTrue(r.out().contains("Exact search      proved optimal"), r.out());
  }

  @Test
  void plan_exactJson_carriesProofObject() throws IOException {
    CliRun r = planExact(publishedInstanceAsManifest(), "-o", "json");
    assertEquals(0, r.code(), r.err());
    // Optimum 17 as above; the heuristic alone uses more here (published best heuristic 18), so
    // the search had to spend nodes.
    assertTrue(r.out().contains("\"workersNeeded\": 17"), r.out());
    assertTrue(r.out().contains("\"provedOptimal\": true"), r.out());
    assertFalse(r.out().contains("\"nodes\": 0,"), r.out());
  }

  @Test
  void plan_exactJson_matchesPublishedSchema() throws IOException {
    CliRun r = planExact(publishedInstanceAsManifest(), "-o", "json");
    assertEquals(0, r.code(), r.err());
    var schema =
        com.networknt.schema.SchemaRegistry.withDefaultDialect(
                com.networknt.schema.SpecificationVersion.DRAFT_2020_12)
            .getSchema(Files.readString(Path.of("docs/schema/plan.schema.json")));
    var json = new tools.jackson.databind.json.JsonMapper().readTree(r.out());
    assertEquals(java.util.List.of(), schema.validate(json));
    // The schema is not vacuous for the new object: an unknown key in it is rejected.
    ((tools.jackson.databind.node.ObjectNode) json.get("plans").get(0).get("exact"))
        .put("proved", true);
    assertFalse(schema.validate(json).isEmpty());
  }

  @Test
  void plan_exactEffortZero_saysBestFoundWithinLimit() throws IOException {
    // --effort 0 leaves no search nodes; this instance's lower bound (16, lower_bound column of
    // the benchmark index) is below its optimum 17, so nothing can be proved.
    CliRun r = planExact(publishedInstanceAsManifest(), "--effort", "0", "-o", "markdown");
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("best found within the effort limit"), r.out());
    assertFalse(r.out().contains("proved optimal"), r.out());
  }

  @Test
  void plan_exactHtml_saysProvedOptimal() throws IOException {
    CliRun r = planExact(publishedInstanceAsManifest(), "-o", "html");
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("data-json=\"/plans/0/exact/provedOptimal\" data-value=\"true\""
        + ">proved optimal<"), r.out());
  }

  @Test
  void plan_withoutExact_hasNoExactFigures() throws IOException {
    CliRun r =
        CliRun.of("plan", "-f", publishedInstanceAsManifest().toString(), "--worker",
            "cpu=150,memory=150Gi,example.com/slots=150", "--kubelet-reserve", "none",
            "--max-pods", "1000", "-o", "json");
    assertEquals(0, r.code(), r.err());
    assertFalse(r.out().contains("\"exact\""), r.out());
  }

  @Test
  void plan_exactWithSpreadRules_refusedInOneLine() {
    CliRun r =
        CliRun.of("plan", "-f", PARCEL, "--host-profile", PROFILE, "--spread-replicas-across",
            "workers", "--exact");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("--exact covers rule-free inputs only"), r.err());
    // One error line (the usage hint that every usage error carries follows it).
    assertEquals(1, r.err().lines().filter(l -> l.startsWith("error:")).count(), r.err());
    assertEquals("", r.out());
  }

  @Test
  void plan_exactAboveFiveHundredPods_refused() throws IOException {
    Path file = dir.resolve("many.yaml");
    Files.writeString(file, """
        apiVersion: apps/v1
        kind: Deployment
        metadata:
          name: web
          namespace: shop
        spec:
          replicas: 501
          selector:
            matchLabels:
              app: web
          template:
            metadata:
              labels:
                app: web
            spec:
              containers:
                - name: web
                  image: web:1
                  resources:
                    requests:
                      cpu: 100m
                      memory: 128Mi
        """);
    CliRun r =
        CliRun.of("plan", "-f", file.toString(), "--worker", "cpu=16,memory=64Gi", "--exact",
            "--effort", "1000");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("--exact covers at most 500 pods to pack, this input has 501"),
        r.err());
  }

  @Test
  void plan_exactOnParcelExample_provedAtLowerBound() {
    // The parcel example packs to its lower bound of 2 workers (golden
    // plan-parcel-two-socket.txt), so the proof needs no search.
    CliRun r = CliRun.of("plan", "-f", PARCEL, "--host-profile", PROFILE, "--exact", "-o", "json");
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("\"workersNeeded\": 2"), r.out());
    assertTrue(r.out().contains("\"provedOptimal\": true"), r.out());
    assertTrue(r.out().contains("\"nodes\": 0"), r.out());
  }
}
