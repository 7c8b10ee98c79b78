package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

/**
 * The commands run in-process through {@link Main#run} on the example scenarios and on broken
 * input; the jar itself is tested end to end in ExamplesIT.
 */
class PipelineTest {
  static final String PARCEL = "manifests-examples/parcel-delivery/";
  static final String TWO_SOCKET = "host-profiles/two-socket-one-node-per-socket.yaml";

  @Test
  void plan_example_printsPlanWithCaution() {
    CliRun r = CliRun.of("plan", "-f", PARCEL, "--host-profile", TWO_SOCKET);
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("Plan for host profile two-socket-32c\n"), r.out());
    assertTrue(r.out().contains("parcel/Deployment/route-optimizer: over by"), r.out());
    assertTrue(r.out().endsWith("follow your organisation's change practice.\n"), r.out());
  }

  @Test
  void plan_jsonMode_keepsStderrEmpty() {
    CliRun r =
        CliRun.of(
            "plan", "-f", "manifests-examples/ticket-office/", "--host-profile",
            "host-profiles/one-socket-empty-channel.yaml", "-o", "json");
    assertEquals(0, r.code(), r.err());
    assertEquals("", r.err());
    // The profile's empty-channel warning is in the document instead.
    assertTrue(r.out().contains("\"severity\": \"warning\""), r.out());
  }

  @Test
  void plan_textMode_warningsOnStderr() {
    CliRun r =
        CliRun.of(
            "plan", "-f", PARCEL, "--host-profile", "host-profiles/one-socket-empty-channel.yaml");
    assertEquals(0, r.code(), r.err());
    assertTrue(
        r.err().startsWith("host-profiles/one-socket-empty-channel.yaml:"), r.err());
    assertTrue(r.err().contains(": warning: "), r.err());
  }

  @Test
  void demand_missingPath_exitsTwoEvenWithSkipInvalid() {
    CliRun r = CliRun.of("demand", "-f", "no-such.yaml", "--skip-invalid");
    assertEquals(2, r.code());
    assertEquals(
        "error: -f no-such.yaml: no such file or folder\nRun 'numafit demand --help' for usage.\n",
        r.err());
  }

  @Test
  void demand_stdin_isRead(@TempDir Path tmp) throws Exception {
    String pod =
        "apiVersion: v1\nkind: Pod\nmetadata:\n  name: probe\nspec:\n  containers:\n"
            + "  - name: c\n    image: registry.example.com/probe:1\n    resources:\n"
            + "      requests: {cpu: 250m, memory: 64Mi}\n";
    CliRun r = CliRun.in(tmp, pod, "demand", "-f", "-", "-o", "json");
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("\"workload\": \"default/Pod/probe\""), r.out());
    // 250m and 64Mi = 67108864 bytes, as written.
    assertTrue(r.out().contains("\"cpu\": 250"), r.out());
    assertTrue(r.out().contains("\"memory\": 67108864"), r.out());
  }

  @Test
  void plan_outIntoMissingFolder_exitsTwoWithMessage(@TempDir Path tmp) {
    Path out = tmp.resolve("nope/plan.txt");
    CliRun r = CliRun.of("plan", "-f", PARCEL, "--worker", "cpu=16,memory=64Gi", "--out",
        out.toString());
    assertEquals(2, r.code());
    assertEquals("error: cannot write " + out + ": no such folder\n", r.err());
    assertEquals("", r.out());
  }

  @Test
  void plan_outFile_replacesOldReportWholly(@TempDir Path tmp) throws Exception {
    Path out = tmp.resolve("plan.txt");
    Files.writeString(out, "old report\n");
    CliRun r = CliRun.of("plan", "-f", PARCEL, "--worker", "cpu=16,memory=64Gi", "--out",
        out.toString());
    assertEquals(0, r.code(), r.err());
    assertEquals("", r.out());
    assertTrue(Files.readString(out).startsWith("Demand: 10 workloads"));
    try (var files = Files.list(tmp)) {
      assertEquals(1, files.count(), "no temporary file left behind");
    }
  }

  @Test
  void plan_workerLargerThanHost_exitsTwo() {
    CliRun r =
        CliRun.of(
            "plan", "-f", PARCEL, "--host-profile", TWO_SOCKET, "--worker",
            "cpu=512,memory=64Gi");
    assertEquals(2, r.code());
    assertTrue(
        r.err().startsWith("error: a --worker of 512 vCPU, 64GiB does not fit on host profile"
            + " two-socket-32c"),
        r.err());
  }

  @Test
  void plan_kubeletConfig_writtenPerProfile(@TempDir Path tmp) throws Exception {
    CliRun r =
        CliRun.of(
            "plan", "-f", PARCEL, "--host-profile", TWO_SOCKET, "--kube-reserved",
            "cpu=1,memory=2Gi", "--kubelet-config", tmp.toString());
    assertEquals(0, r.code(), r.err());
    String config = Files.readString(tmp.resolve("two-socket-32c.kubelet-config.yaml"));
    assertTrue(config.contains("apiVersion: kubelet.config.k8s.io/v1beta1"), config);
    assertTrue(config.contains("maxPods: 110"), config);
  }

  @Test
  void errors_internalError_exitThree_stackTraceOnlyWhenVerbose() {
    for (boolean verbose : new boolean[] {false, true}) {
      ByteArrayOutputStream err = new ByteArrayOutputStream();
      Console c =
          new Console(
              System.in,
              new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8),
              new PrintStream(err, true, StandardCharsets.UTF_8),
              Path.of(""),
              false);
      Errors errors = new Errors(c, verbose);
      int code =
          errors.handleExecutionException(
              new IllegalStateException("boom"),
              new CommandLine(new NumafitCommand(c)),
              null);
      assertEquals(3, code);
      String text = err.toString(StandardCharsets.UTF_8);
      assertTrue(text.startsWith("internal error: java.lang.IllegalStateException: boom"), text);
      assertEquals(verbose, text.contains("\tat "), text);
      if (!verbose) {
        assertTrue(text.contains("run again with --verbose"), text);
      }
    }
  }

  @Test
  void errors_userErrors_mapToTwo() {
    Errors errors =
        new Errors(
            new Console(System.in, System.out, System.err, Path.of(""), false), false);
    assertEquals(2, errors.getExitCode(new UsageException("x")));
    assertEquals(
        2,
        errors.getExitCode(
            new dev.numafit.diag.InputException(dev.numafit.diag.Diagnostic.error(null, "x"))));
    assertEquals(3, errors.getExitCode(new NullPointerException()));
    assertFalse(ExitCode.OK.code() == ExitCode.USAGE_OR_INPUT.code());
  }
}
