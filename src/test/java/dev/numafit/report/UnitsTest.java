package dev.numafit.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class UnitsTest {
  @Test
  void bytes_podOverheadDocsExample_is320MiB() {
    // Pod Overhead docs (K1, FACTS check value 1): cgroup limit 335544320 bytes = 320Mi.
    assertEquals("320MiB", Units.bytes(335544320L));
  }

  @Test
  void bytes_reserveComputeResourcesExample_is28point5GiB() {
    // Reserve Compute Resources docs (K11, FACTS check value 6): allocatable memory 28.5Gi.
    assertEquals("28.5GiB", Units.bytes(30601641984L));
    // ... and ephemeral storage 88Gi.
    assertEquals("88GiB", Units.bytes(88L << 30));
  }

  @Test
  void bytes_smallAndOddAmounts() {
    assertEquals("0B", Units.bytes(0));
    assertEquals("1023B", Units.bytes(1023));
    assertEquals("1KiB", Units.bytes(1024));
    // 123Mi (FACTS check value 4) stays exact; 129M is 123.02MiB after rounding.
    assertEquals("123MiB", Units.bytes(128974848L));
    assertEquals("123.02MiB", Units.bytes(129000000L));
  }

  @Test
  void cpu_wholeCoresAndMillicores() {
    // Pod Overhead docs (K1): the node shows 2250m; the containers total 2000m = 2 CPUs.
    assertEquals("2250m", Units.cpu(2250));
    assertEquals("2", Units.cpu(2000));
    assertEquals("0", Units.cpu(0));
  }

  @Test
  void percent_oneDecimalHalfUp() {
    assertEquals("61.3%", Units.percent(0.61250));
    assertEquals("100.0%", Units.percent(1.0));
  }
}
