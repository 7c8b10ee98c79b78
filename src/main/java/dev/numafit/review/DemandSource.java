package dev.numafit.review;

/** What the review re-places: the pods as they run, or the workloads as declared. */
public enum DemandSource {
  /** The pods as they are, with their nodes (default). */
  RUNNING("running"),
  /** Workload specs × replicas ({@code --replicas peak|declared}), placed from scratch. */
  DECLARED("declared");

  private final String label;

  DemandSource(String label) {
    this.label = label;
  }

  public String label() {
    return label;
  }
}
