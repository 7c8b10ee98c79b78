package dev.numafit.review;

import dev.numafit.resource.Resources;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.SortedMap;

/**
 * The answer to "will the pool still hold its pods after this resize?".
 *
 * @param pool the {@code key=value} selector
 * @param nodesBefore pool nodes today
 * @param nodesAfter pool nodes after the resize
 * @param shapeAfter the new node shape, when it changes
 * @param fits every pod placed, no pod blocked by a budget, and the requested host failures
 *     survived
 * @param pending pods with no node after the resize, with the scheduler's reason
 * @param spanning today's nodes larger than one NUMA node of the host
 * @param utilizationBefore requested / allocatable per resource (cpu, memory, pods) today
 * @param utilizationAfter the same after the resize
 * @param removals the scale-down order (empty unless nodes are removed)
 * @param drain the drain rounds of the removed nodes
 * @param nodesNeeded nodes of the after-shape the pods need when packed with the plan's packer
 *     (node constraints ignored); empty when there are no pods
 * @param lowerBound the packer's lower bound for {@code nodesNeeded}
 * @param tooLarge workloads whose pod does not fit an empty node of the after-shape, with the
 *     room it leaves (after DaemonSets)
 * @param hostFailures the host-failure check, when asked for
 * @param podsConsidered pods the review placed (without DaemonSet pods)
 * @param warnings what the reader or the review could not count, first the missing types
 * @param fillBefore today's pool node by node (in name order)
 * @param fillAfter the pool after the resize node by node, before any host-failure check
 */
public record Review(
    String pool,
    DemandSource from,
    int nodesBefore,
    int nodesAfter,
    Optional<String> shapeAfter,
    Optional<String> hostProfile,
    boolean fits,
    List<PendingPod> pending,
    List<SpanningNode> spanning,
    SortedMap<String, Double> utilizationBefore,
    SortedMap<String, Double> utilizationAfter,
    List<Removal> removals,
    DrainPlan drain,
    OptionalInt nodesNeeded,
    OptionalInt lowerBound,
    List<String> tooLarge,
    Optional<HostFailureCheck> hostFailures,
    int podsConsidered,
    Resources roomPerNode,
    List<String> warnings,
    List<NodeFill> fillBefore,
    List<NodeFill> fillAfter) {
  public Review {
    Objects.requireNonNull(pool, "pool");
    Objects.requireNonNull(from, "from");
    pending = List.copyOf(pending);
    spanning = List.copyOf(spanning);
    utilizationBefore = java.util.Collections.unmodifiableSortedMap(
        new java.util.TreeMap<>(utilizationBefore));
    utilizationAfter = java.util.Collections.unmodifiableSortedMap(
        new java.util.TreeMap<>(utilizationAfter));
    removals = List.copyOf(removals);
    Objects.requireNonNull(drain, "drain");
    tooLarge = List.copyOf(tooLarge);
    Objects.requireNonNull(hostFailures, "hostFailures");
    Objects.requireNonNull(roomPerNode, "roomPerNode");
    warnings = List.copyOf(warnings);
    fillBefore = List.copyOf(fillBefore);
    fillAfter = List.copyOf(fillAfter);
  }

}
