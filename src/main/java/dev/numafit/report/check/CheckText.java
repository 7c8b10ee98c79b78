package dev.numafit.report.check;

import dev.numafit.check.CheckReport;
import dev.numafit.check.Finding;
import dev.numafit.report.Units;
import java.util.ArrayList;
import java.util.List;

/** Wording the check writers share, so every format says the same thing. */
final class CheckText {
  /** The caution every report carries. */
  static final String CAUTION =
      "Caution: checked against declared requests. Verify sizing against your hardware's"
          + " documentation and a load test; follow your organisation's change practice.";

  private CheckText() {}

  /** {@code PASS} or {@code FAIL (2 failing findings)}. */
  static String verdict(CheckReport r) {
    if (r.passed()) {
      return "PASS";
    }
    long n = r.failingCount();
    return "FAIL (" + n + " failing finding" + (n == 1 ? "" : "s") + ")";
  }

  /** Workers and hosts, with the change against the baseline and the fleet size. */
  static String capacity(CheckReport r) {
    StringBuilder b = new StringBuilder();
    b.append(r.head().workers()).append(r.head().workers() == 1 ? " worker" : " workers");
    r.head().hosts().ifPresent(h -> b.append(", ").append(h).append(h == 1 ? " host" : " hosts"));
    r.deltaText().ifPresent(d -> b.append(" (").append(d).append(" against the baseline)"));
    r.fleetHosts().ifPresent(f -> b.append("; fleet ").append(f).append(f == 1 ? " host" : " hosts"));
    return b.toString();
  }

  /** A finding's amounts in readable units, e.g. {@code cpu 4.5, memory 2 GiB}; empty if none. */
  static String amounts(Finding f) {
    List<String> parts = new ArrayList<>();
    for (var e : f.amounts().asMap().entrySet()) {
      parts.add(e.getKey() + " " + (e.getKey().equals("hosts") ? e.getValue().toString()
          : Units.amount(e.getKey(), e.getValue())));
    }
    return String.join(", ", parts);
  }

  /** {@code new, fails} / {@code existing} / {@code new}: the status words of an entry. */
  static String status(CheckReport r, CheckReport.Entry e) {
    List<String> words = new ArrayList<>();
    if (r.baselineGiven()) {
      words.add(e.isNew() ? "new" : "existing");
    }
    if (e.failing()) {
      words.add("fails");
    }
    return String.join(", ", words);
  }
}
