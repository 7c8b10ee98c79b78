package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.networknt.schema.Error;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * {@code plan --pools} end to end on the cold-chain example (docs/pools.md). Which pool takes
 * which workload follows from the node rules of "Assigning Pods to Nodes" and "Taints and
 * Tolerations" (kubernetes.io); worker counts are worked out beside each check.
 */
class PoolsCliTest {
  static final String MANIFESTS = "manifests-examples/cold-chain/manifests/";
  static final String POOLS = "manifests-examples/cold-chain/pools.yaml";
  static final String TWO_SOCKET = "host-profiles/two-socket-one-node-per-socket.yaml";
  private static final JsonMapper JSON = new JsonMapper();

  private static Schema planSchema() throws Exception {
    return SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12)
        .getSchema(Files.readString(Path.of("docs/schema/plan.schema.json")));
  }

  @Test
  void plan_coldChainPools_jsonValidAndWorkloadsInTheirPools() throws Exception {
    CliRun r = CliRun.of("plan", "-f", MANIFESTS, "--pools", POOLS, "-o", "json");
    assertEquals(0, r.code(), r.err());
    JsonNode root = JSON.readTree(r.out());
    List<Error> errors = planSchema().validate(root);
    assertEquals(List.of(), errors);
    JsonNode pools = root.get("pools");
    assertEquals(3, pools.size());
    assertEquals("general", pools.get(0).get("name").asString());
    // sensor-api has no node rules: the first pool, general.
    assertEquals("coldchain/Deployment/sensor-api", pools.get(0).get("workloads").get(0).asString());
    // route-batch selects the batch tier and tolerates dedicated=batch:NoSchedule.
    assertEquals("coldchain/Job/route-batch", pools.get(1).get("workloads").get(0).asString());
    // telemetry-ingest requires disktype In [ssd] and tolerates the NoExecute taint.
    assertEquals(
        "coldchain/StatefulSet/telemetry-ingest", pools.get(2).get("workloads").get(0).asString());
    // log-shipper tolerates nothing: only the untainted general pool carries it.
    assertEquals("[\"coldchain/DaemonSet/log-shipper\",\"coldchain/DaemonSet/node-metrics\"]",
        pools.get(0).get("daemonSets").toString());
    assertEquals("[\"coldchain/DaemonSet/node-metrics\"]", pools.get(2).get("daemonSets").toString());
    assertEquals("[\"dedicated=ingest:NoExecute\"]", pools.get(2).get("taints").toString());
    JsonNode unplaceable = root.get("unplaceable");
    assertEquals(1, unplaceable.size());
    assertEquals("coldchain/Deployment/temperature-archive",
        unplaceable.get(0).get("workload").asString());
    JsonNode plans = root.get("plans");
    // batch: 6 pods at once (parallelism 6, "Jobs": running pods = parallelism) of 4 cpu on
    // 5-vCPU workers (two per NUMA node): a worker's room of under 8 cpu holds one, so 6 workers.
    assertEquals("split-node", plans.get(1).get("worker").get("kind").asString());
    assertEquals(6, plans.get(1).get("workersNeeded").asInt());
    // ingest: 3 pods of 3 cpu on the given 8-vCPU worker, room under 9 cpu: 2 per worker, 2 workers.
    assertEquals(8, plans.get(2).get("worker").get("vcpus").asInt());
    assertEquals(2, plans.get(2).get("workersNeeded").asInt());
    assertEquals(JSON.readTree(r.out()), JSON.readTree(CliRun.of("plan", "-f", MANIFESTS,
        "--pools", POOLS, "-o", "json").out()), "same input, same output");
  }

  @Test
  void plan_coldChainPools_textHasPoolSectionsTableAndUnplaceable() {
    CliRun r = CliRun.of("plan", "-f", MANIFESTS, "--pools", POOLS);
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("Pool batch on host profile two-socket-8-nodes\n"), r.out());
    assertTrue(r.out().contains("  Taints            dedicated=batch:NoSchedule\n"), r.out());
    assertTrue(r.out().contains("\nPools:\n  POOL "), r.out());
    assertTrue(r.out().contains("\nUnplaceable (node rules no pool satisfies; not packed):\n"
        + "  coldchain/Deployment/temperature-archive: pool general: required node\n"), r.out());
    assertFalse(r.out().contains("Comparison:"), r.out());
  }

  @Test
  void plan_markdownAndHtml_carryPoolsAndUnplaceable() {
    CliRun md = CliRun.of("plan", "-f", MANIFESTS, "--pools", POOLS, "-o", "markdown");
    assertEquals(0, md.code(), md.err());
    assertTrue(md.out().contains("## Worker pools\n"), md.out());
    assertTrue(md.out().contains("## Unplaceable workloads\n"), md.out());
    assertTrue(md.out().contains("## Pool ingest on host profile two-socket-32c\n"), md.out());
    CliRun html = CliRun.of("plan", "-f", MANIFESTS, "--pools", POOLS, "-o", "html");
    assertEquals(0, html.code(), html.err());
    assertTrue(html.out().contains("<section id=\"pools\">"), html.out());
    assertTrue(html.out().contains("<section id=\"unplaceable\">"), html.out());
  }

  @Test
  void plan_badPoolsFile_exitsTwoWithFileAndLine(@TempDir Path tmp) throws Exception {
    Path pools = tmp.resolve("pools.yaml");
    Files.writeString(
        pools,
        """
        apiVersion: numafit.dev/v1alpha1
        kind: WorkerPools
        spec:
          pools:
            - name: general
              worker: {cpu: 8, memory: 32Gi}
              taints:
                - key: dedicated
                  effect: Sometimes
        """);
    CliRun r = CliRun.of("plan", "-f", MANIFESTS, "--pools", pools.toString());
    assertEquals(2, r.code(), r.err());
    assertEquals("", r.out());
    assertTrue(
        r.err().contains(pools + ":9: error: spec.pools[0].taints[0].effect: expected"
            + " NoSchedule, PreferNoSchedule or NoExecute, got Sometimes"),
        r.err());
    assertFalse(r.err().contains("Exception"), r.err());
  }

  @Test
  void plan_poolsWithTwoHostProfiles_usageError() {
    CliRun r = CliRun.of("plan", "-f", MANIFESTS, "--pools", POOLS, "--host-profile", TWO_SOCKET,
        "--host-profile", "host-profiles/two-socket-four-nodes-per-socket.yaml");
    assertEquals(2, r.code(), r.err());
    assertTrue(r.err().contains("--pools takes at most one --host-profile"), r.err());
  }

  @Test
  void plan_poolWithoutProfileOrWorker_namesThePool(@TempDir Path tmp) throws Exception {
    Path pools = tmp.resolve("pools.yaml");
    Files.writeString(pools, "apiVersion: numafit.dev/v1alpha1\nkind: WorkerPools\nspec:\n"
        + "  pools:\n    - name: general\n");
    CliRun r = CliRun.of("plan", "-f", MANIFESTS, "--pools", pools.toString());
    assertEquals(2, r.code(), r.err());
    assertTrue(r.err().contains("pool general (" + pools + ":5) has no host profile and no"
        + " worker"), r.err());
  }

  @Test
  void plan_withoutPools_selectorNoPoolHas_listedUnplaceable(@TempDir Path tmp) throws Exception {
    // "Assigning Pods to Nodes": nodeSelector disktype: ssd needs a node with that label; the one
    // pool of a plan without --pools has none.
    Path m = tmp.resolve("app.yaml");
    Files.writeString(
        m,
        """
        apiVersion: apps/v1
        kind: Deployment
        metadata: {name: ssd-only, namespace: shop}
        spec:
          replicas: 2
          selector: {matchLabels: {app: ssd-only}}
          template:
            metadata: {labels: {app: ssd-only}}
            spec:
              nodeSelector: {disktype: ssd}
              containers:
                - name: app
                  image: registry.example.com/shop/app:1
                  resources: {requests: {cpu: "1", memory: 1Gi}}
        """);
    CliRun r = CliRun.of("plan", "-f", m.toString(), "--worker", "cpu=8,memory=32Gi", "-o", "json");
    assertEquals(0, r.code(), r.err());
    JsonNode root = JSON.readTree(r.out());
    assertEquals(List.of(), planSchema().validate(root));
    assertFalse(root.has("pools"));
    assertEquals("shop/Deployment/ssd-only", root.get("unplaceable").get(0).get("workload").asString());
    assertEquals("nodeSelector disktype=ssd: the pool's workers have no label disktype",
        root.get("unplaceable").get(0).get("reason").asString());
    assertEquals(0, root.get("plans").get(0).get("workersNeeded").asInt());
  }

  @Test
  void plan_kubeletConfig_onePerPool(@TempDir Path tmp) {
    CliRun r = CliRun.of("plan", "-f", MANIFESTS, "--pools", POOLS, "--kubelet-config",
        tmp.toString(), "-o", "json");
    assertEquals(0, r.code(), r.err());
    for (String pool : List.of("general", "batch", "ingest")) {
      assertTrue(Files.exists(tmp.resolve(pool + ".kubelet-config.yaml")), pool);
    }
  }

  @Test
  void plan_poolsFromConfigFile_relativeToTheConfigFolder(@TempDir Path tmp) throws Exception {
    // docs/config-file.md: paths in the config file are relative to its folder.
    Path conf = Files.createDirectories(tmp.resolve("conf"));
    Files.writeString(conf.resolve("pools.yaml"),
        "apiVersion: numafit.dev/v1alpha1\nkind: WorkerPools\nspec:\n  pools:\n"
            + "    - name: only\n      worker: {cpu: 8, memory: 32Gi}\n");
    Files.writeString(conf.resolve("numafit.yaml"), "pools: pools.yaml\n");
    CliRun r = CliRun.of("plan", "-f", MANIFESTS, "--config", conf.resolve("numafit.yaml").toString(),
        "-o", "json");
    assertEquals(0, r.code(), r.err());
    assertEquals("only", JSON.readTree(r.out()).get("pools").get(0).get("name").asString());
  }
}
