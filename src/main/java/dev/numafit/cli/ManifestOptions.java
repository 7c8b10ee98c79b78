package dev.numafit.cli;

import java.util.ArrayList;
import java.util.List;
import picocli.CommandLine.Option;

/** Where demand, plan and check read manifests from, and which replica count they take. */
final class ManifestOptions {
  @Option(
      names = {"-f", "--filename"},
      paramLabel = "PATH",
      description =
          "Manifest file (.yaml, .yml, .json), folder (read recursively) or - for standard input."
              + " Repeatable.")
  List<String> files = new ArrayList<>();

  @Option(
      names = "--replicas",
      paramLabel = "peak|declared",
      description =
          "peak: an HPA's maxReplicas where one targets the workload (default); declared:"
              + " spec.replicas.")
  ReplicasOption replicas = ReplicasOption.PEAK;
}
