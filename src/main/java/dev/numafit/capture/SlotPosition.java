package dev.numafit.capture;

import java.util.Objects;

/**
 * Where a memory slot sits, as read from its locator strings.
 *
 * @param socket socket index, 0-based, numbered in the order the locators name them
 * @param channel the channel's name as the locator writes it ({@code A}, {@code 3})
 * @param slot the slot within the channel, 0-based in the order the locators number them
 */
public record SlotPosition(int socket, String channel, int slot) {
  public SlotPosition {
    Objects.requireNonNull(channel, "channel");
    if (socket < 0 || slot < 0) {
      throw new IllegalArgumentException("socket and slot must be >= 0");
    }
  }
}
