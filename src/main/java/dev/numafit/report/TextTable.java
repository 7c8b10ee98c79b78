package dev.numafit.report;

import java.util.ArrayList;
import java.util.List;

/**
 * A plain-text table: a header row and data rows, columns separated by two spaces, each column as
 * wide as its widest cell, numbers right-aligned where asked. Kept narrow so a report reads in an
 * 80-column terminal.
 */
public final class TextTable {
  private final String[] header;
  private final boolean[] rightAligned;
  private final List<String[]> rows = new ArrayList<>();

  /**
   * A table with these column titles; a title starting with {@code >} is right-aligned (the {@code
   * >} is not printed).
   */
  public TextTable(String... titles) {
    header = new String[titles.length];
    rightAligned = new boolean[titles.length];
    for (int i = 0; i < titles.length; i++) {
      rightAligned[i] = titles[i].startsWith(">");
      header[i] = rightAligned[i] ? titles[i].substring(1) : titles[i];
    }
  }

  /** Adds a row; it must have one cell per column. */
  public TextTable row(String... cells) {
    if (cells.length != header.length) {
      throw new IllegalArgumentException(
          "expected " + header.length + " cells, got " + cells.length);
    }
    rows.add(cells.clone());
    return this;
  }

  public boolean isEmpty() {
    return rows.isEmpty();
  }

  /** The table, each line prefixed by {@code indent} and ended by a newline. */
  public String render(String indent) {
    int[] width = new int[header.length];
    for (int i = 0; i < header.length; i++) {
      width[i] = header[i].length();
    }
    for (String[] r : rows) {
      for (int i = 0; i < r.length; i++) {
        width[i] = Math.max(width[i], r[i].length());
      }
    }
    StringBuilder sb = new StringBuilder();
    line(sb, indent, header, width);
    for (String[] r : rows) {
      line(sb, indent, r, width);
    }
    return sb.toString();
  }

  private void line(StringBuilder sb, String indent, String[] cells, int[] width) {
    StringBuilder l = new StringBuilder(indent);
    for (int i = 0; i < cells.length; i++) {
      if (i > 0) {
        l.append("  ");
      }
      String pad = " ".repeat(width[i] - cells[i].length());
      l.append(rightAligned[i] ? pad + cells[i] : cells[i] + pad);
    }
    sb.append(l.toString().stripTrailing()).append('\n');
  }
}
