package dev.numafit.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.diag.Diagnostic;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class HostCaptureTest {
  private static final long GIB = 1L << 30;

  private static CapturedHost sysfs(String tree) throws Exception {
    return HostCapture.derive(new SysfsReader(Fixtures.sysfs(tree)).read(), Optional.empty(), List.of());
  }

  private static CapturedHost withDimms(CapturedTopology t, String dmidecode) throws Exception {
    TextFile f = Fixtures.text("capture/" + dmidecode);
    return HostCapture.derive(t, Optional.of(f.name()), DmidecodeParser.parse(f));
  }

  private static boolean warned(CapturedHost h, String fragment) {
    return h.warnings().stream().map(Diagnostic::message).anyMatch(m -> m.contains(fragment));
  }

  @Test
  void derive_oneNode_fourCoresTwoThreadsKernelMemory() throws Exception {
    CapturedHost h = sysfs("one-node");
    assertEquals(1, h.sockets());
    assertEquals(1, h.nodesPerSocket());
    assertEquals(2, h.threadsPerCore());
    CapturedNode n = h.nodes().get(0);
    // The fixture's 8 CPUs pair as (0,4), (1,5), (2,6), (3,7) in core_cpus_list.
    assertEquals(4, n.cores());
    assertEquals(16303428L * 1024, n.memoryBytes());
    assertFalse(n.channelsConfirmed());
    assertEquals(Optional.of(List.of(List.of(10))), h.distances());
    assertTrue(warned(h, "no SMBIOS memory data"));
  }

  @Test
  void derive_twoSockets_oneNodePerSocketWithDistanceMatrix() throws Exception {
    CapturedHost h = sysfs("two-sockets");
    assertEquals(2, h.sockets());
    assertEquals(1, h.nodesPerSocket());
    assertEquals(1, h.threadsPerCore());
    assertEquals(List.of(8, 8), h.nodes().stream().map(CapturedNode::cores).toList());
    assertEquals(List.of(0, 1), h.nodes().stream().map(CapturedNode::socket).toList());
    assertEquals(Optional.of(List.of(List.of(10, 21), List.of(21, 10))), h.distances());
    assertEquals(512L, h.nodes().get(1).hugepages().get(2048L));
  }

  @Test
  void derive_fourNodesSmt_fourNodesOnOneSocket() throws Exception {
    CapturedHost h = sysfs("four-nodes-smt");
    assertEquals(1, h.sockets());
    assertEquals(4, h.nodesPerSocket());
    assertEquals(2, h.threadsPerCore());
    assertEquals(List.of(4, 4, 4, 4), h.nodes().stream().map(CapturedNode::cores).toList());
    assertEquals(32, h.cpuCount());
    assertEquals(List.of(12, 10, 12, 12), h.distances().orElseThrow().get(1));
  }

  @Test
  void derive_nodeWithoutMemory_warnsItCannotHoldAWorker() throws Exception {
    CapturedHost h = sysfs("node-without-memory");
    // The fixture's node 1 has MemTotal 0: it is left out, node 0 stays with its 4 cores.
    assertEquals(1, h.nodes().size());
    assertEquals(0, h.nodes().get(0).sourceId());
    assertEquals(1, h.nodesPerSocket());
    assertEquals(Optional.of(List.of(List.of(10))), h.distances());
    assertTrue(
        warned(h, "node 1 has 4 CPUs but no memory: a worker there would run on another node's"
            + " memory, so it cannot hold a one-node worker; left out of the profile with its 4"
            + " cores"),
        h.warnings().toString());
  }

  @Test
  void derive_offlineCpus_warnsAndCountsOnlyOnlineThreads() throws Exception {
    CapturedHost h = sysfs("offline-cpus");
    // Online CPUs 0-5: cores (0,4), (1,5), (2), (3) — four cores, the fewest threads is 1.
    assertEquals(4, h.nodes().get(0).cores());
    assertEquals(1, h.threadsPerCore());
    assertTrue(warned(h, "CPUs 6-7 are offline"), h.warnings().toString());
    assertTrue(warned(h, "cores have between 1 and 2 online threads"));
  }

  @Test
  void derive_twoSocketsWithSmbios_channelsMappedAndConfirmed() throws Exception {
    CapturedHost h =
        withDimms(new SysfsReader(Fixtures.sysfs("two-sockets")).read(), "two-sockets.dmidecode.txt");
    CapturedNode n1 = h.nodes().get(1);
    assertTrue(n1.channelsConfirmed());
    assertEquals(List.of("A", "B", "C", "D"), n1.channels().stream().map(CapturedChannel::name).toList());
    assertEquals(List.of(16 * GIB), n1.channels().get(0).dimmBytes());
    assertEquals(64 * GIB, n1.memoryBytes());
    assertEquals("DDR4", h.memoryType());
    assertEquals(3200, h.memorySpeedMts());
    assertFalse(warned(h, "has no module"), h.warnings().toString());
    assertFalse(warned(h, "the kernel reports"), h.warnings().toString());
  }

  @Test
  void derive_fourNodesWithSmbios_channelsSplitEvenlyToConfirm() throws Exception {
    CapturedHost h =
        withDimms(
            new SysfsReader(Fixtures.sysfs("four-nodes-smt")).read(), "four-nodes-smt.dmidecode.txt");
    assertEquals(
        List.of("2", "3"), h.nodes().get(1).channels().stream().map(CapturedChannel::name).toList());
    assertFalse(h.nodes().get(1).channelsConfirmed());
    assertEquals(32 * GIB, h.nodes().get(1).memoryBytes());
    assertTrue(warned(h, "split evenly over its 4 nodes"));
    assertEquals("DDR5", h.memoryType());
    assertEquals(4800, h.memorySpeedMts());
  }

  @Test
  void derive_unbalancedModules_warnsEmptyChannelUnequalAndSlowerSpeed() throws Exception {
    CapturedHost h =
        withDimms(
            new SysfsReader(Fixtures.sysfs("one-node")).read(), "one-node-unbalanced.dmidecode.txt");
    assertTrue(warned(h, "node 0 channel D has no module"), h.warnings().toString());
    assertTrue(warned(h, "3 of 4 channels populated"));
    assertTrue(warned(h, "node 0 has unequal memory per channel (4 GiB, 8 GiB)"));
    assertTrue(warned(h, "module DIMM_B1 (BANK 1) runs at 2933 MT/s, below its rated 3200 MT/s"));
    // The memory runs at the slowest configured module.
    assertEquals(2933, h.memorySpeedMts());
    assertEquals(16 * GIB, h.nodes().get(0).memoryBytes());
  }

  @Test
  void derive_opaqueLocators_memoryFromKernelAndPopulationToConfirm() throws Exception {
    CapturedHost h =
        withDimms(new SysfsReader(Fixtures.sysfs("one-node")).read(), "opaque-locators.dmidecode.txt");
    assertEquals(16303428L * 1024, h.nodes().get(0).memoryBytes());
    assertEquals(List.of(), h.nodes().get(0).channels());
    assertTrue(
        warned(h, "channel population to confirm: the slot locators (such as \"Memory Slot 1"
            + " (Bank Alpha)\") do not map to sockets and channels; found 2 slots, 2 installed,"
            + " 16 GiB in all"),
        h.warnings().toString());
  }

  @Test
  void derive_lscpuWithoutSmbios_saysWhichInputIsMissing() throws Exception {
    CapturedTopology t = LscpuParser.parse(Fixtures.text("capture/four-nodes-smt.lscpu.txt"));
    IllegalArgumentException e =
        assertThrows(
            IllegalArgumentException.class, () -> HostCapture.derive(t, Optional.empty(), List.of()));
    assertEquals(
        "memory per node is unknown: lscpu gives none; add --dmidecode FILE or --sysfs-root DIR",
        e.getMessage());
  }

  @Test
  void derive_lscpuWithSmbios_sameCpuFactsAsSysfs() throws Exception {
    CapturedHost fromLscpu =
        withDimms(
            LscpuParser.parse(Fixtures.text("capture/four-nodes-smt.lscpu.txt")),
            "four-nodes-smt.dmidecode.txt");
    CapturedHost fromSysfs = sysfs("four-nodes-smt");
    assertEquals(fromSysfs.sockets(), fromLscpu.sockets());
    assertEquals(fromSysfs.nodesPerSocket(), fromLscpu.nodesPerSocket());
    assertEquals(fromSysfs.threadsPerCore(), fromLscpu.threadsPerCore());
    assertEquals(
        fromSysfs.nodes().stream().map(CapturedNode::cpus).toList(),
        fromLscpu.nodes().stream().map(CapturedNode::cpus).toList());
    assertEquals(Optional.empty(), fromLscpu.distances());
  }

  @Test
  void derive_modulesFarAboveKernelMemory_warnsMappingToConfirm() throws Exception {
    // 8 × 16 GiB of modules against a node whose MemTotal is 15.55 GiB.
    CapturedHost h =
        withDimms(new SysfsReader(Fixtures.sysfs("one-node")).read(), "four-nodes-smt.dmidecode.txt");
    assertTrue(
        warned(h, "node 0: the kernel reports 15.55 GiB but the modules mapped to it total 128 GiB"),
        h.warnings().toString());
  }

  @Test
  void derive_slotSocketsDisagreeWithCpus_notMappedAndWarned() throws Exception {
    CapturedHost h =
        withDimms(new SysfsReader(Fixtures.sysfs("one-node")).read(), "two-sockets.dmidecode.txt");
    assertTrue(warned(h, "the slot locators name 2 sockets but the CPUs are on 1"));
    assertTrue(warned(h, "channel population to confirm"));
    assertEquals(List.of(), h.nodes().get(0).channels());
  }

  @Test
  void derive_memoryOnlyNode_leftOutWithWarning() throws Exception {
    CapturedTopology t = new SysfsReader(Fixtures.sysfs("two-sockets")).read();
    NodeEntry n0 = t.nodes().get(0);
    NodeEntry n1 = t.nodes().get(1);
    // A third node with memory and no CPUs, as a memory expander shows up.
    NodeEntry memoryOnly =
        new NodeEntry(2, List.of(), 64 * GIB, new java.util.TreeMap<>(), List.of(30, 30, 10),
            n1.source());
    CapturedTopology withExpander =
        new CapturedTopology(
            t.cpuSource(),
            t.cpus(),
            List.of(),
            List.of(
                new NodeEntry(0, n0.cpus(), n0.memoryBytes(), n0.hugepages(), List.of(10, 21, 30),
                    n0.source()),
                new NodeEntry(1, n1.cpus(), n1.memoryBytes(), n1.hugepages(), List.of(21, 10, 30),
                    n1.source()),
                memoryOnly));
    CapturedHost h = HostCapture.derive(withExpander, Optional.empty(), List.of());
    assertEquals(2, h.nodes().size());
    assertEquals(Optional.of(List.of(List.of(10, 21), List.of(21, 10))), h.distances());
    assertTrue(
        warned(h, "node 2 has no online CPUs (a memory-only node with 64 GiB): left out of the"
            + " profile"),
        h.warnings().toString());
  }

  @Test
  void derive_modulesOfTwoTypes_typeUnknownWithWarning() throws Exception {
    String text =
        "Handle 0x0001, DMI type 17, 92 bytes\nMemory Device\n\tSize: 8 GB\n\tLocator: DIMM_A1\n"
            + "\tType: DDR4\n\nHandle 0x0002, DMI type 17, 92 bytes\nMemory Device\n"
            + "\tSize: 8 GB\n\tLocator: DIMM_B1\n\tType: DDR5\n";
    CapturedHost h =
        HostCapture.derive(
            new SysfsReader(Fixtures.sysfs("one-node")).read(),
            Optional.of("m.txt"),
            DmidecodeParser.parse(TextFile.of("m.txt", text)));
    assertEquals("", h.memoryType());
    assertTrue(warned(h, "modules of different types [DDR4, DDR5]: memory type left unknown"));
  }
}
