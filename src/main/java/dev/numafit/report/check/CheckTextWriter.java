package dev.numafit.report.check;

import dev.numafit.check.CheckReport;
import dev.numafit.check.Finding;

/**
 * {@code check -o text}: one compiler-style line per finding ({@code file:line: severity:
 * workload: message [rule; new, fails]}), which CI logs and editors turn into links, then the
 * resolved findings, the capacity, the verdict and the caution.
 */
public final class CheckTextWriter implements CheckWriter {
  @Override
  public String render(CheckReport r) {
    StringBuilder b = new StringBuilder();
    b.append("Worker: ").append(r.worker()).append('\n');
    b.append("Capacity: ").append(CheckText.capacity(r)).append('\n');
    if (r.findings().isEmpty()) {
      b.append("\nNo findings.\n");
    } else {
      long fresh = r.findings().stream().filter(CheckReport.Entry::isNew).count();
      b.append('\n').append("Findings: ").append(r.findings().size());
      if (r.baselineGiven()) {
        b.append(" (").append(fresh).append(" new, ").append(r.findings().size() - fresh)
            .append(" already present)");
      }
      b.append('\n');
      for (CheckReport.Entry e : r.findings()) {
        Finding f = e.finding();
        String status = CheckText.status(r, e);
        b.append(f.location()).append(": ").append(f.severity().label()).append(": ")
            .append(f.subject()).append(": ").append(f.message()).append(" [")
            .append(f.rule().id()).append(status.isEmpty() ? "" : "; " + status).append("]\n");
      }
    }
    if (!r.resolved().isEmpty()) {
      b.append("\nResolved by this change: ").append(r.resolved().size()).append('\n');
      for (Finding f : r.resolved()) {
        b.append("  ").append(f.subject()).append(" [").append(f.rule().id()).append("]\n");
      }
    }
    if (!r.unchecked().isEmpty()) {
      b.append("\nNot checked (no capacity given): ").append(String.join(", ", r.unchecked()))
          .append('\n');
    }
    b.append("\nResult: ").append(CheckText.verdict(r)).append('\n');
    b.append(CheckText.CAUTION).append('\n');
    return b.toString();
  }
}
