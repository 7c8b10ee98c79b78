package dev.numafit.demand;

import dev.numafit.resource.Resources;
import java.util.List;
import java.util.Objects;

/**
 * What one pod of a workload asks of a node, as the scheduler counts it: effective requests and
 * limits rounded up (CPU to millicores, everything else to whole units), QoS class, the whole CPUs
 * the static CPU manager would pin, and flags such as {@code no request for memory}.
 *
 * @param requests effective pod requests including overhead; does not include the {@code pods}
 *     count
 * @param limits effective pod limits; a resource absent here is unlimited
 * @param exclusiveCpus whole CPUs pinned under the static CPU manager policy (Guaranteed pods with
 *     integer CPU per container), 0 otherwise
 */
public record EffectivePod(
    Resources requests, Resources limits, QosClass qos, long exclusiveCpus, List<String> flags) {
  public EffectivePod {
    Objects.requireNonNull(requests, "requests");
    Objects.requireNonNull(limits, "limits");
    Objects.requireNonNull(qos, "qos");
    flags = List.copyOf(flags);
  }
}
