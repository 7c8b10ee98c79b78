package dev.numafit.profile;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.numafit.diag.Diagnostic;
import dev.numafit.host.HostFacts;
import dev.numafit.resource.Resources;
import dev.numafit.shape.ShapeDeriver;
import dev.numafit.shape.ShapeKind;
import dev.numafit.shape.ShapeOptions;
import dev.numafit.shape.ShapeSet;
import dev.numafit.shape.WorkerShape;
import java.nio.file.Path;
import java.util.List;
import java.util.OptionalLong;
import org.junit.jupiter.api.Test;

/**
 * The shipped example profiles (host-profiles/, invented hosts) read cleanly and give the one-node
 * shapes worked by hand from the rules in docs/shapes.md.
 */
class ExampleProfilesTest {
  private static final long GI = 1L << 30;
  private static final ShapeDeriver DERIVER = new ShapeDeriver(ShapeOptions.defaults());

  private static ProfileLoad load(String name) throws Exception {
    return new HostProfileReader().read(Path.of("host-profiles", name));
  }

  @Test
  void twoSocketOneNodePerSocket_oneNodeShape_30VcpusAnd247Gi() throws Exception {
    ProfileLoad l = load("two-socket-one-node-per-socket.yaml");
    assertEquals(List.of(), l.warnings());
    ShapeSet s = DERIVER.derive(l.profile());
    // 32 cores − 2 reserved on node 0 = 30; 256Gi − 16Gi/2 − 512Mi = 247.5Gi → 247Gi.
    assertEquals(30, s.oneNode().vcpus());
    assertEquals(247 * GI, s.oneNode().memoryBytes());
    assertEquals(Resources.of("ephemeral-storage", 200 * GI), s.oneNode().extraCapacity());
    // One node per socket: the only spanning shape is the host, 30 + 32 vCPUs,
    // 512Gi − 16Gi − 512Mi = 495.5Gi → 495Gi.
    assertEquals(List.of(ShapeKind.HOST), s.spanning().stream().map(WorkerShape::kind).toList());
    assertEquals(62, s.spanning().get(0).vcpus());
    assertEquals(495 * GI, s.spanning().get(0).memoryBytes());
    // FACTS B1: eight DDR5-4800 channels × 38.4 GB/s = 307.2 GB/s per node.
    assertEquals(OptionalLong.of(307_200_000_000L),
        HostFacts.of(l.profile()).nodes().get(0).peakBandwidthBytesPerSecond());
  }

  @Test
  void twoSocketFourNodesPerSocket_exceptionNode7_poolHas10Vcpus() throws Exception {
    ProfileLoad l = load("two-socket-four-nodes-per-socket.yaml");
    assertEquals(List.of(), l.warnings());
    ShapeSet s = DERIVER.derive(l.profile());
    // Node 0: 12 − 1 reserved = 11; node 7 (exception): 10 cores → pool 10.
    // 64Gi − 32Gi/8 − 256Mi = 59.75Gi → 59Gi; 512 pages × 2Mi = 1Gi of hugepages-2Mi.
    assertEquals(10, s.oneNode().vcpus());
    assertEquals(59 * GI, s.oneNode().memoryBytes());
    assertEquals(Resources.of("hugepages-2Mi", GI), s.oneNode().extraCapacity());
    assertEquals(List.of(11L, 12L, 12L, 12L, 12L, 12L, 12L, 10L),
        s.perNode().stream().map(w -> w.vcpus()).toList());
    // Spanning: 2-nodes min(11+12, 12+10) = 22 vCPUs, 128Gi − 8Gi − 256Mi → 119Gi;
    // socket min(47, 46) = 46, 256Gi − 16Gi − 256Mi → 239Gi; host 93, 512 − 32 − 0.25 → 479Gi.
    assertEquals(List.of(22L, 46L, 93L), s.spanning().stream().map(WorkerShape::vcpus).toList());
    assertEquals(List.of(119 * GI, 239 * GI, 479 * GI),
        s.spanning().stream().map(WorkerShape::memoryBytes).toList());
    // FACTS B1: two DDR4-3200 channels × 25.6 GB/s = 51.2 GB/s per node.
    assertEquals(OptionalLong.of(51_200_000_000L),
        HostFacts.of(l.profile()).nodes().get(7).peakBandwidthBytesPerSecond());
  }

  @Test
  void oneSocketEmptyChannel_warnsAndPoolFollowsSmallerNode() throws Exception {
    ProfileLoad l = load("one-socket-empty-channel.yaml");
    assertEquals(
        List.of("host-profiles/one-socket-empty-channel.yaml:23: warning: node 1 uses 3 of 4"
            + " channels: 75% of the bandwidth"),
        l.warnings().stream().map(Diagnostic::format).toList());
    ShapeSet s = DERIVER.derive(l.profile());
    // Node 1: 3 × 48Gi = 144Gi − 8Gi/2 − 384Mi = 139.625Gi → 139Gi; node 0 would give 187Gi.
    assertEquals(16, s.oneNode().vcpus());
    assertEquals(139 * GI, s.oneNode().memoryBytes());
    assertEquals(Resources.of("ephemeral-storage", 100 * GI, "example.com/nic-vf", 8L),
        s.oneNode().extraCapacity());
    assertEquals("node 0 leaves 48Gi of memory unused by a pool-shaped worker", s.notes().get(0));
    // FACTS B1: three DDR5-5600 channels × 44.8 GB/s = 134.4 GB/s on node 1.
    assertEquals(OptionalLong.of(134_400_000_000L),
        HostFacts.of(l.profile()).nodes().get(1).peakBandwidthBytesPerSecond());
  }
}
