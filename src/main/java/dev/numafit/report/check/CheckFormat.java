package dev.numafit.report.check;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/** The output formats of {@code numafit check -o}. */
public enum CheckFormat {
  /** Compiler-style lines {@code file:line: severity: ...} and a verdict; for a terminal or CI log. */
  TEXT("text"),
  /** A stable JSON document with sorted keys. */
  JSON("json"),
  /** A compact merge-request comment: new findings and the capacity change. */
  MARKDOWN("markdown"),
  /** SARIF 2.1.0, for code-scanning views that annotate the changed lines. */
  SARIF("sarif"),
  /** JUnit XML, one test case per workload, for CI test reporters. */
  JUNIT("junit"),
  /** The Markdown comment's content as one self-contained HTML page. */
  HTML("html");

  private final String label;

  CheckFormat(String label) {
    this.label = label;
  }

  /** The name typed after {@code -o}. */
  public String label() {
    return label;
  }

  /** The writer for this format. */
  public CheckWriter writer() {
    return switch (this) {
      case TEXT -> new CheckTextWriter();
      case JSON -> new CheckJsonWriter();
      case MARKDOWN -> new CheckMarkdownWriter();
      case SARIF -> new CheckSarifWriter();
      case JUNIT -> new CheckJunitWriter();
      case HTML -> new CheckHtmlWriter();
    };
  }

  /** The format named {@code name}, case-insensitive; the message lists the accepted names. */
  public static CheckFormat fromLabel(String name) {
    for (CheckFormat f : values()) {
      if (f.label.equals(name.toLowerCase(Locale.ROOT))) {
        return f;
      }
    }
    throw new IllegalArgumentException(
        "unknown output format \"" + name + "\" (expected one of: "
            + Arrays.stream(values()).map(CheckFormat::label).collect(Collectors.joining(", "))
            + ")");
  }

  @Override
  public String toString() {
    return label;
  }
}
