package dev.numafit.manifest;

import dev.numafit.demand.LabelExpression;
import dev.numafit.demand.NodeRules;
import dev.numafit.demand.NodeTerm;
import dev.numafit.demand.PlacementRules;
import dev.numafit.demand.Taint;
import dev.numafit.demand.Toleration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.TreeSet;
import tools.jackson.databind.JsonNode;

/**
 * Reads the placement rules of a pod spec that a sizing plan can enforce: required pod
 * anti-affinity and topology spread constraints whose label selector matches the pod's own
 * labels (so they are about the workload's own replicas), and the nodeSelector. Field names and
 * meanings follow the PodSpec API reference (affinity.podAntiAffinity.
 * requiredDuringSchedulingIgnoredDuringExecution, topologySpreadConstraints).
 *
 * <p>A rule whose selector matches other pods, or an empty selector (which matches no pods in an
 * affinity term), does not constrain the workload's own replicas; the former is kept as a note.
 */
final class PlacementReader {
  private PlacementReader() {}

  /**
   * @param spec the pod spec node
   * @param labels the pod template's {@code metadata.labels} node (missing when none)
   */
  static PlacementRules read(JsonNode spec, JsonNode labels) {
    if (spec == null || !spec.isObject()) {
      return PlacementRules.NONE;
    }
    JsonNode anti =
        spec.path("affinity")
            .path("podAntiAffinity")
            .path("requiredDuringSchedulingIgnoredDuringExecution");
    JsonNode spread = spec.path("topologySpreadConstraints");
    JsonNode selector = spec.path("nodeSelector");
    JsonNode nodeAffinity = spec.path("affinity").path("nodeAffinity");
    JsonNode tolerations = spec.path("tolerations");
    if (!anti.isArray() && !spread.isArray() && !selector.isObject() && !nodeAffinity.isObject()
        && !tolerations.isArray()) {
      return PlacementRules.NONE;
    }
    Map<String, String> own = stringMap(labels);
    TreeSet<String> antiKeys = new TreeSet<>();
    List<PlacementRules.Spread> spreads = new ArrayList<>();
    List<String> notes = new ArrayList<>();
    if (anti.isArray()) {
      for (JsonNode term : anti) {
        String key = text(term.get("topologyKey"));
        JsonNode sel = term.get("labelSelector");
        if (key == null || sel == null || sel.isNull()) {
          continue;
        }
        if (matchesOwn(sel, own)) {
          antiKeys.add(key);
        } else {
          notes.add("anti-affinity on " + key + " to pods of other workloads is not modelled");
        }
      }
    }
    if (spread.isArray()) {
      for (JsonNode c : spread) {
        String key = text(c.get("topologyKey"));
        JsonNode skew = c.get("maxSkew");
        if (key == null || skew == null || !skew.isIntegralNumber() || skew.asInt() < 1) {
          continue;
        }
        JsonNode sel = c.get("labelSelector");
        if (sel == null || sel.isNull() || !matchesOwn(sel, own)) {
          notes.add("spread over " + key + " counting pods of other workloads is not modelled");
          continue;
        }
        boolean hard = !"ScheduleAnyway".equals(text(c.get("whenUnsatisfiable")));
        spreads.add(new PlacementRules.Spread(key, skew.asInt(), hard));
      }
    }
    NodeRules node = readNode(nodeAffinity, tolerations, notes);
    return new PlacementRules(antiKeys, spreads, stringMap(selector), notes, node);
  }

  /**
   * The required node affinity (terms ORed, requirements of a term ANDed) and the tolerations.
   * Preferred node affinity is a preference the plan does not honour: noted. A requirement with
   * an operator the API does not define makes its term match nothing, as the API server would
   * refuse it.
   */
  static NodeRules readNode(JsonNode nodeAffinity, JsonNode tolerations, List<String> notes) {
    List<NodeTerm> terms = new ArrayList<>();
    JsonNode required =
        nodeAffinity.path("requiredDuringSchedulingIgnoredDuringExecution").path("nodeSelectorTerms");
    if (required.isArray()) {
      for (JsonNode term : required) {
        List<LabelExpression> exprs = new ArrayList<>();
        List<String> fields = new ArrayList<>();
        boolean broken = false;
        for (JsonNode x : term.path("matchExpressions")) {
          Optional<LabelExpression> e = expression(x);
          if (e.isEmpty()) {
            broken = true;
          } else {
            exprs.add(e.get());
          }
        }
        for (JsonNode f : term.path("matchFields")) {
          Optional<LabelExpression> e = expression(f);
          if (e.isEmpty()) {
            broken = true;
          } else {
            fields.add(e.get().toString());
          }
        }
        // A broken term can match no node: keep it as an empty term.
        terms.add(broken ? new NodeTerm(List.of()) : new NodeTerm(exprs, fields));
      }
    }
    JsonNode preferred = nodeAffinity.path("preferredDuringSchedulingIgnoredDuringExecution");
    if (preferred.isArray() && !preferred.isEmpty()) {
      notes.add("preferred node affinity (" + preferred.size() + " term(s)) is a preference:"
          + " noted, not enforced");
    }
    List<Toleration> tols = new ArrayList<>();
    if (tolerations.isArray()) {
      for (JsonNode t : tolerations) {
        String op = text(t.get("operator"));
        boolean exists = "Exists".equals(op);
        if (op != null && !exists && !"Equal".equals(op)) {
          continue;
        }
        String effectName = text(t.get("effect"));
        Optional<Taint.Effect> effect = Optional.empty();
        if (effectName != null && !effectName.isEmpty()) {
          effect = Taint.Effect.of(effectName);
          if (effect.isEmpty()) {
            continue;
          }
        }
        JsonNode seconds = t.get("tolerationSeconds");
        if (effect.equals(Optional.of(Taint.Effect.NO_EXECUTE)) && seconds != null
            && seconds.isIntegralNumber()) {
          // The pod is evicted that many seconds after it lands: no lasting placement.
          notes.add("toleration of " + (text(t.get("key")) == null ? "every key" : text(t.get("key")))
              + " with tolerationSeconds " + seconds.asLong() + " does not count: the pod is"
              + " evicted after that time");
          continue;
        }
        tols.add(new Toleration(text(t.get("key")), exists, text(t.get("value")), effect));
      }
    }
    return new NodeRules(terms, tols);
  }

  private static Optional<LabelExpression> expression(JsonNode x) {
    String key = text(x.get("key"));
    Optional<LabelExpression.Operator> op = LabelExpression.Operator.of(text(x.get("operator")));
    if (key == null || op.isEmpty()) {
      return Optional.empty();
    }
    List<String> values = new ArrayList<>();
    x.path("values").forEach(v -> values.add(v.isString() ? v.asString() : v.toString()));
    return Optional.of(new LabelExpression(key, op.get(), values));
  }

  /**
   * Whether a label selector (matchLabels and matchExpressions, ANDed) selects a pod with these
   * labels. An empty selector selects nothing here, as in an affinity term.
   */
  static boolean matchesOwn(JsonNode selector, Map<String, String> labels) {
    JsonNode ml = selector.path("matchLabels");
    JsonNode me = selector.path("matchExpressions");
    boolean any = false;
    if (ml.isObject()) {
      for (Map.Entry<String, String> e : stringMap(ml).entrySet()) {
        any = true;
        if (!e.getValue().equals(labels.get(e.getKey()))) {
          return false;
        }
      }
    }
    if (me.isArray()) {
      for (JsonNode x : me) {
        any = true;
        String key = text(x.get("key"));
        String op = text(x.get("operator"));
        List<String> values = new ArrayList<>();
        x.path("values").forEach(v -> values.add(v.isString() ? v.asString() : v.toString()));
        String have = key == null ? null : labels.get(key);
        boolean ok =
            switch (op == null ? "" : op) {
              case "In" -> have != null && values.contains(have);
              case "NotIn" -> have == null || !values.contains(have);
              case "Exists" -> have != null;
              case "DoesNotExist" -> have == null;
              default -> false;
            };
        if (!ok) {
          return false;
        }
      }
    }
    return any;
  }

  private static SortedMap<String, String> stringMap(JsonNode n) {
    SortedMap<String, String> m = new TreeMap<>();
    if (n != null && n.isObject()) {
      for (Map.Entry<String, JsonNode> e : n.properties()) {
        JsonNode v = e.getValue();
        if (v != null && (v.isString() || v.isNumber() || v.isBoolean())) {
          m.put(e.getKey(), v.asString());
        }
      }
    }
    return m;
  }

  private static String text(JsonNode n) {
    return n != null && n.isString() ? n.asString() : null;
  }
}
