package dev.numafit.host;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.numafit.diag.SourceRef;
import dev.numafit.resource.Resources;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalLong;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class HostFactsTest {
  private static final long GI = 1L << 30;

  @ParameterizedTest
  @CsvSource({
    // FACTS check value 21 (H1: JEDEC JESD79-4/-5 speeds; peak = MT/s × 8 bytes per channel).
    "3200, 25600000000", // DDR4-3200 → 25.6 GB/s
    "4800, 38400000000", // DDR5-4800 → 38.4 GB/s
    "5600, 44800000000", // DDR5-5600 → 44.8 GB/s
    "6400, 51200000000", // DDR5-6400 → 51.2 GB/s
    "8800, 70400000000" //  DDR5-8800 → 70.4 GB/s
  })
  void channelBytesPerSecond_jedecSpeeds_matchPublishedPeaks(int mts, long bytesPerSecond) {
    assertEquals(bytesPerSecond, HostFacts.channelBytesPerSecond(mts));
  }

  private static NumaNode node(int id, List<List<Long>> channels) {
    List<MemoryChannel> ch = new ArrayList<>();
    for (int i = 0; i < channels.size(); i++) {
      ch.add(new MemoryChannel("channel " + i, channels.get(i)));
    }
    long mem = ch.stream().mapToLong(MemoryChannel::totalBytes).sum();
    return new NumaNode(id, 0, 8, 2, mem, ch, true, Resources.EMPTY);
  }

  private static HostProfile profile(List<NumaNode> nodes, int mts) {
    return new HostProfile("h", new SourceRef("h.yaml", 1), 1, nodes.size(), "DDR4", mts, nodes,
        Optional.empty(), 0, 0, 0, Optional.empty(), OptionalLong.empty());
  }

  @Test
  void of_twoPopulatedDdr4Channels_bandwidthIsTwiceAChannel() {
    // FACTS B1: two DDR4-3200 channels → 2 × 25.6 GB/s = 51.2 GB/s; one empty → 25.6 GB/s.
    HostFacts f = HostFacts.of(profile(
        List.of(node(0, List.of(List.of(32 * GI), List.of(32 * GI))),
            node(1, List.of(List.of(32 * GI), List.of()))), 3200));
    assertEquals(OptionalLong.of(51_200_000_000L), f.nodes().get(0).peakBandwidthBytesPerSecond());
    assertEquals(OptionalLong.of(25_600_000_000L), f.nodes().get(1).peakBandwidthBytesPerSecond());
    assertEquals(OptionalLong.of(76_800_000_000L), f.totalBandwidthBytesPerSecond());
    assertEquals(16, f.totalCores());
    assertEquals(32, f.totalThreads());
    assertEquals(96 * GI, f.totalMemoryBytes());
  }

  @Test
  void of_unknownSpeed_bandwidthUnknown() {
    HostFacts f = HostFacts.of(profile(List.of(node(0, List.of(List.of(32 * GI)))), 0));
    assertEquals(OptionalLong.empty(), f.nodes().get(0).peakBandwidthBytesPerSecond());
    assertEquals(OptionalLong.empty(), f.totalBandwidthBytesPerSecond());
  }

  @Test
  void findings_emptyAndUnequalChannels_namedPerNode() {
    List<HostFacts.Finding> f = HostFacts.findings(profile(
        List.of(node(0, List.of(List.of(32 * GI), List.of())),
            node(1, List.of(List.of(32 * GI), List.of(16 * GI)))), 3200));
    assertEquals(
        List.of(
            new HostFacts.Finding(0, "node 0 uses 1 of 2 channels: half the bandwidth"),
            new HostFacts.Finding(1,
                "node 1 has unequal DIMMs across its channels (channel 0: 32Gi, channel 1: 16Gi):"
                    + " memory beyond the smallest channel is not interleaved over all channels"
                    + " and runs at lower bandwidth")),
        f);
  }

  @Test
  void findings_nineNodes_topologyManagerWarning() {
    // FACTS A5 / check value 18 (K14): no Topology Manager on more than 8 NUMA nodes by default.
    List<NumaNode> nodes = new ArrayList<>();
    for (int i = 0; i < 9; i++) {
      nodes.add(node(i, List.of(List.of(32 * GI))));
    }
    assertEquals(
        List.of(new HostFacts.Finding(-1,
            "9 NUMA nodes: the kubelet's Topology Manager does not run on more than 8 unless"
                + " max-allowable-numa-nodes is set; a worker spanning them gets no NUMA"
                + " alignment")),
        HostFacts.findings(profile(nodes, 3200)));
  }
}
