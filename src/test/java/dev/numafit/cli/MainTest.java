package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The CLI driven through {@link Main#run}: exit codes, standard output and standard error. The
 * expected exit codes are the project's own table (docs/exit-codes.md).
 */
class MainTest {
  @Test
  void run_version_printsNameAndExitsZero() {
    CliRun r = CliRun.of("--version");
    assertEquals(0, r.code());
    // Run from compiled classes there is no pom.properties, so the fallback text shows.
    assertEquals("numafit development build\n", r.out());
    assertEquals("", r.err());
  }

  @Test
  void run_help_listsEveryCommandAndExamples() {
    CliRun r = CliRun.of("--help");
    assertEquals(0, r.code());
    for (String cmd : new String[] {"demand", "plan", "completion", "help"}) {
      assertTrue(r.out().contains("\n  " + cmd + " "), cmd + " missing from:\n" + r.out());
    }
    assertTrue(r.out().contains("Examples:"));
  }

  @Test
  void run_helpOfEveryCommand_hasExamples() {
    for (String cmd : new String[] {"demand", "plan", "completion"}) {
      CliRun r = CliRun.of(cmd, "--help");
      assertEquals(0, r.code(), cmd);
      assertTrue(r.out().contains("Examples:\n  "), cmd + ":\n" + r.out());
      assertTrue(r.out().startsWith("Usage: numafit " + cmd), r.out());
    }
  }

  @Test
  void run_helpSubcommand_printsPlanUsage() {
    CliRun r = CliRun.of("help", "plan");
    assertEquals(0, r.code());
    assertTrue(r.out().startsWith("Usage: numafit plan"), r.out());
  }

  @Test
  void run_noCommand_exitsTwoWithMessage() {
    CliRun r = CliRun.of();
    assertEquals(2, r.code());
    // The list comes from the registered subcommands, so it grows with them.
    assertTrue(
        r.err().startsWith("error: missing command (expected one of: demand, plan, "), r.err());
    assertTrue(r.err().endsWith(", help)\nRun 'numafit --help' for usage.\n"), r.err());
    assertEquals("", r.out());
  }

  @Test
  void run_unknownOption_exitsTwoWithoutStackTrace() {
    CliRun r = CliRun.of("plan", "--frobnicate");
    assertEquals(2, r.code());
    assertEquals(
        "error: Unknown option: '--frobnicate'\nRun 'numafit plan --help' for usage.\n", r.err());
  }

  @Test
  void run_unknownCommand_exitsTwo() {
    CliRun r = CliRun.of("size");
    assertEquals(2, r.code());
    assertTrue(r.err().startsWith("error: Unmatched argument at index 0: 'size'"), r.err());
  }

  @Test
  void run_planWithoutShape_exitsTwoNamingTheRule() {
    CliRun r = CliRun.of("plan", "-f", "manifests-examples/parcel-delivery");
    assertEquals(2, r.code());
    assertEquals(
        "error: plan needs --host-profile or --worker\nRun 'numafit plan --help' for usage.\n",
        r.err());
  }

  @Test
  void run_planWithSeveralBrokenRules_reportsEveryRule() {
    CliRun r =
        CliRun.of(
            "plan",
            "--worker",
            "cpu=abc,memory=64Gi",
            "--max-utilization",
            "0",
            "--growth",
            "0.5",
            "--kubelet-reserve",
            "none",
            "--kube-reserved",
            "cpu=1");
    assertEquals(2, r.code());
    assertEquals(
        "error: plan needs at least one -f/--filename (a file, a folder, or - for standard"
            + " input)\n"
            + "error: --worker cpu=abc: not a Kubernetes quantity (expected e.g. 500m, 2, 64Gi)\n"
            + "error: --kubelet-reserve none cannot be combined with --kube-reserved,"
            + " --system-reserved or --eviction-hard\n"
            + "error: --max-utilization must be a percentage from 1 to 100, got 0\n"
            + "error: --growth must be 1 or more (it multiplies replica counts), got 0.5\n"
            + "Run 'numafit plan --help' for usage.\n",
        r.err());
  }

  @Test
  void run_badOutputFormat_exitsTwoListingFormats() {
    CliRun r = CliRun.of("demand", "-f", "x.yaml", "-o", "yaml");
    assertEquals(2, r.code());
    assertTrue(
        r.err()
            .startsWith(
                "error: Invalid value for option '--output': unknown output format \"yaml\""
                    + " (expected one of: text, json, html, markdown)"),
        r.err());
  }

  @Test
  void run_demandAsHtml_exitsTwoNamingTheFormatsItWrites() {
    CliRun r = CliRun.of("demand", "-f", "x.yaml", "-o", "html");
    assertEquals(2, r.code());
    assertTrue(
        r.err().startsWith("error: -o html is not available for demand (expected one of: text,"
            + " json)"),
        r.err());
  }

  @Test
  void run_demandWithoutFiles_exitsTwo() {
    CliRun r = CliRun.of("demand");
    assertEquals(2, r.code());
    assertTrue(r.err().startsWith("error: demand needs at least one -f/--filename"), r.err());
  }

  @Test
  void run_completion_printsBashScript() {
    CliRun r = CliRun.of("completion");
    assertEquals(0, r.code());
    assertTrue(r.out().startsWith("#!/usr/bin/env bash"), r.out());
    assertTrue(r.out().contains("--host-profile"), "plan options are completed");
    assertTrue(r.out().contains("complete -F _complete_numafit"), r.out());
  }

  @Test
  void run_noStackTraceForAnyUsageError() {
    for (String[] args :
        new String[][] {
          {"plan", "--max-pods", "many"},
          {"plan", "-f", "-", "-f", "-", "--worker", "cpu=4,memory=8Gi"},
          {"plan", "--worker", "cpu=4"},
          {"demand", "-f"},
        }) {
      CliRun r = CliRun.of(args);
      assertEquals(2, r.code(), String.join(" ", args));
      assertFalse(r.err().contains("\tat "), r.err());
      assertFalse(r.err().contains("Exception"), r.err());
    }
  }

  @Test
  void run_colourOn_coloursOnlyTheSeverityWord() {
    java.io.ByteArrayOutputStream err = new java.io.ByteArrayOutputStream();
    int code =
        Main.run(
            new String[] {"plan", "--worker", "cpu=4,memory=8Gi"},
            new java.io.ByteArrayInputStream(new byte[0]),
            new java.io.PrintStream(new java.io.ByteArrayOutputStream(), true),
            new java.io.PrintStream(err, true, java.nio.charset.StandardCharsets.UTF_8),
            java.nio.file.Path.of("").toAbsolutePath(),
            true);
    assertEquals(2, code);
    assertTrue(
        err.toString(java.nio.charset.StandardCharsets.UTF_8)
            .startsWith("\u001b[31merror\u001b[0m: plan needs at least one -f/--filename"),
        err.toString(java.nio.charset.StandardCharsets.UTF_8));
  }
}
