package dev.numafit.demand;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.demand.LabelExpression.Operator;
import dev.numafit.demand.Taint.Effect;
import java.util.List;
import java.util.Optional;
import java.util.TreeMap;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;

/**
 * Node rules against pool labels and taints. Check values come from two pages of the Kubernetes
 * documentation (kubernetes.io): "Assigning Pods to Nodes"
 * (docs/concepts/scheduling-eviction/assign-pod-node/) and "Taints and Tolerations"
 * (docs/concepts/scheduling-eviction/taint-and-toleration/); the examples are written from memory
 * of those pages, as named beside each check.
 */
class NodeFitTest {
  private static TreeMap<String, String> labels(String... kv) {
    TreeMap<String, String> m = new TreeMap<>();
    for (int i = 0; i < kv.length; i += 2) {
      m.put(kv[i], kv[i + 1]);
    }
    return m;
  }

  private static PlacementRules selector(String... kv) {
    return new PlacementRules(new TreeSet<>(), List.of(), labels(kv), List.of());
  }

  private static PlacementRules affinity(NodeTerm... terms) {
    return PlacementRules.NONE.withNode(new NodeRules(List.of(terms), List.of()));
  }

  private static PlacementRules tolerating(Toleration... t) {
    return PlacementRules.NONE.withNode(new NodeRules(List.of(), List.of(t)));
  }

  private static NodeTerm term(LabelExpression... x) {
    return new NodeTerm(List.of(x));
  }

  private static LabelExpression expr(String key, Operator op, String... values) {
    return new LabelExpression(key, op, List.of(values));
  }

  private static NodeFit fit(PlacementRules r, NodeLabels l, Taint... taints) {
    return NodeFit.of(r, l, List.of(taints));
  }

  private static NodeLabels pool(String... kv) {
    return NodeLabels.ofPool(labels(kv));
  }

  @Test
  void of_nodeSelectorDisktypeSsd_fitsOnlyLabelledPool() {
    // "Assigning Pods to Nodes", nodeSelector: a pod with nodeSelector disktype: ssd runs only on
    // nodes labelled disktype=ssd.
    assertTrue(fit(selector("disktype", "ssd"), pool("disktype", "ssd")).fits());
    NodeFit none = fit(selector("disktype", "ssd"), pool());
    assertFalse(none.fits());
    assertEquals(
        Optional.of("nodeSelector disktype=ssd: the pool's workers have no label disktype"),
        none.refusal());
    assertFalse(fit(selector("disktype", "ssd"), pool("disktype", "hdd")).fits());
  }

  @Test
  void of_requiredZoneInEastOrWest_fitsPoolInEitherZoneOnly() {
    // "Assigning Pods to Nodes", node affinity example (pod-with-node-affinity.yaml): required
    // topology.kubernetes.io/zone In [antarctica-east1, antarctica-west1].
    PlacementRules r =
        affinity(
            term(expr("topology.kubernetes.io/zone", Operator.IN, "antarctica-east1",
                "antarctica-west1")));
    assertTrue(fit(r, pool("topology.kubernetes.io/zone", "antarctica-east1")).fits());
    assertTrue(fit(r, pool("topology.kubernetes.io/zone", "antarctica-west1")).fits());
    NodeFit other = fit(r, pool("topology.kubernetes.io/zone", "arctic-north1"));
    assertEquals(
        Optional.of("required node affinity: no term matches (term 1 topology.kubernetes.io/zone"
            + " in (antarctica-east1, antarctica-west1): the pool's workers have"
            + " topology.kubernetes.io/zone=arctic-north1)"),
        other.refusal());
  }

  @Test
  void of_zoneNotFixedByPool_assumedAndReported() {
    // Our rule (docs/pools.md): a pool that does not fix the zone label leaves it open; a value
    // requirement on it is assumed to hold and reported.
    PlacementRules r =
        affinity(term(expr("topology.kubernetes.io/zone", Operator.IN, "antarctica-east1")));
    NodeFit f = fit(r, pool());
    assertTrue(f.fits());
    assertEquals(1, f.assumed().size());
    // An open label exists on every worker: DoesNotExist fails, Exists holds.
    assertFalse(
        fit(affinity(term(expr("kubernetes.io/hostname", Operator.DOES_NOT_EXIST))), pool())
            .fits());
    assertTrue(
        fit(affinity(term(expr("kubernetes.io/hostname", Operator.EXISTS))), pool()).fits());
  }

  @Test
  void of_termsOredExpressionsAnded_asThePageSays() {
    // "Assigning Pods to Nodes": several nodeSelectorTerms are ORed (one satisfied term is
    // enough); several matchExpressions in one term are ANDed (all must hold).
    NodeTerm ssd = term(expr("disktype", Operator.IN, "ssd"));
    NodeTerm gpu = term(expr("accelerator", Operator.EXISTS));
    assertTrue(fit(affinity(ssd, gpu), pool("accelerator", "yes")).fits());
    assertTrue(fit(affinity(ssd, gpu), pool("disktype", "ssd")).fits());
    assertFalse(fit(affinity(ssd, gpu), pool("disktype", "hdd")).fits());
    NodeTerm both =
        term(expr("disktype", Operator.IN, "ssd"), expr("accelerator", Operator.EXISTS));
    assertFalse(fit(affinity(both), pool("disktype", "ssd")).fits());
    assertTrue(fit(affinity(both), pool("disktype", "ssd", "accelerator", "yes")).fits());
  }

  @Test
  void of_nodeSelectorAndAffinity_bothMustHold() {
    // "Assigning Pods to Nodes": "If you specify both nodeSelector and nodeAffinity, both must be
    // satisfied for the Pod to be scheduled onto a node."
    PlacementRules r =
        selector("disktype", "ssd")
            .withNode(
                new NodeRules(List.of(term(expr("tier", Operator.IN, "fast"))), List.of()));
    assertTrue(fit(r, pool("disktype", "ssd", "tier", "fast")).fits());
    assertFalse(fit(r, pool("disktype", "ssd")).fits());
    assertFalse(fit(r, pool("tier", "fast")).fits());
  }

  @Test
  void of_notInAndDoesNotExist_holdWhenLabelAbsent() {
    // "Assigning Pods to Nodes", operator table: NotIn and DoesNotExist give node anti-affinity;
    // a node without the label satisfies both (the label selector rules of "Labels and
    // Selectors": a missing key is not in any set).
    assertTrue(fit(affinity(term(expr("disktype", Operator.NOT_IN, "hdd"))), pool()).fits());
    assertFalse(
        fit(affinity(term(expr("disktype", Operator.NOT_IN, "hdd"))), pool("disktype", "hdd"))
            .fits());
    assertTrue(fit(affinity(term(expr("spot", Operator.DOES_NOT_EXIST))), pool()).fits());
    assertFalse(
        fit(affinity(term(expr("spot", Operator.DOES_NOT_EXIST))), pool("spot", "true")).fits());
  }

  @Test
  void of_gtAndLt_compareIntegersOnly() {
    // "Assigning Pods to Nodes", operator table: Gt and Lt parse the values as integers and do
    // not work with non-integer values. Label values here are our own.
    assertTrue(fit(affinity(term(expr("cores", Operator.GT, "4"))), pool("cores", "8")).fits());
    assertFalse(fit(affinity(term(expr("cores", Operator.GT, "8"))), pool("cores", "8")).fits());
    assertTrue(fit(affinity(term(expr("cores", Operator.LT, "16"))), pool("cores", "8")).fits());
    assertFalse(
        fit(affinity(term(expr("cores", Operator.GT, "4"))), pool("cores", "eight")).fits());
    assertFalse(fit(affinity(term(expr("cores", Operator.GT, "4"))), pool()).fits());
  }

  @Test
  void of_emptyTerm_matchesNothing() {
    // PodSpec API reference (NodeSelectorTerm): "A null or empty node selector term matches no
    // objects."
    assertFalse(fit(affinity(new NodeTerm(List.of())), pool()).fits());
  }

  @Test
  void of_kubernetesIoOsLinux_fitsEveryPool() {
    // pod-with-affinity-anti-affinity.yaml ("Assigning Pods to Nodes"): required
    // kubernetes.io/os In [linux, ...]. Every worker is a Linux VM carrying that label
    // ("Well-Known Labels, Annotations and Taints": the kubelet sets kubernetes.io/os).
    assertTrue(
        fit(affinity(term(expr("kubernetes.io/os", Operator.IN, "linux", "other"))), pool())
            .fits());
  }

  @Test
  void tolerates_equalAndExistsForms_bothMatchKey1Value1NoSchedule() {
    // "Taints and Tolerations": after `kubectl taint nodes node1 key1=value1:NoSchedule`, both
    // the Equal toleration (key1, value1, NoSchedule) and the Exists toleration (key1,
    // NoSchedule) match the taint.
    Taint t = new Taint("key1", "value1", Effect.NO_SCHEDULE);
    assertTrue(new Toleration("key1", false, "value1", Optional.of(Effect.NO_SCHEDULE)).tolerates(t));
    assertTrue(new Toleration("key1", true, "", Optional.of(Effect.NO_SCHEDULE)).tolerates(t));
    assertFalse(new Toleration("key1", false, "value2", Optional.of(Effect.NO_SCHEDULE)).tolerates(t));
    assertFalse(new Toleration("key1", false, "value1", Optional.of(Effect.NO_EXECUTE)).tolerates(t));
    assertEquals("key1=value1:NoSchedule", t.toString());
  }

  @Test
  void tolerates_emptyKeyExists_toleratesEverything_emptyEffectEveryEffect() {
    // "Taints and Tolerations": "An empty key with operator Exists matches all keys, values and
    // effects which means this will tolerate everything"; "An empty effect matches all effects
    // with key key1".
    for (Effect e : Effect.values()) {
      assertTrue(Toleration.EVERYTHING.tolerates(new Taint("anything", "x", e)));
      assertTrue(new Toleration("key1", true, "", Optional.empty()).tolerates(new Taint("key1", "v", e)));
    }
    // An empty key with Equal is not valid in the API; it tolerates nothing here.
    assertFalse(new Toleration("", false, "", Optional.empty())
        .tolerates(new Taint("k", "", Effect.NO_SCHEDULE)));
  }

  @Test
  void of_threeTaintsTwoTolerated_podStaysOff() {
    // "Taints and Tolerations": node1 has key1=value1:NoSchedule, key1=value1:NoExecute and
    // key2=value2:NoSchedule; a pod tolerating only the two key1 taints cannot be scheduled onto
    // the node, as no toleration matches the third taint.
    PlacementRules r =
        tolerating(
            new Toleration("key1", false, "value1", Optional.of(Effect.NO_SCHEDULE)),
            new Toleration("key1", false, "value1", Optional.of(Effect.NO_EXECUTE)));
    NodeFit f =
        fit(r, pool(),
            new Taint("key1", "value1", Effect.NO_SCHEDULE),
            new Taint("key1", "value1", Effect.NO_EXECUTE),
            new Taint("key2", "value2", Effect.NO_SCHEDULE));
    assertEquals(Optional.of("taint key2=value2:NoSchedule is not tolerated"), f.refusal());
  }

  @Test
  void of_preferNoSchedule_doesNotKeepPodOff() {
    // "Taints and Tolerations": PreferNoSchedule is a "preference" or "soft" NoSchedule: the
    // scheduler tries to avoid the node but may still use it.
    NodeFit f = fit(PlacementRules.NONE, pool(), new Taint("key1", "value1", Effect.PREFER_NO_SCHEDULE));
    assertTrue(f.fits());
    assertEquals(1, f.assumed().size());
  }

  @Test
  void of_noExecuteWithoutToleration_keepsPodOff() {
    // "Taints and Tolerations": NoExecute keeps pods that do not tolerate it off the node (and
    // evicts running ones).
    assertFalse(fit(PlacementRules.NONE, pool(), new Taint("key1", "", Effect.NO_EXECUTE)).fits());
  }

  @Test
  void of_matchFieldsTerm_assumedToHoldAndNoted() {
    // PodSpec API reference (NodeSelectorTerm.matchFields): field selectors on the node object,
    // such as metadata.name. A plan's workers have no names yet: assumed to hold, reported.
    PlacementRules r =
        affinity(new NodeTerm(List.of(), List.of("metadata.name=worker-7")));
    NodeFit f = fit(r, pool());
    assertTrue(f.fits());
    assertEquals(
        List.of("matchFields metadata.name=worker-7 is not modelled (assumed to hold)"),
        f.assumed());
  }
}
