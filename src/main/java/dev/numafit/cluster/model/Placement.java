package dev.numafit.cluster.model;

import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * Where a pod may be scheduled, in the simple form numafit checks: {@code spec.nodeSelector},
 * the required node affinity ({@code requiredDuringSchedulingIgnoredDuringExecution}: its terms
 * are ORed, the requirements of a term ANDed, "Assigning Pods to Nodes") and the tolerations.
 * Preferred affinities, pod (anti-)affinity and topology spread are not modelled.
 *
 * @param requiredTerms node-selector terms; empty means no required affinity
 */
public record Placement(
    SortedMap<String, String> nodeSelector,
    List<LabelSelector> requiredTerms,
    List<Toleration> tolerations) {
  /** No constraint and no toleration. */
  public static final Placement NONE = new Placement(new TreeMap<>(), List.of(), List.of());

  public Placement {
    nodeSelector = Collections.unmodifiableSortedMap(new TreeMap<>(nodeSelector));
    requiredTerms = List.copyOf(requiredTerms);
    tolerations = List.copyOf(tolerations);
  }

  /** Whether a node with these labels satisfies the node selector and the required affinity. */
  public boolean allowsLabels(Map<String, String> labels) {
    if (nodeSelector.isEmpty() && requiredTerms.isEmpty()) {
      return true;
    }
    for (Map.Entry<String, String> e : nodeSelector.entrySet()) {
      if (!e.getValue().equals(labels.get(e.getKey()))) {
        return false;
      }
    }
    if (requiredTerms.isEmpty()) {
      return true;
    }
    for (LabelSelector term : requiredTerms) {
      if (term.matches(labels)) {
        return true;
      }
    }
    return false;
  }

  /** The first taint (in the node's order) that blocks scheduling and no toleration tolerates. */
  public Optional<Taint> untolerated(List<Taint> taints) {
    if (taints.isEmpty()) {
      return Optional.empty();
    }
    for (Taint t : taints) {
      if (!t.blocksScheduling()) {
        continue;
      }
      boolean ok = false;
      for (Toleration tol : tolerations) {
        if (tol.tolerates(t)) {
          ok = true;
          break;
        }
      }
      if (!ok) {
        return Optional.of(t);
      }
    }
    return Optional.empty();
  }
}
