package dev.numafit.host;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** FACTS B2 / check value 22 (H2: ACPI 6.x §5.2.17 SLIT; Linux slit_valid()). */
class SlitTest {
  @Test
  void fromRelative_2point4_stored24() {
    // ACPI SLIT: "a relative distance of 2.4 is stored as 24"; local 1.0 → 10.
    assertEquals(24, Slit.fromRelative(new BigDecimal("2.4")));
    assertEquals(10, Slit.fromRelative(BigDecimal.ONE));
  }

  @Test
  void validate_localTenRemoteAboveTenUnreachable255_valid() {
    // Directions may differ (ACPI: entry i*N+j is i → j); 255 = unreachable.
    assertTrue(Slit.validate(List.of(List.of(10, 21, 255), List.of(24, 10, 32),
        List.of(255, 31, 10)), 3).isEmpty());
  }

  @ParameterizedTest
  @ValueSource(ints = {0, 5, 9})
  void checkEntry_reservedValues_invalid(int value) {
    // 0-9 are reserved (ACPI SLIT).
    assertEquals(
        "expected a remote distance from 11 to 254, or 255 for unreachable, got " + value
            + " (0-9 are reserved)",
        Slit.checkEntry(0, 1, value).orElseThrow().message());
  }

  @Test
  void checkEntry_offDiagonalTen_invalid() {
    // Linux slit_valid() rejects an off-diagonal entry <= LOCAL_DISTANCE (10).
    assertEquals(
        "expected a remote distance from 11 to 254, or 255 for unreachable, got 10",
        Slit.checkEntry(1, 0, 10).orElseThrow().message());
  }

  @Test
  void checkEntry_diagonalNotTen_invalid() {
    // Linux slit_valid() rejects a diagonal other than LOCAL_DISTANCE (10).
    assertEquals(
        "expected 10 on the diagonal (local distance), got 12",
        Slit.checkEntry(1, 1, 12).orElseThrow().message());
  }

  @Test
  void validate_wrongSize_namesRowsAndEntries() {
    assertEquals(List.of(new Slit.Problem(-1, -1, "expected 2 rows, one per NUMA node, got 1")),
        Slit.validate(List.of(List.of(10, 21)), 2));
    assertEquals(
        List.of(new Slit.Problem(1, -1, "expected 2 entries, one per NUMA node, got 3")),
        Slit.validate(List.of(List.of(10, 21), List.of(21, 10, 21)), 2));
  }
}
