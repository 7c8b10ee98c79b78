package dev.numafit.shape;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The tiered default kube-reserved. The scale is common practice, from memory (no Kubernetes page
 * publishes it); the expected values are that scale worked by hand, rounded up (memory to MiB,
 * CPU to millicores).
 */
class TieredReserveTest {
  private static final long MI = 1L << 20;
  private static final long GI = 1L << 30;

  @ParameterizedTest
  @CsvSource({
    // GiB, expected MiB: worked by hand from 25% / 20% / 10% / 6% / 2% tiers.
    "1, 256", //    0.25 × 1Gi
    "4, 1024", //   0.25 × 4Gi
    "8, 1844", //   1Gi + 0.20 × 4Gi = 1.8Gi = 1843.2Mi, rounded up
    "16, 2663", //  1.8Gi + 0.10 × 8Gi = 2.6Gi = 2662.4Mi
    "32, 3646", //  2.6Gi + 0.06 × 16Gi = 3.56Gi = 3645.44Mi
    "64, 5612", //  2.6Gi + 0.06 × 48Gi = 5.48Gi = 5611.52Mi
    "128, 9544", // 2.6Gi + 0.06 × 112Gi = 9.32Gi = 9543.68Mi
    "256, 12166" // 9.32Gi + 0.02 × 128Gi = 11.88Gi = 12165.12Mi
  })
  void memoryBytes_tieredScale_matchesHandArithmetic(long gib, long expectedMib) {
    assertEquals(expectedMib * MI, TieredReserve.memoryBytes(gib * GI));
  }

  @ParameterizedTest
  @CsvSource({
    // vCPUs, expected millicores: 6% of core 1, 1% of core 2, 0.5% of cores 3-4, 0.25% above.
    "1, 60",
    "2, 70",
    "4, 80",
    "5, 83", // 80 + 2.5 = 82.5m, rounded up to whole millicores
    "8, 90",
    "16, 110",
    "32, 150",
    "64, 230"
  })
  void cpuMillicores_tieredScale_matchesHandArithmetic(long vcpus, long expectedMillicores) {
    assertEquals(expectedMillicores, TieredReserve.cpuMillicores(vcpus));
  }

  @ParameterizedTest
  @CsvSource({"0, 0", "-1, 0"})
  void cpuMillicores_noCpu_reservesNothing(long vcpus, long expected) {
    assertEquals(expected, TieredReserve.cpuMillicores(vcpus));
    assertEquals(expected, TieredReserve.memoryBytes(vcpus));
  }
}
