package dev.numafit.capture;

import dev.numafit.diag.SourceRef;
import java.util.Objects;
import java.util.OptionalLong;

/**
 * One memory device slot from SMBIOS type 17 as {@code dmidecode -t 17} prints it (FACTS B4).
 *
 * @param source the {@code Handle} line of the record
 * @param installed false for "Size: No Module Installed"
 * @param sizeBytes module size in bytes (dmidecode's kB/MB/GB/TB are binary); empty when no module
 *     is installed or the size is "Unknown"
 * @param locator {@code Locator}, empty when not printed
 * @param bankLocator {@code Bank Locator}, empty when not printed
 * @param type memory type such as {@code DDR4}, {@code DDR5}; empty when unknown
 * @param speedMts rated {@code Speed} in MT/s, 0 when unknown
 * @param configuredSpeedMts {@code Configured Memory Speed} in MT/s, 0 when unknown
 * @param rank {@code Rank}, 0 when unknown
 */
public record MemoryDevice(
    SourceRef source,
    boolean installed,
    OptionalLong sizeBytes,
    String locator,
    String bankLocator,
    String type,
    int speedMts,
    int configuredSpeedMts,
    int rank) {
  public MemoryDevice {
    Objects.requireNonNull(source, "source");
    Objects.requireNonNull(sizeBytes, "sizeBytes");
    Objects.requireNonNull(locator, "locator");
    Objects.requireNonNull(bankLocator, "bankLocator");
    Objects.requireNonNull(type, "type");
    if (!installed && sizeBytes.isPresent()) {
      throw new IllegalArgumentException("an empty slot has no size");
    }
    if (speedMts < 0 || configuredSpeedMts < 0 || rank < 0) {
      throw new IllegalArgumentException("speed and rank must be >= 0");
    }
  }

  /** The slot's name for messages: locator and bank locator when both are known. */
  public String label() {
    if (locator.isEmpty()) {
      return bankLocator.isEmpty() ? source.toString() : bankLocator;
    }
    return bankLocator.isEmpty() ? locator : locator + " (" + bankLocator + ")";
  }
}
