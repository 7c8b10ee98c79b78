package dev.numafit.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.diag.Diagnostic;
import dev.numafit.host.HostFacts;
import dev.numafit.host.HostProfile;
import dev.numafit.host.NumaNode;
import dev.numafit.profile.HostProfileReader;
import dev.numafit.profile.ProfileLoad;
import dev.numafit.resource.Resources;
import dev.numafit.shape.ShapeDeriver;
import dev.numafit.shape.ShapeOptions;
import dev.numafit.shape.WorkerShape;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

/**
 * Capture → profile YAML → the project's own profile reader → the same facts as the capture
 * derived: sockets, nodes, cores, threads, memory, channels, hugepages and distances.
 */
class CaptureRoundTripTest {
  private static final long GIB = 1L << 30;

  private static CapturedHost capture(String tree, String dmidecode) throws Exception {
    CapturedTopology t = new SysfsReader(Fixtures.sysfs(tree)).read();
    if (dmidecode == null || dmidecode.isEmpty()) {
      return HostCapture.derive(t, Optional.empty(), List.of());
    }
    TextFile f = Fixtures.text("capture/" + dmidecode);
    return HostCapture.derive(t, Optional.of(f.name()), DmidecodeParser.parse(f));
  }

  private static ProfileLoad load(CapturedHost h, String name) throws Exception {
    return new HostProfileReader().parse(name + ".yaml", ProfileWriter.write(h, name));
  }

  @ParameterizedTest
  @CsvSource({
    "one-node,",
    "two-sockets,",
    "two-sockets,two-sockets.dmidecode.txt",
    "four-nodes-smt,",
    "four-nodes-smt,four-nodes-smt.dmidecode.txt",
    "node-without-memory,",
    "offline-cpus,",
    "one-node,one-node-unbalanced.dmidecode.txt",
    "one-node,opaque-locators.dmidecode.txt"
  })
  void captureWriteLoad_fixture_sameDerivedFacts(String tree, String dmidecode) throws Exception {
    CapturedHost h = capture(tree, dmidecode);
    HostProfile p = load(h, tree).profile();
    assertEquals(h.sockets(), p.sockets());
    assertEquals(h.nodesPerSocket(), p.nodesPerSocket());
    assertEquals(h.memorySpeedMts(), p.memorySpeedMts());
    assertEquals(h.memoryType(), p.memoryType());
    assertEquals(h.distances(), p.distances());
    assertEquals(h.nodes().size(), p.nodes().size());
    for (int i = 0; i < h.nodes().size(); i++) {
      CapturedNode c = h.nodes().get(i);
      NumaNode n = p.nodes().get(i);
      assertEquals(c.id(), n.id());
      assertEquals(c.socket(), n.socket());
      assertEquals(c.cores(), n.cores());
      assertEquals(h.threadsPerCore(), n.threadsPerCore());
      assertEquals(c.memoryBytes(), n.memoryBytes(), "node " + i + " memory");
      assertEquals(
          c.channels().stream().map(CapturedChannel::dimmBytes).toList(),
          n.channels().stream().map(ch -> ch.dimmBytes()).toList());
      long hugeBytes =
          c.hugepages().entrySet().stream().mapToLong(e -> e.getKey() * 1024 * e.getValue()).sum();
      long loadedHuge =
          n.extraCapacity().asMap().entrySet().stream()
              .filter(e -> Resources.isHugepages(e.getKey()))
              .mapToLong(e -> e.getValue())
              .sum();
      assertEquals(hugeBytes, loadedHuge, "node " + i + " hugepages");
    }
    HostFacts facts = HostFacts.of(p);
    assertEquals(h.coreCount(), facts.totalCores());
    assertEquals(h.memoryBytes(), facts.totalMemoryBytes());
  }

  @Test
  void load_capturedWithoutSmbios_loadsWithUnconfirmedChannelsAndGivesAWorker() throws Exception {
    CapturedHost h = capture("two-sockets", "");
    ProfileLoad load = load(h, "two-sockets");
    assertFalse(load.profile().nodes().get(0).channelsConfirmed());
    assertTrue(
        load.warnings().stream().map(Diagnostic::message)
            .anyMatch(m -> m.contains("channel population unconfirmed")),
        load.warnings().toString());
    WorkerShape w = new ShapeDeriver(ShapeOptions.defaults()).oneNode(load.profile());
    // 8 cores per node; node memory 65843216 KiB (62.79 GiB) less half of the 3 GiB default
    // reserve and the 512 MiB default per-VM overhead is 60.79 GiB, rounded down to 60 GiB.
    assertEquals(8, w.vcpus());
    assertEquals(60 * GIB, w.memoryBytes());
  }

  @Test
  void load_twoSocketsWithSmbios_bandwidthFromChannels() throws Exception {
    HostProfile p = load(capture("two-sockets", "two-sockets.dmidecode.txt"), "t").profile();
    // FACTS check value 21 (H1): DDR4-3200 is 25.6 GB/s a channel; four populated channels per
    // node give 102.4 GB/s.
    assertEquals(
        102_400_000_000L,
        HostFacts.of(p).nodes().get(0).peakBandwidthBytesPerSecond().getAsLong());
  }
}
