package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;

/**
 * {@code check -o html} against {@code check -o markdown} of the same change scenario (whose text
 * the golden files hold): the same verdict, exit code and findings, as a page with no scripts.
 */
class CheckHtmlTest {
  @Test
  void check_html_sameVerdictAndFindingsAsMarkdown() {
    List<String> md = new ArrayList<>(CheckGoldenTest.changeArgs());
    md.addAll(List.of("-o", "markdown"));
    List<String> html = new ArrayList<>(CheckGoldenTest.changeArgs());
    html.addAll(List.of("-o", "html"));
    CliRun m = CliRun.of(md.toArray(String[]::new));
    CliRun h = CliRun.of(html.toArray(String[]::new));
    assertEquals(m.code(), h.code(), h.err());
    Document page = Jsoup.parse(h.out());
    String heading = m.out().lines().findFirst().orElseThrow();
    assertEquals(heading.replace("### ", ""), page.selectFirst("h1").text());
    long mdRows = m.out().lines().filter(l -> l.startsWith("| ") && !l.startsWith("| Status"))
        .count();
    assertTrue(mdRows > 0, m.out());
    assertEquals(mdRows, page.select("table.findings tbody tr").size());
    assertEquals(
        m.out().lines().filter(l -> l.startsWith("| **fails**")).count(),
        page.select("table.findings tr.failing").size());
    assertEquals(0, page.select("script, link, img").size());
  }
}
