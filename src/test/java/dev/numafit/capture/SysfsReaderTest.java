package dev.numafit.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class SysfsReaderTest {
  @TempDir Path tmp;

  @Test
  void read_oneNode_readsCpusAndMemTotalInKib() throws Exception {
    CapturedTopology t = new SysfsReader(Fixtures.sysfs("one-node")).read();
    assertEquals(1, t.nodes().size());
    assertEquals(List.of(0, 1, 2, 3, 4, 5, 6, 7), t.nodes().get(0).cpus());
    // FACTS check value 23 (Linux drivers/base/node.c, H3): "Node 0 MemTotal: N kB" is N × 1024
    // bytes; the fixture's N is 16303428.
    assertEquals(16303428L * 1024, t.nodes().get(0).memoryBytes());
    assertEquals(8, t.cpus().size());
    assertEquals(List.of(), t.offlineCpus());
    // core_cpus_list of CPU 5 is "1,5": both threads share the core named by CPU 1.
    assertEquals(1, t.cpus().get(5).core());
  }

  @Test
  void read_twoSockets_readsDistancesHugepagesAndPackages() throws Exception {
    CapturedTopology t = new SysfsReader(Fixtures.sysfs("two-sockets")).read();
    assertEquals(List.of(10, 21), t.nodes().get(0).distances());
    assertEquals(List.of(21, 10), t.nodes().get(1).distances());
    // nr_hugepages under hugepages-2048kB (H3, hugetlbpage.rst): 512 pages of 2048 KiB.
    assertEquals(Map.of(2048L, 512L, 1048576L, 0L), t.nodes().get(1).hugepages());
    assertEquals(1, t.cpus().get(12).socket());
    assertEquals(1, t.cpus().get(12).node());
  }

  @Test
  void read_offlineCpus_listsPresentButNotOnline() throws Exception {
    CapturedTopology t = new SysfsReader(Fixtures.sysfs("offline-cpus")).read();
    // The fixture's cpu/present is 0-7 and cpu/online 0-5.
    assertEquals(List.of(6, 7), t.offlineCpus());
    assertEquals(6, t.cpus().size());
  }

  @Test
  void read_truncatedMeminfo_errorNamesFileLineAndExpectedLine() throws Exception {
    Path root = Fixtures.copyTree("one-node", tmp.resolve("t"));
    Path meminfo = root.resolve("sys/devices/system/node/node0/meminfo");
    Files.writeString(meminfo, "Node 0 MemTotal:     ");
    InputException e = assertThrows(InputException.class, () -> new SysfsReader(root).read());
    assertEquals(
        List.of(
            meminfo + ":1: error: expected a line \"Node 0 MemTotal: <number> kB\", got"
                + " \"Node 0 MemTotal:\""),
        formatted(e));
  }

  @Test
  void read_meminfoCutBeforeMemTotal_errorAtLastLine() throws Exception {
    Path root = Fixtures.copyTree("one-node", tmp.resolve("t"));
    Path meminfo = root.resolve("sys/devices/system/node/node0/meminfo");
    Files.writeString(meminfo, "Node 0 MemFree:        15488257 kB\nNode 0 MemU");
    InputException e = assertThrows(InputException.class, () -> new SysfsReader(root).read());
    assertEquals(
        List.of(
            meminfo + ":2: error: file ends after 2 lines without \"Node 0 MemTotal: <number> kB\""
                + " (truncated?)"),
        formatted(e));
  }

  @Test
  void read_emptyMeminfo_errorAtLineOne() throws Exception {
    Path root = Fixtures.copyTree("one-node", tmp.resolve("t"));
    Path meminfo = root.resolve("sys/devices/system/node/node0/meminfo");
    Files.writeString(meminfo, "");
    InputException e = assertThrows(InputException.class, () -> new SysfsReader(root).read());
    assertEquals(
        List.of(
            meminfo + ":1: error: empty file: expected a line \"Node 0 MemTotal: <number> kB\""),
        formatted(e));
  }

  @Test
  void read_distanceRowOfWrongLength_errorNamesNodesExpected() throws Exception {
    Path root = Fixtures.copyTree("four-nodes-smt", tmp.resolve("t"));
    Path distance = root.resolve("sys/devices/system/node/node2/distance");
    Files.writeString(distance, "12 12 10\n");
    InputException e = assertThrows(InputException.class, () -> new SysfsReader(root).read());
    assertEquals(
        List.of(
            distance + ":1: error: expected 4 distances (one per node: node0, node1, node2,"
                + " node3), got 3: \"12 12 10\""),
        formatted(e));
  }

  @Test
  void read_reservedOrWrongSlitValues_areErrorsAndUnreachableIsAccepted() throws Exception {
    Path root = Fixtures.copyTree("two-sockets", tmp.resolve("t"));
    Path d0 = root.resolve("sys/devices/system/node/node0/distance");
    Path d1 = root.resolve("sys/devices/system/node/node1/distance");
    // FACTS check value 22 (ACPI 6.x §5.2.17 SLIT, H2): 0–9 are reserved, the local distance is
    // 10, 255 means unreachable.
    Files.writeString(d0, "10 9\n");
    Files.writeString(d1, "255 12\n");
    InputException e = assertThrows(InputException.class, () -> new SysfsReader(root).read());
    assertEquals(
        List.of(
            d0 + ":1: error: distance to node1: expected a remote distance from 11 to 254, or 255"
                + " for unreachable, got 9 (0-9 are reserved)",
            d1 + ":1: error: distance to node1: expected 10 on the diagonal (local distance), got"
                + " 12"),
        formatted(e));
  }

  @Test
  void read_slitRelativeDistance2point4_isStoredAs24AndAccepted() throws Exception {
    Path root = Fixtures.copyTree("two-sockets", tmp.resolve("t"));
    // FACTS check value 22 (H2): a relative distance of 2.4 is stored as 24.
    Files.writeString(root.resolve("sys/devices/system/node/node0/distance"), "10 24\n");
    Files.writeString(root.resolve("sys/devices/system/node/node1/distance"), "24 10\n");
    CapturedTopology t = new SysfsReader(root).read();
    assertEquals(List.of(10, 24), t.nodes().get(0).distances());
  }

  @Test
  void read_emptyDistanceAndCpulist_eachErrorAtLineOne() throws Exception {
    Path root = Fixtures.copyTree("two-sockets", tmp.resolve("t"));
    Path distance = root.resolve("sys/devices/system/node/node1/distance");
    Path cpulist = root.resolve("sys/devices/system/node/node0/cpulist");
    Files.writeString(distance, "");
    Files.writeString(cpulist, "");
    InputException e = assertThrows(InputException.class, () -> new SysfsReader(root).read());
    assertEquals(
        List.of(
            cpulist + ":1: error: empty file: expected a CPU list such as 0-3,8-11 (or an empty"
                + " line for a node without CPUs)",
            distance + ":1: error: empty file: expected one distance per node separated by"
                + " spaces, e.g. 10 21"),
        formatted(e));
  }

  @Test
  void read_noNodeFolder_saysWhatToGiveInstead() throws IOException {
    Files.createDirectories(tmp.resolve("sys/devices/system/cpu"));
    InputException e = assertThrows(InputException.class, () -> new SysfsReader(tmp).read());
    assertEquals(
        List.of(
            tmp.resolve("sys/devices/system/node") + ": error: expected NUMA node folders node0,"
                + " node1, ... (a kernel without NUMA support has none: give --lscpu and"
                + " --dmidecode instead)"),
        formatted(e));
  }

  @Test
  void read_badCoreId_errorAndOtherFilesStillChecked() throws Exception {
    Path root = Fixtures.copyTree("one-node", tmp.resolve("t"));
    Path coreId = root.resolve("sys/devices/system/cpu/cpu3/topology/core_id");
    Path cpulist = root.resolve("sys/devices/system/node/node0/meminfo");
    Files.writeString(coreId, "three\n");
    Files.writeString(cpulist, "");
    InputException e = assertThrows(InputException.class, () -> new SysfsReader(root).read());
    // Both problems are reported at once: one bad file does not hide the next.
    assertEquals(2, e.diagnostics().size());
    assertEquals(
        coreId + ":1: error: expected a core id (a whole number), got \"three\"",
        e.diagnostics().stream().map(Diagnostic::format).filter(s -> s.contains("core_id"))
            .findFirst().orElseThrow());
  }

  private static List<String> formatted(InputException e) {
    return e.diagnostics().stream().map(Diagnostic::format).toList();
  }
}
