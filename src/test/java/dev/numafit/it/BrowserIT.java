package dev.numafit.it;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.report.html.HtmlRuns;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.select.Elements;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The HTML report of each example scenario, written by the built jar and loaded in headless
 * Chromium from a file:// URL: no console messages, the DOM the browser built holds each host's
 * topology with one shape per NUMA node and per worker VM, the tables' figures equal the JSON
 * report's, and markup in names stays text. .ci/run installs Debian's chromium; without it these
 * tests are skipped with a message (and fail on CI, where it must be there).
 */
class BrowserIT {
  private static Chromium chromium;

  @BeforeAll
  static void findChromium() {
    Optional<Chromium> found = Chromium.find();
    if (found.isEmpty()) {
      String message = "chromium is not installed: browser tests of the HTML report SKIPPED"
          + " (apt-get install chromium; .ci/run does)";
      System.err.println("WARNING: " + message);
      if ("true".equals(System.getenv("CI"))) {
        throw new AssertionError(message + " — required on CI");
      }
      Assumptions.abort(message);
    }
    chromium = found.get();
  }

  @Test
  void chromium_pageWithConsoleError_isDetected(@TempDir Path tmp) throws Exception {
    // The check below is only worth something if a console message would be seen.
    Path page = tmp.resolve("control.html");
    Files.writeString(page, "<!DOCTYPE html><html><body><p>control</p><script>"
        + "console.error('control-message');</script></body></html>");
    Chromium.Load load = chromium.dumpDom(page);
    assertEquals(1, load.console().size(), load.console().toString());
    assertTrue(load.console().get(0).contains("control-message"));
    assertTrue(load.dom().contains("<p>control</p>"));
  }

  @Test
  void examples_inChromium_noConsoleMessages_topologyCounts_figuresEqualJson(@TempDir Path tmp)
      throws Exception {
    int n = 0;
    for (List<String> example : HtmlRuns.EXAMPLES) {
      Path html = tmp.resolve("report-" + n++ + ".html");
      List<String> args = new ArrayList<>(example);
      args.addAll(List.of("-o", "html", "--out", html.toString()));
      JarRun written = JarRun.of(args.toArray(String[]::new));
      assertEquals(0, written.code(), written.err());
      List<String> jsonArgs = new ArrayList<>(example);
      jsonArgs.addAll(List.of("-o", "json"));
      JarRun json = JarRun.of(jsonArgs.toArray(String[]::new));
      assertEquals(0, json.code(), json.err());

      Chromium.Load load = chromium.dumpDom(html);
      assertEquals(List.of(), load.console(), example.toString());
      Document dom = Jsoup.parse(load.dom());
      assertEquals(0, dom.select("script").size());
      JsonNode plans = new JsonMapper().readTree(json.out()).get("plans");
      for (JsonNode plan : plans) {
        if (plan.get("hostProfile").isNull()) {
          continue;
        }
        String name = plan.get("hostProfile").asString();
        Elements svg = dom.select("svg.topology[data-profile=" + name + "]");
        assertEquals(1, svg.size(), name);
        // One node shape per row of the node table, and that many rows as the profile has nodes
        // (the unit test holds the row count to the profile file).
        int rows = dom.select("section[data-profile=" + name + "] tr.node-row").size();
        assertTrue(rows >= 1);
        assertEquals(rows, svg.select("g.numa-node").size(), name);
        assertEquals(plan.get("workersPerHost").asInt(), svg.select("g.worker").size(), name);
      }
      int compared = HtmlRuns.assertFiguresEqualJson(dom, json.out());
      assertTrue(compared > 0);
    }
  }

  @Test
  void markupInNames_inChromium_staysText(@TempDir Path tmp) throws Exception {
    Path manifest = tmp.resolve("evil.yaml");
    Files.writeString(manifest, """
        apiVersion: apps/v1
        kind: Deployment
        metadata:
          name: "<script>alert(1)</script>"
          namespace: demo
        spec:
          replicas: 1
          template:
            spec:
              containers:
                - name: app
                  resources:
                    requests: {cpu: "100", memory: 1Gi}
        """, StandardCharsets.UTF_8);
    Path html = tmp.resolve("evil.html");
    JarRun r = JarRun.of("plan", "-f", manifest.toString(), "--worker", "cpu=8,memory=32Gi",
        "-o", "html", "--out", html.toString());
    assertEquals(0, r.code(), r.err());
    Chromium.Load load = chromium.dumpDom(html);
    assertEquals(List.of(), load.console());
    Document dom = Jsoup.parse(load.dom());
    assertEquals(0, dom.select("script").size());
    assertTrue(dom.select("table.oversize-table").text()
        .contains("demo/Deployment/<script>alert(1)</script>"), load.dom());
  }

  @Test
  void screenshot_ofAnExample_isAPicture(@TempDir Path tmp) throws Exception {
    Path html = tmp.resolve("report.html");
    JarRun r = JarRun.of("plan", "-f", HtmlRuns.TICKETS, "--host-profile", HtmlRuns.FOUR_NODE,
        "-o", "html", "--out", html.toString());
    assertEquals(0, r.code(), r.err());
    Path png = tmp.resolve("shot.png");
    Chromium.Load load = chromium.screenshot(html, png, 1000, 1400);
    assertEquals(List.of(), load.console());
    byte[] bytes = Files.readAllBytes(png);
    // PNG signature (ISO/IEC 15948): 89 50 4E 47 0D 0A 1A 0A.
    assertEquals((byte) 0x89, bytes[0]);
    assertEquals("PNG", new String(bytes, 1, 3, StandardCharsets.US_ASCII));
    // A page of text and pictures, not a blank image (a blank one compresses to a few KiB).
    assertTrue(bytes.length > 50_000, "screenshot only " + bytes.length + " bytes");
    assertFalse(load.console().stream().anyMatch(l -> l.contains("Failed to load")));
  }
  @Test
  void review_inChromium_noConsoleMessages_hostDrawn_figuresEqualJson_screenshot(@TempDir Path tmp)
      throws Exception {
    // The invented example snapshot, reviewed down to five nodes with the two-socket profile.
    List<String> review = List.of("review", "--snapshot", "examples/ticket-office-cluster.json",
        "--pool", "pool=general", "--nodes", "5", "--host-profile", HtmlRuns.TWO_SOCKET);
    Path html = tmp.resolve("review.html");
    List<String> args = new ArrayList<>(review);
    args.addAll(List.of("-o", "html", "--out", html.toString()));
    JarRun written = JarRun.of(args.toArray(String[]::new));
    assertEquals(0, written.code(), written.err());
    List<String> jsonArgs = new ArrayList<>(review);
    jsonArgs.addAll(List.of("-o", "json"));
    JarRun json = JarRun.of(jsonArgs.toArray(String[]::new));
    assertEquals(0, json.code(), json.err());

    Chromium.Load load = chromium.dumpDom(html);
    assertEquals(List.of(), load.console());
    Document dom = Jsoup.parse(load.dom());
    assertEquals(0, dom.select("script").size());
    for (String id : List.of("summary", "proposal", "fill", "findings", "topology")) {
      assertEquals(1, dom.select("section#" + id).size(), id);
    }
    // two-socket-one-node-per-socket.yaml: two NUMA nodes, one one-node worker on each.
    Elements svg = dom.select("#topology svg.topology");
    assertEquals(1, svg.size());
    assertEquals(2, svg.select("g.numa-node").size());
    assertEquals(2, svg.select("g.worker").size());
    JsonNode doc = new JsonMapper().readTree(json.out());
    assertEquals(doc.get("fill").get("before").size(),
        dom.select("svg[aria-labelledby^=fill-before] g.worker-fill").size());
    assertTrue(HtmlRuns.assertFiguresEqualJson(dom, json.out()) > 60);

    Path png = tmp.resolve("review.png");
    Chromium.Load shot = chromium.screenshot(html, png, 1000, 1400);
    assertEquals(List.of(), shot.console());
    byte[] bytes = Files.readAllBytes(png);
    // PNG signature (ISO/IEC 15948): 89 50 4E 47 0D 0A 1A 0A.
    assertEquals((byte) 0x89, bytes[0]);
    assertEquals("PNG", new String(bytes, 1, 3, StandardCharsets.US_ASCII));
    assertTrue(bytes.length > 50_000, "screenshot only " + bytes.length + " bytes");
  }

  @Test
  void reviewWithMarkupInNames_inChromium_staysText(@TempDir Path tmp) throws Exception {
    String evil = "<script>alert(1)</script>";
    Path snapshot = tmp.resolve("evil.json");
    Files.writeString(snapshot, "{\"schemaVersion\":1,\"kind\":\"ClusterSnapshot\",\n"
        + "\"server\":\"https://192.0.2.10:6443\",\"namespace\":null,\"missing\":[],"
        + "\"warnings\":[],\n\"nodes\":[\n"
        + "{\"name\":\"" + evil + "\",\"capacity\":{\"cpu\":4000,\"memory\":17179869184,"
        + "\"pods\":110},\"allocatable\":{\"cpu\":4000,\"memory\":17179869184,\"pods\":110},"
        + "\"labels\":{\"pool\":\"general\"},\"taints\":[],\"unschedulable\":false}\n],\n"
        + "\"budgets\":[],\n\"workloads\":[],\n\"pods\":[\n"
        + "{\"namespace\":\"demo\",\"name\":\"" + evil + "\",\"workload\":\"demo/Deployment/"
        + evil + "\",\"node\":\"" + evil + "\",\"phase\":\"Running\",\"requests\":{\"cpu\":"
        + "1000,\"memory\":1073741824}}\n]\n}\n", StandardCharsets.UTF_8);
    Path html = tmp.resolve("evil-review.html");
    JarRun r = JarRun.of("review", "--snapshot", snapshot.toString(), "--pool", "pool=general",
        "-o", "html", "--out", html.toString());
    assertEquals(0, r.code(), r.err());
    Chromium.Load load = chromium.dumpDom(html);
    assertEquals(List.of(), load.console());
    Document dom = Jsoup.parse(load.dom());
    assertEquals(0, dom.select("script").size());
    assertTrue(dom.select("table.fill-table").text().contains(evil), load.dom());
  }
}
