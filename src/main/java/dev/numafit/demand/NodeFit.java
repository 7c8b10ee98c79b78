package dev.numafit.demand;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * Whether a pod may run on the workers of a pool, by the scheduler's node rules: every
 * nodeSelector entry must match, at least one required node-affinity term must match (its
 * requirements all hold), both together when both are given ("Assigning Pods to Nodes",
 * kubernetes.io/docs/concepts/scheduling-eviction/assign-pod-node/), and every {@code
 * NoSchedule} or {@code NoExecute} taint must be tolerated ("Taints and Tolerations",
 * kubernetes.io/docs/concepts/scheduling-eviction/taint-and-toleration/). {@code
 * PreferNoSchedule} taints do not keep a pod off; they are reported.
 *
 * @param refusal why the pod may not run there (the first rule broken); empty when it may
 * @param assumed requirements on {@link NodeLabels#open} labels and field selectors that were
 *     assumed to hold, and preferences not honoured, as sentences
 */
public record NodeFit(Optional<String> refusal, List<String> assumed) {
  public NodeFit {
    Objects.requireNonNull(refusal, "refusal");
    assumed = List.copyOf(assumed);
  }

  /** Whether the pod may run there. */
  public boolean fits() {
    return refusal.isEmpty();
  }

  /** Checks a pod's rules against a pool's worker labels and taints. */
  public static NodeFit of(PlacementRules rules, NodeLabels labels, List<Taint> taints) {
    List<String> assumed = new ArrayList<>();
    for (Map.Entry<String, String> e : rules.nodeSelector().entrySet()) {
      LabelExpression x = LabelExpression.equal(e.getKey(), e.getValue());
      Optional<String> why = explain(x, labels, assumed);
      if (why.isPresent()) {
        return new NodeFit(Optional.of("nodeSelector " + why.get()), assumed);
      }
    }
    List<NodeTerm> terms = rules.node().required();
    if (!terms.isEmpty()) {
      List<String> failures = new ArrayList<>();
      List<String> termAssumed = List.of();
      boolean matched = false;
      for (int i = 0; i < terms.size() && !matched; i++) {
        NodeTerm t = terms.get(i);
        List<String> local = new ArrayList<>();
        Optional<String> why = t.empty() ? Optional.of("an empty term matches no node") : Optional.empty();
        for (LabelExpression x : t.expressions()) {
          if (why.isPresent()) {
            break;
          }
          why = explain(x, labels, local);
        }
        if (why.isEmpty()) {
          t.fields().forEach(f -> local.add("matchFields " + f + " is not modelled (assumed to hold)"));
          matched = true;
          termAssumed = local;
        } else {
          failures.add("term " + (i + 1) + " " + why.get());
        }
      }
      if (!matched) {
        return new NodeFit(
            Optional.of("required node affinity: no term matches (" + String.join("; ", failures)
                + ")"),
            assumed);
      }
      assumed.addAll(termAssumed);
    }
    for (Taint t : taints) {
      if (rules.node().tolerates(t)) {
        continue;
      }
      if (t.repels()) {
        return new NodeFit(Optional.of("taint " + t + " is not tolerated"), assumed);
      }
      assumed.add("taint " + t + " is not tolerated: the scheduler avoids the pool when it can");
    }
    return new NodeFit(Optional.empty(), assumed);
  }

  /** Empty when {@code x} holds on the pool's workers, else what the workers have instead. */
  private static Optional<String> explain(
      LabelExpression x, NodeLabels labels, List<String> assumed) {
    String key = x.key();
    if (labels.open().contains(key)) {
      switch (x.operator()) {
        case EXISTS:
          return Optional.empty();
        case DOES_NOT_EXIST:
          return Optional.of(x + ": every worker carries " + key);
        default:
          assumed.add(x + " depends on the worker (assumed to hold on some)");
          return Optional.empty();
      }
    }
    if (x.matches(labels.fixed())) {
      return Optional.empty();
    }
    String have = labels.fixed().get(key);
    return Optional.of(
        x + ": the pool's workers have " + (have == null ? "no label " + key : key + "=" + have));
  }
}
