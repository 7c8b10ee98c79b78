package dev.numafit.cli;

import dev.numafit.demand.Demand;
import dev.numafit.demand.ReplicaMode;
import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.diag.Severity;
import dev.numafit.fit.SpanningRoom;
import dev.numafit.host.HostProfile;
import dev.numafit.manifest.ManifestReader;
import dev.numafit.manifest.ReadOptions;
import dev.numafit.plan.Plan;
import dev.numafit.plan.PlanComparison;
import dev.numafit.pack.ExactPacker;
import dev.numafit.pack.VectorPacker;
import dev.numafit.plan.ExactRefused;
import dev.numafit.plan.PlanInput;
import dev.numafit.plan.Planner;
import dev.numafit.plan.PoolPlan;
import dev.numafit.plan.PoolPlanner;
import dev.numafit.plan.PoolPlanning;
import dev.numafit.plan.Unplaceable;
import dev.numafit.plan.WorkerPool;
import dev.numafit.profile.PoolSpec;
import dev.numafit.profile.PoolsFileReader;
import dev.numafit.profile.HostProfileReader;
import dev.numafit.profile.ProfileLoad;
import dev.numafit.report.DemandJsonWriter;
import dev.numafit.report.DemandReport;
import dev.numafit.report.DemandTextWriter;
import dev.numafit.report.PlanHost;
import dev.numafit.report.PlanJsonWriter;
import dev.numafit.report.PlanMarkdownWriter;
import dev.numafit.report.PlanReport;
import dev.numafit.report.PlanTextWriter;
import dev.numafit.report.ReportFormat;
import dev.numafit.report.ReportWriter;
import dev.numafit.report.TextStyle;
import dev.numafit.report.html.PlanHtmlWriter;
import dev.numafit.report.kubelet.KubeletConfigWriter;
import dev.numafit.resource.Resources;
import dev.numafit.shape.Allocatable;
import dev.numafit.shape.AllocatableResult;
import dev.numafit.shape.HostFit;
import dev.numafit.shape.ShapeDeriver;
import dev.numafit.shape.ShapeKind;
import dev.numafit.shape.ShapeOptions;
import dev.numafit.shape.ShapeSet;
import dev.numafit.shape.SpanningSplit;
import dev.numafit.shape.WorkerShape;
import java.io.IOException;
import java.math.BigDecimal;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.TreeMap;

/**
 * Runs a checked command: reads the inputs, calls the core, renders the report and writes it. The
 * only class of the CLI that knows the order of the steps.
 */
final class Pipeline {
  private Pipeline() {}

  static int demand(DemandOptions o, Console console) {
    checkPathsExist(o.files());
    Demand demand = readDemand(o.files(), o.replicas(), o.includeCustom(), console);
    List<Diagnostic> shown = checkInput(demand.diagnostics(), List.of(), o.skipInvalid());
    DemandReport report = new DemandReport(demand, shown);
    ReportWriter<DemandReport> writer = demandWriter(o.format());
    if (o.format() == ReportFormat.TEXT) {
      report.warnings().forEach(console::report);
    }
    ReportOutput.write(writer.render(report), o.out(), console);
    return ExitCode.OK.code();
  }

  static int plan(PlanOptions o, Console console) throws InputException {
    checkPathsExist(o.files());
    List<Diagnostic> profileErrors = new ArrayList<>();
    List<PoolSpec> poolSpecs = List.of();
    if (o.pools().isPresent()) {
      try {
        poolSpecs = new PoolsFileReader().read(o.pools().get());
      } catch (InputException ex) {
        profileErrors.addAll(ex.diagnostics());
      }
    }
    Demand demand = readDemand(o.files(), o.replicas(), o.includeCustom(), console);
    List<Path> profilePaths = new ArrayList<>(o.hostProfiles());
    for (PoolSpec ps : poolSpecs) {
      ps.hostProfile().filter(h -> !profilePaths.contains(h)).ifPresent(profilePaths::add);
    }
    Map<Path, ProfileLoad> profiles = readProfiles(profilePaths, profileErrors);
    List<Diagnostic> warnings =
        new ArrayList<>(checkInput(demand.diagnostics(), profileErrors, o.skipInvalid()));
    VectorPacker packer = new VectorPacker(VectorPacker.DEFAULT_STEP_BUDGET * o.effort());
    Planner planner =
        o.exact()
            ? new Planner(packer, new ExactPacker(ExactPacker.DEFAULT_NODE_LIMIT * o.effort()))
            : new Planner(packer);
    PoolPlanner poolPlanner = new PoolPlanner(planner);
    List<Plan> plans = new ArrayList<>();
    List<WorkerShape> shapes;
    List<String> configNames = new ArrayList<>();
    Optional<PlanComparison> comparison = Optional.empty();
    PlanReport report;
    ProgressLine progress = ProgressLine.of(console);
    try {
      if (o.pools().isPresent()) {
        PoolsSized sized = sizePools(o, profiles, poolSpecs);
        warnings.addAll(sized.warnings());
        PoolPlanning planning = poolPlanner.plan(demand, sized.pools(), progress);
        for (PoolPlan pp : planning.pools()) {
          plans.add(pp.plan());
          configNames.add(pp.name());
          warnings.addAll(pp.plan().warnings());
        }
        shapes = sized.shapes();
        report =
            new PlanReport(demand, plans, comparison, warnings, sized.hosts(), planning.pools(),
                planning.unplaceable());
      } else {
        Sized sized = size(o, profiles);
        warnings.addAll(sized.warnings());
        // One untainted pool without labels of its own: workloads whose node rules it does not
        // satisfy are listed, not packed. The list is the same for every host profile.
        List<Unplaceable> unplaceable = List.of();
        for (PlanInput in : sized.inputs()) {
          PoolPlanning planning =
              poolPlanner.plan(demand, List.of(WorkerPool.single(in)), progress);
          plans.add(planning.pools().get(0).plan());
          unplaceable = planning.unplaceable();
        }
        shapes = sized.shapes();
        Map<String, BigDecimal> costs = sized.costs();
        for (Plan p : plans) {
          warnings.addAll(p.warnings());
          configNames.add(p.hostProfile().orElse("worker"));
        }
        comparison =
            plans.size() >= 2 ? Optional.of(PlanComparison.of(plans, costs)) : Optional.empty();
        report =
            new PlanReport(demand, plans, comparison, warnings, sized.hosts(), List.of(),
                unplaceable);
      }
    } catch (ExactRefused ex) {
      throw new UsageException(ex.getMessage());
    } finally {
      progress.clear();
    }
    if (o.kubeletConfigDir().isPresent()) {
      writeKubeletConfigs(o, configNames, shapes);
    }
    ReportWriter<PlanReport> writer = planWriter(o.format(), console.stdout());
    if (o.format() == ReportFormat.TEXT) {
      report.warnings().forEach(console::report);
    }
    ReportOutput.write(writer.render(report), o.out(), console);
    return ExitCode.OK.code();
  }

  /** The worker pools of a pools file, each pool's worker shape, and host layouts by pool name. */
  record PoolsSized(
      List<WorkerPool> pools,
      List<WorkerShape> shapes,
      TreeMap<String, PlanHost> hosts,
      List<Diagnostic> warnings) {}

  /**
   * Sizes each pool of a pools file: its own host profile or the plan's, its own worker or the
   * plan's --worker, else one worker per NUMA node split {@code workersPerNode} ways.
   *
   * @throws UsageException naming each pool that cannot be sized
   */
  static PoolsSized sizePools(
      PlanOptions o, Map<Path, ProfileLoad> profiles, List<PoolSpec> specs) {
    ShapeDeriver deriver = new ShapeDeriver(new ShapeOptions(o.vcpuPerThread(), o.cpuOvercommit()));
    boolean placement = placementListed(o);
    List<WorkerPool> pools = new ArrayList<>();
    List<WorkerShape> shapes = new ArrayList<>();
    TreeMap<String, PlanHost> hosts = new TreeMap<>();
    List<Diagnostic> warnings = new ArrayList<>();
    List<String> problems = new ArrayList<>();
    java.util.Set<Path> warned = new java.util.HashSet<>();
    for (PoolSpec ps : specs) {
      Optional<Path> hostPath =
          ps.hostProfile().or(() -> o.hostProfiles().stream().findFirst());
      Optional<Resources> worker = ps.worker().or(() -> ps.workersPerNode() > 1
          ? Optional.empty() : o.worker());
      String where = "pool " + ps.name() + " (" + ps.source() + ")";
      if (hostPath.isEmpty() && worker.isEmpty()) {
        problems.add(where + " has no host profile and no worker: give hostProfile or worker in"
            + " the pools file, or --host-profile or --worker");
        continue;
      }
      if (hostPath.isEmpty() && ps.workersPerNode() > 1) {
        problems.add(where + ": workersPerNode needs a host profile");
        continue;
      }
      if (hostPath.isEmpty() && (o.hostFailures() > 0 || o.placementOptions().zoneFailures() > 0)) {
        problems.add(where + " has no host profile: --host-failures and --zone-failures count"
            + " hosts");
        continue;
      }
      Optional<Sizing> one;
      if (hostPath.isPresent()) {
        ProfileLoad load = profiles.get(hostPath.get());
        if (load == null) {
          continue; // its errors are already reported
        }
        if (warned.add(hostPath.get())) {
          warnings.addAll(load.warnings());
        }
        one = sizeProfile(o, deriver, load.profile(), worker, ps.workersPerNode(), placement,
            problems);
      } else {
        one = Optional.of(sizeBare(o, worker.get(), placement));
      }
      if (one.isEmpty()) {
        continue;
      }
      pools.add(new WorkerPool(ps.name(), ps.labels(), ps.taints(), one.get().input()));
      shapes.add(one.get().shape());
      one.get().host().ifPresent(h -> hosts.put(ps.name(), h));
    }
    if (!problems.isEmpty()) {
      throw new UsageException(problems);
    }
    return new PoolsSized(pools, shapes, hosts, warnings);
  }

  /**
   * What sizing needs besides the demand, shared by {@code plan} and {@code check}: one plan input
   * per host profile in order (or one for a bare --worker), the worker shape of each, the profiles'
   * relative costs, each profile's host and worker layout (for the HTML report), and the
   * profiles' warnings.
   */
  record Sized(
      List<PlanInput> inputs,
      List<WorkerShape> shapes,
      Map<String, BigDecimal> costs,
      TreeMap<String, PlanHost> hosts,
      List<Diagnostic> warnings) {}

  /**
   * The worker shape, allocatable, workers per host and spanning rooms for each host profile (or
   * the bare --worker).
   *
   * @throws UsageException when a profile leaves no room for a worker or the --worker does not
   *     fit its host
   */
  static Sized size(PlanOptions o, Map<Path, ProfileLoad> profiles) {
    ShapeDeriver deriver = new ShapeDeriver(new ShapeOptions(o.vcpuPerThread(), o.cpuOvercommit()));
    List<PlanInput> inputs = new ArrayList<>();
    List<Diagnostic> warnings = new ArrayList<>();
    List<WorkerShape> shapes = new ArrayList<>();
    Map<String, BigDecimal> costs = new TreeMap<>();
    TreeMap<String, PlanHost> hosts = new TreeMap<>();
    boolean placement = placementListed(o);
    List<String> problems = new ArrayList<>();
    for (Map.Entry<Path, ProfileLoad> e : profiles.entrySet()) {
      // With --pools the map holds the pools' own profiles too; they are sized per pool.
      if (!o.hostProfiles().contains(e.getKey())) {
        continue;
      }
      ProfileLoad load = e.getValue();
      warnings.addAll(load.warnings());
      HostProfile host = load.profile();
      host.relativeCost().ifPresent(c -> costs.put(host.name(), c));
      Optional<Sizing> one = sizeProfile(o, deriver, host, o.worker(), 1, placement, problems);
      if (one.isEmpty()) {
        continue;
      }
      inputs.add(one.get().input());
      shapes.add(one.get().shape());
      hosts.put(host.name(), one.get().host().orElseThrow());
    }
    if (o.hostProfiles().isEmpty()) {
      Sizing one = sizeBare(o, o.worker().orElseThrow(), placement);
      inputs.add(one.input());
      shapes.add(one.shape());
    }
    if (!problems.isEmpty()) {
      throw new UsageException(problems);
    }
    return new Sized(inputs, shapes, costs, hosts, warnings);
  }

  /** One worker shape's plan input, the shape, and the host layout when there is a host. */
  record Sizing(PlanInput input, WorkerShape shape, Optional<PlanHost> host) {}

  /** The fill charts need to know which pods share a worker. */
  private static boolean placementListed(PlanOptions o) {
    return o.placement() || o.format() == ReportFormat.HTML || o.format() == ReportFormat.MARKDOWN;
  }

  /**
   * The plan input for one host profile: the given worker placed on the host, else one worker
   * per NUMA node split {@code perNode} ways. Empty (with a problem added) when no worker fits.
   */
  private static Optional<Sizing> sizeProfile(
      PlanOptions o,
      ShapeDeriver deriver,
      HostProfile host,
      Optional<Resources> worker,
      int perNode,
      boolean placement,
      List<String> problems) {
    ShapeSet set = deriver.derive(host);
    List<String> notes = new ArrayList<>();
    List<Diagnostic> planWarnings = new ArrayList<>(set.warnings());
    WorkerShape shape;
    HostFit fit;
    if (worker.isPresent()) {
      shape = explicitShape(worker.get(), 1);
      fit = deriver.workersPerHost(host, shape);
      if (fit.spanning()) {
        shape = explicitShape(worker.get(), fit.split().map(SpanningSplit::nodes).orElse(1));
      }
      notes.addAll(fit.notes());
      notes.add(ShapeDeriver.topologyAdvice(shape));
    } else {
      shape = perNode == 1 ? set.oneNode() : deriver.split(host, perNode);
      if (shape.vcpus() <= 0 || shape.memoryBytes() <= 0) {
        problems.add("host profile " + host.name() + " (" + host.source().file()
            + ") leaves no room for a worker after the hypervisor's reserve"
            + (perNode == 1 ? "" : " when each NUMA node carries " + perNode + " workers"));
        return Optional.empty();
      }
      fit = deriver.workersPerHost(host, shape);
      if (perNode == 1) {
        notes.addAll(set.notes());
      } else {
        notes.add(ShapeDeriver.topologyAdvice(shape));
      }
    }
    if (fit.workersPerHost() < 1) {
      problems.add("a --worker of " + describe(shape) + " does not fit on host profile "
          + host.name() + " (larger than the whole host)");
      return Optional.empty();
    }
    AllocatableResult alloc = Allocatable.computeDetailed(shape, o.reserve());
    alloc.warnings().forEach(w -> planWarnings.add(Diagnostic.warning(host.source(), w)));
    List<SpanningRoom> spanning = new ArrayList<>();
    for (WorkerShape s : set.spanning()) {
      spanning.add(new SpanningRoom(s.kind().label(), Allocatable.compute(s, o.reserve())));
    }
    PlanInput in =
        new PlanInput(
            Optional.of(host.name()),
            shape,
            alloc.allocatable(),
            OptionalInt.of(fit.workersPerHost()),
            spanning,
            o.perWorker(),
            o.hostFailures(),
            o.maxUtilizationPct(),
            o.growth(),
            placement,
            notes,
            planWarnings,
            o.placementOptions());
    return Optional.of(new Sizing(in, shape, Optional.of(new PlanHost(host, deriver.layout(host, shape)))));
  }

  /** The plan input for a worker without a host: workers are counted, not hosts. */
  private static Sizing sizeBare(PlanOptions o, Resources worker, boolean placement) {
    WorkerShape shape = explicitShape(worker, 1);
    AllocatableResult alloc = Allocatable.computeDetailed(shape, o.reserve());
    List<Diagnostic> planWarnings = new ArrayList<>();
    alloc.warnings().forEach(w -> planWarnings.add(Diagnostic.warning(null, w)));
    PlanInput in =
        new PlanInput(
            Optional.empty(),
            shape,
            alloc.allocatable(),
            OptionalInt.empty(),
            List.of(),
            o.perWorker(),
            o.hostFailures(),
            o.maxUtilizationPct(),
            o.growth(),
            placement,
            List.of(ShapeDeriver.topologyAdvice(shape)),
            planWarnings,
            o.placementOptions());
    return new Sizing(in, shape, Optional.empty());
  }

  /** The writer of each format for plan reports. */
  static ReportWriter<PlanReport> planWriter(ReportFormat format, TextStyle style) {
    return switch (format) {
      case TEXT -> new PlanTextWriter(style);
      case JSON -> new PlanJsonWriter();
      case HTML -> new PlanHtmlWriter();
      case MARKDOWN -> new PlanMarkdownWriter();
    };
  }

  /** The writer of each format for demand reports. */
  static ReportWriter<DemandReport> demandWriter(ReportFormat format) {
    return switch (format) {
      case TEXT -> new DemandTextWriter();
      case JSON -> new DemandJsonWriter();
      // DemandCommand refuses these formats before anything is read.
      case HTML, MARKDOWN -> throw new IllegalArgumentException("demand writes text or json");
    };
  }

  private static Demand readDemand(
      List<String> files, ReplicasOption replicas, boolean includeCustom, Console console) {
    return new ManifestReader(console.maxDocumentChars())
        .read(files, console.in(), new ReadOptions(replicas.mode(), includeCustom));
  }

  /**
   * Stops with every diagnostic (exit 2) when a host profile is invalid, or when the manifests
   * have errors and --skip-invalid is not given; otherwise returns what the report shows: warnings
   * and notes, plus the skipped errors.
   */
  private static List<Diagnostic> checkInput(
      List<Diagnostic> diagnostics, List<Diagnostic> profileErrors, boolean skipInvalid) {
    boolean manifestErrors = diagnostics.stream().anyMatch(d -> d.severity() == Severity.ERROR);
    if (!profileErrors.isEmpty() || (manifestErrors && !skipInvalid)) {
      List<Diagnostic> all = new ArrayList<>(diagnostics);
      all.addAll(profileErrors);
      all.sort(null);
      throw new InvalidInput(all, manifestErrors && !skipInvalid);
    }
    return diagnostics;
  }

  /**
   * A path that does not exist is a usage error whatever --skip-invalid says: the user meant
   * another path.
   */
  static void checkPathsExist(List<String> files) {
    List<String> problems = new ArrayList<>();
    for (String f : files) {
      if (!f.equals("-") && !Files.exists(Path.of(f))) {
        problems.add("-f " + f + ": no such file or folder");
      }
    }
    if (!problems.isEmpty()) {
      throw new UsageException(problems);
    }
  }

  /** Reads every profile, collecting the errors of all of them. */
  static Map<Path, ProfileLoad> readProfiles(List<Path> paths, List<Diagnostic> errors) {
    Map<Path, ProfileLoad> loads = new LinkedHashMap<>();
    HostProfileReader reader = new HostProfileReader();
    for (Path p : paths) {
      try {
        loads.put(p, reader.read(p));
      } catch (InputException ex) {
        errors.addAll(ex.diagnostics());
      }
    }
    return loads;
  }

  /** The --worker capacity as a shape: cpu whole vCPUs, memory bytes, the rest as extras. */
  private static WorkerShape explicitShape(Resources worker, int nodesSpanned) {
    Resources extras = worker.without(Resources.CPU).without(Resources.MEMORY);
    return new WorkerShape(
        ShapeKind.EXPLICIT,
        1,
        nodesSpanned,
        worker.get(Resources.CPU) / 1000,
        worker.get(Resources.MEMORY),
        extras);
  }

  private static String describe(WorkerShape s) {
    return s.vcpus() + " vCPU, " + dev.numafit.report.Units.bytes(s.memoryBytes());
  }

  /**
   * One KubeletConfiguration per plan, named after its host profile ({@code worker} for a bare
   * --worker plan) or its pool, written through a temporary file like the report.
   */
  private static void writeKubeletConfigs(
      PlanOptions o, List<String> names, List<WorkerShape> shapes) {
    Path dir = o.kubeletConfigDir().orElseThrow();
    try {
      Files.createDirectories(dir);
    } catch (IOException ex) {
      throw new OutputException("cannot create folder " + dir + ": " + ex.getMessage(), ex);
    }
    KubeletConfigWriter writer = new KubeletConfigWriter();
    for (int i = 0; i < names.size(); i++) {
      String file = names.get(i).replaceAll("[^A-Za-z0-9._-]", "_") + ".kubelet-config.yaml";
      ReportOutput.writeFile(dir.resolve(file), writer.render(shapes.get(i), o.reserve()));
    }
  }
}
