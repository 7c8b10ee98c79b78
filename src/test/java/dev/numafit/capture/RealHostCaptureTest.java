package dev.numafit.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Captures the machine the tests run on through sysfs (never through lscpu) and compares the result
 * with programs and kernel files this project did not write: util-linux {@code lscpu -p} (FACTS
 * B5), {@code /proc/meminfo} and {@code /proc/zoneinfo}. Skipped, with the reason shown, where the
 * machine has no {@code /sys/devices/system/node} or no lscpu.
 */
class RealHostCaptureTest {
  private static CapturedHost host;

  @BeforeAll
  static void capture() throws Exception {
    assumeTrue(
        Files.isDirectory(Path.of("/sys/devices/system/node/node0")),
        "skipped: this machine has no /sys/devices/system/node/node0 (kernel without NUMA sysfs)");
    host =
        HostCapture.derive(new SysfsReader(Path.of("/")).read(), Optional.empty(), List.of());
  }

  /** lscpu -p rows as {CPU, Core, Socket, Node}, from the program itself. */
  private static List<int[]> lscpuRows() throws Exception {
    String out = run("lscpu", "-p=CPU,CORE,SOCKET,NODE");
    assumeTrue(out != null, "skipped: lscpu is not installed on this machine");
    return out.lines()
        .filter(l -> !l.startsWith("#") && !l.isBlank())
        .map(
            l -> {
              String[] f = l.split(",", -1);
              return new int[] {
                Integer.parseInt(f[0]),
                Integer.parseInt(f[1]),
                Integer.parseInt(f[2]),
                f[3].isEmpty() ? 0 : Integer.parseInt(f[3])
              };
            })
        .toList();
  }

  @Test
  void capture_realMachine_cpusAndNodesMatchLscpu() throws Exception {
    List<int[]> rows = lscpuRows();
    SortedMap<Integer, Integer> nodeOfCpu = new TreeMap<>();
    rows.forEach(r -> nodeOfCpu.put(r[0], r[3]));
    SortedMap<Integer, Integer> captured = new TreeMap<>();
    host.nodes().forEach(n -> n.cpus().forEach(c -> captured.put(c, n.sourceId())));
    // Same online CPUs, each on the same NUMA node.
    assertEquals(nodeOfCpu, captured);
    assertEquals(
        rows.stream().mapToInt(r -> r[3]).distinct().count(), (long) host.nodes().size());
  }

  @Test
  void capture_realMachine_socketsAndCoresMatchLscpu() throws Exception {
    List<int[]> rows = lscpuRows();
    long sockets = rows.stream().mapToInt(r -> r[2]).distinct().count();
    TreeSet<String> cores = new TreeSet<>();
    rows.forEach(r -> cores.add(r[2] + "/" + r[1]));
    assertEquals(sockets, (long) host.sockets());
    assertEquals(cores.size(), host.coreCount());
  }

  @Test
  void capture_realMachine_nodeMemoryMatchesZoneinfoManagedPages() throws Exception {
    // Node MemTotal is the node's managed pages (Linux drivers/base/node.c); /proc/zoneinfo lists
    // them per zone. Read both within a moment; allow 1% for a balloon moving meanwhile.
    String pageSize = run("getconf", "PAGESIZE");
    assumeTrue(pageSize != null, "skipped: getconf is not installed on this machine");
    long page = Long.parseLong(pageSize.strip());
    SortedMap<Integer, Long> managed = new TreeMap<>();
    int node = -1;
    Pattern header = Pattern.compile("Node (\\d+), zone\\s+\\S+");
    Pattern managedLine = Pattern.compile("\\s+managed\\s+(\\d+)");
    for (String l : Files.readAllLines(Path.of("/proc/zoneinfo"), StandardCharsets.UTF_8)) {
      Matcher h = header.matcher(l);
      if (h.matches()) {
        node = Integer.parseInt(h.group(1));
        continue;
      }
      Matcher m = managedLine.matcher(l);
      if (m.matches() && node >= 0) {
        managed.merge(node, Long.parseLong(m.group(1)) * page, Long::sum);
      }
    }
    for (CapturedNode n : host.nodes()) {
      long expected = managed.getOrDefault(n.sourceId(), 0L);
      assertTrue(
          Math.abs(n.memoryBytes() - expected) <= expected / 100,
          "node " + n.sourceId() + ": captured " + n.memoryBytes() + " bytes, /proc/zoneinfo "
              + expected);
    }
  }

  @Test
  void capture_realMachine_memoryMatchesProcMeminfo() throws Exception {
    long procTotal = memTotal(Path.of("/proc/meminfo"));
    long nodes = host.memoryBytes();
    // The nodes can never hold more than the whole machine.
    assertTrue(nodes <= procTotal + procTotal / 100, nodes + " > /proc/meminfo " + procTotal);
    // Some virtual machines report in /proc/meminfo memory that no node's accounting shows (memory
    // plugged in later): then the two kernel views disagree by themselves and the check says so.
    assumeTrue(
        Math.abs(procTotal - nodes) <= procTotal / 100,
        "skipped: /proc/meminfo MemTotal is " + procTotal + " bytes but the kernel's nodes total "
            + nodes + " bytes (and /proc/zoneinfo agrees with the nodes): this machine's kernel"
            + " reports memory outside its NUMA node accounting");
    assertEquals(procTotal, nodes, procTotal / 100.0);
  }

  private static long memTotal(Path meminfo) throws IOException {
    for (String l : Files.readAllLines(meminfo, StandardCharsets.UTF_8)) {
      if (l.startsWith("MemTotal:")) {
        return Long.parseLong(l.replaceAll("[^0-9]", "")) * 1024;
      }
    }
    throw new IllegalStateException("no MemTotal in " + meminfo);
  }

  /** Runs a program; null when it is not installed. */
  private static String run(String... cmd) throws Exception {
    Process p;
    try {
      p = new ProcessBuilder(cmd).redirectErrorStream(false).start();
    } catch (IOException e) {
      return null;
    }
    String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    assertTrue(p.waitFor(30, TimeUnit.SECONDS), String.join(" ", cmd) + " did not finish");
    assertEquals(0, p.exitValue(), String.join(" ", cmd) + " failed");
    return out;
  }
}
