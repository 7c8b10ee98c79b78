package dev.numafit.review;

import dev.numafit.cluster.model.Taint;
import dev.numafit.resource.Resources;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * Mutable nodes and their pods during one review, with the scheduler's filters. The filter order
 * follows kube-scheduler's default plugins (from memory): NodeUnschedulable, NodeAffinity (node
 * selector and required affinity), TaintToleration, NodeResourcesFit ("Too many pods", then
 * "Insufficient &lt;resource&gt;" for each resource short, FACTS A7: a pod fits when requested +
 * its request ≤ allocatable, equality fits).
 */
final class PoolState {
  /** Resource order of every vector; the last is {@code pods}. */
  final String[] resources;
  final List<Node> nodes = new ArrayList<>();

  /** One node of the simulation. */
  static final class Node {
    final String name;
    final Map<String, String> labels;
    final List<Taint> taints;
    final boolean unschedulable;
    final long[] alloc;
    final long[] used;
    final List<PodItem> pods = new ArrayList<>();
    boolean removed;

    Node(String name, Map<String, String> labels, List<Taint> taints, boolean unschedulable,
        long[] alloc) {
      this.name = name;
      Map<String, String> l = new HashMap<>(labels);
      // matchFields may only name metadata.name; offered to the matcher like a label.
      l.put("metadata.name", name);
      this.labels = l;
      this.taints = taints;
      this.unschedulable = unschedulable;
      this.alloc = alloc;
      this.used = new long[alloc.length];
    }
  }

  PoolState(String[] resources) {
    this.resources = resources;
  }

  int podsIndex() {
    return resources.length - 1;
  }

  long[] vector(Resources r, boolean podCount) {
    long[] v = new long[resources.length];
    for (int i = 0; i < resources.length - 1; i++) {
      v[i] = r.get(resources[i]);
    }
    v[resources.length - 1] = podCount ? 1 : r.get(Resources.PODS);
    return v;
  }

  Node add(String name, Map<String, String> labels, List<Taint> taints, boolean unschedulable,
      Resources allocatable) {
    Node n = new Node(name, labels, taints, unschedulable, vector(allocatable, false));
    nodes.add(n);
    return n;
  }

  /** Puts a pod on a node without any check (it runs there today). */
  static void bind(Node n, PodItem p) {
    n.pods.add(p);
    for (int i = 0; i < p.req().length; i++) {
      n.used[i] += p.req()[i];
    }
  }

  /** Takes back a pod bound by {@link #bind} (the most recent binding of it on this node). */
  static void unbindFrom(Node n, PodItem p) {
    n.pods.remove(n.pods.lastIndexOf(p));
    for (int i = 0; i < p.req().length; i++) {
      n.used[i] -= p.req()[i];
    }
  }

  /** Whether the node's labels and taints admit the pod (not its resources). */
  static boolean admits(Node n, PodItem p) {
    return !n.unschedulable && p.placement().allowsLabels(n.labels)
        && p.placement().untolerated(n.taints).isEmpty();
  }

  /** The scheduler's reasons this node rejects the pod; empty when it fits. */
  List<String> reasons(Node n, PodItem p) {
    List<String> out = new ArrayList<>();
    if (n.unschedulable) {
      out.add("node(s) were unschedulable");
      return out;
    }
    if (!p.placement().allowsLabels(n.labels)) {
      out.add("node(s) didn't match Pod's node affinity/selector");
      return out;
    }
    Optional<Taint> t = p.placement().untolerated(n.taints);
    if (t.isPresent()) {
      out.add("node(s) had untolerated taint {" + t.get().key() + ": " + t.get().value() + "}");
      return out;
    }
    int pods = podsIndex();
    if (n.used[pods] + 1 > n.alloc[pods]) {
      out.add("Too many pods");
    }
    for (int i = 0; i < pods; i++) {
      if (p.req()[i] > 0 && n.used[i] + p.req()[i] > n.alloc[i]) {
        out.add("Insufficient " + resources[i]);
      }
    }
    return out;
  }

  boolean fits(Node n, PodItem p) {
    if (n.removed) {
      return false;
    }
    int pods = podsIndex();
    if (n.used[pods] + 1 > n.alloc[pods]) {
      return false;
    }
    for (int i = 0; i < pods; i++) {
      if (p.req()[i] > 0 && n.used[i] + p.req()[i] > n.alloc[i]) {
        return false;
      }
    }
    return admits(n, p);
  }

  /**
   * The node a scheduler would favour among those that fit: the one left least loaded (lowest
   * largest used fraction after placing), as the default least-allocated scoring spreads pods
   * (common practice); ties go to the earlier node.
   */
  Optional<Node> choose(PodItem p, Node except) {
    Node best = null;
    double bestScore = Double.MAX_VALUE;
    for (Node n : nodes) {
      if (n == except || !fits(n, p)) {
        continue;
      }
      double score = 0;
      for (int i = 0; i < resources.length; i++) {
        if (n.alloc[i] > 0) {
          score = Math.max(score, (double) (n.used[i] + p.req()[i]) / n.alloc[i]);
        }
      }
      if (score < bestScore) {
        best = n;
        bestScore = score;
      }
    }
    return Optional.ofNullable(best);
  }

  /** "0/7 nodes are available: 3 Insufficient cpu, 4 Too many pods." over the live nodes. */
  String why(PodItem p) {
    SortedMap<String, Integer> counts = new TreeMap<>();
    int live = 0;
    for (Node n : nodes) {
      if (n.removed) {
        continue;
      }
      live++;
      for (String r : reasons(n, p)) {
        counts.merge(r, 1, Integer::sum);
      }
    }
    if (live == 0) {
      return "0/0 nodes are available.";
    }
    StringBuilder b = new StringBuilder("0/" + live + " nodes are available: ");
    String sep = "";
    for (Map.Entry<String, Integer> e : counts.entrySet()) {
      b.append(sep).append(e.getValue()).append(' ').append(e.getKey());
      sep = ", ";
    }
    return b.append('.').toString();
  }

  /** Requested / allocatable per resource over the live nodes (4 decimals). */
  SortedMap<String, Double> utilization() {
    SortedMap<String, Double> out = new TreeMap<>();
    for (int i = 0; i < resources.length; i++) {
      long used = 0;
      long alloc = 0;
      for (Node n : nodes) {
        if (!n.removed) {
          used += n.used[i];
          alloc += n.alloc[i];
        }
      }
      String name = i == podsIndex() ? Resources.PODS : resources[i];
      if (alloc > 0) {
        out.put(name, Math.round(10_000.0 * used / alloc) / 10_000.0);
      }
    }
    return out;
  }

  /** Per live node, in node order: its pods' requests, DaemonSet pods apart, and allocatable. */
  List<NodeFill> fill() {
    List<NodeFill> out = new ArrayList<>();
    for (Node n : nodes) {
      if (n.removed) {
        continue;
      }
      long[] pods = new long[resources.length];
      long[] daemons = new long[resources.length];
      for (PodItem p : n.pods) {
        long[] into = p.daemon() ? daemons : pods;
        for (int i = 0; i < resources.length; i++) {
          into[i] += p.req()[i];
        }
      }
      out.add(new NodeFill(n.name, resources(pods), resources(daemons), resources(n.alloc)));
    }
    return out;
  }

  private Resources resources(long[] v) {
    SortedMap<String, Long> m = new TreeMap<>();
    for (int i = 0; i < resources.length; i++) {
      m.put(i == podsIndex() ? Resources.PODS : resources[i], v[i]);
    }
    return Resources.of(m);
  }

  /** Size of a pod for ordering: its largest share of a reference node's allocatable. */
  double size(PodItem p, long[] ref) {
    double s = 0;
    for (int i = 0; i < resources.length; i++) {
      if (ref[i] > 0) {
        s = Math.max(s, (double) p.req()[i] / ref[i]);
      } else if (p.req()[i] > 0) {
        s = Math.max(s, Double.MAX_VALUE / 2);
      }
    }
    return s;
  }
}
