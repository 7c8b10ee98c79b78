package dev.numafit.cli;

import dev.numafit.demand.ReplicaMode;
import dev.numafit.report.ReportFormat;
import java.nio.file.Path;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/** The checked options of {@code numafit demand}. */
public record DemandOptions(
    List<String> files,
    ReplicaMode replicas,
    boolean includeCustom,
    boolean skipInvalid,
    ReportFormat format,
    Optional<Path> out) {
  public DemandOptions {
    files = List.copyOf(files);
    Objects.requireNonNull(replicas, "replicas");
    Objects.requireNonNull(format, "format");
    Objects.requireNonNull(out, "out");
  }
}
