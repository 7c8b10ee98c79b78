package dev.numafit.diag;

import java.util.Objects;
import java.util.Optional;

/**
 * One message about the input, printed as {@code file:line: error: message}. The message names what
 * was found and what would be accepted.
 */
public record Diagnostic(Severity severity, Optional<SourceRef> source, String message)
    implements Comparable<Diagnostic> {
  public Diagnostic {
    Objects.requireNonNull(severity, "severity");
    Objects.requireNonNull(source, "source");
    Objects.requireNonNull(message, "message");
  }

  public static Diagnostic error(SourceRef at, String message) {
    return new Diagnostic(Severity.ERROR, Optional.ofNullable(at), message);
  }

  public static Diagnostic warning(SourceRef at, String message) {
    return new Diagnostic(Severity.WARNING, Optional.ofNullable(at), message);
  }

  public static Diagnostic note(SourceRef at, String message) {
    return new Diagnostic(Severity.NOTE, Optional.ofNullable(at), message);
  }

  /** {@code file:line: severity: message}, or {@code severity: message} without a source. */
  public String format() {
    return source.map(s -> s + ": ").orElse("") + severity.label() + ": " + message;
  }

  @Override
  public String toString() {
    return format();
  }

  /** Orders by source (sourceless first), then severity, then message: a stable print order. */
  @Override
  public int compareTo(Diagnostic o) {
    int c;
    if (source.isPresent() != o.source.isPresent()) {
      return source.isPresent() ? 1 : -1;
    }
    if (source.isPresent() && (c = source.get().compareTo(o.source.get())) != 0) {
      return c;
    }
    c = severity.compareTo(o.severity);
    return c != 0 ? c : message.compareTo(o.message);
  }
}
