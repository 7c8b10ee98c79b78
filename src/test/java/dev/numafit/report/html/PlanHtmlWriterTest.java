package dev.numafit.report.html;

import static dev.numafit.report.html.HtmlRuns.EXAMPLES;
import static dev.numafit.report.html.HtmlRuns.TWO_SOCKET;
import static dev.numafit.report.html.HtmlRuns.run;
import static dev.numafit.report.html.HtmlRuns.with;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Attribute;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.jsoup.select.Elements;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.dataformat.yaml.YAMLMapper;

/**
 * The HTML report of the example scenarios, parsed with jsoup: its figures against the JSON
 * report of the same run, its pictures against the host profiles they draw, its escaping and its
 * self-containment. The scenarios are invented demo data; the numbers themselves are checked
 * against their published sources in the core's tests.
 */
class PlanHtmlWriterTest {
  @Test
  void render_exampleScenarios_everyTableFigureEqualsJson() {
    for (List<String> args : EXAMPLES) {
      Document html = Jsoup.parse(run(with(args, "-o", "html")));
      String json = run(with(args, "-o", "json"));
      int compared = HtmlRuns.assertFiguresEqualJson(html, json);
      JsonNode plans = new JsonMapper().readTree(json).get("plans");
      // Each plan's summary figures are among them (not just any few cells).
      for (int i = 0; i < plans.size(); i++) {
        for (String key : List.of("workersNeeded", "lowerBound", "worker/vcpus")) {
          assertEquals(
              1, html.select("[data-json=/plans/" + i + "/" + key + "]").size(), args + " " + key);
        }
        // Visible text equals the JSON for counts, which are shown as plain integers.
        assertEquals(
            plans.get(i).get("workersNeeded").toString(),
            html.selectFirst("[data-json=/plans/" + i + "/workersNeeded]").text());
      }
      assertTrue(compared >= 10 * plans.size(), args + ": only " + compared + " figures");
    }
  }

  @Test
  void render_topology_oneShapePerNumaNodeAndPerWorkerVm() throws IOException {
    for (List<String> args : EXAMPLES) {
      Document html = Jsoup.parse(run(with(args, "-o", "html")));
      JsonNode plans = new JsonMapper().readTree(run(with(args, "-o", "json"))).get("plans");
      int profiles = 0;
      for (int i = 0; i < args.size(); i++) {
        if (!args.get(i).equals("--host-profile")) {
          continue;
        }
        // Node count straight from the profile file: sockets × nodesPerSocket.
        JsonNode spec = new YAMLMapper().readTree(Files.readString(Path.of(args.get(i + 1))));
        String name = spec.get("metadata").get("name").asString();
        int nodes = spec.get("spec").get("sockets").asInt() * spec.get("spec").get("nodesPerSocket")
            .asInt();
        JsonNode plan = null;
        for (JsonNode p : plans) {
          if (p.get("hostProfile").asString().equals(name)) {
            plan = p;
          }
        }
        Elements svg = html.select("svg.topology[data-profile=" + name + "]");
        assertEquals(1, svg.size(), name);
        assertEquals(nodes, svg.select("g.numa-node").size(), name);
        assertEquals(nodes, html.select("section[data-profile=" + name + "] tr.node-row").size());
        assertEquals(plan.get("workersPerHost").asInt(), svg.select("g.worker").size(), name);
        profiles++;
      }
      // A bare --worker plan draws no host.
      assertEquals(profiles, html.select("svg.topology").size(), args.toString());
    }
  }

  @Test
  void render_emptyChannelProfile_marksTheEmptyChannel() {
    Document html =
        Jsoup.parse(run(List.of("plan", "-f", HtmlRuns.PARCEL, "--host-profile",
            HtmlRuns.EMPTY_CHANNEL, "-o", "html")));
    // host-profiles/one-socket-empty-channel.yaml: node 1 has one of its four channels empty.
    Elements empty = html.select("svg.topology g.numa-node[data-node=1] g.empty-channel");
    assertEquals(1, empty.size());
    assertTrue(empty.text().contains("empty"), empty.text());
    assertEquals(0, html.select("svg.topology g.numa-node[data-node=0] g.empty-channel").size());
    assertEquals("3 of 4", html.select("tr.node-row[data-node=1] td").get(6).text());
  }

  @Test
  void render_profileWithDistances_drawsHeatTableOfTheMatrix() {
    Document html =
        Jsoup.parse(run(List.of("plan", "-f", HtmlRuns.TICKETS, "--host-profile",
            HtmlRuns.FOUR_NODE, "-o", "html")));
    Element heat = html.selectFirst("table.heat");
    // The profile's 8×8 SLIT matrix: 10 on the diagonal, 12 within a socket, 32 across.
    Elements rows = heat.select("tbody tr");
    assertEquals(8, rows.size());
    assertEquals("10", rows.get(0).select("td").get(0).text());
    assertEquals("12", rows.get(0).select("td").get(1).text());
    assertEquals("32", rows.get(0).select("td").get(4).text());
    // The farthest distance gets the darkest class, so it reads without the number too.
    assertTrue(rows.get(0).select("td").get(4).hasClass("h4"));
    assertTrue(rows.get(0).select("td").get(0).hasClass("h0"));
  }

  @Test
  void render_markupInNames_rendersAsText(@TempDir Path tmp) throws IOException {
    String evil = "<script>alert(1)</script>";
    Path manifest = tmp.resolve("evil.yaml");
    Files.writeString(manifest, """
        apiVersion: apps/v1
        kind: Deployment
        metadata:
          name: "<script>alert(1)</script>"
          namespace: "x\\" onmouseover=\\"alert(3)"
        spec:
          replicas: 2
          template:
            spec:
              containers:
                - name: app
                  resources:
                    requests: {cpu: "80", memory: 1Gi}
        """);
    Path profile = tmp.resolve("profile.yaml");
    Files.writeString(profile, Files.readString(Path.of(TWO_SOCKET))
        .replace("name: two-socket-32c", "name: \"<img src=x onerror=alert(2)>\""));
    String page = run(List.of("plan", "-f", manifest.toString(), "--host-profile",
        profile.toString(), "-o", "html"));
    Document html = Jsoup.parse(page);
    assertEquals(0, html.select("script").size());
    assertEquals(0, html.select("img").size());
    for (Element e : html.getAllElements()) {
      for (Attribute a : e.attributes()) {
        assertFalse(a.getKey().startsWith("on"), e.tagName() + " has " + a);
      }
    }
    // The names are there as text: in the oversize table and the topology's label.
    assertTrue(html.select("table.oversize-table").text().contains(evil), page);
    assertTrue(html.select("h2").text().contains("<img src=x onerror=alert(2)>"));
    assertEquals(
        "<img src=x onerror=alert(2)>", html.selectFirst("svg.topology").attr("data-profile"));
  }

  @Test
  void render_page_isSelfContained() {
    for (List<String> args : EXAMPLES) {
      String page = run(with(args, "-o", "html"));
      Document html = Jsoup.parse(page);
      assertEquals(0, html.select("script, link, img, iframe, object, embed").size());
      for (Element e : html.select("[href]")) {
        assertTrue(e.attr("href").startsWith("#"), "outside link " + e);
      }
      for (Element e : html.select("[src]")) {
        throw new AssertionError("source outside the page: " + e);
      }
      String css = html.select("style").html();
      assertFalse(css.contains("@import") || css.contains("url("), css);
      // Patterns are referenced only by ids on the page itself.
      Set<String> ids = new HashSet<>();
      for (Element e : html.select("[id]")) {
        assertTrue(ids.add(e.id()), "duplicate id " + e.id());
      }
      for (Element e : html.select("[fill^=url(]")) {
        String ref = e.attr("fill").replaceAll("^url\\(#(.*)\\)$", "$1");
        assertTrue(ids.contains(ref), "fill refers to missing " + ref);
      }
    }
  }

  @Test
  void render_everyPicture_hasTitleDescriptionAndATable() {
    for (List<String> args : EXAMPLES) {
      Document html = Jsoup.parse(run(with(args, "-o", "html")));
      Elements svgs = html.select("svg");
      assertFalse(svgs.isEmpty());
      for (Element svg : svgs) {
        assertEquals("img", svg.attr("role"));
        Element title = svg.selectFirst("> title");
        Element desc = svg.selectFirst("> desc");
        assertFalse(title.text().isBlank());
        assertFalse(desc.text().isBlank());
        assertEquals(title.id() + " " + desc.id(), svg.attr("aria-labelledby"));
        // The same numbers in a table nearby: in the same section, after the picture.
        Element section = svg.closest("section");
        assertFalse(section.select("table").isEmpty(), svg.className());
      }
    }
  }

  @Test
  void render_sameInputTwice_sameBytes() {
    List<String> args = with(EXAMPLES.get(1), "-o", "html");
    assertEquals(run(args), run(args));
  }

  @Test
  void render_manyWorkers_histogramCountsEveryWorker(@TempDir Path tmp) throws IOException {
    Path manifest = tmp.resolve("many.yaml");
    Files.writeString(manifest, """
        apiVersion: apps/v1
        kind: Deployment
        metadata: {name: small, namespace: demo}
        spec:
          replicas: 90
          template:
            spec:
              containers:
                - name: app
                  resources:
                    requests: {cpu: 1500m, memory: 1Gi}
        """);
    List<String> args = List.of("plan", "-f", manifest.toString(), "--worker", "cpu=2,memory=8Gi");
    Document html = Jsoup.parse(run(with(args, "-o", "html")));
    int workers =
        new JsonMapper().readTree(run(with(args, "-o", "json"))).get("plans").get(0)
            .get("workersNeeded").asInt();
    // 1500m pods on a 2-CPU worker: one per worker, so 90 workers — above the histogram limit.
    assertEquals(90, workers);
    assertEquals(1, html.select("svg.fill-histogram").size());
    assertEquals(0, html.select("svg.fill").size());
    Elements rows = html.select("table.histogram tbody tr");
    assertEquals(10, rows.size());
    for (int col = 0; col < 3; col++) {
      int sum = 0;
      for (Element row : rows) {
        sum += Integer.parseInt(row.select("td").get(col).text());
      }
      assertEquals(workers, sum);
    }
    assertEquals(workers, html.select("table.fill-table tbody tr").size());
  }

  @Test
  void render_smallPlan_oneFillRowPerWorker() {
    List<String> args = EXAMPLES.get(0);
    Document html = Jsoup.parse(run(with(args, "-o", "html")));
    int workers = new JsonMapper().readTree(run(with(args, "-o", "json"))).get("plans").get(0)
        .get("workersNeeded").asInt();
    Element svg = html.selectFirst("svg.fill");
    assertEquals(workers, svg.select("g.worker-fill").size());
    assertEquals(workers, html.select("table.fill-table tbody tr").size());
    // DaemonSets are drawn apart from the packed pods on every worker.
    assertEquals(3 * workers, svg.select("g.worker-fill rect.daemon").size());
    assertEquals(3 * workers, svg.select("g.worker-fill rect.packed").size());
  }
}
