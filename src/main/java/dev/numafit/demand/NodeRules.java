package dev.numafit.demand;

import java.util.List;

/**
 * What a pod declares about the nodes it may run on, besides its nodeSelector (kept in {@link
 * PlacementRules#nodeSelector}): the terms of its required node affinity and its tolerations.
 *
 * @param required the {@code requiredDuringSchedulingIgnoredDuringExecution} node-selector terms
 *     (ORed); empty when the pod has no required node affinity
 * @param tolerations the pod's tolerations in the order written
 */
public record NodeRules(List<NodeTerm> required, List<Toleration> tolerations) {
  /** No required node affinity, no tolerations. */
  public static final NodeRules NONE = new NodeRules(List.of(), List.of());

  public NodeRules {
    required = List.copyOf(required);
    tolerations = List.copyOf(tolerations);
  }

  /** Whether the pod tolerates {@code taint}. */
  public boolean tolerates(Taint taint) {
    return tolerations.stream().anyMatch(t -> t.tolerates(taint));
  }
}
