package dev.numafit.demand;

import java.util.List;

/**
 * One term of a required node affinity ({@code nodeSelectorTerms[i]}): its requirements are
 * ANDed; the terms of an affinity are ORed ("Assigning Pods to Nodes",
 * kubernetes.io/docs/concepts/scheduling-eviction/assign-pod-node/).
 *
 * @param expressions the term's {@code matchExpressions}
 * @param fields the term's {@code matchFields} as written (field selectors on the node object,
 *     such as {@code metadata.name}); not modelled: a plan's workers have no names yet, so these
 *     are assumed to hold and reported
 */
public record NodeTerm(List<LabelExpression> expressions, List<String> fields) {
  public NodeTerm {
    expressions = List.copyOf(expressions);
    fields = List.copyOf(fields);
  }

  /** A term of label requirements only. */
  public NodeTerm(List<LabelExpression> expressions) {
    this(expressions, List.of());
  }

  /** Whether the term has nothing in it; such a term matches no node (PodSpec API reference). */
  public boolean empty() {
    return expressions.isEmpty() && fields.isEmpty();
  }

  @Override
  public String toString() {
    if (empty()) {
      return "(empty term)";
    }
    List<String> parts = new java.util.ArrayList<>();
    expressions.forEach(e -> parts.add(e.toString()));
    fields.forEach(f -> parts.add("field " + f));
    return String.join(", ", parts);
  }
}
