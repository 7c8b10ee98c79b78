package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code numafit check} through {@link Main#run}: exit codes, standard output and error. */
class CheckCommandTest {
  private static final String PARCEL = "manifests-examples/parcel-delivery/";
  private static final String PROFILE = "host-profiles/two-socket-one-node-per-socket.yaml";

  @Test
  void check_exampleWithDeliberatelyOversizePod_exitsOneAndNamesIt() {
    // The parcel-delivery README says route-optimizer is deliberately too big for a one-node
    // worker (40 CPUs against a 30-vCPU worker of this profile).
    CliRun r = CliRun.of("check", "-f", PARCEL, "--host-profile", PROFILE);
    assertEquals(1, r.code(), r.err());
    assertTrue(r.out().contains("route-optimizer.yaml:22: error: parcel/Deployment/route-optimizer"),
        r.out());
    assertTrue(r.out().contains("Result: FAIL"), r.out());
  }

  @Test
  void check_failOnNone_exitsZero() {
    CliRun r = CliRun.of("check", "-f", PARCEL, "--host-profile", PROFILE, "--fail-on", "none");
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("Result: PASS"), r.out());
  }

  @Test
  void check_warningRulesOnly_exitsZero() {
    // A 64-vCPU worker holds the 40-CPU pod; what is left are warnings, which do not fail.
    CliRun r = CliRun.of("check", "-f", PARCEL, "--worker", "cpu=64,memory=512Gi");
    assertEquals(0, r.code(), r.out() + r.err());
  }

  @Test
  void check_noFiles_exitsTwoWithSentence() {
    CliRun r = CliRun.of("check", "--worker", "cpu=16,memory=64Gi");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("error: check needs at least one -f/--filename"), r.err());
  }

  @Test
  void check_fleetHostsWithoutProfile_exitsTwo() {
    CliRun r = CliRun.of("check", "-f", PARCEL, "--worker", "cpu=16,memory=64Gi",
        "--fleet-hosts", "3");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("--fleet-hosts needs --host-profile"), r.err());
  }

  @Test
  void check_unknownRule_exitsTwoListingRules() {
    CliRun r = CliRun.of("check", "-f", PARCEL, "--worker", "cpu=16,memory=64Gi",
        "--fail-on", "too-big");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("unknown rule \"too-big\" (expected none or one of:"
        + " pod-exceeds-worker,"), r.err());
  }

  @Test
  void check_unknownFormat_exitsTwo() {
    CliRun r = CliRun.of("check", "-f", PARCEL, "--worker", "cpu=16,memory=64Gi", "-o", "yaml");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("unknown output format \"yaml\""), r.err());
  }

  @Test
  void check_manifestThatDoesNotParse_exitsTwoNamingFileAndLine(@TempDir Path dir)
      throws IOException {
    Path bad = dir.resolve("bad.yaml");
    Files.writeString(bad, "kind: Deployment\nmetadata:\n  name: x\n spec: [\n");
    CliRun r = CliRun.of("check", "-f", bad.toString(), "--worker", "cpu=16,memory=64Gi");
    assertEquals(2, r.code());
    assertTrue(r.err().contains(bad + ":"), r.err());
    assertTrue(r.err().contains("error: malformed YAML"), r.err());
    assertEquals("", r.out());
  }

  @Test
  void check_skipInvalid_isNotAnOption() {
    CliRun r = CliRun.of("check", "-f", PARCEL, "--worker", "cpu=16,memory=64Gi",
        "--skip-invalid");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("--skip-invalid"), r.err());
  }

  @Test
  void check_configFile_suppliesOptionsAndFlagsOverride(@TempDir Path dir) throws IOException {
    // numafit.yaml in the working folder works for check as for plan (docs/config-file.md).
    Files.writeString(dir.resolve("numafit.yaml"),
        "worker: cpu=16,memory=64Gi\nfail-on: [none]\n");
    String parcel = Path.of(PARCEL).toAbsolutePath().toString();
    CliRun fromFile = CliRun.in(dir, "", "check", "-f", parcel);
    assertEquals(0, fromFile.code(), fromFile.err());
    assertTrue(fromFile.out().contains("given worker: 16 vCPUs, 64GiB"), fromFile.out());
    // The flag wins over the file: the default rules fail on the 40-CPU route-optimizer.
    CliRun flag = CliRun.in(dir, "", "check", "-f", parcel, "--fail-on", "pod-exceeds-worker");
    assertEquals(1, flag.code(), flag.err());
  }

  @Test
  void check_outFile_writesReportNotStdout(@TempDir Path dir) throws IOException {
    Path out = dir.resolve("report.json");
    CliRun r = CliRun.of("check", "-f", PARCEL, "--host-profile", PROFILE, "-o", "json",
        "--out", out.toString());
    assertEquals(1, r.code(), r.err());
    assertEquals("", r.out());
    assertTrue(Files.readString(out).contains("\"result\" : \"fail\""));
  }
}
