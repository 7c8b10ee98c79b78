package dev.numafit.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import java.io.ByteArrayInputStream;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ProfileCaptureTest {
  private static final InputStream NO_STDIN = new ByteArrayInputStream(new byte[0]);

  @TempDir Path tmp;

  @Test
  void capture_lscpuWithSysfsRoot_cpusFromLscpuMemoryFromSysfs() throws Exception {
    CapturedHost h =
        ProfileCapture.capture(
            new ProfileCapture.Request(
                Optional.of(Fixtures.sysfs("four-nodes-smt")),
                Optional.empty(),
                Optional.of(Fixtures.path("capture/four-nodes-smt.lscpu.txt"))),
            NO_STDIN);
    assertTrue(h.cpuSource().startsWith("lscpu -p file "), h.cpuSource());
    assertEquals(4, h.nodes().size());
    // Node 2's MemTotal in the fixture is 32651000 + 2 × 1024 kB.
    assertEquals((32651000L + 2048) * 1024, h.nodes().get(2).memoryBytes());
    assertEquals(4, h.nodes().get(2).cores());
  }

  @Test
  void capture_lscpuWithDmidecode_memoryFromModules() throws Exception {
    CapturedHost h =
        ProfileCapture.capture(
            new ProfileCapture.Request(
                Optional.empty(),
                Optional.of(Fixtures.path("capture/two-sockets.dmidecode.txt").toString()),
                Optional.of(Fixtures.path("capture/two-sockets.lscpu.txt"))),
            NO_STDIN);
    assertEquals(2, h.sockets());
    assertEquals(64L << 30, h.nodes().get(0).memoryBytes());
    assertEquals(Optional.empty(), h.distances());
  }

  @Test
  void capture_badSysfsAndBadDmidecode_bothReportedAtOnce() throws Exception {
    Path root = Fixtures.copyTree("one-node", tmp.resolve("t"));
    Path meminfo = root.resolve("sys/devices/system/node/node0/meminfo");
    Files.writeString(meminfo, "");
    InputException e =
        assertThrows(
            InputException.class,
            () ->
                ProfileCapture.capture(
                    new ProfileCapture.Request(
                        Optional.of(root), Optional.of("-"), Optional.empty()),
                    new ByteArrayInputStream("".getBytes(StandardCharsets.UTF_8))));
    assertEquals(
        java.util.List.of(
            meminfo + ":1: error: empty file: expected a line \"Node 0 MemTotal: <number> kB\"",
            "<stdin>:1: error: empty file: expected the output of dmidecode -t 17 (records"
                + " starting \"Handle 0x..., DMI type 17, ... bytes\")"),
        e.diagnostics().stream().map(Diagnostic::format).toList());
  }

  @Test
  void capture_missingDmidecodeFile_errorNamesIt() {
    InputException e =
        assertThrows(
            InputException.class,
            () ->
                ProfileCapture.capture(
                    new ProfileCapture.Request(
                        Optional.of(Fixtures.sysfs("one-node")),
                        Optional.of(tmp.resolve("none.txt").toString()),
                        Optional.empty()),
                    NO_STDIN));
    assertEquals(
        tmp.resolve("none.txt") + ": error: file not found",
        e.diagnostics().get(0).format());
  }
}
