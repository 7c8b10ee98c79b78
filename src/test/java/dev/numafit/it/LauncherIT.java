package dev.numafit.it;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The {@code ./numafit} launcher and the {@code kubectl-numafit} plugin wrapper, run as bash
 * scripts on the jar this build just packaged (class-data sharing off, so no training run).
 */
class LauncherIT {
  @BeforeAll
  static void jarIsFresh() throws IOException {
    // The launcher would rebuild a stale jar with Maven; inside a Maven build that is not wanted.
    FileTime jar = Files.getLastModifiedTime(JarRun.JAR);
    try (Stream<Path> src = Files.walk(JarRun.PROJECT.resolve("src/main"))) {
      assumeTrue(
          src.noneMatch(p -> modifiedAfter(p, jar))
              && !modifiedAfter(JarRun.PROJECT.resolve("pom.xml"), jar),
          "jar older than the sources");
    }
  }

  private static boolean modifiedAfter(Path p, FileTime t) {
    try {
      return Files.getLastModifiedTime(p).compareTo(t) > 0;
    } catch (IOException ex) {
      return true;
    }
  }

  private static String[] run(Path script, String... args) throws Exception {
    List<String> cmd = new java.util.ArrayList<>(List.of("bash", script.toString()));
    cmd.addAll(List.of(args));
    ProcessBuilder pb = new ProcessBuilder(cmd).directory(JarRun.PROJECT.toFile());
    pb.environment().put("NUMAFIT_CDS", "0");
    Path out = Files.createTempFile("launcher", ".out");
    Path err = Files.createTempFile("launcher", ".err");
    pb.redirectOutput(out.toFile()).redirectError(err.toFile());
    Process p = pb.start();
    assertTrue(p.waitFor(120, TimeUnit.SECONDS), "launcher did not finish");
    return new String[] {
      Integer.toString(p.exitValue()),
      Files.readString(out, StandardCharsets.UTF_8),
      Files.readString(err, StandardCharsets.UTF_8)
    };
  }

  @Test
  void launcher_passesArgumentsAndExitCode() throws Exception {
    String[] ok = run(JarRun.PROJECT.resolve("numafit"), "--version");
    assertEquals("0", ok[0], ok[2]);
    assertEquals(JarRun.of("--version").out(), ok[1]);
    assertEquals("", ok[2], "no rebuild message: the jar is fresh");
    String[] bad = run(JarRun.PROJECT.resolve("numafit"), "plan", "-f", "no/such/path",
        "--worker", "cpu=2,memory=4Gi");
    assertEquals("2", bad[0]);
    assertEquals(
        "error: -f no/such/path: no such file or folder\nRun 'numafit plan --help' for usage.\n",
        bad[2]);
  }

  @Test
  void kubectlPlugin_throughASymlinkOnPath_runsNumafit(@TempDir Path bin) throws Exception {
    // kubectl finds plugins as executables named kubectl-<name> on PATH, often symlinks.
    Path link = bin.resolve("kubectl-numafit");
    Files.createSymbolicLink(link, JarRun.PROJECT.resolve("kubectl-numafit"));
    String[] r = run(link, "demand", "--help");
    assertEquals("0", r[0], r[2]);
    assertTrue(r[1].startsWith("Usage: numafit demand"), r[1]);
  }

  @Test
  void launcher_onATerminal_coloursAndFitsItsWidth_unlessNoColor() throws Exception {
    // script(1) runs the launcher on a pseudo-terminal, so [ -t 1 ] is true as on a real one.
    Path script = Path.of("/usr/bin/script");
    assumeTrue(Files.isExecutable(script), "script(1) not installed");
    String cmd = "bash numafit plan -f " + ExamplesIT.PARCEL + " --host-profile "
        + ExamplesIT.TWO_SOCKET;
    String coloured = onTerminal(cmd, null);
    assertTrue(coloured.contains("\u001b[1mPlan for host profile"), coloured);
    // COLUMNS=110: the longest line is wider than the 80 columns of the plain report.
    int widest = coloured.lines().map(l -> l.replaceAll("\u001b\\[[0-9;]*m", ""))
        .mapToInt(String::length).max().orElse(0);
    assertTrue(widest > 80 && widest <= 110, "widest line " + widest);
    String plain = onTerminal(cmd, "1");
    // NO_COLOR (no-color.org): no escape codes even on a terminal.
    assertFalse(plain.contains("\u001b"), plain);
    // And through a pipe, the launcher passes no terminal: the jar's own plain output.
    String[] piped = run(JarRun.PROJECT.resolve("numafit"), "plan", "-f", ExamplesIT.PARCEL,
        "--host-profile", ExamplesIT.TWO_SOCKET);
    assertEquals(JarRun.of("plan", "-f", ExamplesIT.PARCEL, "--host-profile",
        ExamplesIT.TWO_SOCKET).out(), piped[1]);
  }

  @Test
  void launcher_stderrATerminal_progressThere_stdoutSameAsWithout(@TempDir Path tmp)
      throws Exception {
    Path script = Path.of("/usr/bin/script");
    assumeTrue(Files.isExecutable(script), "script(1) not installed");
    // Standard output to a file, standard error left on the pseudo-terminal: [ -t 2 ] is true.
    Path stdout = tmp.resolve("plan.json");
    String args = "plan -f " + ExamplesIT.TICKETS + " --host-profile " + ExamplesIT.TWO_SOCKET
        + " --host-failures 1 -o json";
    String terminal = onTerminal("bash numafit " + args + " >" + stdout, "1");
    assertTrue(terminal.contains("\rfailure sets checked: "), terminal);
    // NO_COLOR: the line carries no escape sequence.
    assertFalse(terminal.contains("\u001b"), terminal);
    // The report is the same bytes as the jar's own run without a terminal.
    assertEquals(JarRun.of(args.split(" ")).out(),
        Files.readString(stdout, StandardCharsets.UTF_8));
    // Through a pipe nothing of it shows.
    String[] piped = run(JarRun.PROJECT.resolve("numafit"), args.split(" "));
    assertFalse(piped[2].contains("failure sets checked"), piped[2]);
  }

  private static String onTerminal(String command, String noColor) throws Exception {
    ProcessBuilder pb = new ProcessBuilder("script", "-q", "-e", "-c", command, "/dev/null")
        .directory(JarRun.PROJECT.toFile());
    pb.environment().put("NUMAFIT_CDS", "0");
    pb.environment().put("COLUMNS", "110");
    pb.environment().remove("NO_COLOR");
    if (noColor != null) {
      pb.environment().put("NO_COLOR", noColor);
    }
    Path out = Files.createTempFile("launcher-tty", ".out");
    pb.redirectOutput(out.toFile()).redirectErrorStream(true)
        .redirectInput(ProcessBuilder.Redirect.from(Path.of("/dev/null").toFile()));
    Process p = pb.start();
    assertTrue(p.waitFor(120, TimeUnit.SECONDS), "launcher did not finish");
    assertEquals(0, p.exitValue(), Files.readString(out, StandardCharsets.UTF_8));
    String text = Files.readString(out, StandardCharsets.UTF_8).replace("\r\n", "\n");
    Files.delete(out);
    return text;
  }
}
