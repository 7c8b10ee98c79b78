package dev.numafit.capture;

import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.TreeSet;

/**
 * The kernel's CPU list notation ({@code 0-3,8-11}, FACTS B3: {@code cpulist},
 * {@code core_cpus_list}, {@code cpu/online}) read into sorted CPU numbers and printed back.
 */
public final class CpuLists {
  private CpuLists() {}

  /**
   * Parses a CPU list. An empty or blank text is an empty list (a node without CPUs prints an empty
   * line).
   *
   * @throws IllegalArgumentException naming the part that is not {@code N} or {@code N-M}
   */
  public static List<Integer> parse(String text) {
    TreeSet<Integer> cpus = new TreeSet<>();
    String t = text.strip();
    if (t.isEmpty()) {
      return List.of();
    }
    for (String part : t.split(",", -1)) {
      String p = part.strip();
      int dash = p.indexOf('-');
      try {
        if (dash < 0) {
          cpus.add(nonNegative(p));
        } else {
          int from = nonNegative(p.substring(0, dash));
          int to = nonNegative(p.substring(dash + 1));
          if (to < from) {
            throw new IllegalArgumentException(
                "expected a CPU list such as 0-3,8-11, got range \"" + p + "\" that runs backwards");
          }
          for (int c = from; c <= to; c++) {
            cpus.add(c);
          }
        }
      } catch (NumberFormatException e) {
        throw new IllegalArgumentException(
            "expected a CPU list such as 0-3,8-11, got \"" + t + "\" (bad part \"" + p + "\")");
      }
    }
    return List.copyOf(cpus);
  }

  private static int nonNegative(String s) {
    if (s.isEmpty() || !s.chars().allMatch(Character::isDigit)) {
      throw new NumberFormatException(s);
    }
    return Integer.parseInt(s);
  }

  /** Prints CPU numbers in the kernel's compact form, ranges joined: {@code [0,1,2,5]} → {@code 0-2,5}. */
  public static String format(Collection<Integer> cpus) {
    List<Integer> sorted = new ArrayList<>(new TreeSet<>(cpus));
    StringBuilder out = new StringBuilder();
    int i = 0;
    while (i < sorted.size()) {
      int j = i;
      while (j + 1 < sorted.size() && sorted.get(j + 1) == sorted.get(j) + 1) {
        j++;
      }
      if (out.length() > 0) {
        out.append(',');
      }
      out.append(sorted.get(i));
      if (j > i) {
        out.append('-').append(sorted.get(j));
      }
      i = j + 1;
    }
    return out.toString();
  }
}
