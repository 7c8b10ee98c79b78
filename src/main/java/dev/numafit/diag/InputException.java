package dev.numafit.diag;

import java.util.List;

/**
 * Thrown by readers when input is invalid and cannot be used. Carries every error found so the user
 * sees all of them at once; the CLI maps it to exit code 2 without a stack trace.
 */
public final class InputException extends Exception {
  private static final long serialVersionUID = 1L;
  private final transient List<Diagnostic> diagnostics;

  public InputException(List<Diagnostic> diagnostics) {
    super(diagnostics.isEmpty() ? "invalid input" : diagnostics.get(0).format());
    this.diagnostics = List.copyOf(diagnostics);
  }

  public InputException(Diagnostic diagnostic) {
    this(List.of(diagnostic));
  }

  public List<Diagnostic> diagnostics() {
    return diagnostics;
  }
}
