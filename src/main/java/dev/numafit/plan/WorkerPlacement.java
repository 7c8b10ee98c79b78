package dev.numafit.plan;

import java.util.List;

/**
 * One worker of a plan and the pods placed on it, pod ids {@code namespace/Kind/name#index}.
 */
public record WorkerPlacement(String worker, List<String> pods) {
  public WorkerPlacement {
    pods = List.copyOf(pods);
  }
}
