package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code numafit profile ...} run as a real process of the built jar (failsafe, after package). */
class ProfileCaptureIT {
  private static final Path JAR = Path.of("target/numafit.jar");

  @TempDir Path tmp;

  private record Run(int code, String out, String err) {}

  private static Run run(String... args) throws Exception {
    List<String> cmd = new ArrayList<>();
    cmd.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
    cmd.add("-jar");
    cmd.add(JAR.toString());
    cmd.addAll(List.of(args));
    Process p = new ProcessBuilder(cmd).start();
    p.getOutputStream().close();
    String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    String err = new String(p.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
    assertTrue(p.waitFor(60, TimeUnit.SECONDS), "numafit did not finish");
    return new Run(p.exitValue(), out, err);
  }

  @Test
  void capture_fixtureTree_sameProfileAsTheGoldenFile() throws Exception {
    Run r =
        run("profile", "capture", "--sysfs-root", "src/test/resources/sysfs/two-sockets",
            "--dmidecode", "src/test/resources/capture/two-sockets.dmidecode.txt", "--name",
            "two-sockets");
    assertEquals(0, r.code(), r.err());
    String golden =
        Files.readString(Path.of("src/test/resources/capture/golden/two-sockets+two-sockets.yaml"));
    // The golden file names the fixture root <fixtures> and the dmidecode file by its short name.
    String expected =
        golden
            .replace("<fixtures>", "src/test/resources/sysfs")
            .replace("from two-sockets.dmidecode.txt",
                "from src/test/resources/capture/two-sockets.dmidecode.txt");
    assertEquals(expected, r.out());
  }

  @Test
  void captureThenValidate_thisMachine_validAndExitZero() throws Exception {
    Path out = tmp.resolve("this-machine.yaml");
    Run c = run("profile", "capture", "--name", "this-machine", "--out", out.toString());
    if (!Files.isDirectory(Path.of("/sys/devices/system/node/node0"))) {
      // Without NUMA sysfs the capture must say what to give instead, with exit code 2.
      assertEquals(2, c.code());
      assertTrue(c.err().contains("give --lscpu and --dmidecode instead"), c.err());
      return;
    }
    assertEquals(0, c.code(), c.err());
    Run v = run("profile", "validate", out.toString());
    assertEquals(0, v.code(), v.err());
    assertTrue(v.out().startsWith(out + ": valid"), v.out());
  }

  @Test
  void validate_invalidProfile_exitTwoWithFileAndLine() throws Exception {
    Path bad = tmp.resolve("bad.yaml");
    Files.writeString(bad, "apiVersion: numafit.dev/v9\nkind: HostProfile\n");
    Run r = run("profile", "validate", bad.toString());
    assertEquals(2, r.code());
    assertEquals(bad + ": invalid\n", r.out());
    assertTrue(r.err().startsWith(bad + ":1: error: apiVersion: expected numafit.dev/v1alpha1"),
        r.err());
  }
}
