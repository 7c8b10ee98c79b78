package dev.numafit.report.kubelet;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.resource.Resources;
import dev.numafit.shape.KubeletReserve;
import dev.numafit.shape.ShapeKind;
import dev.numafit.shape.WorkerShape;
import io.fabric8.kubernetes.api.model.Quantity;
import java.math.BigDecimal;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;
import tools.jackson.dataformat.yaml.YAMLMapper;

class KubeletConfigWriterTest {
  private static final long MI = 1L << 20;
  private static final long GI = 1L << 30;
  private final KubeletConfigWriter writer = new KubeletConfigWriter();

  @Test
  void render_spanningShape_reservedMemorySumsTo5220Mi() {
    // FACTS check value 7 (K16, "Utilizing the NUMA-aware Memory Manager"): kube-reserved 4Gi +
    // system-reserved 1Gi + the default 100Mi eviction threshold → reserved memory totals 5220Mi.
    WorkerShape spanning = new WorkerShape(ShapeKind.TWO_NODES, 1, 2, 24, 96 * GI, Resources.EMPTY);
    KubeletReserve reserve =
        new KubeletReserve(
            Optional.of(Resources.of("cpu", 100L, "memory", 4 * GI)),
            Resources.of("memory", GI),
            Resources.of("memory", 100 * MI),
            110);
    JsonNode root = new YAMLMapper().readTree(writer.render(spanning, reserve));
    long total = 0;
    for (JsonNode entry : root.get("reservedMemory")) {
      total += Quantity.getAmountInBytes(
          Quantity.parse(entry.get("limits").get("memory").asString())).longValueExact();
    }
    assertEquals(5220 * MI, total);
    assertEquals(2, root.get("reservedMemory").size());
    assertEquals("static", root.get("cpuManagerPolicy").asString());
    assertEquals("single-numa-node", root.get("topologyManagerPolicy").asString());
    assertEquals("pod", root.get("topologyManagerScope").asString());
    assertEquals("Static", root.get("memoryManagerPolicy").asString());
  }

  @Test
  void render_oneNodeShapeWithDefaults_exactText() {
    // Tiered kube-reserved for 16 vCPU / 64Gi: 110m and 5612Mi (TieredReserveTest); eviction
    // memory.available<100Mi and nodefs.available<10% (K12); maxPods 110 (K13).
    WorkerShape shape =
        new WorkerShape(ShapeKind.ONE_NODE, 1, 1, 16, 64 * GI,
            Resources.of("ephemeral-storage", 100 * GI));
    assertEquals(
        """
        # Kubelet configuration for a worker of 16 vCPUs and 64Gi (1-node, 1 NUMA node).
        # Merge into your kubelet configuration; verify against your hardware's documentation
        # and a load test, and follow your organisation's change practice.
        apiVersion: kubelet.config.k8s.io/v1beta1
        kind: KubeletConfiguration
        kubeReserved:
          cpu: 110m
          memory: 5612Mi
        evictionHard:
          memory.available: 100Mi
          nodefs.available: 10%
        maxPods: 110
        """,
        writer.render(shape, KubeletReserve.defaults()));
  }

  @Test
  void render_nineNodeHostShape_raisesMaxAllowableNumaNodes() {
    // FACTS A5 / check value 18 (K14): above 8 NUMA nodes the Topology Manager needs
    // max-allowable-numa-nodes.
    WorkerShape host = new WorkerShape(ShapeKind.HOST, 1, 9, 90, 500 * GI, Resources.EMPTY);
    JsonNode root = new YAMLMapper().readTree(writer.render(host, KubeletReserve.defaults()));
    assertEquals("9",
        root.get("topologyManagerPolicyOptions").get("max-allowable-numa-nodes").asString());
    assertEquals(9, root.get("reservedMemory").size());
  }

  @Test
  void render_sameInputTwice_sameBytes() {
    WorkerShape shape = new WorkerShape(ShapeKind.SOCKET, 1, 4, 46, 239 * GI, Resources.EMPTY);
    KubeletReserve r = KubeletReserve.defaults().withEvictionPercent("memory", BigDecimal.ONE);
    assertEquals(writer.render(shape, r), writer.render(shape, r));
  }

  @Test
  void write_file_writtenWhole(@TempDir Path dir) throws Exception {
    WorkerShape shape = new WorkerShape(ShapeKind.ONE_NODE, 1, 1, 8, 32 * GI, Resources.EMPTY);
    Path out = dir.resolve("sub").resolve("kubelet-config.yaml");
    writer.write(out, shape, KubeletReserve.defaults());
    assertEquals(writer.render(shape, KubeletReserve.defaults()), Files.readString(out));
    try (var files = Files.list(out.getParent())) {
      assertEquals(1, files.count()); // no temporary file left behind
    }
    assertTrue(Files.readString(out).contains("maxPods: 110"));
  }
}
