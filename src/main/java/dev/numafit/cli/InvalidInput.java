package dev.numafit.cli;

import dev.numafit.diag.Diagnostic;
import java.util.List;

/**
 * The input is invalid (a host profile, or manifests without --skip-invalid): every diagnostic
 * (errors and warnings, sorted) is printed and the command exits 2.
 */
final class InvalidInput extends RuntimeException {
  private static final long serialVersionUID = 1L;
  private final transient List<Diagnostic> diagnostics;
  private final boolean skippable;

  /**
   * @param skippable whether --skip-invalid would have let the run go on (manifest errors only)
   */
  InvalidInput(List<Diagnostic> diagnostics, boolean skippable) {
    super(diagnostics.isEmpty() ? "invalid input" : diagnostics.get(0).format());
    this.diagnostics = List.copyOf(diagnostics);
    this.skippable = skippable;
  }

  boolean skippable() {
    return skippable;
  }

  List<Diagnostic> diagnostics() {
    return diagnostics;
  }
}
