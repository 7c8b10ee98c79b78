package dev.numafit.cli;

import dev.numafit.cluster.model.ClusterModel;
import dev.numafit.demand.ReplicaMode;
import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.host.HostProfile;
import dev.numafit.profile.HostProfileReader;
import dev.numafit.profile.ProfileLoad;
import dev.numafit.report.PlanHost;
import dev.numafit.report.ReportWriter;
import dev.numafit.report.html.ReviewHtmlWriter;
import dev.numafit.report.ReviewJsonWriter;
import dev.numafit.report.ReviewTextWriter;
import dev.numafit.resource.Resources;
import dev.numafit.review.DemandSource;
import dev.numafit.review.NodeShape;
import dev.numafit.review.ResizeRequest;
import dev.numafit.review.Review;
import dev.numafit.review.Reviewer;
import dev.numafit.shape.Allocatable;
import dev.numafit.shape.KubeletReserve;
import dev.numafit.shape.ShapeDeriver;
import dev.numafit.shape.ShapeKind;
import dev.numafit.shape.ShapeOptions;
import dev.numafit.shape.WorkerShape;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;

/** {@code numafit review}: picocli wiring of the pool-resize review ({@link Reviewer}). */
@Command(
    name = "review",
    sortOptions = false,
    usageHelpAutoWidth = false,
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    description = {
      "Reviews a node-pool resize before doing it: which of today's nodes span NUMA nodes of"
          + " the host, whether every pod still fits the resized pool (and why not), which"
          + " nodes to remove first, and the drain in rounds under PodDisruptionBudgets.",
      "Reads the cluster live (list requests only, see docs/rbac.md) or from --snapshot FILE."
    },
    footerHeading = "%nExamples:%n",
    footer = {
      "  numafit review --pool pool=general --nodes 7 \\",
      "      --host-profile host-profiles/two-socket-one-node-per-socket.yaml",
      "  numafit review --snapshot cluster.json --pool pool=general \\",
      "      --worker cpu=16,memory=64Gi --nodes 12 -o json",
      "  numafit review --snapshot cluster.json --pool pool=general --worker one-node \\",
      "      --host-profile host-profiles/two-socket-four-nodes-per-socket.yaml",
      "",
      "Exit codes: 0 the resize fits, 1 it does not (pods pending or budgets blocking),"
          + " 2 usage, input or connection error, 3 internal error."
    })
public final class ReviewCommand implements Callable<Integer> {
  @ParentCommand NumafitCommand root;

  @Mixin ClusterOptions cluster = new ClusterOptions();

  // Required, but checked in call(): picocli's own check would run before numafit.yaml is read.
  @Option(
      names = "--pool",
      paramLabel = "KEY=VALUE",
      description = "The pool: nodes with this label (required; may come from numafit.yaml).")
  String pool;

  @Option(
      names = "--host-profile",
      paramLabel = "FILE",
      description = "Host profile for the NUMA check and --worker one-node (see"
          + " docs/host-profile.md).")
  Path hostProfile;

  @Option(
      names = "--nodes",
      paramLabel = "N",
      description = "Node count after the resize (default: as today).")
  Integer nodes;

  @Option(
      names = "--worker",
      paramLabel = "cpu=N,memory=Q|one-node",
      description = "Node shape after the resize, as in plan; one-node: the host profile's"
          + " one-node worker (default: the pool's nodes as they are).")
  String worker;

  @Option(
      names = "--host-failures",
      paramLabel = "K",
      description = "Hosts that may fail after the resize with every pod still placed"
          + " (default: 0).")
  int hostFailures;

  @Option(
      names = "--host-label",
      paramLabel = "KEY",
      description = "Node label naming the host a worker runs on (default: one worker per NUMA"
          + " node of the host profile, consecutive by node name).")
  String hostLabel;

  @Option(
      names = "--from",
      paramLabel = "running|declared",
      description = "Pods as they run now (default) or workloads as declared × replicas.")
  String from = "running";

  @Option(
      names = "--replicas",
      paramLabel = "peak|declared",
      description = "With --from declared: an autoscaler's maxReplicas (peak, default) or"
          + " spec.replicas.")
  ReplicasOption replicas = ReplicasOption.PEAK;

  @Option(
      names = {"-o", "--output"},
      paramLabel = "text|json|markdown|html",
      description = "Output format (default: text); html: one self-contained page with"
          + " pictures, best with --out FILE.")
  String output = "text";

  @Option(names = "--out", paramLabel = "FILE", description = "Write the report to FILE.")
  Path out;

  @Option(names = "--verbose", description = "List every request made (never a credential).")
  boolean verbose;

  @Option(
      names = "--config",
      paramLabel = "FILE",
      description = "Read options from FILE (default: numafit.yaml in the current folder).")
  Path config;

  @Override
  public Integer call() throws InputException {
    Console console = root.console();
    List<String> problems = new ArrayList<>();
    if (pool == null) {
      throw new UsageException(List.of("missing --pool KEY=VALUE: the label of the pool's nodes,"
          + " e.g. --pool pool=general"));
    }
    String[] kv = pool.split("=", 2);
    if (kv.length != 2 || kv[0].isBlank() || kv[1].isBlank()) {
      problems.add("--pool " + pool + ": expected KEY=VALUE, e.g. --pool pool=general");
    }
    DemandSource source = switch (from.toLowerCase(Locale.ROOT)) {
      case "running" -> DemandSource.RUNNING;
      case "declared" -> DemandSource.DECLARED;
      default -> {
        problems.add("--from " + from + ": expected running or declared");
        yield DemandSource.RUNNING;
      }
    };
    String format = output.toLowerCase(Locale.ROOT);
    if (!List.of("text", "json", "markdown", "html").contains(format)) {
      problems.add("unknown output format \"" + output
          + "\" (expected one of: text, json, markdown, html)");
    }
    if (nodes != null && nodes < 1) {
      problems.add("--nodes must be 1 or more, got " + nodes);
    }
    if (hostFailures < 0) {
      problems.add("--host-failures must be 0 or more, got " + hostFailures);
    }
    if ("one-node".equals(worker) && hostProfile == null) {
      problems.add("--worker one-node needs --host-profile");
    }
    Optional<Resources> explicit = Optional.empty();
    if (worker != null && !"one-node".equals(worker)) {
      try {
        Resources w = ResourceArgs.parse(worker);
        if (w.get(Resources.CPU) <= 0 || w.get(Resources.MEMORY) <= 0
            || w.get(Resources.CPU) % 1000 != 0) {
          problems.add("--worker needs whole vCPUs and memory above zero, e.g. --worker"
              + " cpu=16,memory=64Gi");
        }
        explicit = Optional.of(w);
      } catch (IllegalArgumentException ex) {
        problems.add("--worker: " + ex.getMessage());
      }
    }
    if (!problems.isEmpty()) {
      throw new UsageException(problems);
    }

    Optional<HostProfile> profile = Optional.empty();
    Optional<Resources> oneNode = Optional.empty();
    ShapeDeriver deriver = new ShapeDeriver(ShapeOptions.defaults());
    if (hostProfile != null) {
      ProfileLoad load = new HostProfileReader().read(hostProfile);
      load.warnings().forEach(console::report);
      profile = Optional.of(load.profile());
      oneNode = Optional.of(deriver.oneNode(load.profile()).capacity());
    }
    Optional<NodeShape> shape = Optional.empty();
    // The worker VM the HTML report draws on the host: the after-shape, else the one-node worker.
    Optional<WorkerShape> drawn = profile.map(deriver::oneNode);
    if ("one-node".equals(worker)) {
      WorkerShape s = deriver.oneNode(profile.orElseThrow());
      shape = Optional.of(new NodeShape("one-node (cpu=" + s.vcpus() + ",memory="
          + dev.numafit.report.Units.bytes(s.memoryBytes()) + ")", s.capacity(),
          Allocatable.compute(s, KubeletReserve.defaults())));
    } else if (explicit.isPresent()) {
      Resources w = explicit.get();
      WorkerShape s = new WorkerShape(ShapeKind.EXPLICIT, 1, 1, w.get(Resources.CPU) / 1000,
          w.get(Resources.MEMORY), w.without(Resources.CPU).without(Resources.MEMORY));
      shape = Optional.of(new NodeShape(worker, s.capacity(),
          Allocatable.compute(s, KubeletReserve.defaults())));
      drawn = Optional.of(s);
    }
    int perHost = profile.map(p -> Math.max(1, p.nodes().size())).orElse(1);
    ResizeRequest request = new ResizeRequest(kv[0], kv[1],
        nodes == null ? OptionalInt.empty() : OptionalInt.of(nodes), shape, oneNode,
        profile.map(HostProfile::name), hostFailures, Optional.ofNullable(hostLabel), perHost,
        source, replicas.mode());

    ClusterModel model = cluster.load(console, verbose);
    Review review;
    try {
      review = new Reviewer().review(model, request);
    } catch (IllegalArgumentException ex) {
      throw new InputException(Diagnostic.error(null, ex.getMessage()));
    }
    ReportWriter<Review> writer = switch (format) {
      case "json" -> new ReviewJsonWriter();
      case "markdown" -> new ReviewTextWriter(true);
      case "html" -> htmlWriter(profile, drawn, worker != null, deriver);
      default -> new ReviewTextWriter(false);
    };
    if (format.equals("text")) {
      for (String w : review.warnings()) {
        if (!w.startsWith("not read: ")) {
          console.report(Diagnostic.warning(null, w));
        }
      }
    }
    ReportOutput.write(writer.render(review), Optional.ofNullable(out), console);
    return review.fits() ? ExitCode.OK.code() : ExitCode.FINDINGS.code();
  }

  /** The HTML writer, drawing the host when a profile was given and the shape fits on it. */
  private static ReviewHtmlWriter htmlWriter(Optional<HostProfile> profile,
      Optional<WorkerShape> drawn, boolean shapeGiven, ShapeDeriver deriver) {
    if (profile.isEmpty() || drawn.isEmpty()) {
      return new ReviewHtmlWriter();
    }
    try {
      PlanHost host = new PlanHost(profile.get(), deriver.layout(profile.get(), drawn.get()));
      return new ReviewHtmlWriter(Optional.of(host), drawn, shapeGiven);
    } catch (IllegalArgumentException ex) {
      // A shape larger than the host has no layout on it: the page then draws no host.
      return new ReviewHtmlWriter();
    }
  }
}
