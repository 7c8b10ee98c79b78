package dev.numafit.report.check;

import static dev.numafit.report.html.HtmlPage.esc;

import dev.numafit.check.CheckReport;
import dev.numafit.check.Finding;
import dev.numafit.report.html.HtmlPage;
import java.util.List;

/**
 * {@code check -o html}: the Markdown comment's content as one self-contained page — the verdict,
 * the capacity change, a table of the new findings (all of them without a baseline) with the
 * failing ones marked in words, what was already present or resolved, and the caution. Every
 * string from input is escaped.
 */
public final class CheckHtmlWriter implements CheckWriter {
  @Override
  public String render(CheckReport r) {
    StringBuilder b = new StringBuilder();
    String verdict = CheckText.verdict(r);
    b.append("<h1>numafit check: <span class=\"verdict\">").append(esc(verdict))
        .append("</span></h1>\n");
    b.append("<table class=\"kv\">\n<tr><th scope=\"row\">Capacity</th><td>")
        .append(esc(CheckText.capacity(r))).append("</td></tr>\n<tr><th scope=\"row\">Worker</th><td>")
        .append(esc(r.worker())).append("</td></tr>\n</table>\n");
    List<CheckReport.Entry> shown = r.newFindings();
    b.append("<h2>").append(r.baselineGiven() ? "New findings in this change" : "Findings")
        .append("</h2>\n");
    if (shown.isEmpty()) {
      b.append("<p>None.</p>\n");
    } else {
      b.append("<table class=\"findings\">\n<thead><tr><th scope=\"col\">Status</th>")
          .append("<th scope=\"col\">Rule</th><th scope=\"col\">Workload</th>")
          .append("<th scope=\"col\">Where</th><th scope=\"col\">Finding</th></tr></thead>\n<tbody>\n");
      for (CheckReport.Entry e : shown) {
        Finding f = e.finding();
        b.append("<tr class=\"").append(e.failing() ? "failing" : "passing").append("\"><td>")
            .append(e.failing() ? "<strong>fails</strong>" : esc(f.severity().label()))
            .append("</td><td><code>").append(esc(f.rule().id())).append("</code></td><td>")
            .append(esc(f.subject())).append("</td><td>").append(esc(f.location().toString()))
            .append("</td><td>").append(esc(f.message())).append("</td></tr>\n");
      }
      b.append("</tbody></table>\n");
    }
    if (r.baselineGiven()) {
      long existing = r.findings().size() - shown.size();
      b.append("<p>").append(existing).append(existing == 1 ? " finding was" : " findings were")
          .append(" already present before this change");
      if (r.resolved().isEmpty()) {
        b.append(".</p>\n");
      } else {
        b.append("; ").append(r.resolved().size()).append(" resolved by it:</p>\n<ul>\n");
        for (Finding f : r.resolved()) {
          b.append("<li>").append(esc(f.subject())).append(" (<code>").append(esc(f.rule().id()))
              .append("</code>)</li>\n");
        }
        b.append("</ul>\n");
      }
    }
    b.append("<p class=\"caution\" role=\"note\"><strong>").append(esc(CheckText.CAUTION))
        .append("</strong></p>\n");
    return HtmlPage.page("numafit check: " + verdict, b.toString());
  }
}
