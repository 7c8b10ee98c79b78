package dev.numafit.host;

import java.util.OptionalLong;

/**
 * Formats and reads byte sizes in Kubernetes' binary suffixes ({@code Ki, Mi, Gi, Ti, Pi, Ei}), for
 * messages and notes. Only exact values get a suffix, so a formatted size never hides a remainder.
 */
public final class ByteUnits {
  private static final String[] SUFFIXES = {"Ei", "Pi", "Ti", "Gi", "Mi", "Ki"};
  private static final int[] SHIFTS = {60, 50, 40, 30, 20, 10};

  /** One GiB in bytes. */
  public static final long GIB = 1L << 30;

  /** One MiB in bytes. */
  public static final long MIB = 1L << 20;

  private ByteUnits() {}

  /**
   * The bytes as a quantity string with the largest binary suffix that divides them exactly:
   * {@code 68719476736 → "64Gi"}, {@code 2148 MiB → "2148Mi"}, {@code 1000 → "1000"}.
   */
  public static String format(long bytes) {
    if (bytes != 0) {
      for (int i = 0; i < SHIFTS.length; i++) {
        long unit = 1L << SHIFTS[i];
        if (bytes % unit == 0) {
          return (bytes / unit) + SUFFIXES[i];
        }
      }
    }
    return Long.toString(bytes);
  }

  /**
   * The size named by a plain binary or decimal quantity such as {@code 2Mi}, {@code 1Gi} or
   * {@code 4096}: used for hugepage sizes in resource names ({@code hugepages-2Mi}). Empty when the
   * text is not such a quantity.
   */
  public static OptionalLong parseSimple(String text) {
    int i = 0;
    while (i < text.length() && Character.isDigit(text.charAt(i))) {
      i++;
    }
    if (i == 0 || i > 18) {
      return OptionalLong.empty();
    }
    long n = Long.parseLong(text.substring(0, i));
    String suffix = text.substring(i);
    if (suffix.isEmpty()) {
      return OptionalLong.of(n);
    }
    for (int s = 0; s < SUFFIXES.length; s++) {
      if (SUFFIXES[s].equals(suffix)) {
        if (n > (Long.MAX_VALUE >> SHIFTS[s])) {
          return OptionalLong.empty();
        }
        return OptionalLong.of(n << SHIFTS[s]);
      }
    }
    return OptionalLong.empty();
  }

  /**
   * The page size of a {@code hugepages-<size>} resource name in bytes, empty when the name is not
   * one or its size is unreadable.
   */
  public static OptionalLong hugepageSize(String resourceName) {
    if (!resourceName.startsWith("hugepages-")) {
      return OptionalLong.empty();
    }
    return parseSimple(resourceName.substring("hugepages-".length()));
  }
}
