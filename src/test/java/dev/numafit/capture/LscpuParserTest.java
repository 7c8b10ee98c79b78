package dev.numafit.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import java.util.List;
import org.junit.jupiter.api.Test;

class LscpuParserTest {
  private static final String HEADER =
      "# The following is the parsable format, which can be fed to other\n"
          + "# programs. Each different item in every column has an unique ID\n"
          + "# starting usually from zero.\n"
          + "# CPU,Core,Socket,Node,,L1d,L1i,L2,L3\n";

  @Test
  void parse_publishedRowShape_readsCpuCoreSocketNode() throws Exception {
    // FACTS check value 25 (util-linux lscpu.1.adoc / lscpu.c, H5): the row 4,0,0,0,,0,0,0,0 is
    // CPU 4, core 0, socket 0, node 0.
    CapturedTopology t =
        LscpuParser.parse(TextFile.of("l.txt", HEADER + "0,0,0,0,,0,0,0,0\n4,0,0,0,,0,0,0,0\n"));
    CpuEntry cpu4 = t.cpus().get(1);
    assertEquals(4, cpu4.cpu());
    assertEquals(0, cpu4.socket());
    assertEquals(0, cpu4.node());
    // Both rows name core 0 of socket 0: the same physical core.
    assertEquals(t.cpus().get(0).core(), cpu4.core());
  }

  @Test
  void parse_fixture_thirtyTwoCpusOnFourNodes() throws Exception {
    CapturedTopology t = LscpuParser.parse(Fixtures.text("capture/four-nodes-smt.lscpu.txt"));
    assertEquals(32, t.cpus().size());
    assertEquals(4, t.cpus().stream().mapToInt(CpuEntry::node).distinct().count());
    assertEquals(List.of(), t.nodes());
  }

  @Test
  void parse_emptyFile_errorAtLineOne() throws Exception {
    TextFile f = Fixtures.text("capture/empty.txt");
    InputException e = assertThrows(InputException.class, () -> LscpuParser.parse(f));
    assertEquals(
        List.of(
            f.name() + ":1: error: empty file: expected the output of lscpu -p (a \"# CPU,Core,"
                + "Socket,Node,...\" header and one row per CPU)"),
        formatted(e));
  }

  @Test
  void parse_rowsWithoutHeader_errorAtFirstRow() {
    InputException e =
        assertThrows(
            InputException.class, () -> LscpuParser.parse(TextFile.of("l.txt", "0,0,0,0\n")));
    assertEquals(
        List.of(
            "l.txt:1: error: expected a \"# CPU,Core,Socket,Node,...\" header line (lscpu -p)"
                + " before the first row, got \"0,0,0,0\""),
        formatted(e));
  }

  @Test
  void parse_shortAndNonNumericRows_everyErrorWithLine() {
    String text = HEADER + "0,0,0,0,,0,0,0,0\n1,0\n2,x,0,0,,0,0,0,0\n";
    InputException e =
        assertThrows(InputException.class, () -> LscpuParser.parse(TextFile.of("l.txt", text)));
    assertEquals(
        List.of(
            "l.txt:6: error: expected 9 comma-separated fields as in the header at line 4, got 2:"
                + " \"1,0\"",
            "l.txt:7: error: expected a whole number in column CORE, got \"x\""),
        formatted(e));
  }

  private static List<String> formatted(InputException e) {
    return e.diagnostics().stream().map(Diagnostic::format).toList();
  }
}
