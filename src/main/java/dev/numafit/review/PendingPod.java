package dev.numafit.review;

import java.util.Objects;

/**
 * A pod the resized pool cannot place.
 *
 * @param pod {@code namespace/name} for a running pod; {@code namespace/Kind/name#index} under
 *     {@code --from declared}
 * @param workload {@code namespace/Kind/name} of the owning workload
 * @param reason the scheduler-style message, e.g. {@code 0/7 nodes are available: 7 Insufficient
 *     cpu.}
 */
public record PendingPod(String pod, String workload, String reason) {
  public PendingPod {
    Objects.requireNonNull(pod, "pod");
    Objects.requireNonNull(workload, "workload");
    Objects.requireNonNull(reason, "reason");
  }
}
