package dev.numafit.report.check;

import dev.numafit.check.CheckReport;
import dev.numafit.check.Finding;

/**
 * {@code check -o markdown}: a compact merge-request comment. A heading with the verdict, the
 * capacity change, a table of the new findings (all findings when there is no baseline), a count
 * of those already present and of those resolved, and the caution.
 */
public final class CheckMarkdownWriter implements CheckWriter {
  @Override
  public String render(CheckReport r) {
    StringBuilder b = new StringBuilder();
    b.append("### numafit check: ").append(CheckText.verdict(r)).append("\n\n");
    b.append("**Capacity:** ").append(cell(CheckText.capacity(r))).append("  \n");
    b.append("**Worker:** ").append(cell(r.worker())).append("\n\n");
    var shown = r.newFindings();
    if (shown.isEmpty()) {
      b.append(r.baselineGiven() ? "No new findings.\n" : "No findings.\n");
    } else {
      b.append(r.baselineGiven() ? "New findings in this change:\n\n" : "Findings:\n\n");
      b.append("| Status | Rule | Workload | Where | Finding |\n");
      b.append("|---|---|---|---|---|\n");
      for (CheckReport.Entry e : shown) {
        Finding f = e.finding();
        b.append("| ").append(e.failing() ? "**fails**" : f.severity().label())
            .append(" | `").append(f.rule().id()).append("` | `").append(cell(f.subject()))
            .append("` | `").append(cell(f.location().toString())).append("` | ")
            .append(cell(f.message())).append(" |\n");
      }
    }
    long existing = r.findings().size() - shown.size();
    if (r.baselineGiven()) {
      b.append('\n').append(existing).append(existing == 1 ? " finding was" : " findings were")
          .append(" already present before this change");
      b.append(r.resolved().isEmpty() ? ".\n"
          : "; " + r.resolved().size() + " resolved by it: "
              + String.join(", ", r.resolved().stream()
                  .map(f -> "`" + cell(f.subject()) + "` (" + f.rule().id() + ")").toList())
              + ".\n");
    }
    b.append("\n> ").append(CheckText.CAUTION).append('\n');
    return b.toString();
  }

  /** Text safe inside a table cell: pipes escaped, line breaks and backticks flattened. */
  private static String cell(String s) {
    return s.replace("\\", "\\\\").replace("|", "\\|").replace("`", "'").replace("\n", " ");
  }
}
