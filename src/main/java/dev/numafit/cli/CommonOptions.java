package dev.numafit.cli;

import dev.numafit.report.ReportFormat;
import java.nio.file.Path;
import picocli.CommandLine.Option;

/** Options every reporting command shares: output format, output file, verbosity. */
final class CommonOptions {
  @Option(
      names = {"-o", "--output"},
      paramLabel = "FORMAT",
      converter = FormatConverter.class,
      completionCandidates = FormatConverter.Names.class,
      description = "Output format: ${COMPLETION-CANDIDATES} (default: text).")
  ReportFormat output = ReportFormat.TEXT;

  @Option(
      names = "--out",
      paramLabel = "FILE",
      description =
          "Write the report to FILE instead of standard output (via a temporary file in the same"
              + " folder, then renamed).")
  Path out;

  @Option(
      names = "--verbose",
      description = "Print a stack trace with an internal error.")
  boolean verbose;

  /** Stops with a usage error when {@code -o} names a format this command does not write. */
  void requireFormat(String command, ReportFormat... accepted) {
    if (!java.util.List.of(accepted).contains(output)) {
      throw new UsageException(
          java.util.List.of(
              "-o " + output.label() + " is not available for " + command + " (expected one of: "
                  + String.join(", ",
                      java.util.Arrays.stream(accepted).map(ReportFormat::label).toList())
                  + ")"));
    }
  }

  /** Converts {@code -o} values with the message of {@link ReportFormat#fromLabel}. */
  static final class FormatConverter implements picocli.CommandLine.ITypeConverter<ReportFormat> {
    @Override
    public ReportFormat convert(String value) {
      try {
        return ReportFormat.fromLabel(value);
      } catch (IllegalArgumentException ex) {
        throw new picocli.CommandLine.TypeConversionException(ex.getMessage());
      }
    }

    /** The format names, for help and shell completion. */
    static final class Names extends java.util.ArrayList<String> {
      private static final long serialVersionUID = 1L;

      Names() {
        for (ReportFormat f : ReportFormat.values()) {
          add(f.label());
        }
      }
    }
  }
}
