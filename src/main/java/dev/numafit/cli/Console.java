package dev.numafit.cli;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.Severity;
import dev.numafit.manifest.ManifestReader;
import dev.numafit.report.TextStyle;
import java.io.InputStream;
import java.io.PrintStream;
import java.nio.file.Path;
import java.util.Objects;

/**
 * The process's streams and surroundings as the commands see them, so tests can drive the whole
 * CLI with byte buffers.
 *
 * @param workingDir the folder {@code numafit.yaml} is looked for in
 * @param maxDocumentChars longest manifest document read, in characters ({@code
 *     --max-document-size})
 * @param colour whether diagnostics on standard error may use ANSI colour (stderr is a terminal and
 *     NO_COLOR is unset)
 * @param stdout colour and width for text reports on standard output
 */
record Console(
    InputStream in,
    PrintStream out,
    PrintStream err,
    Path workingDir,
    boolean colour,
    TextStyle stdout,
    int maxDocumentChars) {
  Console {
    Objects.requireNonNull(in, "in");
    Objects.requireNonNull(out, "out");
    Objects.requireNonNull(err, "err");
    Objects.requireNonNull(workingDir, "workingDir");
    Objects.requireNonNull(stdout, "stdout");
    if (maxDocumentChars <= 0) {
      throw new IllegalArgumentException("maxDocumentChars must be positive");
    }
  }

  /** A console with the default manifest size limit. */
  Console(
      InputStream in,
      PrintStream out,
      PrintStream err,
      Path workingDir,
      boolean colour,
      TextStyle stdout) {
    this(in, out, err, workingDir, colour, stdout, ManifestReader.DEFAULT_MAX_DOCUMENT_CHARS);
  }

  /** A console whose standard output is not a terminal. */
  Console(InputStream in, PrintStream out, PrintStream err, Path workingDir, boolean colour) {
    this(in, out, err, workingDir, colour, TextStyle.PLAIN);
  }

  /** This console with another limit for one manifest input, in characters. */
  Console withMaxDocumentChars(int chars) {
    return new Console(in, out, err, workingDir, colour, stdout, chars);
  }

  /** Prints one diagnostic as {@code file:line: severity: message} on standard error. */
  void report(Diagnostic d) {
    String label = d.severity().label();
    if (colour) {
      String code = d.severity() == Severity.ERROR ? "31" : d.severity() == Severity.WARNING
          ? "33" : "36";
      label = "\u001b[" + code + "m" + label + "\u001b[0m";
    }
    err.println(d.source().map(s -> s + ": ").orElse("") + label + ": " + d.message());
  }

  /** Prints {@code error: message} on standard error. */
  void error(String message) {
    report(Diagnostic.error(null, message));
  }
}
