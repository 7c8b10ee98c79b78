/**
 * The cluster as numafit sees it, in pure immutable records: nodes (capacity, allocatable, labels,
 * taints), pods (owner workload, node, effective requests, scheduling constraints in a simple form),
 * PodDisruptionBudgets and declared workloads. Built by the {@code dev.numafit.cluster} adapter
 * from a live cluster or a snapshot file; read by the pure {@code dev.numafit.review}. No client or
 * JSON type appears here. Amounts are {@link dev.numafit.resource.Resources}: cpu in millicores,
 * memory and storage in bytes, pods as a count.
 */
package dev.numafit.cluster.model;
