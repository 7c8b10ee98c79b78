package dev.numafit.shape;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.diag.SourceRef;
import dev.numafit.host.HostProfile;
import dev.numafit.host.MemoryChannel;
import dev.numafit.host.NumaNode;
import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalLong;
import org.junit.jupiter.api.Test;

/**
 * Shape arithmetic on hand-built hosts. Expected values are worked by hand from the rules in
 * docs/shapes.md (the sizing rules; one worker per NUMA node is common practice).
 */
class ShapeDeriverTest {
  private static final long MI = 1L << 20;
  private static final long GI = 1L << 30;
  private static final ShapeDeriver DEFAULT = new ShapeDeriver(ShapeOptions.defaults());

  /** sockets × nodesPerSocket nodes of {@code cores} cores, 2 threads, two 32Gi channels each. */
  static HostProfile host(
      int sockets, int nps, int cores, long reserveBytes, int reserveCores, long overheadBytes,
      Resources extra) {
    List<NumaNode> nodes = new ArrayList<>();
    for (int i = 0; i < sockets * nps; i++) {
      nodes.add(
          new NumaNode(i, i / nps, cores, 2, 64 * GI,
              List.of(new MemoryChannel("channel 0", List.of(32 * GI)),
                  new MemoryChannel("channel 1", List.of(32 * GI))),
              true, extra));
    }
    return new HostProfile("test", new SourceRef("test.yaml", 1), sockets, nps, "DDR4", 3200, nodes,
        Optional.empty(), reserveBytes, reserveCores, overheadBytes, Optional.empty(),
        OptionalLong.empty());
  }

  private static final HostProfile TWO_NODES =
      host(2, 1, 12, 8 * GI, 2, 512 * MI, Resources.EMPTY);

  @Test
  void oneNode_reservedCoresFromNode0_poolIsMinimum() {
    // node 0: 12 − 2 reserved = 10 vCPUs; node 1: 12. Memory: 64Gi − 8Gi/2 − 512Mi = 59.5Gi → 59Gi.
    WorkerShape pool = DEFAULT.oneNode(TWO_NODES);
    assertEquals(10, pool.vcpus());
    assertEquals(59 * GI, pool.memoryBytes());
    assertEquals(ShapeKind.ONE_NODE, pool.kind());
    List<NodeWorker> perNode = DEFAULT.perNode(TWO_NODES);
    assertEquals(10, perNode.get(0).vcpus());
    assertEquals(12, perNode.get(1).vcpus());
  }

  @Test
  void derive_largerNode_noteSaysWhatIsUnused() {
    ShapeSet set = DEFAULT.derive(TWO_NODES);
    assertEquals(
        List.of(
            "node 1 leaves 2 vCPUs unused by a pool-shaped worker",
            "give each worker VM one virtual socket with all its 10 vCPUs, so the guest sees one"
                + " NUMA node that matches the physical one"),
        set.notes());
    assertTrue(set.warnings().isEmpty());
  }

  @Test
  void oneNode_vcpuPerThread_countsThreads() {
    // (12 − 2 reserved cores) × 2 threads = 20 on node 0; 24 on node 1; pool 20.
    ShapeDeriver threads = new ShapeDeriver(new ShapeOptions(true, BigDecimal.ONE));
    assertEquals(20, threads.oneNode(TWO_NODES).vcpus());
  }

  @Test
  void derive_overcommit_scalesVcpusAndWarns() {
    // 10 × 1.5 = 15 on node 0.
    ShapeDeriver over = new ShapeDeriver(new ShapeOptions(false, new BigDecimal("1.5")));
    ShapeSet set = over.derive(TWO_NODES);
    assertEquals(15, set.oneNode().vcpus());
    assertEquals(
        "test.yaml:1: warning: cpu overcommit 1.5: workers get more vCPUs than the node has"
            + " cores; NUMA locality and consistent performance suffer",
        set.warnings().get(0).format());
  }

  @Test
  void split_k2AndK4_divideCoresAndMemoryAfterOverheads() {
    // k=2: floor(10/2) = 5 vCPUs; (64 − 4 − 2 × 0.5)Gi / 2 = 29.5Gi → 29Gi.
    WorkerShape two = DEFAULT.split(TWO_NODES, 2);
    assertEquals(5, two.vcpus());
    assertEquals(29 * GI, two.memoryBytes());
    assertEquals(2, two.workersPerNode());
    // k=4: floor(10/4) = 2 vCPUs; (64 − 4 − 4 × 0.5)Gi / 4 = 14.5Gi → 14Gi.
    WorkerShape four = DEFAULT.split(TWO_NODES, 4);
    assertEquals(2, four.vcpus());
    assertEquals(14 * GI, four.memoryBytes());
  }

  @Test
  void split_hugepagesAndDevices_dividedInWholeUnits() {
    // 5 pages of 2Mi and 3 devices per node, split 2 ways: 2 pages (4Mi) and 1 device each.
    HostProfile p = host(1, 1, 12, 0, 0, 0,
        Resources.of("hugepages-2Mi", 10 * MI, "example.com/vf", 3L));
    WorkerShape two = DEFAULT.split(p, 2);
    assertEquals(Resources.of("hugepages-2Mi", 4 * MI, "example.com/vf", 1L), two.extraCapacity());
  }

  @Test
  void oneNode_reservedCoresSpillToNextNode() {
    // 14 reserved cores on 12-core nodes: all 12 of node 0, then 2 of node 1.
    HostProfile p = host(3, 1, 12, 0, 14, 0, Resources.EMPTY);
    List<NodeWorker> perNode = DEFAULT.perNode(p);
    assertEquals(List.of(0L, 10L, 12L), perNode.stream().map(NodeWorker::vcpus).toList());
    ShapeSet set = DEFAULT.derive(p);
    assertEquals(
        "test.yaml:1: warning: the smallest node leaves no room for a worker after the"
            + " hypervisor's reserve (0 vCPUs, 64Gi)",
        set.warnings().get(0).format());
  }

  @Test
  void spanning_twoSocketsOfTwoNodes_twoNodesSocketHost() {
    // 2 sockets × 2 nodes × 12 cores, no reserve: 2-nodes = 24 vCPUs, 128Gi − 0 = 128Gi;
    // socket = the same two nodes (skipped in derive); host = 48 vCPUs, 256Gi.
    HostProfile p = host(2, 2, 12, 0, 0, 0, Resources.EMPTY);
    WorkerShape two = DEFAULT.spanning(p, ShapeKind.TWO_NODES).orElseThrow();
    assertEquals(24, two.vcpus());
    assertEquals(128 * GI, two.memoryBytes());
    assertEquals(2, two.nodesSpanned());
    ShapeSet set = DEFAULT.derive(p);
    assertEquals(List.of(ShapeKind.TWO_NODES, ShapeKind.HOST),
        set.spanning().stream().map(WorkerShape::kind).toList());
    assertEquals(48, set.spanning().get(1).vcpus());
    assertEquals(256 * GI, set.spanning().get(1).memoryBytes());
  }

  @Test
  void spanning_oneNodePerSocket_hasNoTwoNodeShape() {
    assertTrue(DEFAULT.spanning(TWO_NODES, ShapeKind.TWO_NODES).isEmpty());
  }

  @Test
  void spanning_hostShare_takesReserveOfSpannedNodesAndOneOverhead() {
    // host: 10 + 12 = 22 vCPUs; 128Gi − 8Gi − 512Mi = 119.5Gi → 119Gi.
    WorkerShape h = DEFAULT.spanning(TWO_NODES, ShapeKind.HOST).orElseThrow();
    assertEquals(22, h.vcpus());
    assertEquals(119 * GI, h.memoryBytes());
  }

  @Test
  void workersPerHost_shapeFitsNodes_countsPerNode() {
    // Node memory for workers: 64Gi − 4Gi = 60Gi; each worker costs its memory + 512Mi.
    // 4 vCPU / 16Gi: node 0 min(10/4=2, 60/16.5=3) = 2; node 1 min(12/4=3, 3) = 3 → 5.
    HostFit fit =
        DEFAULT.workersPerHost(TWO_NODES,
            new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 4, 16 * GI, Resources.EMPTY));
    assertEquals(5, fit.workersPerHost());
    assertFalse(fit.spanning());
  }

  @Test
  void workersPerHost_16VcpusOn12CoreNodes_spanningWorkerInTwoHalves() {
    // Common practice, the usual worked example: 16 vCPUs on 12-core nodes span two nodes,
    // split 8 + 8. Per host (no reserve): 24 vCPUs / 16 = 1 worker.
    HostProfile p = host(2, 1, 12, 0, 0, 0, Resources.EMPTY);
    HostFit fit =
        DEFAULT.workersPerHost(p,
            new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 16, 32 * GI, Resources.EMPTY));
    assertTrue(fit.spanning());
    assertEquals(1, fit.workersPerHost());
    assertEquals(List.of(8L, 8L), fit.split().orElseThrow().vcpusPerNode());
  }

  @Test
  void workersPerHost_largerThanHost_zeroWithNote() {
    HostFit fit =
        DEFAULT.workersPerHost(TWO_NODES,
            new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 64, 32 * GI, Resources.EMPTY));
    assertEquals(0, fit.workersPerHost());
    assertTrue(fit.notes().contains("this worker is larger than a whole host"));
  }

  @Test
  void topologyAdvice_spanningShape_asksForMatchingVirtualNodes() {
    WorkerShape s = new WorkerShape(ShapeKind.TWO_NODES, 1, 2, 24, 128 * GI, Resources.EMPTY);
    assertEquals(
        "a worker VM of 24 vCPUs spans 2 NUMA nodes: give it 2 virtual NUMA nodes matching the"
            + " physical ones, so the guest's kubelet can align pods to one of them",
        ShapeDeriver.topologyAdvice(s));
  }
}
