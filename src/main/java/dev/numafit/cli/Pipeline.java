package dev.numafit.cli;

/**
 * Runs a checked command: reads the inputs, calls the core, renders the report and writes it.
 * The only class of the CLI that knows the order of the steps.
 */
final class Pipeline {
  private Pipeline() {}

  static int demand(DemandOptions options, Console console) {
    throw new UnsupportedOperationException("demand is not wired yet");
  }

  static int plan(PlanOptions options, Console console) {
    throw new UnsupportedOperationException("plan is not wired yet");
  }
}
