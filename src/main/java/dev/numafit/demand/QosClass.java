package dev.numafit.demand;

/** Pod quality-of-service class (FACTS A2, Kubernetes "Pod Quality of Service Classes"). */
public enum QosClass {
  GUARANTEED("Guaranteed"),
  BURSTABLE("Burstable"),
  BEST_EFFORT("BestEffort");

  private final String label;

  QosClass(String label) {
    this.label = label;
  }

  /** The name Kubernetes prints ({@code Guaranteed}, {@code Burstable}, {@code BestEffort}). */
  public String label() {
    return label;
  }
}
