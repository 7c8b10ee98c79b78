package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.cluster.ResourceType;
import dev.numafit.pack.Progress;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The progress line on standard error, driven with a fake terminal flag, and standard output of
 * whole runs with and without it. The lines' wording is numafit's own; the counts are the calls
 * made.
 */
class ProgressLineTest {
  private final ByteArrayOutputStream bytes = new ByteArrayOutputStream();
  private final PrintStream err = new PrintStream(bytes, true, StandardCharsets.UTF_8);

  private String written() {
    return bytes.toString(StandardCharsets.UTF_8);
  }

  @Test
  void update_notATerminal_writesNothing() {
    ProgressLine line = new ProgressLine(err, false, true);
    for (int i = 1; i <= 50; i++) {
      line.update(Progress.Phase.FAILURES, i, 50);
    }
    line.update(ResourceType.values()[0], 500, 1, false);
    line.clear();
    assertEquals("", written());
  }

  @Test
  void update_terminal_oneLineOverwrittenPerPercentThenCleared() {
    ProgressLine line = new ProgressLine(err, true, false);
    for (int i = 1; i <= 1000; i++) {
      line.update(Progress.Phase.FAILURES, i, 1000);
    }
    String out = written();
    // Never a new line: the same line is rewritten after a carriage return.
    assertFalse(out.contains("\n"));
    // 1000 steps of 1000: a line each for 0%–99% (steps 1, 10, 20, … 990), then one clear.
    assertEquals(100 + 1, out.chars().filter(c -> c == '\r').count() - 1);
    assertTrue(out.contains("\rfailure sets checked: 500 / 1,000 (50%)"), out);
    // Cleared at the end: spaces over the last line, the cursor back at the start.
    String lastLine = "failure sets checked: 990 / 1,000 (99%)";
    assertTrue(out.endsWith(lastLine + "\r" + " ".repeat(lastLine.length()) + "\r"), out);
  }

  @Test
  void update_noColour_noEscapeSequence() {
    ProgressLine line = new ProgressLine(err, true, false);
    line.update(Progress.Phase.PACK, 0, 60_000);
    line.update(Progress.Phase.EXACT, 20_000, 0);
    assertFalse(written().contains("\u001b"));
    assertTrue(written().contains("exact search, nodes searched: 20,000"), written());
  }

  @Test
  void update_colourAllowed_lineDimmedAndReset() {
    ProgressLine line = new ProgressLine(err, true, true);
    line.update(Progress.Phase.PACK, 0, 60_000);
    // SGR 2 (faint) and SGR 0 (reset), ECMA-48 section 8.3.117.
    assertEquals("\r\u001b[2mpacking pods: 0 / 60,000 (0%)\u001b[0m", written());
  }

  @Test
  void update_unknownTotal_aLineEveryStride() {
    ProgressLine line = new ProgressLine(err, true, false);
    for (long i = 1; i <= 5 * ProgressLine.STRIDE; i++) {
      line.update(Progress.Phase.EXACT, i, 0);
    }
    // A line at step 1 (key 0) and at each of the 5 strides.
    assertEquals(6, written().chars().filter(c -> c == '\r').count());
  }

  @Test
  void update_clusterRead_pagesShownAndClearedWhenDone() {
    ProgressLine line = new ProgressLine(err, true, false);
    ResourceType type = ResourceType.values()[0];
    line.update(type, 500, 1, false);
    line.update(type, 1000, 2, false);
    line.update(type, 1200, 3, true);
    String out = written();
    String second = "reading " + type.display() + ": 1,000 read, 2 pages";
    String last = "reading " + type.display() + ": 1,200 read, 3 pages";
    assertTrue(out.contains("\r" + second), out);
    assertTrue(out.endsWith("\r" + last + "\r" + " ".repeat(last.length()) + "\r"), out);
  }

  @Test
  void update_shorterLineAfterLonger_padsOverTheRest() {
    ProgressLine line = new ProgressLine(err, true, false);
    line.update(Progress.Phase.FAILURES, 1, 100_000);
    line.update(Progress.Phase.PACK, 0, 60_000);
    String first = "failure sets checked: 1 / 100,000 (0%)";
    String second = "packing pods: 0 / 60,000 (0%)";
    assertEquals("\r" + first + "\r" + second + " ".repeat(first.length() - second.length()),
        written());
  }

  /** Standard output and error of one in-process run. */
  private static String[] run(String... args) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    int code = Main.run(args, new ByteArrayInputStream(new byte[0]),
        new PrintStream(out, true, StandardCharsets.UTF_8),
        new PrintStream(err, true, StandardCharsets.UTF_8));
    assertEquals(0, code, err.toString(StandardCharsets.UTF_8));
    return new String[] {out.toString(StandardCharsets.UTF_8),
        err.toString(StandardCharsets.UTF_8)};
  }

  @Test
  void plan_stderrTerminalOrNot_stdoutByteIdentical() {
    List<String> formats = List.of("text", "json");
    for (String format : formats) {
      String[] args = {"plan", "-f", "manifests-examples/ticket-office/", "--host-profile",
          "host-profiles/two-socket-one-node-per-socket.yaml", "--host-failures", "1", "-o",
          format};
      String[] plain = run(args);
      String[] tty;
      String before = System.getProperty("numafit.stderrTty");
      System.setProperty("numafit.stderrTty", "1");
      try {
        tty = run(args);
      } finally {
        if (before == null) {
          System.clearProperty("numafit.stderrTty");
        } else {
          System.setProperty("numafit.stderrTty", before);
        }
      }
      assertEquals(plain[0], tty[0], format);
      // The progress was there (so the comparison is worth something), and only on the terminal.
      assertTrue(tty[1].contains("\rfailure sets checked: "), tty[1]);
      assertFalse(plain[1].contains("\r"), plain[1]);
      // The terminal's stream equals the plain one once the progress lines are taken out.
      assertEquals(plain[1], tty[1].replaceAll("(?:\r[^\r\n]*)+\r", ""),
          format);
    }
  }
}
