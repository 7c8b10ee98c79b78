package dev.numafit.cli;

/** The report could not be written where the user asked (exit code 2, message only). */
final class OutputException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  OutputException(String message, Throwable cause) {
    super(message, cause);
  }
}
