package dev.numafit.report.html;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.cli.Main;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** Runs the CLI in process for the report tests, and the checks HTML and JSON share. */
public final class HtmlRuns {
  public static final String PARCEL = "manifests-examples/parcel-delivery/";
  public static final String TICKETS = "manifests-examples/ticket-office/";
  public static final String TWO_SOCKET = "host-profiles/two-socket-one-node-per-socket.yaml";
  public static final String FOUR_NODE = "host-profiles/two-socket-four-nodes-per-socket.yaml";
  public static final String EMPTY_CHANNEL = "host-profiles/one-socket-empty-channel.yaml";

  /** The example runs every report test covers: each scenario, each profile, a bare worker. */
  public static final List<List<String>> EXAMPLES =
      List.of(
          List.of("plan", "-f", PARCEL, "--host-profile", TWO_SOCKET),
          List.of(
              "plan", "-f", TICKETS, "--host-profile", TWO_SOCKET, "--host-profile", FOUR_NODE,
              "--host-profile", EMPTY_CHANNEL),
          List.of("plan", "-f", PARCEL, "--host-profile", FOUR_NODE, "--worker",
              "cpu=16,memory=96Gi"),
          List.of("plan", "-f", TICKETS, "--worker", "cpu=16,memory=64Gi"));

  private HtmlRuns() {}

  /** Standard output of a run that must succeed. */
  static String run(List<String> args) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    int code =
        Main.run(
            args.toArray(String[]::new),
            new ByteArrayInputStream(new byte[0]),
            new PrintStream(out, true, StandardCharsets.UTF_8),
            new PrintStream(err, true, StandardCharsets.UTF_8));
    assertEquals(0, code, err.toString(StandardCharsets.UTF_8));
    return out.toString(StandardCharsets.UTF_8);
  }

  static List<String> with(List<String> args, String... more) {
    List<String> all = new java.util.ArrayList<>(args);
    all.addAll(List.of(more));
    return all;
  }

  /**
   * Every cell marked {@code data-json} holds the value the JSON report has at that pointer;
   * returns how many cells were compared.
   */
  public static int assertFiguresEqualJson(Document html, String json) {
    JsonNode root = new JsonMapper().readTree(json);
    int compared = 0;
    for (Element cell : html.select("[data-json]")) {
      String pointer = cell.attr("data-json");
      JsonNode node = root.at(pointer);
      assertNotNull(node, pointer);
      assertTrue(!node.isMissingNode(), "no " + pointer + " in the JSON report");
      String value = cell.attr("data-value");
      if (node.isNumber()) {
        assertEquals(
            0,
            new BigDecimal(node.toString()).compareTo(new BigDecimal(value)),
            pointer + ": HTML " + value + ", JSON " + node);
      } else {
        assertEquals(node.asString(), value, pointer);
      }
      compared++;
    }
    return compared;
  }
}
