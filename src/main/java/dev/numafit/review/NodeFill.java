package dev.numafit.review;

import dev.numafit.resource.Resources;
import java.util.Objects;

/**
 * How full one node of the pool is, for the fill pictures of the review report: the requests of
 * the pods bound to it, DaemonSet pods apart, against the kubelet's allocatable. Amounts: cpu in
 * millicores, memory in bytes, {@code pods} a count, extended resources in counts.
 *
 * @param node the node's name ({@code new-01}… for nodes the resize adds)
 * @param pods summed requests of the node's pods other than DaemonSet pods, {@code pods} = their
 *     count
 * @param daemonSets summed requests of the node's DaemonSet pods, {@code pods} = their count
 * @param allocatable the node's allocatable, {@code pods} = its maxPods
 */
public record NodeFill(String node, Resources pods, Resources daemonSets, Resources allocatable) {
  public NodeFill {
    Objects.requireNonNull(node, "node");
    Objects.requireNonNull(pods, "pods");
    Objects.requireNonNull(daemonSets, "daemonSets");
    Objects.requireNonNull(allocatable, "allocatable");
  }
}
