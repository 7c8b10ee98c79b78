package dev.numafit.cli;

import dev.numafit.report.ReportFormat;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;

/** {@code numafit demand}: prints every workload with its effective per-pod requests. */
@Command(
    name = "demand",
    sortOptions = false,
    usageHelpAutoWidth = false,
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    description = {
      "Reads manifests and prints every workload: replicas (declared and peak, and where the peak"
          + " came from), effective per-pod requests and limits as Kubernetes computes them, QoS,"
          + " exclusive CPUs, flags, and totals at peak."
    },
    footerHeading = "%nExamples:%n",
    footer = {
      "  numafit demand -f manifests-examples/parcel-delivery/",
      "  numafit demand -f deploy.yaml -f jobs/ --replicas declared -o json",
      "  render-manifests | numafit demand -f -",
      "",
      "Exit codes: 0 done, 2 usage or input error, 3 internal error."
    })
public final class DemandCommand implements Callable<Integer> {
  @ParentCommand NumafitCommand root;

  @Mixin CommonOptions common = new CommonOptions();

  @Mixin ManifestOptions manifests = new ManifestOptions();

  @Option(
      names = "--include-custom",
      description = "Size custom resources that embed pod templates (a guess, flagged).")
  boolean includeCustom;

  @Option(
      names = "--skip-invalid",
      description = "Skip invalid documents (listed) instead of failing with exit code 2.")
  boolean skipInvalid;

  @Override
  public Integer call() throws Exception {
    common.requireFormat("demand", ReportFormat.TEXT, ReportFormat.JSON);
    return Pipeline.demand(DemandOptions.check(this), root.console());
  }
}
