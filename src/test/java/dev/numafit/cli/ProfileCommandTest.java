package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code numafit profile capture | validate | show} through {@link Main#run}. */
class ProfileCommandTest {
  private static final String SYSFS = "src/test/resources/sysfs/";
  private static final String CAPTURE = "src/test/resources/capture/";

  @TempDir Path tmp;

  @Test
  void capture_fixtureWithDmidecode_writesLoadableProfileAndWarnsOnStderr() throws Exception {
    Path out = tmp.resolve("p.yaml");
    CliRun r =
        CliRun.of(
            "profile", "capture", "--sysfs-root", SYSFS + "one-node", "--dmidecode",
            CAPTURE + "one-node-unbalanced.dmidecode.txt", "--name", "rack-a", "--out",
            out.toString());
    assertEquals(0, r.code(), r.err());
    assertEquals("", r.out());
    assertTrue(r.err().contains("warning: node 0 channel D has no module"), r.err());
    assertTrue(r.err().contains("warning: hypervisor reserve to confirm"), r.err());
    String profile = Files.readString(out, StandardCharsets.UTF_8);
    assertTrue(profile.contains("  name: rack-a\n"), profile);
    CliRun v = CliRun.of("profile", "validate", out.toString());
    assertEquals(0, v.code(), v.err());
    assertTrue(v.out().startsWith(out + ": valid ("), v.out());
    // The profile reader itself sees the empty channel (issue 2's wording).
    assertTrue(v.err().contains("node 0 uses 3 of 4 channels"), v.err());
  }

  @Test
  void capture_dmidecodeFromStdin_sameAsFromFile() throws Exception {
    String dmi = Files.readString(Path.of(CAPTURE + "two-sockets.dmidecode.txt"));
    CliRun fromStdin =
        CliRun.in(Path.of("").toAbsolutePath(), dmi, "profile", "capture", "--sysfs-root",
            SYSFS + "two-sockets", "--dmidecode", "-");
    CliRun fromFile =
        CliRun.of("profile", "capture", "--sysfs-root", SYSFS + "two-sockets", "--dmidecode",
            CAPTURE + "two-sockets.dmidecode.txt");
    assertEquals(0, fromStdin.code(), fromStdin.err());
    assertEquals(
        fromFile.out().replace(CAPTURE + "two-sockets.dmidecode.txt", "X"),
        fromStdin.out().replace("<stdin>", "X"));
  }

  @Test
  void capture_otherDmiType_exit2WithFileAndLine() {
    CliRun r =
        CliRun.of("profile", "capture", "--sysfs-root", SYSFS + "one-node", "--dmidecode",
            CAPTURE + "processor.dmidecode.txt");
    assertEquals(2, r.code());
    assertEquals("", r.out());
    assertEquals(
        CAPTURE + "processor.dmidecode.txt:5: error: expected DMI type 17 (Memory Device) records"
            + " as printed by dmidecode -t 17, got DMI type 4 and no type 17 record\n",
        r.err());
  }

  @Test
  void capture_emptyLscpuFile_exit2WithFileAndLine() {
    CliRun r = CliRun.of("profile", "capture", "--lscpu", CAPTURE + "empty.txt");
    assertEquals(2, r.code());
    assertTrue(
        r.err().startsWith(CAPTURE + "empty.txt:1: error: empty file: expected the output of"
            + " lscpu -p"),
        r.err());
  }

  @Test
  void capture_lscpuAlone_saysWhichInputIsMissing() {
    CliRun r = CliRun.of("profile", "capture", "--lscpu", CAPTURE + "four-nodes-smt.lscpu.txt");
    assertEquals(2, r.code());
    assertEquals(
        "error: memory per node is unknown: lscpu gives none; add --dmidecode FILE or"
            + " --sysfs-root DIR\n",
        r.err());
  }

  @Test
  void capture_badName_usageError() {
    CliRun r = CliRun.of("profile", "capture", "--sysfs-root", SYSFS + "one-node", "--name", "a b");
    assertEquals(2, r.code());
    assertTrue(r.err().startsWith("error: --name must be letters"), r.err());
  }

  @Test
  void validate_oneValidOneInvalid_exit2AndEveryFileReported() throws Exception {
    Path good = tmp.resolve("good.yaml");
    Files.writeString(
        good,
        CliRun.of("profile", "capture", "--sysfs-root", SYSFS + "two-sockets").out());
    Path bad = tmp.resolve("bad.yaml");
    Files.writeString(bad, "apiVersion: numafit.dev/v1alpha1\nkind: HostProfile\n");
    CliRun r = CliRun.of("profile", "validate", bad.toString(), good.toString());
    assertEquals(2, r.code());
    assertTrue(r.out().contains(bad + ": invalid\n"), r.out());
    assertTrue(r.out().contains(good + ": valid"), r.out());
    assertTrue(r.err().contains(bad + ":1: error: metadata: missing; expected a mapping"), r.err());
  }

  @Test
  void validate_noFile_usageError() {
    CliRun r = CliRun.of("profile", "validate");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("FILE"), r.err());
  }

  @Test
  void show_textAndJson_fromTheCapturedProfile() {
    String file = "src/test/resources/profile-show/captured-two-sockets.yaml";
    CliRun text = CliRun.of("profile", "show", file);
    assertEquals(0, text.code(), text.err());
    assertTrue(text.out().contains("one-node worker: 8 vCPU, 62 GiB memory"), text.out());
    CliRun json = CliRun.of("profile", "show", file, "-o", "json");
    assertEquals(0, json.code(), json.err());
    assertEquals("", json.err());
    assertTrue(json.out().contains("\"peakBandwidthBytesPerSecond\" : 102400000000"), json.out());
  }

  @Test
  void show_missingFile_exit2() {
    CliRun r = CliRun.of("profile", "show", "no-such.yaml");
    assertEquals(2, r.code());
    assertEquals("no-such.yaml: error: no such file\n", r.err());
  }

  @Test
  void profile_withoutSubcommand_usageError() {
    CliRun r = CliRun.of("profile");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("missing command (expected one of: capture, validate, show)"),
        r.err());
  }
}
