package dev.numafit.report;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/** The output formats of {@code -o/--output}: one writer per format for each report. */
public enum ReportFormat {
  /** Aligned tables for an 80-column terminal, binary units; warnings go to standard error. */
  TEXT("text"),
  /** A stable JSON document with sorted keys; warnings go into its {@code warnings} array. */
  JSON("json"),
  /**
   * One self-contained HTML page with inline SVG pictures and a table beside each; warnings are in
   * the page.
   */
  HTML("html"),
  /** The HTML report's sections as GitHub-flavoured Markdown tables, without the pictures. */
  MARKDOWN("markdown");

  private final String label;

  ReportFormat(String label) {
    this.label = label;
  }

  /** The name the user types after {@code -o}. */
  public String label() {
    return label;
  }

  /** The format named {@code name}, case-insensitive; the message lists the accepted names. */
  public static ReportFormat fromLabel(String name) {
    for (ReportFormat f : values()) {
      if (f.label.equals(name.toLowerCase(Locale.ROOT))) {
        return f;
      }
    }
    throw new IllegalArgumentException(
        "unknown output format \""
            + name
            + "\" (expected one of: "
            + Arrays.stream(values()).map(ReportFormat::label).collect(Collectors.joining(", "))
            + ")");
  }

  @Override
  public String toString() {
    return label;
  }
}
