package dev.numafit.verify.fuzz;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.diag.Severity;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.regex.Pattern;

/**
 * The property every fuzz target checks: a reader answers with a result or with numafit's own
 * {@link InputException}, whose messages name the input file (and a line where there is one);
 * any other exception escapes and is a finding. The manifest reader never throws, so for it the
 * check is that its last-resort net (an error "cannot read this document (...)", which means an
 * unexpected exception was caught) stayed unused.
 */
final class FuzzChecks {
  /** Longest input a target reads, in bytes: larger inputs only slow the search down. */
  static final int MAX_INPUT = 8192;

  private FuzzChecks() {}

  /** The fuzzer's bytes as text: malformed UTF-8 becomes U+FFFD, as a lenient editor shows it. */
  static String text(byte[] data) {
    return new String(data, 0, Math.min(data.length, MAX_INPUT), StandardCharsets.UTF_8);
  }

  /** Every diagnostic of a refusal names {@code file}, with a line when it has one. */
  static void refusalNames(InputException ex, String file) {
    assertFalse(ex.diagnostics().isEmpty(), "a refusal without a message");
    for (Diagnostic d : ex.diagnostics()) {
      assertTrue(d.source().isPresent() && d.source().get().file().equals(file), d.format());
      assertTrue(d.format().startsWith(file + ":"), d.format());
    }
  }

  /**
   * The safety net's message: "cannot read this document (" then the caught exception's class
   * name, a colon, its message and ")". Matched whole, not by its start: a document can put that
   * text into a name that a regular message quotes first (the fuzzer did, with a namespace).
   */
  private static final Pattern SAFETY_NET =
      Pattern.compile("cannot read this document \\([A-Z][A-Za-z0-9_$]*(Exception|Error): .*\\)",
          Pattern.DOTALL);

  /** The manifest reader's diagnostics: each names a file, none comes from its safety net. */
  static void noSafetyNet(List<Diagnostic> diagnostics) {
    for (Diagnostic d : diagnostics) {
      assertTrue(d.source().isPresent(), d.format());
      assertFalse(d.severity() == Severity.ERROR && SAFETY_NET.matcher(d.message()).matches(),
          d.format());
    }
  }
}
