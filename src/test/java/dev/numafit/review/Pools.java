package dev.numafit.review;

import dev.numafit.cluster.model.BudgetRecord;
import dev.numafit.cluster.model.ClusterModel;
import dev.numafit.cluster.model.IntOrPercent;
import dev.numafit.cluster.model.NodeRecord;
import dev.numafit.cluster.model.Placement;
import dev.numafit.cluster.model.PodRecord;
import dev.numafit.demand.ReplicaMode;
import dev.numafit.demand.WorkloadId;
import dev.numafit.resource.Resources;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.TreeMap;

/** Small cluster models for the review tests (invented scenarios of a made-up web shop). */
public final class Pools {
  public static final long GI = 1L << 30;
  public static final long MI = 1L << 20;

  public final List<NodeRecord> nodes = new ArrayList<>();
  public final List<PodRecord> pods = new ArrayList<>();
  public final List<BudgetRecord> budgets = new ArrayList<>();
  public Optional<String> namespace = Optional.empty();

  public Pools node(String name, long cpuMillis, long memory) {
    Resources r = Resources.of("cpu", cpuMillis, "memory", memory, "pods", 110L);
    nodes.add(new NodeRecord(name, r, r, new TreeMap<>(Map.of("pool", "general",
        "kubernetes.io/hostname", name)), List.of(), false));
    return this;
  }

  public Pools pods(String workload, int count, long cpuMillis, long memory, String node,
      String... budgets) {
    WorkloadId id = new WorkloadId("shop", "Deployment", workload);
    for (int i = 0; i < count; i++) {
      String name = workload + "-" + node + "-" + i;
      pods.add(new PodRecord("shop", name, id, node, "Running",
          Resources.of("cpu", cpuMillis, "memory", memory), Placement.NONE, false,
          List.of(budgets)));
    }
    return this;
  }

  public Pools daemonOnEveryNode(long cpuMillis, long memory) {
    WorkloadId id = new WorkloadId("infra", "DaemonSet", "log-shipper");
    for (NodeRecord n : List.copyOf(nodes)) {
      pods.add(new PodRecord("infra", "log-shipper-" + n.name(), id, n.name(), "Running",
          Resources.of("cpu", cpuMillis, "memory", memory), Placement.NONE, true, List.of()));
    }
    return this;
  }

  public Pools budget(String name, String minAvailable, String maxUnavailable) {
    budgets.add(new BudgetRecord("shop", name,
        Optional.ofNullable(minAvailable).map(IntOrPercent::parse),
        Optional.ofNullable(maxUnavailable).map(IntOrPercent::parse)));
    return this;
  }

  public ClusterModel model() {
    return new ClusterModel("https://203.0.113.10:6443", namespace, nodes, pods, budgets,
        List.of(), List.of(), List.of());
  }

  public static ResizeRequest resize(int nodes) {
    return new ResizeRequest("pool", "general", OptionalInt.of(nodes), Optional.empty(),
        Optional.empty(), Optional.empty(), 0, Optional.empty(), 2, DemandSource.RUNNING,
        ReplicaMode.PEAK);
  }
}
