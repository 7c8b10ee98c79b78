package dev.numafit.demand;

import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.SortedMap;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * The scheduling rules a workload's pods declare about where they may run relative to each
 * other, as far as they constrain a sizing plan: required pod anti-affinity against the
 * workload's own pods and topology spread constraints whose selector matches the workload's own
 * pods. Rules that select other workloads' pods are not modelled; they are listed in {@link
 * #notModelled} so the report can say so.
 *
 * <p>Topology keys are kept as written ({@code kubernetes.io/hostname}, {@code
 * topology.kubernetes.io/zone}, {@link #HOST_KEY}); the packer maps them to its domains.
 *
 * @param antiAffinityKeys topology keys of required anti-affinity to the workload's own pods:
 *     at most one of its pods per domain of each key
 * @param spread topology spread constraints against the workload's own pods, sorted by key
 * @param nodeSelector the pod's nodeSelector labels (kept for reporting)
 * @param notModelled human-readable notes about rules read but not enforced
 * @param node required node affinity and tolerations, checked against worker pools ({@link
 *     NodeFit})
 */
public record PlacementRules(
    SortedSet<String> antiAffinityKeys,
    List<Spread> spread,
    SortedMap<String, String> nodeSelector,
    List<String> notModelled,
    NodeRules node) {

  /**
   * The label of our own naming that every worker carries to name the physical host it runs on,
   * so that rules can spread replicas across hosts, not only across workers.
   */
  public static final String HOST_KEY = "numafit.dev/host";

  /** The well-known label naming a worker (one domain per worker). */
  public static final String HOSTNAME_KEY = "kubernetes.io/hostname";

  /** The well-known zone label. */
  public static final String ZONE_KEY = "topology.kubernetes.io/zone";

  /** No rules. */
  public static final PlacementRules NONE =
      new PlacementRules(new TreeSet<>(), List.of(), new TreeMap<>(), List.of(), NodeRules.NONE);

  public PlacementRules {
    Objects.requireNonNull(node, "node");
    antiAffinityKeys = Collections.unmodifiableSortedSet(new TreeSet<>(antiAffinityKeys));
    spread = spread.stream().sorted().toList();
    nodeSelector = Collections.unmodifiableSortedMap(new TreeMap<>(nodeSelector));
    notModelled = List.copyOf(notModelled);
  }

  /** Rules without required node affinity or tolerations. */
  public PlacementRules(
      SortedSet<String> antiAffinityKeys,
      List<Spread> spread,
      SortedMap<String, String> nodeSelector,
      List<String> notModelled) {
    this(antiAffinityKeys, spread, nodeSelector, notModelled, NodeRules.NONE);
  }

  /** Whether any rule constrains where pods go relative to each other. */
  public boolean constrains() {
    return !antiAffinityKeys.isEmpty() || spread.stream().anyMatch(Spread::hard);
  }

  /** These rules plus required anti-affinity on {@code key}. */
  public PlacementRules withAntiAffinity(String key) {
    TreeSet<String> keys = new TreeSet<>(antiAffinityKeys);
    keys.add(key);
    return new PlacementRules(keys, spread, nodeSelector, notModelled, node);
  }

  /** These rules with other node rules. */
  public PlacementRules withNode(NodeRules newNode) {
    return new PlacementRules(antiAffinityKeys, spread, nodeSelector, notModelled, newNode);
  }

  /**
   * One topology spread constraint against the workload's own pods.
   *
   * @param topologyKey the node label whose values are the domains
   * @param maxSkew at least 1: the most the pod count of two domains may differ
   * @param hard true for {@code whenUnsatisfiable: DoNotSchedule} (enforced), false for {@code
   *     ScheduleAnyway} (reported only)
   */
  public record Spread(String topologyKey, int maxSkew, boolean hard)
      implements Comparable<Spread> {
    public Spread {
      Objects.requireNonNull(topologyKey, "topologyKey");
      if (maxSkew < 1) {
        throw new IllegalArgumentException("maxSkew must be >= 1, was " + maxSkew);
      }
    }

    @Override
    public int compareTo(Spread o) {
      int c = topologyKey.compareTo(o.topologyKey);
      if (c != 0) {
        return c;
      }
      c = Integer.compare(maxSkew, o.maxSkew);
      return c != 0 ? c : Boolean.compare(hard, o.hard);
    }
  }
}
