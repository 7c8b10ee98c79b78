/**
 * The review of a node-pool resize, pure: a {@link dev.numafit.cluster.model.ClusterModel} and a
 * {@link dev.numafit.review.ResizeRequest} in, a {@link dev.numafit.review.Review} out. It checks
 * today's pool against the host's one-node worker (NUMA spanning), simulates the pods on the
 * resized pool with scheduler-style filters (node selector and required node affinity, taints and
 * tolerations, unschedulable nodes, pods per node, resources), plans which nodes to remove first,
 * drains them in rounds under PodDisruptionBudgets, and counts nodes of a new shape with the
 * plan's packer. Amounts: cpu in millicores, memory in bytes, pods as a count.
 */
package dev.numafit.review;
