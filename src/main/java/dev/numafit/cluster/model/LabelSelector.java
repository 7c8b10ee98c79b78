package dev.numafit.cluster.model;

import java.util.List;
import java.util.Map;

/**
 * A conjunction of label requirements: a PodDisruptionBudget selector ({@code matchLabels} and
 * {@code matchExpressions} together) or one node-selector term of a required node affinity.
 * An empty selector matches everything.
 */
public record LabelSelector(List<LabelRequirement> requirements) {
  /** Matches every label set. */
  public static final LabelSelector EVERYTHING = new LabelSelector(List.of());

  public LabelSelector {
    requirements = List.copyOf(requirements);
  }

  /** Whether every requirement holds for {@code labels}. */
  public boolean matches(Map<String, String> labels) {
    for (LabelRequirement r : requirements) {
      if (!r.matches(labels)) {
        return false;
      }
    }
    return true;
  }

  @Override
  public String toString() {
    return requirements.stream().map(LabelRequirement::toString)
        .collect(java.util.stream.Collectors.joining(","));
  }
}
