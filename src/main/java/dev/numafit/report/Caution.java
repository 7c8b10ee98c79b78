package dev.numafit.report;

/** The caution every plan report carries, in every format. */
public final class Caution {
  /** Sizing errors cause outages: the plan is a starting point, not a verdict. */
  public static final String TEXT =
      "Caution: sized from declared requests. Verify against your hardware's documentation and"
          + " a load test; follow your organisation's change practice.";

  private Caution() {}
}
