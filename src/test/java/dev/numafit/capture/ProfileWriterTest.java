package dev.numafit.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

/**
 * Golden files for captured profiles: fixture sysfs tree (and dmidecode text) in, profile text out.
 * Regenerate with {@code -Dnumafit.regenerateGolden=true} after checking the difference by eye.
 */
class ProfileWriterTest {
  private static final long GIB = 1L << 30;

  static String capture(String tree, String dmidecode) throws Exception {
    CapturedTopology t = new SysfsReader(Fixtures.sysfs(tree)).read();
    if (dmidecode.isEmpty()) {
      return stable(ProfileWriter.write(HostCapture.derive(t, Optional.empty(), List.of()), tree));
    }
    TextFile f = Fixtures.text("capture/" + dmidecode);
    CapturedHost h = HostCapture.derive(t, Optional.of(dmidecode), DmidecodeParser.parse(f));
    return stable(ProfileWriter.write(h, tree));
  }

  /** The fixture root differs per checkout: show it as {@code <fixtures>}. */
  static String stable(String text) {
    return text.replace(Fixtures.path("sysfs").toString(), "<fixtures>");
  }

  @ParameterizedTest
  @CsvSource({
    "one-node,",
    "two-sockets,two-sockets.dmidecode.txt",
    "four-nodes-smt,four-nodes-smt.dmidecode.txt",
    "node-without-memory,",
    "offline-cpus,",
    "one-node,one-node-unbalanced.dmidecode.txt",
    "one-node,opaque-locators.dmidecode.txt"
  })
  void write_fixture_matchesGoldenFile(String tree, String dmidecode) throws Exception {
    String dmi = dmidecode == null ? "" : dmidecode;
    String actual = capture(tree, dmi);
    String name = tree + (dmi.isEmpty() ? "" : "+" + dmi.replace(".dmidecode.txt", "")) + ".yaml";
    Path golden = Path.of("src/test/resources/capture/golden", name);
    if (Boolean.getBoolean("numafit.regenerateGolden")) {
      Files.writeString(golden, actual, StandardCharsets.UTF_8);
    }
    assertEquals(Files.readString(golden, StandardCharsets.UTF_8), actual);
  }

  @Test
  void write_sameCaptureTwice_sameBytes() throws Exception {
    assertEquals(
        capture("four-nodes-smt", "four-nodes-smt.dmidecode.txt"),
        capture("four-nodes-smt", "four-nodes-smt.dmidecode.txt"));
  }

  @Test
  void reservedMemoryDefault_twoPercentRoundedUpToGib_atLeastOne() {
    // The capture's own placeholder rule (documented in docs/profile-capture.md, from memory).
    assertEquals(1 * GIB, CaptureDefaults.reservedMemoryBytes(4 * GIB));
    // 2% of 512 GiB is 10.24 GiB, rounded up to 11 GiB.
    assertEquals(11 * GIB, CaptureDefaults.reservedMemoryBytes(512 * GIB));
    assertEquals(2 * GIB, CaptureDefaults.reservedMemoryBytes(100 * GIB));
  }

  @Test
  void pageSize_sysfsKib_asKubernetesSuffix() {
    // hugepages-2048kB is the 2Mi page, hugepages-1048576kB the 1Gi page (hugetlbpage.rst, H3;
    // resource names hugepages-2Mi, hugepages-1Gi per K17).
    assertEquals("2Mi", ProfileWriter.pageSize(2048));
    assertEquals("1Gi", ProfileWriter.pageSize(1048576));
  }

  @Test
  void write_unevenNodesPerSocket_saysToWriteByHand() throws Exception {
    CapturedTopology t = new SysfsReader(Fixtures.sysfs("two-sockets")).read();
    // Move CPUs 12-15 to a third node on socket 1 so the sockets have 1 and 2 nodes.
    List<CpuEntry> cpus =
        t.cpus().stream()
            .map(c -> c.cpu() >= 12 ? new CpuEntry(c.cpu(), c.socket(), c.die(), c.core(), 2) : c)
            .toList();
    NodeEntry n1 = t.nodes().get(1);
    NodeEntry n2 =
        new NodeEntry(2, List.of(12, 13, 14, 15), n1.memoryBytes(), n1.hugepages(),
            List.of(21, 11, 10), n1.source());
    CapturedTopology uneven =
        new CapturedTopology("test", cpus, List.of(), List.of(t.nodes().get(0), n1, n2));
    CapturedHost h = HostCapture.derive(uneven, Optional.empty(), List.of());
    IllegalArgumentException e =
        assertThrows(IllegalArgumentException.class, () -> ProfileWriter.write(h, "x"));
    assertTrue(e.getMessage().startsWith("the sockets have different numbers of NUMA nodes {0=1, 1=2}"),
        e.getMessage());
  }
}
