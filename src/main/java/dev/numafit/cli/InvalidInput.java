package dev.numafit.cli;

import dev.numafit.diag.Diagnostic;
import java.util.List;

/**
 * The manifests hold invalid documents and --skip-invalid was not given: every diagnostic (errors
 * and warnings, sorted) is printed and the command exits 2.
 */
final class InvalidInput extends RuntimeException {
  private static final long serialVersionUID = 1L;
  private final transient List<Diagnostic> diagnostics;

  InvalidInput(List<Diagnostic> diagnostics) {
    super(diagnostics.isEmpty() ? "invalid input" : diagnostics.get(0).format());
    this.diagnostics = List.copyOf(diagnostics);
  }

  List<Diagnostic> diagnostics() {
    return diagnostics;
  }
}
