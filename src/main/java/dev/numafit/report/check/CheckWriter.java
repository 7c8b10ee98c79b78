package dev.numafit.report.check;

import dev.numafit.check.CheckReport;
import dev.numafit.report.ReportWriter;

/** Renders a {@link CheckReport} in one {@link CheckFormat}; pure, byte-identical for equal input. */
public interface CheckWriter extends ReportWriter<CheckReport> {}
