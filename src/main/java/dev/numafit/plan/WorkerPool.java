package dev.numafit.plan;

import dev.numafit.demand.NodeLabels;
import dev.numafit.demand.Taint;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * A group of workers of one shape that carry the same labels and taints, sized on its own.
 *
 * @param name the pool's name, unique within a plan
 * @param labels labels every worker of the pool carries (besides the well-known ones, see {@link
 *     NodeLabels#ofPool})
 * @param taints taints every worker of the pool carries, sorted
 * @param input the worker shape, allocatable and planning options of the pool
 */
public record WorkerPool(
    String name, SortedMap<String, String> labels, List<Taint> taints, PlanInput input) {
  /** The name of the one pool of a plan made without a pools file. */
  public static final String DEFAULT_NAME = "default";

  public WorkerPool {
    Objects.requireNonNull(name, "name");
    if (name.isEmpty()) {
      throw new IllegalArgumentException("a pool needs a name");
    }
    labels = Collections.unmodifiableSortedMap(new TreeMap<>(labels));
    taints = taints.stream().sorted().distinct().toList();
    Objects.requireNonNull(input, "input");
  }

  /** The one untainted pool without labels of its own that carries everything. */
  public static WorkerPool single(PlanInput input) {
    return new WorkerPool(DEFAULT_NAME, new TreeMap<>(), List.of(), input);
  }

  /** The labels the scheduler sees on the pool's workers. */
  public NodeLabels nodeLabels() {
    return NodeLabels.ofPool(labels);
  }
}
