package dev.numafit.cluster.model;

/**
 * A budget value that is either a pod count or a percentage of the expected pods.
 *
 * @param value the count, or the percentage (0–100) when {@code percent}
 */
public record IntOrPercent(int value, boolean percent) {
  public IntOrPercent {
    if (value < 0) {
      throw new IllegalArgumentException("budget value must be >= 0, got " + value);
    }
  }

  /** Parses {@code 3} or {@code "50%"}. */
  public static IntOrPercent parse(String text) {
    String t = text.trim();
    try {
      if (t.endsWith("%")) {
        return new IntOrPercent(Integer.parseInt(t.substring(0, t.length() - 1).trim()), true);
      }
      return new IntOrPercent(Integer.parseInt(t), false);
    } catch (NumberFormatException ex) {
      throw new IllegalArgumentException(
          "\"" + text + "\" is not a pod count or a percentage (expected e.g. 2 or 50%)");
    }
  }

  /**
   * The count for {@code total} expected pods; a percentage rounds up ("Specifying a Disruption
   * Budget for your Application": 50% of 7 pods means 4).
   */
  public int of(int total) {
    if (!percent) {
      return value;
    }
    return (int) ((value * (long) total + 99) / 100);
  }

  @Override
  public String toString() {
    return percent ? value + "%" : Integer.toString(value);
  }
}
