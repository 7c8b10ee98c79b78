package dev.numafit.report.html;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The HTML report of a plan with worker pools (the cold-chain example of docs/pools.md) keeps the
 * page's promises: every marked figure equals the JSON, ids are unique, each pool draws its own
 * host, and the pools and unplaceable tables list what the JSON lists.
 */
class PoolsHtmlTest {
  static final List<String> POOLS =
      List.of("plan", "-f", "manifests-examples/cold-chain/manifests/", "--pools",
          "manifests-examples/cold-chain/pools.yaml");

  @Test
  void render_pools_figuresEqualJson_idsUnique_oneHostPerPool() {
    Document html = Jsoup.parse(HtmlRuns.run(HtmlRuns.with(POOLS, "-o", "html")));
    String json = HtmlRuns.run(HtmlRuns.with(POOLS, "-o", "json"));
    JsonNode root = new JsonMapper().readTree(json);
    int compared = HtmlRuns.assertFiguresEqualJson(html, json);
    assertTrue(compared >= 10 * root.get("plans").size(), "only " + compared + " figures");
    Set<String> ids = new HashSet<>();
    for (Element e : html.select("[id]")) {
      assertTrue(ids.add(e.id()), "duplicate id " + e.id());
    }
    // Three pools, each on a host profile: three host drawings, one per plan section.
    assertEquals(3, html.select("svg.topology").size());
    for (int i = 0; i < 3; i++) {
      assertEquals(1, html.select("section#plan-" + i + " svg.topology").size(), "plan " + i);
    }
    List<String> poolNames =
        html.select("section#pools tbody tr > th").stream().map(Element::text).toList();
    assertEquals(List.of("general", "batch", "ingest"), poolNames);
    assertEquals(
        root.get("unplaceable").get(0).get("workload").asString(),
        html.selectFirst("section#unplaceable tbody tr > th").text());
    assertEquals(
        "Pool batch on host profile two-socket-8-nodes",
        html.selectFirst("section#plan-1 h2").text());
  }
}
