package dev.numafit.review;

import dev.numafit.cluster.model.Placement;
import java.util.List;

/**
 * A pod in the simulation: its requests as a vector over the state's resource order (the last
 * entry is the pod count, 1).
 */
record PodItem(
    String id, String workload, long[] req, Placement placement, List<String> budgets,
    boolean healthy, boolean daemon) {}
