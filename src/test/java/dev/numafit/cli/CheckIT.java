package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code numafit check} as a subprocess of the built jar (run by failsafe in {@code verify}, after
 * {@code package}): the exit codes a CI job sees, and the same bytes as the in-process golden files.
 */
class CheckIT {
  private static final Path JAR = Path.of("target/numafit.jar");

  record Result(int code, String out, String err) {}

  static Result run(String... args) throws IOException, InterruptedException {
    return runWithPath(null, args);
  }

  /** Runs the jar; a non-null {@code path} replaces the PATH the process sees. */
  static Result runWithPath(String path, String... args) throws IOException, InterruptedException {
    List<String> cmd = new ArrayList<>();
    cmd.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
    cmd.add("-jar");
    cmd.add(JAR.toString());
    cmd.addAll(List.of(args));
    ProcessBuilder pb = new ProcessBuilder(cmd).redirectInput(ProcessBuilder.Redirect.from(
        new java.io.File("/dev/null")));
    if (path != null) {
      pb.environment().put("PATH", path);
    }
    Process p = pb.start();
    var err = new java.io.ByteArrayOutputStream();
    Thread drain = new Thread(() -> {
      try {
        p.getErrorStream().transferTo(err);
      } catch (IOException ignored) {
        // the exit code and stdout carry the assertion
      }
    });
    drain.start();
    String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    int code = p.waitFor();
    drain.join();
    return new Result(code, out, err.toString(StandardCharsets.UTF_8));
  }

  @Test
  void check_failingFindings_exitsOne() throws Exception {
    // The parcel-delivery README's deliberately oversize route-optimizer fails the gate.
    Result r = run("check", "-f", "manifests-examples/parcel-delivery/", "--host-profile",
        "host-profiles/two-socket-one-node-per-socket.yaml");
    assertEquals(1, r.code(), r.err());
    assertEquals(Files.readString(Path.of("src/test/resources/check/golden/parcel-delivery.txt")),
        r.out());
  }

  @Test
  void check_noFailingFinding_exitsZero() throws Exception {
    Result r = run("check", "-f", "manifests-examples/parcel-delivery/", "--worker",
        "cpu=64,memory=512Gi");
    assertEquals(0, r.code(), r.out() + r.err());
    assertTrue(r.out().contains("Result: PASS"), r.out());
  }

  @Test
  void check_usageError_exitsTwo() throws Exception {
    Result r = run("check", "-f", "manifests-examples/parcel-delivery/");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("error: check needs --host-profile or --worker"), r.err());
  }

  @Test
  void check_unparsableManifest_exitsTwo(@TempDir Path dir) throws Exception {
    Path bad = dir.resolve("broken.yaml");
    Files.writeString(bad, "kind: Pod\nmetadata:\n  name: a\n  labels: [x\n");
    Result r = run("check", "-f", bad.toString(), "--worker", "cpu=16,memory=64Gi");
    assertEquals(2, r.code());
    assertTrue(r.err().contains(bad + ":") && r.err().contains("error: malformed YAML"), r.err());
    assertEquals("", r.out());
  }

  @Test
  void check_changeScenarioSarifToFile_exitsOneAndWritesFile(@TempDir Path dir) throws Exception {
    Path out = dir.resolve("numafit.sarif");
    List<String> args = new ArrayList<>(CheckGoldenTest.changeArgs());
    args.addAll(List.of("-o", "sarif", "--out", out.toString()));
    Result r = run(args.toArray(String[]::new));
    assertEquals(1, r.code(), r.err());
    assertEquals("", r.out());
    assertEquals(Files.readString(Path.of("src/test/resources/check/golden/change.sarif")),
        Files.readString(out));
  }

  @Test
  void check_baselineGitWithoutGit_exitsTwoWithClearMessage(@TempDir Path empty)
      throws Exception {
    // A PATH holding only an empty folder: no git command to start.
    Result r = runWithPath(empty.toString(), "check", "-f", "manifests-examples/parcel-delivery/",
        "--worker", "cpu=16,memory=64Gi", "--baseline-git", "HEAD");
    assertEquals(2, r.code(), r.out());
    assertTrue(r.err().contains("error: --baseline-git needs the git command line, but \"git\""
        + " could not be started"), r.err());
  }
}
