package dev.numafit.diag;

import java.util.Objects;

/**
 * Where an input value came from: a file path as the user gave it (or {@code <stdin>}) and a
 * 1-based line, 0 when the line is unknown.
 */
public record SourceRef(String file, int line) implements Comparable<SourceRef> {
  public SourceRef {
    Objects.requireNonNull(file, "file");
    if (line < 0) {
      throw new IllegalArgumentException("line must be >= 0, was " + line);
    }
  }

  /** {@code file:line}, or just {@code file} when the line is unknown. */
  @Override
  public String toString() {
    return line > 0 ? file + ":" + line : file;
  }

  @Override
  public int compareTo(SourceRef o) {
    int c = file.compareTo(o.file);
    return c != 0 ? c : Integer.compare(line, o.line);
  }
}
