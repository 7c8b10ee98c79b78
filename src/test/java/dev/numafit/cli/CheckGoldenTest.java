package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Golden outputs of {@code numafit check} in every format, on the example scenarios and on the
 * change scenario under src/test/resources/check/change (base and head).
 *
 * <p>Regenerate after an intended change with {@code mvn -o test -Dtest=CheckGoldenTest
 * -Dnumafit.updateGolden=true}, then review the diff.
 */
class CheckGoldenTest {
  static final Path GOLDEN = Path.of("src/test/resources/check/golden");
  static final String CHECK = "src/test/resources/check/";

  /** Arguments of each scenario, and the exit code it must give. */
  record Scenario(String name, int exit, List<String> args) {}

  static List<Scenario> scenarios() {
    // The examples' deliberately oversize workloads (their READMEs say so) fail the gate: exit 1.
    return List.of(
        new Scenario("parcel-delivery", 1, List.of("check", "-f",
            "manifests-examples/parcel-delivery/", "--host-profile",
            "host-profiles/two-socket-one-node-per-socket.yaml")),
        new Scenario("ticket-office", 1, List.of("check", "-f",
            "manifests-examples/ticket-office/", "--host-profile",
            "host-profiles/two-socket-one-node-per-socket.yaml")),
        new Scenario("change", 1, changeArgs()));
  }

  /**
   * The change scenario: head against base, on the test host (4 workers of 16 vCPU / 64Gi per
   * host, nothing reserved), with a fleet of 1 host.
   */
  static List<String> changeArgs() {
    return List.of("check", "-f", CHECK + "change/head", "--baseline", CHECK + "change/base",
        "--host-profile", CHECK + "host-two-nodes.yaml", "--worker", "cpu=16,memory=64Gi",
        "--kubelet-reserve", "none", "--fleet-hosts", "1");
  }

  static Stream<Arguments> cases() {
    List<Arguments> out = new ArrayList<>();
    for (Scenario s : scenarios()) {
      for (String format : List.of("text", "json", "markdown", "sarif", "junit")) {
        out.add(Arguments.of(s, format));
      }
    }
    return out.stream();
  }

  static String extension(String format) {
    return switch (format) {
      case "text" -> "txt";
      case "markdown" -> "md";
      case "junit" -> "xml";
      default -> format;
    };
  }

  static CliRun run(Scenario s, String format) {
    List<String> args = new ArrayList<>(s.args());
    args.add("-o");
    args.add(format);
    return CliRun.of(args.toArray(String[]::new));
  }

  @ParameterizedTest(name = "{0} -o {1}")
  @MethodSource("cases")
  void check_scenario_matchesGolden(Scenario s, String format) throws IOException {
    CliRun r = run(s, format);
    assertEquals(s.exit(), r.code(), r.err());
    Path golden = GOLDEN.resolve(s.name() + "." + extension(format));
    if (Boolean.getBoolean("numafit.updateGolden")) {
      Files.createDirectories(GOLDEN);
      Files.writeString(golden, r.out(), StandardCharsets.UTF_8);
    }
    assertEquals(Files.readString(golden, StandardCharsets.UTF_8), r.out());
  }

  @ParameterizedTest(name = "{0} -o {1}")
  @MethodSource("cases")
  void check_sameInputTwice_identicalBytes(Scenario s, String format) {
    assertEquals(run(s, format).out(), run(s, format).out());
  }
}
