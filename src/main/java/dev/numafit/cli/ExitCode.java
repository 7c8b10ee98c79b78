package dev.numafit.cli;

/**
 * The exit codes of every numafit command, in one table (docs/exit-codes.md mirrors it).
 */
public enum ExitCode {
  /** The command did its job; a plan with oversize pods is still a plan. */
  OK(0, "done"),
  /** A check command found problems (reserved for the pre-merge gate). */
  FINDINGS(1, "findings"),
  /** The command line or an input file was wrong; the message says what and where. */
  USAGE_OR_INPUT(2, "usage or input error"),
  /** A bug in numafit; --verbose prints the stack trace. */
  INTERNAL(3, "internal error");

  private final int code;
  private final String meaning;

  ExitCode(int code, String meaning) {
    this.code = code;
    this.meaning = meaning;
  }

  public int code() {
    return code;
  }

  public String meaning() {
    return meaning;
  }
}
