package dev.numafit.shape;

import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.diag.SourceRef;
import dev.numafit.host.HostProfile;
import dev.numafit.host.MemoryChannel;
import dev.numafit.host.NumaNode;
import dev.numafit.resource.Resources;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalLong;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/** Invariants of shape derivation and allocatable over generated hosts. */
class ShapeProperties {
  private static final long GI = 1L << 30;
  private static final long MI = 1L << 20;

  private static HostProfile host(int sockets, int nps, int cores, int dimmGi, int channels,
      int smallerNodeCores, int reserveGiPerNode, int reserveCores, int overheadMi) {
    List<NumaNode> nodes = new ArrayList<>();
    int n = sockets * nps;
    for (int i = 0; i < n; i++) {
      List<MemoryChannel> ch = new ArrayList<>();
      for (int c = 0; c < channels; c++) {
        ch.add(new MemoryChannel("channel " + c, List.of(dimmGi * GI)));
      }
      // The last node is an exception with fewer cores, as a per-node exception would give.
      int c = i == n - 1 ? Math.min(cores, smallerNodeCores) : cores;
      nodes.add(new NumaNode(i, i / nps, c, 2, channels * dimmGi * GI, ch, true, Resources.EMPTY));
    }
    int totalCores = nodes.stream().mapToInt(NumaNode::cores).sum();
    return new HostProfile("p", new SourceRef("p.yaml", 1), sockets, nps, "DDR5", 4800, nodes,
        Optional.empty(), (long) reserveGiPerNode * n * GI, Math.min(reserveCores, totalCores - 1),
        overheadMi * MI, Optional.empty(), OptionalLong.empty());
  }

  @Property
  void poolAndSplitShapes_fitEveryNode(
      @ForAll @IntRange(min = 1, max = 2) int sockets,
      @ForAll @IntRange(min = 1, max = 4) int nps,
      @ForAll @IntRange(min = 1, max = 64) int cores,
      @ForAll @IntRange(min = 4, max = 64) int dimmGi,
      @ForAll @IntRange(min = 1, max = 8) int channels,
      @ForAll @IntRange(min = 1, max = 64) int smallerNodeCores,
      @ForAll @IntRange(min = 0, max = 3) int reserveGiPerNode,
      @ForAll @IntRange(min = 0, max = 4) int reserveCores,
      @ForAll @IntRange(min = 0, max = 1024) int overheadMi) {
    HostProfile p = host(sockets, nps, cores, dimmGi, channels, smallerNodeCores,
        reserveGiPerNode, reserveCores, overheadMi);
    ShapeDeriver d = new ShapeDeriver(ShapeOptions.defaults());
    int nodes = p.nodes().size();
    for (int k : List.of(1, 2, 4)) {
      WorkerShape s = d.split(p, k);
      if (s.vcpus() == 0 || s.memoryBytes() == 0) {
        continue;
      }
      // k workers of the split shape fit on every node, so a host holds at least k per node.
      HostFit fit = d.workersPerHost(p, s);
      assertTrue(!fit.spanning() && fit.workersPerHost() >= k * nodes,
          () -> "k=" + k + " shape " + s + " gave " + fit);
    }
  }

  @Property
  void allocatable_neverAboveCapacityNorNegative(
      @ForAll @IntRange(min = 1, max = 256) int vcpus,
      @ForAll @IntRange(min = 1, max = 2048) int memoryGi,
      @ForAll @IntRange(min = 0, max = 4096) int hugepagesOf2Mi) {
    WorkerShape s = new WorkerShape(ShapeKind.EXPLICIT, 1, 1, vcpus, memoryGi * GI,
        Resources.of("hugepages-2Mi", hugepagesOf2Mi * 2 * MI));
    Resources cap = s.capacity();
    Resources alloc = Allocatable.compute(s, KubeletReserve.defaults());
    for (String r : cap.names()) {
      assertTrue(alloc.get(r) >= 0 && alloc.get(r) <= cap.get(r), r);
    }
  }
}
