package dev.numafit.cli;

import java.util.List;

/**
 * The command line breaks one or more rules; each message is one plain sentence the user reads
 * ("plan needs --host-profile or --worker"). Maps to exit code 2 without a stack trace.
 */
public final class UsageException extends RuntimeException {
  private static final long serialVersionUID = 1L;
  private final List<String> problems;

  public UsageException(List<String> problems) {
    super(String.join("; ", problems));
    this.problems = List.copyOf(problems);
  }

  public UsageException(String problem) {
    this(List.of(problem));
  }

  /** Every broken rule, in the order they were checked. */
  public List<String> problems() {
    return problems;
  }
}
