package dev.numafit.plan;

import dev.numafit.demand.Demand;
import dev.numafit.demand.Workload;
import dev.numafit.diag.Diagnostic;
import dev.numafit.fit.OversizeCheck;
import dev.numafit.fit.SpanningRoom;
import dev.numafit.demand.PlacementRules;
import dev.numafit.pack.ExactPacker;
import dev.numafit.pack.LowerBound;
import dev.numafit.pack.Packing;
import dev.numafit.pack.Progress;
import dev.numafit.pack.RulePacker;
import dev.numafit.pack.VectorPacker;
import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.SortedMap;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * Turns a demand and a worker shape into a {@link Plan}: how many workers and hosts, which pods
 * are too big, how full the workers are and which resource runs out first.
 *
 * <p>The rules, in order:
 *
 * <ol>
 *   <li>DaemonSet pods (one of each, each taking one of the worker's {@code pods}) and {@code
 *       --per-worker} demand are on every worker.
 *   <li>The room on each worker for other pods is {@code floor(allocatable × maxUtilization / 100)
 *       − per-worker demand}, per resource. The percentage applies to the allocatable amount, not
 *       to what is left after DaemonSets, and not to {@code pods}: maxPods is a count the kubelet
 *       enforces, not a load that needs headroom.
 *   <li>Every other workload runs {@code ceil(peak × growth)} pods, each asking its effective
 *       requests plus one {@code pods}.
 *   <li>Pods that do not fit the room are reported as oversize ({@link OversizeCheck}) and not
 *       packed; resources with no capacity are reported as unchecked.
 *   <li>The rest are packed ({@link VectorPacker}) over every resource that has a capacity; the
 *       lower bound ({@link dev.numafit.pack.LowerBound}) says how close the packing is.
 *   <li>Workloads with placement rules (required anti-affinity and DoNotSchedule spread on their
 *       own pods, over workers, hosts or zones, see {@link RuleMapping}) are packed by {@link
 *       RulePacker}, which decides the host of every worker too; otherwise hosts = {@code
 *       ceil(workers / workersPerHost)}.
 *   <li>With {@code --host-failures K} or a zone failure, hosts = the smallest count that
 *       survives the worst case ({@link RulePacker#hostsToSurvive}); the count without failures is
 *       kept beside it.
 *   <li>Utilization per resource = (packed requests + per-worker demand × workers) / (allocatable
 *       × workers), 4 decimals; the binding resource has the highest.
 * </ol>
 *
 * <p>With an {@link ExactPacker} (the exact mode, {@code plan --exact}), the packing of step 5 is
 * handed to it to find fewer workers and prove the minimum; the plan then carries an {@link
 * ExactSearch}. The exact mode covers rule-free inputs of at most {@link #EXACT_MAX_PODS} pods to
 * pack and refuses others ({@link ExactRefused}).
 *
 * <p>Pure and deterministic: the same demand and input give the same plan.
 */
public final class Planner {
  /**
   * The most pods (after DaemonSets and oversize pods are taken out) the exact mode accepts. The
   * search proves small inputs; beyond a few hundred pods it rarely finishes, so a larger input
   * is refused rather than left running. A larger node limit does not raise this.
   */
  public static final int EXACT_MAX_PODS = 500;

  private final VectorPacker packer;
  private final Optional<ExactPacker> exact;

  /** A planner with the default packer. */
  public Planner() {
    this(new VectorPacker());
  }

  /** A planner with the given packer (for a different step budget). */
  public Planner(VectorPacker packer) {
    this.packer = packer;
    this.exact = Optional.empty();
  }

  /**
   * A planner in the exact mode: {@code packer}'s packing is the starting point of {@code
   * exact}'s search.
   */
  public Planner(VectorPacker packer, ExactPacker exact) {
    this.packer = packer;
    this.exact = Optional.of(exact);
  }

  /** Plans the demand onto the input's worker shape. */
  public Plan plan(Demand demand, PlanInput in) {
    return plan(demand, in, Progress.NONE);
  }

  /**
   * {@link #plan(Demand, PlanInput)}, telling {@code progress} how far the long steps have come:
   * packing more than {@link Progress#PACK_REPORT_ABOVE} pods (when it starts and ends) and each
   * set of failed hosts the failure-headroom check tries. The plan is the same whatever is passed.
   */
  public Plan plan(Demand demand, PlanInput in, Progress progress) {
    List<Diagnostic> warnings = new ArrayList<>(in.warnings());
    List<String> notes = new ArrayList<>(in.notes());
    Resources allocatable = in.allocatable();
    SortedSet<String> checked = new TreeSet<>(allocatable.names());

    // Sorted by printed id, each id printed once (WorkloadId compares by its printed form).
    TreeMap<String, Workload> byId = new TreeMap<>();
    for (Workload w : demand.workloads()) {
      byId.put(w.id().toString(), w);
    }
    List<Workload> workloads = new ArrayList<>(byId.values());

    Resources perWorker = in.perWorkerExtra();
    for (Workload w : workloads) {
      if (w.perWorker()) {
        perWorker = perWorker.plus(w.pod().requests().with(Resources.PODS, 1L));
      }
    }

    Resources room = roomOf(allocatable, checked, perWorker, in.maxUtilizationPct());
    for (String r : checked) {
      long scaled = scaled(r, allocatable.get(r), in.maxUtilizationPct());
      if (perWorker.get(r) > scaled) {
        warnings.add(
            Diagnostic.warning(
                null,
                "per-worker demand (DaemonSets and --per-worker) needs "
                    + perWorker.get(r)
                    + " of "
                    + r
                    + " but a worker has "
                    + scaled
                    + ": no other pod fits"));
      }
    }
    List<OversizeCheck.Option> options = new ArrayList<>();
    for (SpanningRoom s : in.spanning()) {
      options.add(
          new OversizeCheck.Option(
              s.label(), roomOf(s.allocatable(), checked, perWorker, in.maxUtilizationPct())));
    }

    // Replica counts at peak × growth; workloads that run no pods take no part.
    List<Workload> running = new ArrayList<>();
    List<Integer> replicas = new ArrayList<>();
    List<OversizeCheck.PodRequest> requests = new ArrayList<>();
    for (Workload w : workloads) {
      if (w.perWorker()) {
        continue;
      }
      int count = scaleReplicas(w.replicas().peak(), in.growth());
      if (count == 0) {
        continue;
      }
      running.add(w);
      replicas.add(count);
      requests.add(
          new OversizeCheck.PodRequest(w.id(), w.pod().requests(), w.pod().exclusiveCpus()));
    }
    OversizeCheck.Result fit = OversizeCheck.check(requests, checked, room, options);
    SortedSet<String> unchecked = new TreeSet<>(fit.unchecked());
    for (String r : perWorker.names()) {
      if (!checked.contains(r)) {
        unchecked.add(r);
      }
    }
    fit.exclusiveCpus()
        .forEach(
            (id, cpus) ->
                notes.add(id + " pins " + cpus + " whole CPUs per pod (static CPU manager)"));

    // Items: one row per pod that fits, over the checked resources in name order.
    String[] dims = checked.toArray(new String[0]);
    long[] capacity = new long[dims.length];
    for (int k = 0; k < dims.length; k++) {
      capacity[k] = room.get(dims[k]);
    }
    TreeSet<String> oversizeIds = new TreeSet<>();
    fit.oversize().forEach(o -> oversizeIds.add(o.workload().toString()));
    List<long[]> rows = new ArrayList<>();
    List<String> podIds = new ArrayList<>();
    List<RulePacker.Group> groups = new ArrayList<>();
    List<Workload> grouped = new ArrayList<>();
    PlacementOptions po = in.placementOptions();
    for (int i = 0; i < running.size(); i++) {
      Workload w = running.get(i);
      if (oversizeIds.contains(w.id().toString())) {
        continue;
      }
      Resources pod = w.pod().requests().with(Resources.PODS, 1L);
      long[] row = new long[dims.length];
      for (int k = 0; k < dims.length; k++) {
        row[k] = pod.get(dims[k]);
      }
      for (int r = 0; r < replicas.get(i); r++) {
        rows.add(row);
        if (in.placement()) {
          podIds.add(w.id() + "#" + r);
        }
      }
      groups.add(RuleMapping.group(w, row, replicas.get(i), po, notes));
      grouped.add(w);
    }
    long[][] items = rows.toArray(new long[0][]);
    boolean ruled = groups.stream().anyMatch(RulePacker.Group::ruled);
    boolean failures = in.hostFailures() > 0 || po.zoneFailures() > 0;
    int perHost = in.workersPerHost().orElse(1);
    if (ruled && in.workersPerHost().isEmpty()) {
      notes.add("no host profile: each worker counts as its own host for rules on "
          + PlacementRules.HOST_KEY);
    }
    RulePacker.Topology topo = new RulePacker.Topology(perHost, po.zones());
    if (exact.isPresent()) {
      refuseExact(ruled, groups, grouped, items.length);
    }
    Optional<ExactSearch> exactSearch = Optional.empty();
    int workers;
    int lowerBound;
    int[] binOfItem;
    RulePacker.Result layout = null;
    boolean large = items.length > Progress.PACK_REPORT_ABOVE;
    if (large) {
      progress.update(Progress.Phase.PACK, 0, items.length);
    }
    if (ruled) {
      List<RulePacker.Group> packed = new ArrayList<>(groups);
      layout = RulePacker.pack(packed, capacity, topo);
      binOfItem = layout.binOfItem();
      workers = layout.bins();
      List<Integer> unplaced = layout.unplaced();
      if (!unplaced.isEmpty()) {
        TreeMap<String, Integer> byWorkload = new TreeMap<>();
        int[] groupOf = new int[items.length];
        for (int g = 0, i = 0; g < groups.size(); g++) {
          for (int j = 0; j < groups.get(g).count(); j++) {
            groupOf[i++] = g;
          }
        }
        for (int item : unplaced) {
          byWorkload.merge(grouped.get(groupOf[item]).id().toString(), 1, Integer::sum);
        }
        byWorkload.forEach(
            (id, n) ->
                warnings.add(
                    Diagnostic.warning(
                        null,
                        id + ": " + n + " pod(s) cannot be placed under its anti-affinity or"
                            + " spread rules (not packed)")));
      }
      List<long[]> placedRows = new ArrayList<>();
      for (int i = 0; i < items.length; i++) {
        if (binOfItem[i] >= 0) {
          placedRows.add(items[i]);
        }
      }
      int bound = LowerBound.of(placedRows.toArray(new long[0][]), capacity);
      // Pods that may not share a worker each need their own.
      for (int g = 0; g < groups.size(); g++) {
        if (groups.get(g).antiAffinity().contains(RulePacker.Domain.WORKER)) {
          bound = Math.max(bound, groups.get(g).count());
        }
      }
      lowerBound = Math.min(bound, workers);
    } else {
      Packing packing = packer.pack(items, capacity, progress);
      if (exact.isPresent()) {
        ExactPacker.Result r = exact.get().improve(items, capacity, packing, progress);
        packing = r.packing();
        exactSearch = Optional.of(new ExactSearch(r.provedOptimal(), r.nodes(), r.lowerBound()));
      }
      workers = packing.bins();
      lowerBound = packing.lowerBound();
      binOfItem = packing.binOfItem();
      if (failures && in.workersPerHost().isPresent()) {
        layout = RulePacker.fromPacking(binOfItem, workers, topo);
      }
    }

    if (large) {
      progress.update(Progress.Phase.PACK, items.length, items.length);
    }

    OptionalInt hosts = OptionalInt.empty();
    OptionalInt hostsWithoutFailures = OptionalInt.empty();
    if (in.workersPerHost().isPresent()) {
      int plain =
          ruled ? layout.hosts() : ceilDiv(workers, in.workersPerHost().getAsInt());
      hosts = OptionalInt.of(plain);
      if (failures) {
        int extra = in.hostFailures() + 2
            + (po.zoneFailures() > 0 ? plain / (po.zones() - 1) + po.zones() : 0);
        RulePacker.FailureResult fr =
            RulePacker.hostsToSurvive(
                groups, capacity, topo, layout, in.hostFailures(), po.zoneFailures() > 0, extra,
                progress);
        hosts = OptionalInt.of(fr.hosts());
        hostsWithoutFailures = OptionalInt.of(plain);
        if (!fr.survives()) {
          warnings.add(
              Diagnostic.warning(
                  null,
                  "no host count up to " + fr.hosts() + " survives the failures asked for under"
                      + " the placement rules; " + fr.hosts() + " is reported"));
        }
        if (!fr.exhaustive()) {
          notes.add("too many sets of " + in.hostFailures() + " hosts to check each: the hosts"
              + " carrying the most demand were taken as the worst case");
        }
      }
    }

    // Utilization over all workers: packed requests plus what every worker carries anyway.
    long[] packed = new long[dims.length];
    for (int i = 0; i < items.length; i++) {
      if (binOfItem[i] < 0) {
        continue;
      }
      for (int k = 0; k < dims.length; k++) {
        packed[k] = Math.addExact(packed[k], items[i][k]);
      }
    }
    SortedMap<String, BigDecimal> exact = new TreeMap<>();
    SortedMap<String, Double> utilization = new TreeMap<>();
    for (int k = 0; k < dims.length; k++) {
      BigDecimal used =
          BigDecimal.valueOf(packed[k])
              .add(BigDecimal.valueOf(perWorker.get(dims[k])).multiply(BigDecimal.valueOf(workers)));
      BigDecimal total =
          BigDecimal.valueOf(allocatable.get(dims[k])).multiply(BigDecimal.valueOf(workers));
      BigDecimal u =
          total.signum() == 0 ? BigDecimal.ZERO : used.divide(total, 12, RoundingMode.HALF_UP);
      exact.put(dims[k], u);
      utilization.put(dims[k], u.setScale(4, RoundingMode.HALF_UP).doubleValue());
    }
    String binding = "none";
    BigDecimal highest = BigDecimal.ZERO;
    for (var e : exact.entrySet()) {
      if (e.getValue().compareTo(highest) > 0) {
        highest = e.getValue();
        binding = e.getKey();
      }
    }
    if (!binding.equals("none")) {
      String other = binding.equals(Resources.CPU) ? Resources.MEMORY : Resources.CPU;
      if (exact.containsKey(other)) {
        BigDecimal pct =
            exact.get(other).multiply(BigDecimal.valueOf(100)).divide(highest, 0, RoundingMode.HALF_UP);
        notes.add(binding + " runs out at " + pct.toPlainString() + "% of " + other);
      }
    }

    Optional<List<WorkerPlacement>> placement = Optional.empty();
    if (in.placement()) {
      List<List<String>> byWorker = new ArrayList<>();
      for (int b = 0; b < workers; b++) {
        byWorker.add(new ArrayList<>());
      }
      for (int i = 0; i < items.length; i++) {
        if (binOfItem[i] >= 0) {
          byWorker.get(binOfItem[i]).add(podIds.get(i));
        }
      }
      int width = Math.max(3, Integer.toString(workers).length());
      List<WorkerPlacement> list = new ArrayList<>();
      for (int b = 0; b < workers; b++) {
        list.add(new WorkerPlacement(workerName(b + 1, width), byWorker.get(b)));
      }
      placement = Optional.of(list);
    }

    return new Plan(
        in.hostProfile(),
        in.worker(),
        allocatable,
        perWorker,
        room,
        in.workersPerHost(),
        workers,
        lowerBound,
        hosts,
        fit.oversize(),
        utilization,
        binding,
        placement,
        List.copyOf(unchecked),
        notes,
        warnings,
        hostsWithoutFailures,
        exactSearch);
  }

  /**
   * Refuses the exact mode where it would not prove what it says: the search keeps no placement
   * rule, and past {@link #EXACT_MAX_PODS} pods it would only run out of nodes.
   */
  private static void refuseExact(
      boolean ruled, List<RulePacker.Group> groups, List<Workload> grouped, int pods) {
    if (ruled) {
      List<String> ids = new ArrayList<>();
      for (int g = 0; g < groups.size(); g++) {
        if (groups.get(g).ruled()) {
          ids.add(grouped.get(g).id().toString());
        }
      }
      String shown = ids.size() <= 3 ? String.join(", ", ids)
          : String.join(", ", ids.subList(0, 3)) + " and " + (ids.size() - 3) + " more";
      throw new ExactRefused("--exact covers rule-free inputs only, but " + shown
          + (ids.size() == 1 ? " carries" : " carry") + " required anti-affinity or"
          + " DoNotSchedule spread rules (or --spread-replicas-across adds them): plan without"
          + " --exact");
    }
    if (pods > EXACT_MAX_PODS) {
      throw new ExactRefused("--exact covers at most " + EXACT_MAX_PODS + " pods to pack, this"
          + " input has " + pods + " (--effort does not raise this limit): plan without --exact");
    }
  }

  /** {@code worker-001}: numbered from 1, zero-padded so names sort in number order. */
  static String workerName(int number, int width) {
    String digits = Integer.toString(number);
    return "worker-" + "0".repeat(Math.max(0, width - digits.length())) + digits;
  }

  /** ceil(peak × growth). */
  static int scaleReplicas(int peak, BigDecimal growth) {
    return new BigDecimal(peak).multiply(growth).setScale(0, RoundingMode.CEILING).intValueExact();
  }

  /** The share of an allocatable amount that may be used; {@code pods} is a count, not scaled. */
  static long scaled(String resource, long amount, int pct) {
    if (resource.equals(Resources.PODS) || pct == 100) {
      return amount;
    }
    return BigDecimal.valueOf(amount)
        .multiply(BigDecimal.valueOf(pct))
        .divide(BigDecimal.valueOf(100), 0, RoundingMode.FLOOR)
        .longValueExact();
  }

  private static Resources roomOf(
      Resources allocatable, SortedSet<String> checked, Resources perWorker, int pct) {
    TreeMap<String, Long> room = new TreeMap<>();
    for (String r : checked) {
      room.put(r, Math.max(0, scaled(r, allocatable.get(r), pct) - perWorker.get(r)));
    }
    return Resources.of(room);
  }

  private static int ceilDiv(int a, int b) {
    return a == 0 ? 0 : (a - 1) / b + 1;
  }
}
