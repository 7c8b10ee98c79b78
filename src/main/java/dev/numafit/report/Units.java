package dev.numafit.report;

import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.math.RoundingMode;

/**
 * Renders integer resource amounts for people: CPU from millicores ({@code 2}, {@code 2500m}),
 * memory-like amounts from bytes in binary units ({@code 512MiB}, {@code 28.5GiB}), counts as
 * plain integers.
 */
public final class Units {
  private static final String[] BINARY = {"B", "KiB", "MiB", "GiB", "TiB", "PiB", "EiB"};

  private Units() {}

  /** Whether a resource is measured in bytes: memory, ephemeral-storage and hugepages. */
  public static boolean isBytes(String resource) {
    return resource.equals(Resources.MEMORY)
        || resource.equals(Resources.EPHEMERAL_STORAGE)
        || Resources.isHugepages(resource);
  }

  /** CPU in millicores as whole cores when exact ({@code 2}), else in millicores ({@code 2500m}). */
  public static String cpu(long millicores) {
    if (millicores % 1000 == 0) {
      return Long.toString(millicores / 1000);
    }
    return millicores + "m";
  }

  /**
   * Bytes in the largest binary unit that keeps the number at least 1, with at most two decimals
   * (rounded half up, trailing zeros dropped): 335544320 is {@code 320MiB}, 30601641984 is {@code
   * 28.5GiB}.
   */
  public static String bytes(long bytes) {
    if (bytes < 0) {
      return "-" + bytes(-bytes);
    }
    int unit = 0;
    long scale = 1;
    while (unit < BINARY.length - 1 && bytes / scale >= 1024) {
      scale *= 1024;
      unit++;
    }
    BigDecimal v =
        BigDecimal.valueOf(bytes)
            .divide(BigDecimal.valueOf(scale), 2, RoundingMode.HALF_UP)
            .stripTrailingZeros();
    return v.toPlainString() + BINARY[unit];
  }

  /** An amount of the named resource in its human unit. */
  public static String amount(String resource, long value) {
    if (resource.equals(Resources.CPU)) {
      return cpu(value);
    }
    if (isBytes(resource)) {
      return bytes(value);
    }
    return Long.toString(value);
  }

  /** A resource vector as {@code cpu 2, memory 4GiB, pods 1}; {@code none} when empty. */
  public static String vector(Resources r) {
    if (r.isEmpty()) {
      return "none";
    }
    StringBuilder sb = new StringBuilder();
    for (var e : r.asMap().entrySet()) {
      if (sb.length() > 0) {
        sb.append(", ");
      }
      sb.append(e.getKey()).append(' ').append(amount(e.getKey(), e.getValue()));
    }
    return sb.toString();
  }

  /** Each amount of a vector as {@code name amount}, sorted by name. */
  public static java.util.List<String> items(Resources r) {
    java.util.List<String> out = new java.util.ArrayList<>();
    r.asMap().forEach((k, v) -> out.add(k + " " + amount(k, v)));
    return out;
  }

  /** A fraction as a percentage with one decimal: 0.6124 is {@code 61.2%}. */
  public static String percent(double fraction) {
    return BigDecimal.valueOf(fraction * 100).setScale(1, RoundingMode.HALF_UP).toPlainString()
        + "%";
  }
}
