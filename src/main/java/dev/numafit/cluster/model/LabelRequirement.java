package dev.numafit.cluster.model;

import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * One label requirement of a selector or of a node-affinity term, as in "Labels and Selectors" and
 * "Assigning Pods to Nodes" (kubernetes.io/docs/concepts/scheduling-eviction/assign-pod-node/):
 * operators {@code In}, {@code NotIn}, {@code Exists}, {@code DoesNotExist}, {@code Gt}, {@code Lt}
 * ({@code Gt}/{@code Lt} compare integers).
 */
public record LabelRequirement(String key, String operator, List<String> values) {
  public LabelRequirement {
    Objects.requireNonNull(key, "key");
    Objects.requireNonNull(operator, "operator");
    values = List.copyOf(values);
  }

  /** {@code key=value}, the requirement {@code matchLabels} stands for. */
  public static LabelRequirement equal(String key, String value) {
    return new LabelRequirement(key, "In", List.of(value));
  }

  /** Whether a label set satisfies this requirement; an unknown operator never matches. */
  public boolean matches(Map<String, String> labels) {
    String v = labels.get(key);
    switch (operator) {
      case "In":
        return v != null && values.contains(v);
      case "NotIn":
        return v == null || !values.contains(v);
      case "Exists":
        return v != null;
      case "DoesNotExist":
        return v == null;
      case "Gt":
      case "Lt":
        if (v == null || values.size() != 1) {
          return false;
        }
        try {
          long have = Long.parseLong(v);
          long want = Long.parseLong(values.get(0));
          return "Gt".equals(operator) ? have > want : have < want;
        } catch (NumberFormatException ex) {
          return false;
        }
      default:
        return false;
    }
  }

  @Override
  public String toString() {
    return switch (operator) {
      case "Exists" -> key;
      case "DoesNotExist" -> "!" + key;
      case "In" -> values.size() == 1 ? key + "=" + values.get(0)
          : key + " in (" + String.join(",", values) + ")";
      case "NotIn" -> key + " notin (" + String.join(",", values) + ")";
      default -> key + " " + operator + " " + String.join(",", values);
    };
  }
}
