package dev.numafit.check;

import dev.numafit.demand.Amounts;
import dev.numafit.demand.ContainerRole;
import dev.numafit.demand.ContainerSpec;
import dev.numafit.demand.Demand;
import dev.numafit.demand.PodArithmetic;
import dev.numafit.demand.PodModel;
import dev.numafit.demand.Workload;
import dev.numafit.demand.WorkloadId;
import dev.numafit.demand.WorkloadSource;
import dev.numafit.diag.SourceRef;
import dev.numafit.fit.SpanningRoom;
import dev.numafit.plan.Plan;
import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * Evaluates every {@link Rule} over one {@link CheckInput}. Pure and deterministic: findings come
 * out sorted by workload, rule and line.
 *
 * <p>A pod is compared with the one-node worker's room as the plan computed it: the kubelet's
 * allocatable (FACTS A4) scaled by {@code --max-utilization}, less DaemonSets and per-worker
 * demand, plus one of the worker's {@code pods}. Equality fits, as in the scheduler's NodeResourcesFit
 * filter (FACTS A7). A DaemonSet's pod is compared with the scaled allocatable itself, since the
 * room already has it subtracted. Only resources with a capacity are compared; the others are the
 * plan's "not checked" list.
 */
public final class CheckEngine {
  private CheckEngine() {}

  /** All findings for the input, sorted. */
  public static List<Finding> run(CheckInput in, CheckOptions options) {
    return run(in, options, Optional.empty());
  }

  /**
   * All findings for the input, sorted.
   *
   * @param baseline the demand before the change, used only to point a capacity finding at the
   *     workload that grew most
   */
  public static List<Finding> run(CheckInput in, CheckOptions options, Optional<Demand> baseline) {
    Plan plan = in.plan();
    SortedSet<String> checked = new TreeSet<>(plan.allocatable().names());
    Resources scaledAllocatable = scaled(plan.allocatable(), checked, in.maxUtilizationPct());
    Resources room = plan.room();
    List<Resources> spanningRooms = new ArrayList<>();
    for (SpanningRoom s : in.spanning()) {
      spanningRooms.add(
          scaled(s.allocatable(), checked, in.maxUtilizationPct())
              .minus(plan.perWorkerDemand())
              .max(Resources.EMPTY));
    }
    List<Finding> out = new ArrayList<>();
    for (Workload w : in.demand().workloads()) {
      Located at = new Located(w, Optional.ofNullable(in.sources().get(w.id())));
      Resources limit = w.perWorker() ? scaledAllocatable : room;
      Resources demand = w.pod().requests().with(Resources.PODS, 1L);
      workerFit(w, at, demand, limit, checked, in.spanning(), spanningRooms, out);
      hostFit(w, at, demand, checked, spanningRooms, out);
      exclusive(w, at, plan.allocatable(), checked, out);
      hugepages(w, at, demand, limit, checked, out);
      missingRequests(w, at, out);
      limitRatio(w, at, options.limitRatio(), out);
    }
    capacity(in, options, baseline, room, checked).ifPresent(out::add);
    out.sort(null);
    return out;
  }

  private static void workerFit(
      Workload w,
      Located at,
      Resources demand,
      Resources limit,
      SortedSet<String> checked,
      List<SpanningRoom> spanning,
      List<Resources> spanningRooms,
      List<Finding> out) {
    TreeMap<String, Long> over = new TreeMap<>();
    List<String> parts = new ArrayList<>();
    for (String r : checked) {
      if (Resources.isHugepages(r)) {
        continue; // hugepages have their own rule
      }
      long excess = demand.get(r) - limit.get(r);
      if (excess > 0) {
        over.put(r, excess);
        parts.add(r + " " + show(r, demand.get(r)) + " is " + show(r, excess) + " over the "
            + show(r, limit.get(r)) + " it leaves");
      }
    }
    if (over.isEmpty()) {
      return;
    }
    String smallest = "no spanning shape was given to compare with";
    if (!spanning.isEmpty()) {
      smallest = "it is larger than a worker spanning the whole host";
      for (int i = 0; i < spanning.size(); i++) {
        if (fits(demand, spanningRooms.get(i), checked)) {
          smallest = "the smallest worker that holds it spans " + spanWords(spanning.get(i).label());
          break;
        }
      }
    }
    String first = over.firstKey();
    out.add(
        Finding.of(
            Rule.POD_EXCEEDS_WORKER,
            Optional.of(w.id()),
            at.largest(first),
            "pod does not fit a one-node worker"
                + (w.perWorker() ? " (DaemonSet pod against the whole allocatable)" : "")
                + ": " + String.join("; ", parts) + "; " + smallest,
            Resources.of(over)));
  }

  private static void hostFit(
      Workload w,
      Located at,
      Resources demand,
      SortedSet<String> checked,
      List<Resources> spanningRooms,
      List<Finding> out) {
    if (spanningRooms.isEmpty()) {
      return;
    }
    Resources widest = spanningRooms.get(spanningRooms.size() - 1);
    TreeMap<String, Long> over = new TreeMap<>();
    List<String> parts = new ArrayList<>();
    for (String r : checked) {
      long excess = demand.get(r) - widest.get(r);
      if (excess > 0) {
        over.put(r, excess);
        parts.add(r + " " + show(r, demand.get(r)) + " is " + show(r, excess) + " over "
            + show(r, widest.get(r)));
      }
    }
    if (over.isEmpty()) {
      return;
    }
    out.add(
        Finding.of(
            Rule.POD_EXCEEDS_HOST,
            Optional.of(w.id()),
            at.largest(over.firstKey()),
            "pod does not fit even a worker spanning the whole host, so it can never run: "
                + String.join("; ", parts),
            Resources.of(over)));
  }

  private static void exclusive(
      Workload w, Located at, Resources allocatable, SortedSet<String> checked, List<Finding> out) {
    long pinned = w.pod().exclusiveCpus();
    if (pinned == 0 || !checked.contains(Resources.CPU)) {
      return;
    }
    long whole = allocatable.get(Resources.CPU) / 1000;
    if (pinned <= whole) {
      return;
    }
    out.add(
        Finding.of(
            Rule.EXCLUSIVE_CPUS_EXCEED_WORKER,
            Optional.of(w.id()),
            at.largest(Resources.CPU),
            "Guaranteed pod pins " + pinned + " whole CPUs under the static CPU manager, "
                + (pinned - whole) + " more than the " + whole
                + " whole CPUs of a one-node worker's allocatable ("
                + show(Resources.CPU, allocatable.get(Resources.CPU)) + ")",
            Resources.of(Resources.CPU, (pinned - whole) * 1000)));
  }

  private static void hugepages(
      Workload w,
      Located at,
      Resources demand,
      Resources limit,
      SortedSet<String> checked,
      List<Finding> out) {
    TreeMap<String, Long> over = new TreeMap<>();
    List<String> parts = new ArrayList<>();
    long withoutCapacity = 0;
    String firstSize = null;
    for (String r : demand.names()) {
      if (!Resources.isHugepages(r)) {
        continue;
      }
      firstSize = firstSize == null ? r : firstSize;
      if (checked.contains(r)) {
        long excess = demand.get(r) - limit.get(r);
        if (excess > 0) {
          over.put(r, excess);
          parts.add(r + " " + show(r, demand.get(r)) + " is " + show(r, excess)
              + " over the " + show(r, limit.get(r)) + " a one-node worker pre-allocates");
        }
      } else {
        withoutCapacity = Math.addExact(withoutCapacity, demand.get(r));
      }
    }
    if (withoutCapacity > 0 && checked.contains(Resources.MEMORY)) {
      // No hugepages capacity given: the pages would be carved out of the worker's memory, which
      // the pod's ordinary memory request needs as well.
      long need = Math.addExact(withoutCapacity, demand.get(Resources.MEMORY));
      long excess = need - limit.get(Resources.MEMORY);
      if (excess > 0) {
        over.put(Resources.MEMORY, excess);
        parts.add("hugepages " + show(Resources.MEMORY, withoutCapacity) + " (no hugepages"
            + " capacity given) plus memory " + show(Resources.MEMORY, demand.get(Resources.MEMORY))
            + " is " + show(Resources.MEMORY, excess) + " over the "
            + show(Resources.MEMORY, limit.get(Resources.MEMORY))
            + " of memory a one-node worker leaves");
      }
    }
    if (over.isEmpty()) {
      return;
    }
    out.add(
        Finding.of(
            Rule.HUGEPAGES_EXCEED_WORKER,
            Optional.of(w.id()),
            at.largest(firstSize),
            String.join("; ", parts),
            Resources.of(over)));
  }

  private static void missingRequests(Workload w, Located at, List<Finding> out) {
    if (at.source.isEmpty()) {
      List<String> missing = new ArrayList<>();
      for (String f : w.pod().flags()) {
        if (f.equals(PodArithmetic.NO_CPU_REQUEST) || f.equals(PodArithmetic.NO_MEMORY_REQUEST)) {
          missing.add(f);
        }
      }
      if (!missing.isEmpty()) {
        out.add(Finding.of(Rule.MISSING_REQUEST, Optional.of(w.id()), w.source(),
            "pod has " + String.join(" and ", missing) + ": sizing counts it as zero",
            Resources.EMPTY));
      }
      return;
    }
    PodModel pod = at.source.get().admitted();
    List<String> parts = new ArrayList<>();
    SourceRef first = null;
    for (ContainerSpec c : longRunning(pod)) {
      List<String> lacking = new ArrayList<>();
      for (String r : List.of(Resources.CPU, Resources.MEMORY)) {
        if (!c.requests().containsKey(r) && !pod.podRequests().containsKey(r)) {
          lacking.add(r);
        }
      }
      if (!lacking.isEmpty()) {
        parts.add("container \"" + c.name() + "\" has no " + String.join(" or ", lacking)
            + " request");
        first = first == null ? at.container(c.name()) : first;
      }
    }
    if (!parts.isEmpty()) {
      out.add(Finding.of(Rule.MISSING_REQUEST, Optional.of(w.id()), first,
          String.join("; ", parts) + ": sizing counts it as zero", Resources.EMPTY));
    }
  }

  private static void limitRatio(
      Workload w, Located at, BigDecimal ratio, List<Finding> out) {
    if (at.source.isEmpty()) {
      return;
    }
    PodModel pod = at.source.get().admitted();
    List<ContainerSpec> all = new ArrayList<>(pod.initContainers());
    all.addAll(pod.containers());
    List<String> parts = new ArrayList<>();
    SourceRef first = null;
    for (ContainerSpec c : all) {
      for (String r : List.of(Resources.CPU, Resources.MEMORY)) {
        BigDecimal limit = c.limits().get(r);
        if (limit == null || limit.signum() == 0) {
          continue;
        }
        BigDecimal request = c.requests().getOrDefault(r, BigDecimal.ZERO);
        if (limit.compareTo(request.multiply(ratio)) <= 0) {
          continue;
        }
        String times = request.signum() == 0 ? "with a zero request"
            : limit.divide(request, 1, RoundingMode.HALF_UP).stripTrailingZeros().toPlainString()
                + "× its request " + Amounts.format(r, request);
        parts.add("container \"" + c.name() + "\" " + r + " limit "
            + Amounts.format(r, limit) + " is " + times);
        first = first == null ? at.container(c.name()) : first;
      }
    }
    if (!parts.isEmpty()) {
      out.add(Finding.of(Rule.LIMIT_REQUEST_RATIO, Optional.of(w.id()), first,
          String.join("; ", parts) + " (above " + ratio.stripTrailingZeros().toPlainString()
              + "×)", Resources.EMPTY));
    }
  }

  private static Optional<Finding> capacity(
      CheckInput in,
      CheckOptions options,
      Optional<Demand> baseline,
      Resources room,
      SortedSet<String> checked) {
    Plan plan = in.plan();
    if (options.fleetHosts().isEmpty() || plan.hostsNeeded().isEmpty()) {
      return Optional.empty();
    }
    int fleet = options.fleetHosts().getAsInt();
    int hosts = plan.hostsNeeded().getAsInt();
    if (hosts <= fleet) {
      return Optional.empty();
    }
    // Point at the replica count of the workload that adds most to the packing: the one that grew
    // most against the baseline, else the largest.
    Map<WorkloadId, Double> before = new TreeMap<>();
    baseline.ifPresent(d -> d.workloads().forEach(w -> before.put(w.id(), weight(w, room, checked))));
    Workload top = null;
    double best = 0;
    for (Workload w : in.demand().workloads()) {
      if (w.perWorker()) {
        continue;
      }
      double grew = weight(w, room, checked) - before.getOrDefault(w.id(), 0.0);
      if (top == null || grew > best) {
        top = w;
        best = grew;
      }
    }
    SourceRef at = new SourceRef("(fleet)", 0);
    Optional<WorkloadId> topId = Optional.empty();
    if (top != null) {
      WorkloadSource src = in.sources().get(top.id());
      at = src == null ? top.source() : src.replicas().orElse(top.source());
      topId = Optional.of(top.id());
    }
    String perHost = "";
    if (plan.workersPerHost().isPresent()) {
      int per = plan.workersPerHost().getAsInt();
      int forWorkers = plan.workersNeeded() == 0 ? 0 : (plan.workersNeeded() - 1) / per + 1;
      int headroom = hosts - forWorkers;
      perHost = " (" + plan.workersNeeded() + " workers at " + per + " per host"
          + (headroom > 0 ? ", plus " + headroom + " for host failures" : "") + ")";
    }
    return Optional.of(
        Finding.of(
            Rule.FLEET_CAPACITY,
            Optional.empty(),
            at,
            "the workload at peak needs " + hosts + " hosts" + perHost + " but the fleet has "
                + fleet + topId.map(id -> "; the largest addition is " + id).orElse(""),
            Resources.of("hosts", (long) (hosts - fleet))));
  }

  /** Peak pods × the largest share of a worker's room one pod takes. */
  private static double weight(Workload w, Resources room, SortedSet<String> checked) {
    double share = 0;
    Resources demand = w.pod().requests().with(Resources.PODS, 1L);
    for (String r : checked) {
      long cap = room.get(r);
      if (cap > 0) {
        share = Math.max(share, (double) demand.get(r) / cap);
      }
    }
    return share * w.replicas().peak();
  }

  /** {@code 2-nodes} → {@code two NUMA nodes}, and so on; other labels as they are. */
  static String spanWords(String label) {
    return switch (label) {
      case "2-nodes" -> "two NUMA nodes";
      case "socket" -> "a whole socket";
      case "host" -> "the whole host";
      default -> label;
    };
  }

  private static boolean fits(Resources demand, Resources room, SortedSet<String> checked) {
    for (String r : checked) {
      if (demand.get(r) > room.get(r)) {
        return false;
      }
    }
    return true;
  }

  private static List<ContainerSpec> longRunning(PodModel pod) {
    List<ContainerSpec> out = new ArrayList<>();
    for (ContainerSpec c : pod.initContainers()) {
      if (c.role() == ContainerRole.SIDECAR) {
        out.add(c);
      }
    }
    out.addAll(pod.containers());
    return out;
  }

  /** Allocatable scaled by max-utilization, over the checked resources; pods are a count. */
  static Resources scaled(Resources allocatable, SortedSet<String> checked, int pct) {
    TreeMap<String, Long> out = new TreeMap<>();
    for (String r : checked) {
      long a = allocatable.get(r);
      out.put(r, r.equals(Resources.PODS) || pct == 100 ? a
          : BigDecimal.valueOf(a).multiply(BigDecimal.valueOf(pct))
              .divide(BigDecimal.valueOf(100), 0, RoundingMode.FLOOR).longValueExact());
    }
    return Resources.of(out);
  }

  private static final String[] BINARY = {"B", "KiB", "MiB", "GiB", "TiB", "PiB", "EiB"};

  /**
   * An integer amount for a message: cpu from millicores as cores or {@code 2500m}; bytes in the
   * largest binary unit, two decimals at most ({@code 15.5GiB}); counts as they are.
   */
  static String show(String resource, long amount) {
    if (resource.equals(Resources.CPU)) {
      return amount % 1000 == 0 ? Long.toString(amount / 1000) : amount + "m";
    }
    boolean bytes = resource.equals(Resources.MEMORY)
        || resource.equals(Resources.EPHEMERAL_STORAGE) || Resources.isHugepages(resource);
    if (!bytes || amount < 1024) {
      return bytes ? amount + "B" : Long.toString(amount);
    }
    int unit = 0;
    long scale = 1;
    while (unit < BINARY.length - 1 && amount / scale >= 1024) {
      scale *= 1024;
      unit++;
    }
    return BigDecimal.valueOf(amount).divide(BigDecimal.valueOf(scale), 2, RoundingMode.HALF_UP)
        .stripTrailingZeros().toPlainString() + BINARY[unit];
  }

  /** A workload and where its parts are written. */
  private static final class Located {
    final Workload workload;
    final Optional<WorkloadSource> source;

    Located(Workload workload, Optional<WorkloadSource> source) {
      this.workload = workload;
      this.source = source;
    }

    /** The line of the container requesting most of {@code resource}, else the template's. */
    SourceRef largest(String resource) {
      if (source.isEmpty()) {
        return workload.source();
      }
      PodModel pod = source.get().admitted();
      List<ContainerSpec> all = new ArrayList<>(pod.initContainers());
      all.addAll(pod.containers());
      ContainerSpec top = null;
      for (ContainerSpec c : all) {
        BigDecimal v = resource == null ? null : c.requests().get(resource);
        if (v != null && v.signum() > 0
            && (top == null || v.compareTo(top.requests().get(resource)) > 0)) {
          top = c;
        }
      }
      return top == null ? source.get().podTemplate() : source.get().container(top.name());
    }

    SourceRef container(String name) {
      return source.map(s -> s.container(name)).orElse(workload.source());
    }
  }
}
