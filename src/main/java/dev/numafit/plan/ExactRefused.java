package dev.numafit.plan;

/**
 * The exact mode was asked for an input it does not cover (placement rules, or more pods than
 * {@link Planner#EXACT_MAX_PODS}). The message is one sentence for the user; the command line
 * reports it as a usage error.
 */
public final class ExactRefused extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public ExactRefused(String message) {
    super(message);
  }
}
