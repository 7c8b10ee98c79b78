package dev.numafit.profile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.host.HostProfile;
import dev.numafit.host.NumaNode;
import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.OptionalLong;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Every message of the host-profile reader, with its exact text. The format is our own
 * (docs/host-profile.md); SLIT rules follow FACTS B2 (ACPI §5.2.17, Linux slit_valid()).
 */
class HostProfileReaderTest {
  private static final long GI = 1L << 30;
  private static final long MI = 1L << 20;

  /** A valid profile; line numbers are referred to by the tests below. */
  private static final String BASE =
      """
      apiVersion: numafit.dev/v1alpha1
      kind: HostProfile
      metadata:
        name: test-host
      spec:
        sockets: 1
        nodesPerSocket: 2
        threadsPerCore: 2
        memoryType: DDR4
        memorySpeedMTs: 3200
        node:
          cores: 12
          channels: [[32Gi], [32Gi]]
        hypervisor:
          reservedMemory: 8Gi
          perVmOverhead: 512Mi
      """;

  private final HostProfileReader reader = new HostProfileReader();

  private ProfileLoad load(String text) throws InputException {
    return reader.parse("t.yaml", text);
  }

  private List<String> errors(String text) {
    InputException e = assertThrows(InputException.class, () -> load(text));
    return e.diagnostics().stream().map(Diagnostic::format).toList();
  }

  private List<String> warnings(String text) throws InputException {
    return load(text).warnings().stream().map(Diagnostic::format).toList();
  }

  @Test
  void read_validProfile_buildsNodesAndReserve() throws InputException {
    HostProfile p = load(BASE).profile();
    assertEquals("test-host", p.name());
    assertEquals(2, p.nodes().size());
    NumaNode n1 = p.nodes().get(1);
    assertEquals(1, n1.id());
    assertEquals(0, n1.socket());
    assertEquals(12, n1.cores());
    assertEquals(24, n1.threads());
    assertEquals(64 * GI, n1.memoryBytes());
    assertEquals(2, n1.populatedChannels());
    assertEquals(8 * GI, p.hypervisorMemoryBytes());
    assertEquals(512 * MI, p.perVmOverheadBytes());
    assertEquals("DDR4", p.memoryType());
    assertEquals(3200, p.memorySpeedMts());
    assertEquals(Optional.empty(), p.relativeCost());
    assertEquals(OptionalLong.empty(), p.ephemeralStoragePerWorker());
    assertTrue(load(BASE).warnings().isEmpty());
  }

  @Test
  void read_file_namesFileInMessages(@TempDir Path dir) throws Exception {
    Path f = dir.resolve("p.yaml");
    Files.writeString(f, BASE.replace("cores: 12", "cores: 0"));
    InputException e = assertThrows(InputException.class, () -> reader.read(f));
    assertEquals(f + ":12: error: spec.node.cores: expected a whole number > 0, got 0",
        e.diagnostics().get(0).format());
  }

  @Test
  void read_missingFile_error(@TempDir Path dir) {
    Path f = dir.resolve("absent.yaml");
    InputException e = assertThrows(InputException.class, () -> reader.read(f));
    assertEquals(f + ": error: no such file", e.diagnostics().get(0).format());
  }

  @Test
  void read_zeroCores_error() {
    assertEquals(List.of("t.yaml:12: error: spec.node.cores: expected a whole number > 0, got 0"),
        errors(BASE.replace("cores: 12", "cores: 0")));
  }

  @Test
  void read_zeroCoresInException_errorNamesEntry() {
    String text = BASE + "  nodes:\n    - id: 1\n      cores: 0\n";
    assertEquals(
        List.of("t.yaml:19: error: spec.nodes[0].cores: expected a whole number > 0, got 0"),
        errors(text));
  }

  @Test
  void read_distanceMatrixWrongSize_error() {
    assertEquals(
        List.of("t.yaml:17: error: spec.distances: expected 2 rows, one per NUMA node, got 1"),
        errors(BASE + "  distances: [[10, 21]]\n"));
    assertEquals(
        List.of("t.yaml:19: error: spec.distances[1]: expected 2 entries, one per NUMA node, got 1"),
        errors(BASE + "  distances:\n    - [10, 21]\n    - [21]\n"));
  }

  @Test
  void read_slitDiagonalNotTen_error() {
    // FACTS B2: the diagonal is normalised to 10.
    assertEquals(
        List.of("t.yaml:17: error: spec.distances[0][0]: expected 10 on the diagonal (local"
            + " distance), got 12"),
        errors(BASE + "  distances: [[12, 21], [21, 10]]\n"));
  }

  @Test
  void read_slitOffDiagonalTenOrReserved_error() {
    // FACTS B2: off-diagonal ≤ 10 is rejected by Linux; 0-9 are reserved by ACPI.
    assertEquals(
        List.of(
            "t.yaml:18: error: spec.distances[0][1]: expected a remote distance from 11 to 254,"
                + " or 255 for unreachable, got 10",
            "t.yaml:19: error: spec.distances[1][0]: expected a remote distance from 11 to 254,"
                + " or 255 for unreachable, got 5 (0-9 are reserved)"),
        errors(BASE + "  distances:\n    - [10, 10]\n    - [5, 10]\n"));
  }

  @Test
  void read_slitUnreachableAndAsymmetric_accepted() throws InputException {
    // FACTS B2: 255 = unreachable; the two directions may differ.
    HostProfile p = load(BASE + "  distances: [[10, 255], [21, 10]]\n").profile();
    assertEquals(List.of(List.of(10, 255), List.of(21, 10)), p.distances().orElseThrow());
  }

  @Test
  void read_distanceRowNotAList_errorOnce() {
    assertEquals(
        List.of("t.yaml:17: error: spec.distances[1]: expected a list of distances such as"
            + " [10, 21], got 7"),
        errors(BASE + "  distances: [[10, 21], 7]\n"));
  }

  @Test
  void read_documentNotAMapping_error() {
    assertEquals(
        List.of("t.yaml:1: error: expected a HostProfile mapping with apiVersion, kind, metadata"
            + " and spec, got hello"),
        errors("hello\n"));
  }

  @Test
  void read_slitNotANumber_error() {
    assertEquals(
        List.of("t.yaml:17: error: spec.distances[0][1]: expected a whole number from 10 to 255,"
            + " got far"),
        errors(BASE + "  distances: [[10, far], [21, 10]]\n"));
  }

  @Test
  void read_unknownApiVersionAndKind_error() {
    assertEquals(
        List.of(
            "t.yaml:1: error: apiVersion: expected numafit.dev/v1alpha1, got numafit.dev/v2",
            "t.yaml:2: error: kind: expected HostProfile, got Node"),
        errors(BASE.replace("v1alpha1", "v2").replace("kind: HostProfile", "kind: Node")));
  }

  @Test
  void read_unknownField_errorNamesFieldAndChoices() {
    assertEquals(
        List.of(
            "t.yaml:11: error: spec.node.cores: missing; expected a whole number > 0",
            "t.yaml:12: error: spec.node.coers: unknown field; expected one of cores, channels,"
                + " memory, hugepages, devices"),
        errors(BASE.replace("cores: 12", "coers: 12")));
    assertEquals(
        List.of("t.yaml:5: error: spec.sockets: missing; expected a whole number > 0",
            "t.yaml:6: error: spec.socket: unknown field; expected one of sockets,"
            + " nodesPerSocket, threadsPerCore, memoryType, memorySpeedMTs, node, nodes,"
            + " distances, hypervisor, relativeCost, ephemeralStoragePerWorker"),
        errors(BASE.replace("sockets: 1", "socket: 1")));
  }

  @Test
  void read_negativeSize_error() {
    assertEquals(
        List.of("t.yaml:15: error: spec.hypervisor.reservedMemory: expected a size >= 0 such as"
            + " 64Gi, got -8Gi"),
        errors(BASE.replace("reservedMemory: 8Gi", "reservedMemory: -8Gi")));
  }

  @Test
  void read_invalidSize_error() {
    assertEquals(
        List.of("t.yaml:13: error: spec.node.channels[1][0]: expected a size such as 64Gi, got"
            + " lots"),
        errors(BASE.replace("[[32Gi], [32Gi]]", "[[32Gi], [lots]]")));
  }

  @Test
  void read_fractionalBytes_error() {
    // FACTS A3: memory 400m is 0.4 bytes, not a whole byte.
    assertEquals(
        List.of("t.yaml:16: error: spec.hypervisor.perVmOverhead: expected a whole number of"
            + " bytes, got 400m"),
        errors(BASE.replace("perVmOverhead: 512Mi", "perVmOverhead: 400m")));
  }

  @Test
  void read_hugepagesBeyondOnePebibyte_errorNotOverflow() {
    // Found by fuzzing: 512 pages of 2Ei overflowed a long and escaped as an ArithmeticException.
    assertEquals(
        List.of("t.yaml:15: error: spec.node.hugepages.2Ei: expected pages adding up to at most"
            + " 1Pi, got 512 pages of 2Ei"),
        errors(BASE.replace("    channels: [[32Gi], [32Gi]]\n",
            "    channels: [[32Gi], [32Gi]]\n    hugepages:\n      2Ei: 512\n")));
  }

  @Test
  void read_dimmBeyondOnePebibyte_error() {
    // Eight such DIMMs would already overflow a long when the node's memory is summed.
    assertEquals(
        List.of("t.yaml:13: error: spec.node.channels[0][0]: expected a size of at most 1Pi, got"
            + " 2Ei"),
        errors(BASE.replace("channels: [[32Gi], [32Gi]]", "channels: [[2Ei], [32Gi]]")));
  }

  @Test
  void read_millionsOfNodes_errorNotOutOfMemory() {
    // Found by fuzzing: 8 sockets × 4444444 nodes per socket made the reader build 35 million
    // nodes and run out of memory.
    assertEquals(
        List.of("t.yaml:7: error: spec.nodesPerSocket: expected at most 1024 NUMA nodes in all"
            + " (sockets × nodesPerSocket), got 8 × 4444444 = 35555552"),
        errors(BASE.replace("sockets: 1", "sockets: 8")
            .replace("nodesPerSocket: 2", "nodesPerSocket: 4444444")));
  }

  @Test
  void read_reserveLargerThanHost_error() {
    assertEquals(
        List.of("t.yaml:15: error: spec.hypervisor.reservedMemory: expected less than the host's"
            + " memory (128Gi), got 200Gi"),
        errors(BASE.replace("reservedMemory: 8Gi", "reservedMemory: 200Gi")));
    assertEquals(
        List.of("t.yaml:17: error: spec.hypervisor.reservedCores: expected fewer than the host's"
            + " 24 cores, got 24"),
        errors(BASE + "    reservedCores: 24\n"));
  }

  @Test
  void read_manyProblems_allReportedInLineOrder() {
    String text =
        BASE.replace("kind: HostProfile", "kind: Host")
            .replace("cores: 12", "cores: -1")
            .replace("memoryType: DDR4", "memoryType: DDR3")
            .replace("perVmOverhead: 512Mi", "perVmOverhead: big");
    assertEquals(
        List.of(
            "t.yaml:2: error: kind: expected HostProfile, got Host",
            "t.yaml:9: error: spec.memoryType: expected DDR4 or DDR5, got DDR3",
            "t.yaml:12: error: spec.node.cores: expected a whole number > 0, got -1",
            "t.yaml:16: error: spec.hypervisor.perVmOverhead: expected a size such as 64Gi, got"
                + " big"),
        errors(text));
  }

  @Test
  void read_malformedYaml_errorWithLine() {
    assertEquals(
        List.of("t.yaml:13: error: malformed YAML: while parsing a flow sequence; expected ','"
            + " or ']', but got <scalar>"),
        errors(BASE.replace("[[32Gi], [32Gi]]", "[[32Gi], [32Gi]")));
  }

  @Test
  void read_emptyFileAndSecondDocument_error() {
    assertEquals(List.of("t.yaml:1: error: expected a HostProfile document, the file is empty"),
        errors(""));
    assertEquals(
        List.of("t.yaml:18: error: expected one HostProfile document per file, found a second"
            + " one"),
        errors(BASE + "---\nkind: HostProfile\n"));
  }

  @Test
  void read_duplicateKey_error() {
    assertEquals(
        List.of("t.yaml:17: error: sockets: duplicate key; first given on line 6"),
        errors(BASE + "  sockets: 2\n"));
  }

  @Test
  void read_channelsAndMemoryBoth_error() {
    assertEquals(
        List.of("t.yaml:14: error: spec.node.memory: expected either channels or memory, not both"
            + " (memory comes from the DIMMs when channels are given)"),
        errors(BASE.replace("channels: [[32Gi], [32Gi]]\n",
            "channels: [[32Gi], [32Gi]]\n    memory: 64Gi\n")));
  }

  @Test
  void read_noMemory_error() {
    assertEquals(
        List.of("t.yaml:11: error: spec.node.channels: missing; expected the memory channels with"
            + " their DIMM sizes, or memory per node"),
        errors(BASE.replace("    channels: [[32Gi], [32Gi]]\n", "")));
    assertEquals(
        List.of("t.yaml:13: error: spec.node.channels: expected at least one DIMM on the node, got"
            + " only empty channels"),
        errors(BASE.replace("[[32Gi], [32Gi]]", "[[], []]")));
    assertEquals(
        List.of("t.yaml:13: error: spec.node.channels[0][0]: expected a DIMM size > 0 such as"
            + " 32Gi, got 0 (leave the channel's list empty for no DIMM)"),
        errors(BASE.replace("[[32Gi], [32Gi]]", "[[0], [32Gi]]")));
  }

  @Test
  void read_exceptionIdOutOfRangeOrRepeated_error() {
    assertEquals(
        List.of("t.yaml:18: error: spec.nodes[0].id: expected a node id from 0 to 1, got 2"),
        errors(BASE + "  nodes:\n    - id: 2\n      cores: 8\n"));
    assertEquals(
        List.of("t.yaml:20: error: spec.nodes[1].id: node 1 already has an exception at"
            + " spec.nodes[0]"),
        errors(BASE + "  nodes:\n    - id: 1\n      cores: 8\n    - id: 1\n      cores: 6\n"));
  }

  @Test
  void read_perNodeException_replacesCoresAndMemory() throws InputException {
    // Node 1 has 8 cores and one 32Gi DIMM given as memory directly (unconfirmed channels).
    ProfileLoad l = load(BASE + "  nodes:\n    - id: 1\n      cores: 8\n      memory: 32Gi\n");
    NumaNode n0 = l.profile().nodes().get(0);
    NumaNode n1 = l.profile().nodes().get(1);
    assertEquals(12, n0.cores());
    assertEquals(64 * GI, n0.memoryBytes());
    assertEquals(8, n1.cores());
    assertEquals(32 * GI, n1.memoryBytes());
    assertEquals(false, n1.channelsConfirmed());
    assertEquals(
        List.of("t.yaml:20: warning: node 1 memory given directly (32Gi): channel population"
            + " unconfirmed, so its bandwidth is unknown; list the channels and DIMMs to check it"),
        l.warnings().stream().map(Diagnostic::format).toList());
  }

  @Test
  void read_hugepagesDevicesCostStorage_parsed() throws InputException {
    String text =
        BASE.replace("channels: [[32Gi], [32Gi]]\n",
                "channels: [[32Gi], [32Gi]]\n    hugepages:\n      2Mi: 1024\n      1Gi: 2\n"
                    + "    devices:\n      example.com/accelerator: 1\n")
            + "  relativeCost: 1.25\n  ephemeralStoragePerWorker: 200Gi\n";
    HostProfile p = load(text).profile();
    assertEquals(
        Resources.of("hugepages-2Mi", 2 * GI, "hugepages-1Gi", 2 * GI,
            "example.com/accelerator", 1L),
        p.nodes().get(1).extraCapacity());
    assertEquals(Optional.of(new BigDecimal("1.25")), p.relativeCost());
    assertEquals(OptionalLong.of(200 * GI), p.ephemeralStoragePerWorker());
  }

  @Test
  void read_badHugepagesAndDevices_error() {
    String text =
        BASE.replace("channels: [[32Gi], [32Gi]]\n",
            "channels: [[32Gi], [32Gi]]\n    hugepages:\n      2Xi: 10\n      1Gi: 65\n"
                + "    devices:\n      accelerator: 1\n");
    assertEquals(
        List.of(
            "t.yaml:14: error: spec.node.hugepages: expected hugepages within node 0's memory"
                + " (64Gi), got 65Gi",
            "t.yaml:14: error: spec.node.hugepages: expected hugepages within node 1's memory"
                + " (64Gi), got 65Gi",
            "t.yaml:15: error: spec.node.hugepages.2Xi: expected a page size such as 2Mi or 1Gi,"
                + " got 2Xi",
            "t.yaml:18: error: spec.node.devices.accelerator: expected an extended resource name"
                + " such as example.com/accelerator, got accelerator"),
        errors(text));
  }

  @Test
  void read_relativeCostNotPositive_error() {
    assertEquals(
        List.of("t.yaml:17: error: spec.relativeCost: expected a number > 0, got 0"),
        errors(BASE + "  relativeCost: 0\n"));
  }

  @Test
  void read_emptyChannel_warnsHalfBandwidth() throws InputException {
    // One of two channels empty: that node's peak bandwidth is halved (FACTS B1 arithmetic).
    assertEquals(
        List.of(
            "t.yaml:13: warning: node 0 uses 1 of 2 channels: half the bandwidth",
            "t.yaml:13: warning: node 1 uses 1 of 2 channels: half the bandwidth"),
        warnings(BASE.replace("[[32Gi], [32Gi]]", "[[32Gi], []]")));
  }

  @Test
  void read_unequalDimms_warns() throws InputException {
    assertEquals(
        List.of("t.yaml:19: warning: node 1 has unequal DIMMs across its channels (channel 0:"
            + " 32Gi, channel 1: 16Gi): memory beyond the smallest channel is not interleaved over"
            + " all channels and runs at lower bandwidth"),
        warnings(BASE + "  nodes:\n    - id: 1\n      channels: [[32Gi], [16Gi]]\n"));
  }

  @Test
  void read_memoryGivenDirectly_warnsUnconfirmed() throws InputException {
    assertEquals(
        List.of(
            "t.yaml:13: warning: node 0 memory given directly (64Gi): channel population"
                + " unconfirmed, so its bandwidth is unknown; list the channels and DIMMs to check"
                + " it",
            "t.yaml:13: warning: node 1 memory given directly (64Gi): channel population"
                + " unconfirmed, so its bandwidth is unknown; list the channels and DIMMs to check"
                + " it"),
        warnings(BASE.replace("channels: [[32Gi], [32Gi]]", "memory: 64Gi")));
  }

  @Test
  void read_moreThanEightNodes_warnsTopologyManager() throws InputException {
    // FACTS A5 / check value 18 (K14): the Topology Manager is off above 8 NUMA nodes unless
    // max-allowable-numa-nodes is set.
    assertEquals(
        List.of("t.yaml:5: warning: 9 NUMA nodes: the kubelet's Topology Manager does not run on"
            + " more than 8 unless max-allowable-numa-nodes is set; a worker spanning them gets no"
            + " NUMA alignment"),
        warnings(BASE.replace("nodesPerSocket: 2", "nodesPerSocket: 9")));
  }

  @Test
  void read_speedOutsideJedecRange_warns() throws InputException {
    // FACTS B1: DDR4 runs 1600 to 3200 MT/s (JESD79-4).
    assertEquals(
        List.of("t.yaml:10: warning: spec.memorySpeedMTs: 4800 MT/s is outside the JEDEC range"
            + " for DDR4 (1600 to 3200 MT/s)"),
        warnings(BASE.replace("3200", "4800")));
  }
}
