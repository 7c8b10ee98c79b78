package dev.numafit.cli;

import dev.numafit.report.ReportFormat;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/** The options of {@code numafit demand} after its rules were checked (see {@link #check}). */
public record DemandOptions(
    List<String> files,
    ReplicasOption replicas,
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

  /**
   * Checks the rules picocli cannot, all at once, and builds the options.
   *
   * @throws UsageException naming each broken rule in one sentence
   */
  static DemandOptions check(DemandCommand c) {
    List<String> problems = new ArrayList<>();
    if (c.manifests.files.isEmpty()) {
      problems.add("demand needs at least one -f/--filename (a file, a folder, or - for standard"
          + " input)");
    }
    if (c.manifests.files.stream().filter("-"::equals).count() > 1) {
      problems.add("-f - (standard input) can be given only once");
    }
    if (!problems.isEmpty()) {
      throw new UsageException(problems);
    }
    return new DemandOptions(
        c.manifests.files,
        c.manifests.replicas,
        c.includeCustom,
        c.skipInvalid,
        c.common.output,
        Optional.ofNullable(c.common.out));
  }
}
