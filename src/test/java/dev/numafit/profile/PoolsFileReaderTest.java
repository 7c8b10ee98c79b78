package dev.numafit.profile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.demand.Taint;
import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.resource.Resources;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The WorkerPools format of docs/pools.md: the cold-chain example reads as documented, and every
 * wrong field is one {@code file:line: error:} message, all of them together.
 */
class PoolsFileReaderTest {
  static final Path EXAMPLE = Path.of("manifests-examples/cold-chain/pools.yaml");

  private static List<String> errors(String text, Path base) {
    InputException ex =
        assertThrows(InputException.class, () -> new PoolsFileReader().parse("p.yaml", text, base));
    return ex.diagnostics().stream().map(Diagnostic::format).toList();
  }

  private static List<String> errors(String text) {
    return errors(text, Path.of("."));
  }

  @Test
  void read_coldChainExample_threePoolsAsDocumented() throws Exception {
    List<PoolSpec> pools = new PoolsFileReader().read(EXAMPLE);
    assertEquals(List.of("general", "batch", "ingest"), pools.stream().map(PoolSpec::name).toList());
    PoolSpec batch = pools.get(1);
    assertEquals(Map.of("frostline.example/tier", "batch"), batch.labels());
    assertEquals(List.of(new Taint("dedicated", "batch", Taint.Effect.NO_SCHEDULE)), batch.taints());
    assertEquals(2, batch.workersPerNode());
    assertEquals(
        Optional.of(Path.of("host-profiles/two-socket-four-nodes-per-socket.yaml").toAbsolutePath()),
        batch.hostProfile());
    // worker {cpu: 8, memory: 32Gi}: 8000 millicores, 32 × 2^30 bytes.
    assertEquals(
        Optional.of(Resources.of(Resources.CPU, 8000L, Resources.MEMORY, 32L << 30)),
        pools.get(2).worker());
    assertEquals(Optional.empty(), pools.get(0).worker());
    // "- name: batch" is on line 13 of the example file.
    assertEquals(13, batch.source().line());
  }

  @Test
  void parse_wrongHeaderAndUnknownField_eachNamedWithLine() {
    String text =
        """
        apiVersion: numafit.dev/v1
        kind: WorkerPool
        spec:
          pools:
            - name: general
              colour: blue
        """;
    assertEquals(
        List.of(
            "p.yaml:1: error: apiVersion: expected numafit.dev/v1alpha1, got numafit.dev/v1",
            "p.yaml:2: error: kind: expected WorkerPools, got WorkerPool",
            "p.yaml:6: error: spec.pools[0].colour: unknown field; expected one of name, labels,"
                + " taints, hostProfile, worker, workersPerNode"),
        errors(text));
  }

  @Test
  void parse_badPoolFields_allReportedWithLines() {
    String text =
        """
        apiVersion: numafit.dev/v1alpha1
        kind: WorkerPools
        spec:
          pools:
            - name: General_Pool
              labels:
                "bad key!": x
                tier: "has space"
              taints:
                - key: dedicated
                  effect: NoWhere
                - value: x
                  effect: NoSchedule
              worker: {cpu: 1.5, memory: lots}
              workersPerNode: 0
            - name: b
              hostProfile: missing.yaml
            - name: b
              worker: {cpu: 4, memory: 16Gi}
        """;
    List<String> e = errors(text);
    assertEquals(
        List.of(
            "p.yaml:5: error: spec.pools[0].name: expected a name of lower-case letters, digits"
                + " and '-' (at most 63, starting and ending with a letter or digit), got"
                + " General_Pool",
            "p.yaml:7: error: spec.pools[0].labels.bad key!: expected a label key such as"
                + " example.com/tier (an optional DNS prefix and '/', then a name of at most 63"
                + " letters, digits, '-', '_', '.')",
            "p.yaml:8: error: spec.pools[0].labels.tier: expected a label value (at most 63"
                + " letters, digits, '-', '_', '.'), got has space",
            "p.yaml:11: error: spec.pools[0].taints[0].effect: expected NoSchedule,"
                + " PreferNoSchedule or NoExecute, got NoWhere",
            "p.yaml:12: error: spec.pools[0].taints[1].key: missing; expected a taint key such as"
                + " dedicated",
            "p.yaml:14: error: spec.pools[0].worker.cpu: expected whole vCPUs (1 or more) such as"
                + " 16, got 1.5",
            "p.yaml:14: error: spec.pools[0].worker.memory: expected a size above zero such as"
                + " 64Gi, got lots",
            "p.yaml:15: error: spec.pools[0].workersPerNode: expected a whole number from 1 to 64,"
                + " got 0",
            "p.yaml:17: error: spec.pools[1].hostProfile: no such file missing.yaml (relative to"
                + " this file's folder)",
            "p.yaml:18: error: spec.pools[2].name: pool b is already defined on line 16"),
        e);
  }

  @Test
  void parse_noPools_andMalformedYaml_reported() {
    assertEquals(
        List.of("p.yaml:4: error: spec.pools: expected a list of one or more pools, got a list"),
        errors("apiVersion: numafit.dev/v1alpha1\nkind: WorkerPools\nspec:\n  pools: []\n"));
    List<String> bad = errors("apiVersion: [\n");
    assertEquals(1, bad.size());
    assertTrue(bad.get(0).startsWith("p.yaml:"), bad.get(0));
    assertTrue(bad.get(0).contains("error: malformed YAML"), bad.get(0));
    assertEquals(
        List.of("p.yaml:1: error: expected a WorkerPools document, the file is empty"),
        errors(""));
  }

  @Test
  void parse_hostProfileRelativeToFile(@TempDir Path dir) throws Exception {
    Files.createDirectories(dir.resolve("hosts"));
    Files.writeString(dir.resolve("hosts/h.yaml"), "x");
    List<PoolSpec> pools =
        new PoolsFileReader()
            .parse(
                "p.yaml",
                """
                apiVersion: numafit.dev/v1alpha1
                kind: WorkerPools
                spec:
                  pools:
                    - name: general
                      hostProfile: hosts/h.yaml
                      worker: one-node
                """,
                dir);
    assertEquals(Optional.of(dir.resolve("hosts/h.yaml")), pools.get(0).hostProfile());
    assertEquals(1, pools.get(0).workersPerNode());
  }
}
