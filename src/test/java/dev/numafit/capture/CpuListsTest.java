package dev.numafit.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import org.junit.jupiter.api.Test;

class CpuListsTest {
  @Test
  void parse_rangesAndSingles_expandsSorted() {
    // FACTS B3 (Linux sysfs-devices-node): cpulist is a list such as 0-3,8-11.
    assertEquals(List.of(0, 1, 2, 3, 8, 9, 10, 11), CpuLists.parse("0-3,8-11\n"));
    assertEquals(List.of(5), CpuLists.parse("5"));
  }

  @Test
  void parse_emptyLine_isNoCpus() {
    // A node without CPUs prints an empty cpulist line (FACTS B3 format).
    assertEquals(List.of(), CpuLists.parse(""));
  }

  @Test
  void parse_garbage_namesTheBadPart() {
    IllegalArgumentException e =
        assertThrows(IllegalArgumentException.class, () -> CpuLists.parse("0-3,x"));
    assertEquals(
        "expected a CPU list such as 0-3,8-11, got \"0-3,x\" (bad part \"x\")", e.getMessage());
  }

  @Test
  void parse_backwardsRange_isRejected() {
    IllegalArgumentException e =
        assertThrows(IllegalArgumentException.class, () -> CpuLists.parse("7-4"));
    assertEquals(
        "expected a CPU list such as 0-3,8-11, got range \"7-4\" that runs backwards",
        e.getMessage());
  }

  @Test
  void format_consecutiveNumbers_joinsRanges() {
    assertEquals("0-2,5,7-8", CpuLists.format(List.of(8, 7, 5, 2, 1, 0)));
    assertEquals("", CpuLists.format(List.of()));
  }
}
