package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ConfigFileTest {
  @TempDir Path dir;

  private String[] merged(String... args) throws Exception {
    Console c =
        new Console(System.in, System.out, System.err, dir, false);
    return Main.withConfig(args, c);
  }

  @Test
  void withConfig_numafitYamlInWorkingDir_fillsOptionsNotGiven() throws Exception {
    Files.writeString(
        dir.resolve("numafit.yaml"),
        "host-profile:\n  - hosts/a.yaml\n  - hosts/b.yaml\nmax-utilization: 80\nplacement: true\n"
            + "vcpu-per-thread: false\n");
    String[] args = merged("plan", "-f", "app.yaml", "--max-utilization", "90");
    String a = dir.resolve("hosts/a.yaml").toString();
    String b = dir.resolve("hosts/b.yaml").toString();
    // --max-utilization given on the command line wins; false booleans add nothing.
    assertEquals(
        List.of(
            "plan", "--host-profile", a, "--host-profile", b, "--placement", "-f", "app.yaml",
            "--max-utilization", "90"),
        Arrays.asList(args));
  }

  @Test
  void withConfig_otherCommands_areLeftAlone() throws Exception {
    Files.writeString(dir.resolve("numafit.yaml"), "max-utilization: 80\n");
    assertEquals(
        List.of("demand", "-f", "x.yaml"), Arrays.asList(merged("demand", "-f", "x.yaml")));
  }

  @Test
  void withConfig_explicitConfig_isRead() throws Exception {
    Path sub = Files.createDirectories(dir.resolve("ci"));
    Files.writeString(sub.resolve("sizing.yaml"), "worker: cpu=8,memory=32Gi\n");
    assertEquals(
        List.of("plan", "--worker", "cpu=8,memory=32Gi", "-f", "x", "--config", "ci/sizing.yaml"),
        Arrays.asList(merged("plan", "-f", "x", "--config", "ci/sizing.yaml")));
  }

  @Test
  void run_configWithUnknownKeyAndBadValue_exitsTwoWithFileAndLine() throws IOException {
    Files.writeString(
        dir.resolve("numafit.yaml"),
        "# CI sizing\nworker: cpu=8,memory=32Gi\nhostprofile: a.yaml\nplacement: yes please\n");
    CliRun r = CliRun.in(dir, "", "plan", "-f", "x.yaml");
    assertEquals(2, r.code());
    assertEquals(
        "numafit.yaml:3: error: unknown option \"hostprofile\" for numafit plan (expected a long"
            + " option name without dashes, such as host-profile)\n"
            + "numafit.yaml:4: error: placement: expected true or false\n",
        r.err());
  }

  @Test
  void run_configNotYaml_exitsTwoWithLine() throws IOException {
    Files.writeString(dir.resolve("numafit.yaml"), "worker: [cpu=8\nplacement: true\n");
    CliRun r = CliRun.in(dir, "", "plan", "-f", "x.yaml");
    assertEquals(2, r.code());
    assertTrue(r.err().startsWith("numafit.yaml:"), r.err());
    assertTrue(r.err().contains(": error: not valid YAML: "), r.err());
  }

  @Test
  void run_missingExplicitConfig_exitsTwo() {
    CliRun r = CliRun.in(dir, "", "plan", "-f", "x.yaml", "--config", "nope.yaml");
    assertEquals(2, r.code());
    assertEquals("error: --config nope.yaml: no such file\n", r.err());
  }
}
