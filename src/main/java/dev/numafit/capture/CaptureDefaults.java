package dev.numafit.capture;

/**
 * The values a capture cannot read from the host, written into a captured profile as defaults and
 * marked "to confirm". None is a published figure: they are placeholders, chosen from memory to be
 * on the safe side for a typical hypervisor, and the profile says so.
 */
public final class CaptureDefaults {
  private static final long GIB = 1L << 30;

  /** Per-VM memory overhead of the hypervisor: 512 MiB (placeholder, from memory). */
  public static final long PER_VM_OVERHEAD_BYTES = 512L << 20;

  /** Whole cores kept by the hypervisor: none (the profile format's own default). */
  public static final int RESERVED_CORES = 0;

  private CaptureDefaults() {}

  /**
   * Memory the hypervisor keeps on the host: 2% of the host's memory rounded up to a whole GiB, at
   * least 1 GiB (placeholder, from memory).
   *
   * @param hostMemoryBytes the memory of the whole host in bytes
   */
  public static long reservedMemoryBytes(long hostMemoryBytes) {
    long twoPercent = (hostMemoryBytes + 49) / 50;
    long gib = (twoPercent + GIB - 1) / GIB;
    return Math.max(1, gib) * GIB;
  }
}
