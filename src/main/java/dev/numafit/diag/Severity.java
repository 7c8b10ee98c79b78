package dev.numafit.diag;

/** How serious a diagnostic is. {@link #ERROR} makes an input invalid; the rest are advice. */
public enum Severity {
  ERROR("error"),
  WARNING("warning"),
  NOTE("note");

  private final String label;

  Severity(String label) {
    this.label = label;
  }

  /** The lower-case word printed in messages ({@code error}, {@code warning}, {@code note}). */
  public String label() {
    return label;
  }
}
