package dev.numafit.cli;

import dev.numafit.check.Capacity;
import dev.numafit.check.CheckEngine;
import dev.numafit.check.CheckInput;
import dev.numafit.check.CheckReport;
import dev.numafit.check.Finding;
import dev.numafit.check.Gate;
import dev.numafit.demand.Demand;
import dev.numafit.demand.ReplicaMode;
import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.diag.Severity;
import dev.numafit.fit.SpanningRoom;
import dev.numafit.host.HostProfile;
import dev.numafit.manifest.ManifestRead;
import dev.numafit.manifest.ManifestReader;
import dev.numafit.manifest.ReadOptions;
import dev.numafit.plan.Plan;
import dev.numafit.plan.PlanInput;
import dev.numafit.plan.Planner;
import dev.numafit.profile.HostProfileReader;
import dev.numafit.profile.ProfileLoad;
import dev.numafit.report.Units;
import dev.numafit.report.check.CheckFormat;
import dev.numafit.resource.Resources;
import dev.numafit.shape.Allocatable;
import dev.numafit.shape.AllocatableResult;
import dev.numafit.shape.HostFit;
import dev.numafit.shape.ShapeDeriver;
import dev.numafit.shape.ShapeKind;
import dev.numafit.shape.ShapeOptions;
import dev.numafit.shape.ShapeSet;
import dev.numafit.shape.WorkerShape;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.SortedMap;

/**
 * Runs {@code numafit check}: reads the change's manifests (and the baseline's), sizes the worker
 * as {@code plan} does, evaluates the rules, decides the verdict and writes the report.
 */
final class CheckRun {
  private CheckRun() {}

  /** The worker the manifests are checked against, and what {@link Planner} needs besides. */
  record Sizing(
      String description,
      WorkerShape shape,
      Resources allocatable,
      OptionalInt workersPerHost,
      List<SpanningRoom> spanning,
      List<String> notes,
      List<Diagnostic> warnings) {}

  static int run(CheckSettings s, Console console) throws InputException {
    PlanOptions po = s.plan();
    ReadOptions read = new ReadOptions(
        po.replicas().mode(),
        po.includeCustom());
    ManifestReader reader = new ManifestReader();
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
    Sizing sizing = sizing(po);
    Planner planner = new Planner();
    Plan headPlan = planner.plan(head.demand(), planInput(po, sizing));
    List<Finding> headFindings =
        CheckEngine.run(
            new CheckInput(head.demand(), head.sources(), headPlan, sizing.spanning(),
                po.maxUtilizationPct()),
            s.check(),
            base.map(ManifestRead::demand));
    Optional<List<Finding>> baseFindings = Optional.empty();
    Optional<Capacity> baseCapacity = Optional.empty();
    if (base.isPresent()) {
      Plan basePlan = planner.plan(base.get().demand(), planInput(po, sizing));
      baseFindings =
          Optional.of(
              CheckEngine.run(
                  new CheckInput(base.get().demand(), base.get().sources(), basePlan,
                      sizing.spanning(), po.maxUtilizationPct()),
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
            sizing.description(),
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

  private static PlanInput planInput(PlanOptions po, Sizing sz) {
    return new PlanInput(
        Optional.empty(),
        sz.shape(),
        sz.allocatable(),
        sz.workersPerHost(),
        sz.spanning(),
        po.perWorker(),
        po.hostFailures(),
        po.maxUtilizationPct(),
        po.growth(),
        false,
        sz.notes(),
        List.of());
  }

  /**
   * The worker shape as {@code plan} derives it: the host profile's one-node worker, or the
   * {@code --worker} shape (placed on the host when a profile is given).
   */
  static Sizing sizing(PlanOptions po) throws InputException {
    List<Diagnostic> warnings = new ArrayList<>();
    List<String> notes = new ArrayList<>();
    Optional<HostProfile> profile = Optional.empty();
    if (!po.hostProfiles().isEmpty()) {
      ProfileLoad load = new HostProfileReader().read(po.hostProfiles().get(0));
      warnings.addAll(load.warnings());
      profile = Optional.of(load.profile());
    }
    ShapeDeriver deriver =
        new ShapeDeriver(new ShapeOptions(po.vcpuPerThread(), po.cpuOvercommit()));
    WorkerShape shape;
    List<SpanningRoom> spanning = new ArrayList<>();
    OptionalInt perHost = OptionalInt.empty();
    String label;
    if (po.worker().isPresent()) {
      Resources w = po.worker().get();
      shape = new WorkerShape(ShapeKind.EXPLICIT, 1, 1, w.get(Resources.CPU) / 1000,
          w.get(Resources.MEMORY), w.without(Resources.CPU).without(Resources.MEMORY));
      label = "given worker";
    } else {
      shape = null;
      label = "one-node worker";
    }
    if (profile.isPresent()) {
      HostProfile hp = profile.get();
      ShapeSet set = deriver.derive(hp);
      warnings.addAll(set.warnings());
      if (shape == null) {
        shape = set.oneNode();
      }
      for (WorkerShape span : set.spanning()) {
        spanning.add(new SpanningRoom(span.kind().label(), Allocatable.compute(span, po.reserve())));
      }
      if (shape.vcpus() == 0) {
        throw new InputException(Diagnostic.error(hp.source(),
            "host profile " + hp.name() + " leaves no vCPU for a one-node worker"));
      }
      HostFit fit = deriver.workersPerHost(hp, shape);
      notes.addAll(fit.notes());
      if (fit.workersPerHost() < 1) {
        throw new InputException(Diagnostic.error(hp.source(),
            "the worker (" + shape.vcpus() + " vCPUs, " + Units.bytes(shape.memoryBytes())
                + ") does not fit on a host of profile " + hp.name()));
      }
      perHost = OptionalInt.of(fit.workersPerHost());
      label += " of host profile " + hp.name();
    }
    AllocatableResult alloc = Allocatable.computeDetailed(shape, po.reserve());
    alloc.warnings().forEach(w -> warnings.add(Diagnostic.warning(null, w)));
    String description = label + ": " + shape.vcpus() + " vCPUs, "
        + Units.bytes(shape.memoryBytes()) + "; allocatable " + Units.vector(alloc.allocatable());
    return new Sizing(description, shape, alloc.allocatable(), perHost, spanning, notes, warnings);
  }
}
