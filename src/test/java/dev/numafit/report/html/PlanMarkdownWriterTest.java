package dev.numafit.report.html;

import static dev.numafit.report.html.HtmlRuns.EXAMPLES;
import static dev.numafit.report.html.HtmlRuns.run;
import static dev.numafit.report.html.HtmlRuns.with;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Element;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code plan -o markdown}: the HTML report's sections as GitHub-flavoured tables. The exact text
 * of the examples is held by golden files (ReportFormatsIT); these check its structure.
 */
class PlanMarkdownWriterTest {
  @Test
  void render_examples_sameSectionsAsHtml() {
    for (List<String> args : EXAMPLES) {
      String md = run(with(args, "-o", "markdown"));
      List<String> mdHeadings =
          md.lines().filter(l -> l.startsWith("## ") || l.startsWith("### "))
              .map(l -> l.substring(l.indexOf(' ') + 1)).toList();
      List<String> htmlHeadings =
          Jsoup.parse(run(with(args, "-o", "html"))).select("h2, h3").stream()
              .map(Element::text).toList();
      assertEquals(htmlHeadings, mdHeadings, args.toString());
    }
  }

  @Test
  void render_examples_everyTableRowHasTheHeadersCellCount() {
    for (List<String> args : EXAMPLES) {
      String md = run(with(args, "-o", "markdown"));
      int columns = -1;
      for (String line : md.lines().toList()) {
        if (!line.startsWith("|")) {
          columns = -1;
          continue;
        }
        int cells = cells(line);
        if (columns < 0) {
          columns = cells;
        }
        assertEquals(columns, cells, line);
      }
    }
  }

  @Test
  void render_markupAndPipesInNames_staysInsideItsCell(@TempDir Path tmp) throws IOException {
    Path manifest = tmp.resolve("evil.yaml");
    Files.writeString(manifest, """
        apiVersion: apps/v1
        kind: Deployment
        metadata:
          name: "<script>alert(1)</script>"
          namespace: "a|b*c_"
        spec:
          replicas: 1
          template:
            spec:
              containers:
                - name: app
                  resources:
                    requests: {cpu: "100", memory: 1Gi}
        """);
    String md = run(List.of("plan", "-f", manifest.toString(), "--worker", "cpu=8,memory=32Gi",
        "-o", "markdown"));
    assertFalse(md.contains("<script>"), md);
    assertTrue(md.contains("a\\|b\\*c\\_/Deployment/&lt;script&gt;alert(1)&lt;/script&gt;"), md);
    String row = md.lines().filter(l -> l.contains("alert(1)") && l.contains("| cpu |"))
        .findFirst().orElseThrow();
    // Workload, resource, request, room, over by, shape: six cells despite the pipe in the name.
    assertEquals(6, cells(row));
  }

  /** Cells of a table row: pipes not escaped by a backslash, less the outer one. */
  private static int cells(String line) {
    int pipes = 0;
    for (int i = 0; i < line.length(); i++) {
      if (line.charAt(i) == '\\') {
        i++;
      } else if (line.charAt(i) == '|') {
        pipes++;
      }
    }
    return pipes - 1;
  }
}
