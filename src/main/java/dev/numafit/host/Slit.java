package dev.numafit.host;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Validation of a NUMA distance matrix in ACPI SLIT form (FACTS B2: ACPI 6.x §5.2.17; Linux
 * {@code slit_valid()}): an N×N matrix of bytes, local distance normalised to 10 on the diagonal,
 * remote distances above 10 (the two directions may differ), 255 for unreachable, 0–9 reserved.
 * Pure, so both the profile reader and a host capture can use it.
 */
public final class Slit {
  /** The normalised local distance. */
  public static final int LOCAL = 10;

  /** The distance meaning "unreachable". */
  public static final int UNREACHABLE = 255;

  private Slit() {}

  /**
   * One thing wrong with a matrix.
   *
   * @param row the 0-based row, -1 when the problem is the number of rows
   * @param column the 0-based column, -1 when the problem is a whole row
   * @param message what was found and what is expected, without a location
   */
  public record Problem(int row, int column, String message) {}

  /**
   * Every problem of {@code matrix} as a distance matrix of {@code nodes} NUMA nodes, in row order;
   * empty when it is valid.
   */
  public static List<Problem> validate(List<List<Integer>> matrix, int nodes) {
    List<Problem> problems = new ArrayList<>();
    if (matrix.size() != nodes) {
      problems.add(
          new Problem(
              -1,
              -1,
              "expected " + nodes + " rows, one per NUMA node, got " + matrix.size()));
      return problems;
    }
    for (int i = 0; i < nodes; i++) {
      List<Integer> row = matrix.get(i);
      if (row.size() != nodes) {
        problems.add(
            new Problem(
                i, -1, "expected " + nodes + " entries, one per NUMA node, got " + row.size()));
        continue;
      }
      for (int j = 0; j < nodes; j++) {
        checkEntry(i, j, row.get(j)).ifPresent(problems::add);
      }
    }
    return problems;
  }

  /** The problem with one entry, if any. */
  public static Optional<Problem> checkEntry(int row, int column, int value) {
    if (row == column) {
      if (value != LOCAL) {
        return Optional.of(
            new Problem(row, column, "expected 10 on the diagonal (local distance), got " + value));
      }
      return Optional.empty();
    }
    if (value == UNREACHABLE || (value > LOCAL && value < UNREACHABLE)) {
      return Optional.empty();
    }
    String why = value >= 0 && value <= 9 ? " (0-9 are reserved)" : "";
    return Optional.of(
        new Problem(
            row,
            column,
            "expected a remote distance from 11 to 254, or 255 for unreachable, got "
                + value
                + why));
  }

  /**
   * The SLIT entry for a distance relative to local access: the table stores it scaled by 10
   * (FACTS B2: a relative distance of 2.4 is stored as 24). Rounded half up to a whole number.
   */
  public static int fromRelative(BigDecimal relative) {
    return relative.multiply(BigDecimal.TEN).setScale(0, RoundingMode.HALF_UP).intValueExact();
  }
}
