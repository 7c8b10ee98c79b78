package dev.numafit.demand;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * One requirement of a required node-affinity term ({@code matchExpressions} of a
 * nodeSelectorTerm), with the operators of "Assigning Pods to Nodes"
 * (kubernetes.io/docs/concepts/scheduling-eviction/assign-pod-node/): {@code In}, {@code NotIn},
 * {@code Exists}, {@code DoesNotExist}, {@code Gt}, {@code Lt}. {@code Gt} and {@code Lt} compare
 * the label's value and the single given value as integers; a value that is not an integer never
 * matches.
 *
 * @param key the node label key
 * @param operator how the label is compared
 * @param values the values to compare with; empty for {@code Exists} and {@code DoesNotExist}
 */
public record LabelExpression(String key, Operator operator, List<String> values) {
  /** The operators of a node selector requirement. */
  public enum Operator {
    IN("In"),
    NOT_IN("NotIn"),
    EXISTS("Exists"),
    DOES_NOT_EXIST("DoesNotExist"),
    GT("Gt"),
    LT("Lt");

    private final String apiName;

    Operator(String apiName) {
      this.apiName = apiName;
    }

    /** The name used in the Kubernetes API. */
    public String apiName() {
      return apiName;
    }

    /** The operator with this API name, if any. */
    public static Optional<Operator> of(String apiName) {
      for (Operator o : values()) {
        if (o.apiName.equals(apiName)) {
          return Optional.of(o);
        }
      }
      return Optional.empty();
    }
  }

  public LabelExpression {
    Objects.requireNonNull(key, "key");
    Objects.requireNonNull(operator, "operator");
    values = List.copyOf(values);
  }

  /** {@code key=value}, the requirement a nodeSelector entry stands for. */
  public static LabelExpression equal(String key, String value) {
    return new LabelExpression(key, Operator.IN, List.of(value));
  }

  /**
   * Whether a node with these labels satisfies the requirement. {@code NotIn} and {@code
   * DoesNotExist} hold when the label is absent; {@code In}, {@code Exists}, {@code Gt} and {@code
   * Lt} need it.
   */
  public boolean matches(java.util.Map<String, String> labels) {
    String have = labels.get(key);
    return switch (operator) {
      case IN -> have != null && values.contains(have);
      case NOT_IN -> have == null || !values.contains(have);
      case EXISTS -> have != null;
      case DOES_NOT_EXIST -> have == null;
      case GT, LT -> compare(have);
    };
  }

  private boolean compare(String have) {
    if (have == null || values.size() != 1) {
      return false;
    }
    try {
      long h = Long.parseLong(have.trim());
      long w = Long.parseLong(values.get(0).trim());
      return operator == Operator.GT ? h > w : h < w;
    } catch (NumberFormatException ex) {
      return false;
    }
  }

  @Override
  public String toString() {
    return switch (operator) {
      case EXISTS -> key + " exists";
      case DOES_NOT_EXIST -> key + " does not exist";
      case IN -> values.size() == 1
          ? key + "=" + values.get(0)
          : key + " in (" + String.join(", ", values) + ")";
      case NOT_IN -> key + " not in (" + String.join(", ", values) + ")";
      case GT -> key + " > " + String.join(", ", values);
      case LT -> key + " < " + String.join(", ", values);
    };
  }
}
