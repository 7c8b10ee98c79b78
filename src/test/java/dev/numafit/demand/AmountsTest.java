package dev.numafit.demand;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.math.BigDecimal;
import org.junit.jupiter.api.Test;

class AmountsTest {
  @Test
  void format_cpu_coresOrMillicores() {
    // Canonical forms from the Quantity reference (FACTS A3, K10): 1.5 is "1500m".
    assertEquals("1500m", Amounts.format("cpu", new BigDecimal("1.5")));
    assertEquals("2", Amounts.format("cpu", new BigDecimal("2.000")));
    assertEquals("100m", Amounts.format("cpu", new BigDecimal("0.1")));
  }

  @Test
  void format_bytes_largestExactBinarySuffix() {
    // K10: 1.5Gi is "1536Mi".
    assertEquals("1536Mi", Amounts.format("memory", new BigDecimal(1536L << 20)));
    assertEquals("80Mi", Amounts.format("hugepages-2Mi", new BigDecimal(80L << 20)));
    assertEquals("129000000", Amounts.format("memory", new BigDecimal(129_000_000L)));
    assertEquals("0.4", Amounts.format("memory", new BigDecimal("0.4")));
    assertEquals("3", Amounts.format("example.com/accel", new BigDecimal(3)));
  }
}
