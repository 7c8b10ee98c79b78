package dev.numafit.capture;

/**
 * The ACPI SLIT rules for one distance value (FACTS B2: ACPI 6.x §5.2.17, Linux
 * {@code slit_valid()}): the local distance is 10, remote distances are above 10, 255 means
 * unreachable, 0–9 are reserved.
 */
final class Slit {
  private Slit() {}

  /** Why a value is not a valid SLIT entry, or null when it is. */
  static String problem(boolean local, int value) {
    if (local) {
      return value == 10 ? null : "expected 10 for a node's distance to itself";
    }
    if (value == 255) {
      return null;
    }
    if (value <= 10 || value > 255) {
      return "expected a remote distance of 11..254, or 255 for unreachable";
    }
    return null;
  }
}
