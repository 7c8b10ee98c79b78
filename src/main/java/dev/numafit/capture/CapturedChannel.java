package dev.numafit.capture;

import java.util.List;
import java.util.Objects;

/**
 * One memory channel of a captured node and the modules in it.
 *
 * @param name the channel's name from the slot locators ({@code A}, {@code 0})
 * @param dimmBytes installed module sizes in bytes, in slot order; empty for an empty channel
 * @param slots the locator of each slot in the channel (installed or not), for comments
 */
public record CapturedChannel(String name, List<Long> dimmBytes, List<String> slots) {
  public CapturedChannel {
    Objects.requireNonNull(name, "name");
    dimmBytes = List.copyOf(dimmBytes);
    slots = List.copyOf(slots);
  }
}
