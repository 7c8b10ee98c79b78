package dev.numafit.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.cli.Main;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The compact host picture of the text plan, and the text plan's fit to the terminal width. */
class HostDiagramTest {
  private static final String TICKETS = "manifests-examples/ticket-office/";
  private static final String FOUR_NODE = "host-profiles/two-socket-four-nodes-per-socket.yaml";

  private static String plan(String... args) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    int code = Main.run(args, new ByteArrayInputStream(new byte[0]),
        new PrintStream(out, true, StandardCharsets.UTF_8),
        new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8));
    assertEquals(0, code);
    return out.toString(StandardCharsets.UTF_8);
  }

  @Test
  void render_fourNodesPerSocket_oneRowPerNodeUnderItsSocket() {
    String text = plan("plan", "-f", TICKETS, "--host-profile", FOUR_NODE);
    List<String> rows = text.lines().filter(l -> l.startsWith("      node ")).toList();
    // host-profiles/two-socket-four-nodes-per-socket.yaml: 2 sockets × 4 nodes, one worker each.
    assertEquals(8, rows.size());
    assertTrue(text.contains("    socket 0\n      node 0 "), text);
    assertTrue(text.contains("    socket 1\n      node 4 "), text);
    rows.forEach(r -> assertTrue(r.endsWith("  1 worker"), r));
    // Node 0 gives the hypervisor its one reserved core: the CPU bar starts with it.
    assertTrue(rows.get(0).contains("cpu [h"), rows.get(0));
    assertFalse(rows.get(1).contains("cpu [h"), rows.get(1));
  }

  @Test
  void bar_partsAddUpToTheWidth_andAThinPartKeepsOneCell() {
    // 2 reserved of 32 cores, 30 for a worker, in 15 cells: 0.94 cells of hypervisor → 1.
    String bar = HostDiagram.bar(
        List.of(part('h', 2), part('#', 30), part('.', 0)), 15, TextStyle.PLAIN);
    assertEquals("h##############", bar);
    // 1 part in 100 would round to no cell; it keeps one, taken from the largest.
    String thin = HostDiagram.bar(List.of(part('h', 1), part('#', 99)), 10, TextStyle.PLAIN);
    assertEquals("h#########", thin);
    assertEquals(10, thin.length());
  }

  @Test
  void render_wideColourTerminal_fitsItsWidthAndColoursTheBars() {
    TextStyle wide = new TextStyle(true, 110);
    String text = new PlanTextWriter(wide).render(ReportFixtures.planReport());
    String hostText = plan("plan", "-f", TICKETS, "--host-profile", FOUR_NODE);
    assertFalse(text.isEmpty());
    assertTrue(text.contains("\u001b[1mPlan for"), text);
    for (String line : text.lines().toList()) {
      String visible = line.replaceAll("\u001b\\[[0-9;]*m", "");
      assertTrue(visible.length() <= 110, visible.length() + ": " + visible);
    }
    assertFalse(hostText.contains("\u001b"));
  }

  @Test
  void render_plainStyle_noEscapeCodesAndEightyColumns() {
    for (String line : plan("plan", "-f", TICKETS, "--host-profile", FOUR_NODE).lines().toList()) {
      assertFalse(line.contains("\u001b"), line);
      assertTrue(line.length() <= 80, line.length() + ": " + line);
    }
  }

  private static HostDiagram.Part part(char mark, double units) {
    return new HostDiagram.Part(mark, units);
  }
}
