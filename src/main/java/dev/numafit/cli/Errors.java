package dev.numafit.cli;

import dev.numafit.diag.InputException;
import java.io.PrintWriter;
import java.io.StringWriter;
import picocli.CommandLine;
import picocli.CommandLine.IExecutionExceptionHandler;
import picocli.CommandLine.IExitCodeExceptionMapper;
import picocli.CommandLine.IParameterExceptionHandler;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.ParseResult;

/**
 * The one place that turns failures into messages and {@link ExitCode}s. A user's mistake (bad
 * option, bad input file, a rule between options) prints {@code error: ...} lines and exits 2,
 * never with a stack trace; anything else is an internal error (exit 3), with a stack trace only
 * under {@code --verbose}.
 */
final class Errors
    implements IExitCodeExceptionMapper, IExecutionExceptionHandler, IParameterExceptionHandler {
  private final Console console;
  private final boolean verbose;

  Errors(Console console, boolean verbose) {
    this.console = console;
    this.verbose = verbose;
  }

  @Override
  public int getExitCode(Throwable t) {
    if (t instanceof ParameterException
        || t instanceof UsageException
        || t instanceof InputException
        || t instanceof OutputException
        || t instanceof InvalidInput) {
      return ExitCode.USAGE_OR_INPUT.code();
    }
    return ExitCode.INTERNAL.code();
  }

  @Override
  public int handleParseException(ParameterException ex, String[] args) {
    CommandLine cmd = ex.getCommandLine();
    console.error(ex.getMessage());
    hint(cmd);
    return getExitCode(ex);
  }

  @Override
  public int handleExecutionException(Exception ex, CommandLine cmd, ParseResult parseResult) {
    if (ex instanceof ParameterException pe) {
      return handleParseException(pe, new String[0]);
    } else if (ex instanceof UsageException ue) {
      ue.problems().forEach(console::error);
      hint(cmd);
    } else if (ex instanceof InputException ie) {
      ie.diagnostics().forEach(console::report);
    } else if (ex instanceof InvalidInput ii) {
      ii.diagnostics().forEach(console::report);
      long n = ii.diagnostics().stream()
          .filter(d -> d.severity() == dev.numafit.diag.Severity.ERROR).count();
      console.err().println(n + (n == 1 ? " error" : " errors") + " in the input"
          + (ii.skippable()
              ? "; fix them, or use --skip-invalid to leave the invalid documents out."
              : "."));
    } else if (ex instanceof OutputException oe) {
      console.error(oe.getMessage());
    } else {
      console.err().println(
          "internal error: "
              + ex
              + (verbose ? "" : " (run again with --verbose for the stack trace)"));
      if (verbose) {
        StringWriter trace = new StringWriter();
        ex.printStackTrace(new PrintWriter(trace));
        console.err().print(trace);
      }
    }
    return getExitCode(ex);
  }

  private void hint(CommandLine cmd) {
    console.err().println("Run '" + cmd.getCommandSpec().qualifiedName() + " --help' for usage.");
  }
}
