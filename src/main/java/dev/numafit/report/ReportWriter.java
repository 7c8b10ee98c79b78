package dev.numafit.report;

/**
 * Renders one kind of report in one {@link ReportFormat}. Writers are pure: the same report gives
 * the same text, byte for byte.
 *
 * @param <R> the report value
 */
public interface ReportWriter<R> {
  /** The whole report, ending with a newline. */
  String render(R report);
}
