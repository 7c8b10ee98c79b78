package dev.numafit.shape;

import dev.numafit.host.ByteUnits;
import dev.numafit.resource.Resources;

/**
 * The default kube-reserved used when none is given: a tiered scale by worker size (common
 * practice, from memory; no published Kubernetes default exists — the kubelet itself reserves
 * nothing unless told).
 *
 * <p>Memory: 25% of the first 4 GiB, 20% of the next 4 GiB, 10% of the next 8 GiB, 6% of the next
 * 112 GiB and 2% of everything above 128 GiB; rounded up to a whole MiB so the kubelet
 * configuration carries a readable exact value. CPU: 6% of the first core, 1% of the second, 0.5%
 * of the next two and 0.25% of every core above four; rounded up to a whole millicore (a
 * reservation finer than 1m cannot be written, FACTS A3).
 */
public final class TieredReserve {
  private static final long GIB = ByteUnits.GIB;

  /** Memory tiers: upper bound of each tier in GiB and its percentage. */
  private static final long[][] MEMORY_TIERS = {{4, 25}, {8, 20}, {16, 10}, {128, 6}};

  private static final long MEMORY_PERCENT_ABOVE = 2;

  private TieredReserve() {}

  /** Tiered kube-reserved memory in bytes for a worker of {@code memoryBytes}. */
  public static long memoryBytes(long memoryBytes) {
    if (memoryBytes <= 0) {
      return 0;
    }
    // Sum bytes × percent exactly, then divide once: no rounding inside the tiers.
    long hundredths = 0;
    long lower = 0;
    for (long[] tier : MEMORY_TIERS) {
      long upper = tier[0] * GIB;
      long inTier = Math.max(0, Math.min(memoryBytes, upper) - lower);
      hundredths = Math.addExact(hundredths, Math.multiplyExact(inTier, tier[1]));
      lower = upper;
    }
    hundredths =
        Math.addExact(
            hundredths, Math.multiplyExact(Math.max(0, memoryBytes - lower), MEMORY_PERCENT_ABOVE));
    long bytes = ceilDiv(hundredths, 100);
    return ceilDiv(bytes, ByteUnits.MIB) * ByteUnits.MIB;
  }

  /** Tiered kube-reserved CPU in millicores for a worker of {@code vcpus}. */
  public static long cpuMillicores(long vcpus) {
    if (vcpus <= 0) {
      return 0;
    }
    // In ten-thousandths of a core: 6% = 600, 1% = 100, 0.5% = 50, 0.25% = 25; 1m = 10 of them.
    long units = 600;
    units += 100 * Math.min(Math.max(vcpus - 1, 0), 1);
    units += 50 * Math.min(Math.max(vcpus - 2, 0), 2);
    units += Math.multiplyExact(25L, Math.max(vcpus - 4, 0));
    return ceilDiv(units, 10);
  }

  /** Tiered kube-reserved for a worker: {@code cpu} in millicores and {@code memory} in bytes. */
  public static Resources forWorker(long vcpus, long memoryBytes) {
    return Resources.of(
        Resources.CPU, cpuMillicores(vcpus), Resources.MEMORY, memoryBytes(memoryBytes));
  }

  private static long ceilDiv(long a, long b) {
    return -Math.floorDiv(-a, b);
  }
}
