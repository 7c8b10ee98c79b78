package dev.numafit.cli;

import dev.numafit.check.Capacity;
import dev.numafit.check.CheckEngine;
import dev.numafit.check.CheckInput;
import dev.numafit.check.CheckReport;
import dev.numafit.check.Finding;
import dev.numafit.check.Gate;
import dev.numafit.demand.Demand;
import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.diag.Severity;
import dev.numafit.manifest.ManifestRead;
import dev.numafit.manifest.ManifestReader;
import dev.numafit.manifest.ReadOptions;
import dev.numafit.plan.Plan;
import dev.numafit.plan.PlanInput;
import dev.numafit.plan.Planner;
import dev.numafit.profile.ProfileLoad;
import dev.numafit.report.Units;
import dev.numafit.report.check.CheckFormat;
import dev.numafit.shape.WorkerShape;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.SortedMap;

/**
 * Runs {@code numafit check}: reads the change's manifests (and the baseline's), sizes the worker
 * as {@code plan} does, evaluates the rules, decides the verdict and writes the report.
 */
final class CheckRun {
  private CheckRun() {}

  static int run(CheckSettings s, Console console) throws InputException {
    PlanOptions po = s.plan();
    ReadOptions read = new ReadOptions(
        po.replicas().mode(),
        po.includeCustom());
    Pipeline.checkPathsExist(po.files());
    Pipeline.checkPathsExist(s.baseline());
    List<Diagnostic> profileErrors = new ArrayList<>();
    Map<Path, ProfileLoad> profiles = Pipeline.readProfiles(po.hostProfiles(), profileErrors);
    if (!profileErrors.isEmpty()) {
      throw new InputException(profileErrors);
    }
    ManifestReader reader = new ManifestReader(console.maxDocumentChars());
    ManifestRead head = reader.readLocated(po.files(), console.in(), read);
    Optional<ManifestRead> base = Optional.empty();
    if (!s.baseline().isEmpty()) {
      base = Optional.of(reader.readLocated(s.baseline(), console.in(), read));
    } else if (s.baselineGit().isPresent()) {
      SortedMap<String, String> texts =
          GitRevision.read(console.workingDir(), s.baselineGit().get(), po.files());
      base = Optional.of(reader.readTexts(texts, read));
    }
    List<Diagnostic> errors = new ArrayList<>(errors(head.demand()));
    base.ifPresent(b -> errors.addAll(errors(b.demand())));
    if (!errors.isEmpty()) {
      // A gate must not pass on a file it could not read: no --skip-invalid here.
      throw new InputException(errors);
    }
    // The same shape, allocatable and spanning rooms as plan (one host profile at most).
    Pipeline.Sized sizing = Pipeline.size(po, profiles);
    PlanInput input = sizing.inputs().get(0);
    Planner planner = new Planner();
    Plan headPlan = planner.plan(head.demand(), input);
    List<Finding> headFindings =
        CheckEngine.run(
            new CheckInput(head.demand(), head.sources(), headPlan, input.spanning(),
                po.maxUtilizationPct()),
            s.check(),
            base.map(ManifestRead::demand));
    Optional<List<Finding>> baseFindings = Optional.empty();
    Optional<Capacity> baseCapacity = Optional.empty();
    if (base.isPresent()) {
      Plan basePlan = planner.plan(base.get().demand(), input);
      baseFindings =
          Optional.of(
              CheckEngine.run(
                  new CheckInput(base.get().demand(), base.get().sources(), basePlan,
                      input.spanning(), po.maxUtilizationPct()),
                  s.check()));
      baseCapacity = Optional.of(new Capacity(basePlan.workersNeeded(), basePlan.hostsNeeded()));
    }
    List<Diagnostic> warnings = new ArrayList<>(sizing.warnings());
    head.demand().diagnostics().stream()
        .filter(d -> d.severity() != Severity.ERROR)
        .forEach(warnings::add);
    warnings.addAll(headPlan.warnings());
    CheckReport report =
        Gate.decide(
            describe(po, input),
            head.demand().workloads().stream().map(w -> w.id().toString()).toList(),
            headFindings,
            baseFindings,
            new Capacity(headPlan.workersNeeded(), headPlan.hostsNeeded()),
            baseCapacity,
            s.check(),
            headPlan.unchecked(),
            warnings);
    if (s.format() != CheckFormat.JSON) {
      report.warnings().forEach(console::report);
    }
    ReportOutput.write(s.format().writer().render(report), s.out(), console);
    return report.passed() ? ExitCode.OK.code() : ExitCode.FINDINGS.code();
  }

  private static List<Diagnostic> errors(Demand d) {
    return d.diagnostics().stream().filter(x -> x.severity() == Severity.ERROR).toList();
  }

  /** One line naming the worker checked against, its size and its allocatable. */
  private static String describe(PlanOptions po, PlanInput in) {
    WorkerShape shape = in.worker();
    String label = po.worker().isPresent() ? "given worker" : "one-node worker";
    label += in.hostProfile().map(n -> " of host profile " + n).orElse("");
    return label + ": " + shape.vcpus() + " vCPUs, " + Units.bytes(shape.memoryBytes())
        + "; allocatable " + Units.vector(in.allocatable());
  }
}
