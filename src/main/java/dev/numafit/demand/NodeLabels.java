package dev.numafit.demand;

import java.util.Collections;
import java.util.SortedMap;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;

/**
 * The labels every worker of a pool carries, as far as a plan knows them.
 *
 * <p>Some labels are on every worker with a value that differs from worker to worker or that the
 * plan does not choose ({@code kubernetes.io/hostname}, the zone, {@link PlacementRules#HOST_KEY});
 * these are {@link #open} keys: a requirement that the label exist holds, one that it not exist
 * fails, and a requirement on its value is assumed to hold (some worker may carry that value) and
 * reported as an assumption.
 *
 * @param fixed labels with the same value on every worker of the pool
 * @param open keys every worker carries with a value the plan does not fix; never also in {@code
 *     fixed}
 */
public record NodeLabels(SortedMap<String, String> fixed, SortedSet<String> open) {
  /** The label the kubelet sets to the node's operating system ("Well-Known Labels"). */
  public static final String OS_KEY = "kubernetes.io/os";

  /** The label the kubelet sets to the node's CPU architecture ("Well-Known Labels"). */
  public static final String ARCH_KEY = "kubernetes.io/arch";

  public NodeLabels {
    fixed = Collections.unmodifiableSortedMap(new TreeMap<>(fixed));
    TreeSet<String> o = new TreeSet<>(open);
    o.removeAll(fixed.keySet());
    open = Collections.unmodifiableSortedSet(o);
  }

  /**
   * The labels of a pool's workers: {@code kubernetes.io/os=linux} (workers are Linux VMs) and
   * the pool's own labels, which win; the hostname, zone, host and (unless the pool sets it)
   * architecture labels are open.
   */
  public static NodeLabels ofPool(SortedMap<String, String> poolLabels) {
    TreeMap<String, String> fixed = new TreeMap<>();
    fixed.put(OS_KEY, "linux");
    fixed.putAll(poolLabels);
    TreeSet<String> open = new TreeSet<>();
    open.add(PlacementRules.HOSTNAME_KEY);
    open.add(PlacementRules.ZONE_KEY);
    open.add(PlacementRules.HOST_KEY);
    open.add(ARCH_KEY);
    return new NodeLabels(fixed, open);
  }
}
