package dev.numafit.manifest;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.numafit.demand.Demand;
import dev.numafit.diag.Diagnostic;
import java.util.List;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;

/**
 * A list document ({@code kind: List}, as {@code kubectl get -o yaml} writes it) whose kind comes
 * before its items is read item by item, so a huge list never sits in memory whole; one whose
 * kind comes after its items (as {@code kubectl get -o json} orders the keys) is read whole. Both
 * must give the same workloads and the same messages at the lines where the problems are.
 */
class ListItemsTest {
  /** Items of a list, from line 4 on: a Pod with a bad CPU request, a number, a good Pod. */
  static final String ITEMS = """
      items:
      - apiVersion: v1
        kind: Pod
        metadata: {name: ledger, namespace: billing}
        spec:
          containers:
          - name: app
            resources: {requests: {cpu: 1.5.5, memory: 64Mi}}
      - 42
      - apiVersion: v1
        kind: Pod
        metadata: {name: meter, namespace: billing}
        spec:
          containers:
          - name: app
            resources: {requests: {cpu: 250m, memory: 128Mi}}
      """;

  static Demand read(String text) {
    TreeMap<String, String> in = new TreeMap<>();
    in.put("list.yaml", text);
    return new ManifestReader().readTexts(in, ReadOptions.defaults()).demand();
  }

  static List<String> formatted(Demand d) {
    return d.diagnostics().stream().map(Diagnostic::format).toList();
  }

  @Test
  void readTexts_kindBeforeItems_itemsReadOneByOneWithTheirLines() {
    Demand d = read("apiVersion: v1\nkind: List\nmetadata: {}\n" + ITEMS);
    assertEquals(List.of("billing/Pod/meter"),
        d.workloads().stream().map(w -> w.id().toString()).toList());
    // Lines counted by hand in the text above: the cpu value on line 11, the number on line 12.
    assertEquals(List.of(
        "list.yaml:11: error: billing/Pod/ledger: container \"app\": resources.requests.cpu"
            + " \"1.5.5\" is not a Kubernetes quantity (expected e.g. 500m, 2, 1.5Gi)",
        "list.yaml:12: note: list item is not a Kubernetes object (no kind), skipped"),
        formatted(d).stream().filter(m -> m.contains("ledger") || m.contains("list item"))
            .toList());
  }

  @Test
  void readTexts_kindAfterItems_sameWorkloadsAndMessagesAsItemByItem() {
    Demand streamed = read("apiVersion: v1\nmetadata: {}\nkind: List\n" + ITEMS);
    Demand whole = read("apiVersion: v1\nmetadata: {}\n# kind follows the items\n" + ITEMS
        + "kind: List\n");
    assertEquals(streamed.workloads(), whole.workloads());
    // Both start the items on line 4: the same lines either way.
    assertEquals(formatted(streamed), formatted(whole));
  }

  @Test
  void readTexts_podListWithoutItemKinds_itemsTakeTheListsKind() {
    // A typed list (PodList) may leave kind out of its items; they are Pods.
    Demand d = read("apiVersion: v1\nkind: PodList\nitems:\n- metadata: {name: a, namespace: n}\n"
        + "  spec: {containers: [{name: c, resources: {requests: {cpu: 100m}}}]}\n");
    assertEquals(List.of("n/Pod/a"), d.workloads().stream().map(w -> w.id().toString()).toList());
  }
}
