package dev.numafit.report.html;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.cli.Main;
import dev.numafit.cluster.SnapshotFile;
import dev.numafit.review.Pools;
import dev.numafit.review.ReviewerTest;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.jsoup.select.Elements;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The HTML report of {@code numafit review}, parsed with jsoup: its sections, its figures against
 * {@code review -o json} of the same run, its pictures (title, description, a table beside each),
 * its escaping and its self-containment. Inputs are invented snapshots: the example under
 * examples/ and the ten-worker web shop of {@link ReviewerTest}, whose figures that test derives
 * by hand.
 */
class ReviewHtmlWriterTest {
  static final String EXAMPLE = "examples/ticket-office-cluster.json";

  @TempDir Path dir;

  /** One run of the CLI in process. */
  record Run(int code, String out, String err) {}

  static Run run(List<String> args) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    int code = Main.run(args.toArray(String[]::new), new ByteArrayInputStream(new byte[0]),
        new PrintStream(out, true, StandardCharsets.UTF_8),
        new PrintStream(err, true, StandardCharsets.UTF_8));
    return new Run(code, out.toString(StandardCharsets.UTF_8),
        err.toString(StandardCharsets.UTF_8));
  }

  static List<String> with(List<String> args, String... more) {
    List<String> all = new ArrayList<>(args);
    all.addAll(List.of(more));
    return all;
  }

  /** The review runs these tests cover: with and without a host profile, a shape change. */
  static final List<List<String>> REVIEWS = List.of(
      List.of("review", "--snapshot", EXAMPLE, "--pool", "pool=general", "--nodes", "5",
          "--host-profile", HtmlRuns.TWO_SOCKET),
      List.of("review", "--snapshot", EXAMPLE, "--pool", "pool=general", "--nodes", "9",
          "--worker", "one-node", "--host-profile", HtmlRuns.FOUR_NODE, "--host-failures", "1"),
      List.of("review", "--snapshot", EXAMPLE, "--pool", "pool=general", "--nodes", "3"));

  private Path tenWorkers() throws Exception {
    Path f = dir.resolve("shop.json");
    Files.writeString(f, SnapshotFile.toText(ReviewerTest.tenWorkers().model()));
    return f;
  }

  @Test
  void render_exampleReviews_sectionsPresentAndEveryFigureEqualsJson() {
    for (List<String> args : REVIEWS) {
      Run html = run(with(args, "-o", "html"));
      Run json = run(with(args, "-o", "json"));
      assertEquals(json.code(), html.code(), html.err());
      assertTrue(html.code() <= 1, html.err());
      Document page = Jsoup.parse(html.out());
      for (String id : List.of("summary", "proposal", "fill", "findings")) {
        assertNotNull(page.getElementById(id), args + ": no section " + id);
      }
      assertEquals(args.contains("--host-profile"), page.getElementById("topology") != null,
          args.toString());
      int compared = HtmlRuns.assertFiguresEqualJson(page, json.out());
      JsonNode doc = new JsonMapper().readTree(json.out());
      // One row per node of the JSON's fill, before and after, each with 3 resources × 3 figures
      // and the node's name.
      for (String when : List.of("before", "after")) {
        int nodes = doc.get("fill").get(when).size();
        assertEquals(nodes, page.select("table.fill-table[data-fill=" + when + "] tr.fill-row")
            .size(), args + " " + when);
        assertEquals(nodes * 10, page.select("[data-json^=/fill/" + when + "/]").size());
      }
      for (String key : List.of("/nodes/before", "/nodes/after", "/fits", "/podsConsidered",
          "/utilization/before/cpu", "/utilization/after/memory")) {
        assertEquals(1, page.select("[data-json=" + key + "]").size(), args + " " + key);
      }
      assertEquals(doc.get("pending").size(),
          page.select("[data-json~=^/pending/[0-9]+/pod$]").size(), args.toString());
      assertTrue(compared > 60, args + ": only " + compared + " figures");
    }
  }

  @Test
  void render_tenWorkersToSeven_pendingPodsListedAndPoolFullAfter() throws Exception {
    List<String> args = List.of("review", "--snapshot", tenWorkers().toString(), "--pool",
        "pool=general", "--nodes", "7");
    Run html = run(with(args, "-o", "html"));
    // Exit 1: the resize does not fit (docs/review.md, exit codes).
    assertEquals(1, html.code(), html.err());
    Document page = Jsoup.parse(html.out());
    HtmlRuns.assertFiguresEqualJson(page, run(with(args, "-o", "json")).out());
    assertEquals("DOES NOT FIT", page.selectFirst("p.verdict strong").text());
    // The three ledger pods of w08–w10 (ReviewerTest: they fit nowhere on the seven left).
    Elements pending = page.select("[data-json~=^/pending/[0-9]+/pod$]");
    assertEquals(3, pending.size());
    for (Element p : pending) {
      assertTrue(p.text().startsWith("shop/ledger-"), p.text());
    }
    // After: (14 × 1950 + 7 × 100) / (7 × 4000) = 1 (ReviewerTest's arithmetic).
    assertEquals("1.0000",
        page.selectFirst("[data-json=/utilization/after/cpu]").attr("data-value"));
    assertEquals("100.0%", page.selectFirst("[data-json=/utilization/after/cpu]").text());
    // Seven nodes drawn after, ten before: one group per node in each fill picture.
    assertEquals(10, page.select("svg[aria-labelledby^=fill-before] g.worker-fill").size());
    assertEquals(7, page.select("svg[aria-labelledby^=fill-after] g.worker-fill").size());
    // w08–w10 go, in that order (ReviewerTest).
    assertEquals(List.of("w08", "w09", "w10"),
        page.select("[data-json~=^/scaleDown/[0-9]+/node$]").eachText());
  }

  @Test
  void render_markupInNodeAndPodNames_rendersAsText() throws Exception {
    String evil = "<script>alert(1)</script>";
    Pools p = new Pools();
    p.node(evil, 4000, 16 * Pools.GI);
    p.node("w02", 4000, 16 * Pools.GI);
    p.pods(evil, 1, 3000, Pools.GI, evil);
    p.pods("big", 1, 3000, Pools.GI, "w02");
    Path f = dir.resolve("evil.json");
    Files.writeString(f, SnapshotFile.toText(p.model()));
    Run html = run(List.of("review", "--snapshot", f.toString(), "--pool", "pool=general",
        "--nodes", "1", "-o", "html"));
    assertEquals(1, html.code(), html.err());
    assertFalse(html.out().contains(evil), "raw markup on the page");
    Document page = Jsoup.parse(html.out());
    assertEquals(0, page.select("script").size());
    // The node's name as text in the fill table and the pod's name among the pending pods.
    assertTrue(page.select("table.fill-table").text().contains(evil));
    assertTrue(page.select("table.findings").text().contains("shop/" + evil + "-" + evil + "-0"),
        page.select("table.findings").text());
  }

  @Test
  void render_page_isSelfContainedWithUniqueIds() {
    for (List<String> args : REVIEWS) {
      Document page = Jsoup.parse(run(with(args, "-o", "html")).out());
      assertEquals(0, page.select("script, link, img, iframe, object, embed").size());
      for (Element e : page.select("[href]")) {
        assertTrue(e.attr("href").startsWith("#"), "outside link " + e);
      }
      assertTrue(page.select("[src]").isEmpty());
      String css = page.select("style").html();
      assertFalse(css.contains("@import") || css.contains("url("), css);
      Set<String> ids = new HashSet<>();
      for (Element e : page.select("[id]")) {
        assertTrue(ids.add(e.id()), "duplicate id " + e.id());
      }
      for (Element e : page.select("[fill^=url(]")) {
        String ref = e.attr("fill").replaceAll("^url\\(#(.*)\\)$", "$1");
        assertTrue(ids.contains(ref), "fill refers to missing " + ref);
      }
      for (Element e : page.select("a[href^=#]")) {
        assertTrue(ids.contains(e.attr("href").substring(1)), "dead link " + e);
      }
    }
  }

  @Test
  void render_everyPicture_hasTitleDescriptionAndATableInItsSection() {
    for (List<String> args : REVIEWS) {
      Document page = Jsoup.parse(run(with(args, "-o", "html")).out());
      Elements svgs = page.select("svg");
      assertTrue(svgs.size() >= 3, args.toString());
      for (Element svg : svgs) {
        assertEquals("img", svg.attr("role"));
        Element title = svg.selectFirst("> title");
        Element desc = svg.selectFirst("> desc");
        assertFalse(title.text().isBlank());
        assertFalse(desc.text().isBlank());
        assertEquals(title.id() + " " + desc.id(), svg.attr("aria-labelledby"));
        assertFalse(svg.closest("section").select("table").isEmpty(), svg.className());
      }
    }
  }

  @Test
  void render_hostProfile_oneShapePerNumaNodeAndPerWorkerVm() {
    // two-socket-four-nodes-per-socket.yaml: 2 sockets × 4 NUMA nodes; one-node workers, one per
    // node (the profile file's own figures).
    Document page = Jsoup.parse(run(with(REVIEWS.get(1), "-o", "html")).out());
    Element svg = page.selectFirst("#topology svg.topology");
    assertNotNull(svg);
    assertEquals(8, svg.select("g.numa-node").size());
    assertEquals(8, svg.select("g.worker").size());
    assertEquals(8, page.select("#topology tr.node-row").size());
  }

  @Test
  void render_moreThanFortyNodes_histogramCountsEveryNode() throws Exception {
    Pools p = new Pools();
    for (int i = 1; i <= 45; i++) {
      String n = String.format("w%02d", i);
      p.node(n, 4000, 16 * Pools.GI);
      p.pods("web", i % 4, 1000, Pools.GI, n);
    }
    Path f = dir.resolve("wide.json");
    Files.writeString(f, SnapshotFile.toText(p.model()));
    Run html = run(List.of("review", "--snapshot", f.toString(), "--pool", "pool=general",
        "-o", "html"));
    assertEquals(0, html.code(), html.err());
    Document page = Jsoup.parse(html.out());
    assertEquals(2, page.select("svg.fill-histogram").size());
    assertEquals(0, page.select("svg.fill").size());
    // Every node counted once per resource in the table beside the histogram.
    for (Element table : page.select("table.histogram")) {
      for (int col = 1; col <= 3; col++) {
        int sum = 0;
        for (Element row : table.select("tbody tr")) {
          sum += Integer.parseInt(row.child(col).text());
        }
        assertEquals(45, sum);
      }
    }
    // Node i runs i % 4 pods of 1000m on 4000m: cpu fill 0, 25, 50 or 75%; of w01–w45, 12
    // nodes have i % 4 = 1 (w01, w05, …, w45) and 11 each of the other residues.
    Elements rows = page.select("table.histogram").first().select("tbody tr");
    assertEquals("11", rows.get(0).child(1).text());
    assertEquals("12", rows.get(2).child(1).text());
    assertEquals("11", rows.get(5).child(1).text());
    assertEquals("11", rows.get(7).child(1).text());
  }

  @Test
  void render_sameInputTwice_sameBytes() {
    List<String> args = with(REVIEWS.get(0), "-o", "html");
    assertEquals(run(args).out(), run(args).out());
  }
}
