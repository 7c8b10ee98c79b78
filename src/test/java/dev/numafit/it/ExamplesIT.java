package dev.numafit.it;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.json.JsonMapper;

/**
 * End-to-end tests of the built jar on the example scenarios: exit code, standard output and
 * standard error against golden files (src/test/resources/golden; regenerate with {@code mvn
 * verify -Dnumafit.golden.update=true} and review the diff). The scenarios are invented demo data;
 * the arithmetic behind the numbers is checked against its published sources in the unit tests.
 */
class ExamplesIT {
  static final String PARCEL = "manifests-examples/parcel-delivery/";
  static final String TICKETS = "manifests-examples/ticket-office/";
  static final String TWO_SOCKET = "host-profiles/two-socket-one-node-per-socket.yaml";
  static final String FOUR_NODE = "host-profiles/two-socket-four-nodes-per-socket.yaml";
  static final String EMPTY_CHANNEL = "host-profiles/one-socket-empty-channel.yaml";

  @Test
  void plan_readmeFirstCommand_matchesGolden() {
    // The README's first command, exactly.
    JarRun r = JarRun.of("plan", "-f", PARCEL, "--host-profile", TWO_SOCKET);
    assertEquals(0, r.code(), r.err());
    r.matchesGolden("plan-parcel-two-socket");
  }

  @Test
  void plan_threeProfilesCompared_textAndJson_matchGolden() {
    JarRun text =
        JarRun.of(
            "plan", "-f", TICKETS, "--host-profile", TWO_SOCKET, "--host-profile", FOUR_NODE,
            "--host-profile", EMPTY_CHANNEL);
    assertEquals(0, text.code(), text.err());
    // Text mode: warnings on stderr (the empty-channel profile warns).
    assertTrue(text.err().contains(": warning: "), text.err());
    text.matchesGolden("plan-tickets-compare");
    JarRun json =
        JarRun.of(
            "plan", "-f", TICKETS, "--host-profile", TWO_SOCKET, "--host-profile", FOUR_NODE,
            "--host-profile", EMPTY_CHANNEL, "-o", "json");
    assertEquals(0, json.code(), json.err());
    // JSON mode: warnings go into the document, stderr stays empty.
    assertEquals("", json.err());
    json.matchesGolden("plan-tickets-compare-json");
  }

  @Test
  void plan_bareWorkerWithPlacement_matchesGolden() {
    JarRun r =
        JarRun.of(
            "plan", "-f", PARCEL, "--worker", "cpu=16,memory=64Gi", "--placement",
            "--per-worker", "cpu=200m,memory=512Mi,pods=2", "-o", "json");
    assertEquals(0, r.code(), r.err());
    r.matchesGolden("plan-parcel-worker-placement-json");
  }

  @Test
  void plan_workerPlacedOnHost_withHeadroomOptions_matchesGolden() {
    JarRun r =
        JarRun.of(
            "plan", "-f", TICKETS, "--host-profile", FOUR_NODE, "--worker", "cpu=16,memory=96Gi",
            "--max-utilization", "80", "--growth", "1.5", "--host-failures", "1",
            "--replicas", "declared");
    assertEquals(0, r.code(), r.err());
    r.matchesGolden("plan-tickets-spanning-worker");
  }

  @Test
  void demand_bothScenarios_textAndJson_matchGolden() {
    JarRun.of("demand", "-f", PARCEL).matchesGolden("demand-parcel");
    JarRun.of("demand", "-f", TICKETS, "-o", "json").matchesGolden("demand-tickets-json");
  }

  @Test
  void json_fromTheJar_validatesAgainstPublishedSchemas() throws IOException {
    JsonMapper mapper = new JsonMapper();
    SchemaRegistry registry = SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12);
    var planSchema =
        registry.getSchema(Files.readString(Path.of("docs/schema/plan.schema.json")));
    var demandSchema =
        registry.getSchema(Files.readString(Path.of("docs/schema/demand.schema.json")));
    for (JarRun r :
        List.of(
            JarRun.of("plan", "-f", TICKETS, "--host-profile", TWO_SOCKET, "--host-profile",
                EMPTY_CHANNEL, "-o", "json", "--placement"),
            JarRun.of("plan", "-f", PARCEL, "--worker", "cpu=8,memory=32Gi", "-o", "json"))) {
      assertEquals(0, r.code(), r.err());
      assertEquals(List.of(), planSchema.validate(mapper.readTree(r.out())), r.out());
    }
    JarRun d = JarRun.of("demand", "-f", PARCEL, "-f", TICKETS, "-o", "json");
    assertEquals(0, d.code(), d.err());
    assertEquals(List.of(), demandSchema.validate(mapper.readTree(d.out())));
  }

  @Test
  void plan_sameInputTwice_sameBytes() {
    JarRun a = JarRun.of("plan", "-f", TICKETS, "--host-profile", FOUR_NODE, "--placement");
    JarRun b = JarRun.of("plan", "-f", TICKETS, "--host-profile", FOUR_NODE, "--placement");
    assertEquals(0, a.code(), a.err());
    assertEquals(a.out(), b.out());
    assertEquals(a.err(), b.err());
  }

  @Test
  void plan_crlfAndLfCopies_giveSameOutput(@TempDir Path tmp) throws IOException {
    Path lf = copyScenario(tmp.resolve("lf"), "\n");
    Path crlf = copyScenario(tmp.resolve("crlf"), "\r\n");
    String[] args = {"plan", "-f", PARCEL, "--host-profile", TWO_SOCKET, "-o", "json"};
    JarRun a = JarRun.in(lf, null, args);
    JarRun b = JarRun.in(crlf, null, args);
    assertEquals(0, a.code(), a.err());
    assertEquals(0, b.code(), b.err());
    assertEquals(a.out(), b.out());
    assertEquals(a.err(), b.err());
    // ... and both equal the run on the checked-in files.
    assertEquals(JarRun.of(args).out(), a.out());
  }

  @Test
  void plan_stdinDash_readsManifests(@TempDir Path tmp) throws IOException {
    Path all = tmp.resolve("all.yaml");
    StringBuilder sb = new StringBuilder();
    try (Stream<Path> files = Files.list(Path.of(PARCEL))) {
      for (Path f : files.filter(p -> p.toString().endsWith(".yaml")).sorted().toList()) {
        sb.append("---\n").append(Files.readString(f));
      }
    }
    Files.writeString(all, sb.toString());
    JarRun r = JarRun.in(JarRun.PROJECT, all, "demand", "-f", "-", "-o", "json");
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("\"file\": \"<stdin>\""), r.out());
    assertTrue(r.out().contains("\"workload\": \"parcel/Deployment/route-optimizer\""));
  }

  @Test
  void plan_outFile_writesReportAndNothingOnStdout(@TempDir Path tmp) throws IOException {
    Path out = tmp.resolve("plan.json");
    Path kubelet = tmp.resolve("kubelet");
    JarRun r =
        JarRun.of(
            "plan", "-f", PARCEL, "--host-profile", TWO_SOCKET, "-o", "json", "--out",
            out.toString(), "--kubelet-config", kubelet.toString());
    assertEquals(0, r.code(), r.err());
    assertEquals("", r.out());
    assertEquals(
        JarRun.of("plan", "-f", PARCEL, "--host-profile", TWO_SOCKET, "-o", "json").out(),
        Files.readString(out, StandardCharsets.UTF_8));
    try (Stream<Path> left = Files.list(tmp)) {
      // No temporary file is left beside the report.
      assertEquals(
          List.of("kubelet", "plan.json"),
          left.map(p -> p.getFileName().toString()).sorted().toList());
    }
    String config =
        Files.readString(kubelet.resolve("two-socket-32c.kubelet-config.yaml"));
    assertTrue(config.contains("kind: KubeletConfiguration"), config);
    assertTrue(config.contains("maxPods: 110"), config);
  }

  @Test
  void errors_exitTwo_withFileAndLine_andNoStackTrace() {
    JarRun bad = JarRun.of("demand", "-f", "src/test/resources/it-input/mixed-folder");
    assertEquals(2, bad.code());
    assertEquals("", bad.out());
    bad.matchesGolden("demand-invalid-folder");
    JarRun skipped =
        JarRun.of("demand", "-f", "src/test/resources/it-input/mixed-folder", "--skip-invalid");
    assertEquals(0, skipped.code());
    // The valid documents of the folder are still read.
    assertTrue(skipped.out().contains("depot/Deployment/sorter"), skipped.out());
    assertTrue(skipped.out().contains("depot/Deployment/scanner"), skipped.out());
    skipped.matchesGolden("demand-invalid-folder-skipped");
    JarRun profile =
        JarRun.of(
            "plan", "-f", PARCEL, "--host-profile",
            "src/test/resources/it-input/zero-cores-profile.yaml");
    assertEquals(2, profile.code());
    profile.matchesGolden("plan-invalid-profile");
    JarRun missing = JarRun.of("plan", "-f", "no/such/folder", "--worker", "cpu=4,memory=8Gi");
    assertEquals(2, missing.code());
    missing.matchesGolden("plan-missing-path");
    for (JarRun r : List.of(bad, skipped, profile, missing)) {
      assertFalse(r.err().contains("\tat "), r.err());
      assertFalse(r.err().contains("Exception"), r.err());
    }
  }

  @Test
  void version_andHelp_fromTheJar() {
    JarRun v = JarRun.of("--version");
    assertEquals(0, v.code());
    // The version comes from the pom.properties Maven packs into the jar.
    assertTrue(v.out().matches("numafit \\d+\\.\\d+\\.\\d+(-SNAPSHOT)?\n"), v.out());
    JarRun h = JarRun.of("plan", "--help");
    assertEquals(0, h.code());
    assertTrue(h.out().contains("Examples:"), h.out());
    JarRun c = JarRun.of("completion");
    assertEquals(0, c.code());
    assertTrue(c.out().startsWith("#!/usr/bin/env bash"));
  }

  /** Copies the parcel scenario and the two-socket profile, rewriting every line end. */
  private static Path copyScenario(Path root, String eol) throws IOException {
    Path scenario = Files.createDirectories(root.resolve(PARCEL));
    try (Stream<Path> files = Files.list(Path.of(PARCEL))) {
      for (Path f : files.sorted().toList()) {
        String text = Files.readString(f).replace("\r\n", "\n").replace("\n", eol);
        Files.writeString(scenario.resolve(f.getFileName().toString()), text);
      }
    }
    Path profile = root.resolve(TWO_SOCKET);
    Files.createDirectories(profile.getParent());
    Files.writeString(profile, Files.readString(Path.of(TWO_SOCKET)).replace("\n", eol));
    return root;
  }
}
