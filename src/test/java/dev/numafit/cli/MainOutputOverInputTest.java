package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code --out} never names one of the run's inputs; the input is left untouched. */
class MainOutputOverInputTest {
  @TempDir Path dir;

  static final String POD = "apiVersion: v1\nkind: Pod\nmetadata: {name: invoice}\nspec:\n"
      + "  containers:\n  - name: c\n    resources: {requests: {cpu: 100m}}\n";

  @Test
  void run_outIsTheInputFile_refusedAndInputUnchanged() throws Exception {
    Path in = Files.writeString(dir.resolve("invoice.yaml"), POD);
    CliRun r = CliRun.of("demand", "-f", in.toString(), "--out", in.toString());
    assertEquals(2, r.code());
    assertEquals("error: --out " + in + " is also an input of this run; numafit never writes"
        + " its output over its inputs (choose another file)\n", r.err());
    assertEquals(POD, Files.readString(in));
  }

  @Test
  void run_outSpelledDifferentlyWithEquals_stillRefused() throws Exception {
    Path in = Files.writeString(dir.resolve("invoice.yaml"), POD);
    CliRun r = CliRun.of("demand", "-f=" + in, "--out=" + dir.resolve(".").resolve("invoice.yaml"));
    assertEquals(2, r.code(), r.err());
    assertEquals(POD, Files.readString(in));
  }

  @Test
  void run_outIsAManifestInsideAnInputFolder_refused() throws Exception {
    Files.writeString(dir.resolve("invoice.yaml"), POD);
    CliRun r = CliRun.of("demand", "-f", dir.toString(), "-o", "json", "--out",
        dir.resolve("report.json").toString());
    assertEquals(2, r.code());
    assertTrue(r.err().contains("lies in the input folder"), r.err());
    assertTrue(Files.notExists(dir.resolve("report.json")));
  }

  @Test
  void run_outElsewhere_written() throws Exception {
    Path in = Files.writeString(dir.resolve("invoice.yaml"), POD);
    Path out = dir.resolve("report.txt");
    CliRun r = CliRun.of("demand", "-f", in.toString(), "--out", out.toString());
    assertEquals(0, r.code(), r.err());
    assertTrue(Files.readString(out).contains("default/Pod/invoice"));
  }
}
