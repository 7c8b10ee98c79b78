package dev.numafit.capture;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Maps SMBIOS memory slots to sockets and channels from their Locator and Bank Locator strings.
 * Firmware writes these freely; the patterns recognised are the common general forms:
 *
 * <ul>
 *   <li>socket: a token {@code P<n>}, {@code CPU<n>}, {@code PROC <n>} or {@code SOCKET <n>}
 *       (case-insensitive, optional space or underscore before the number), in either string;
 *   <li>channel: {@code CHANNEL<x>} or {@code CH<x>} where x is a letter or a number; else
 *       {@code DIMM<letter><digit>} ({@code DIMM_A1}, {@code DIMMB2}) where the letter is the
 *       channel and the digit the slot; else a whole locator of one letter and a digit
 *       ({@code A1});
 *   <li>slot within the channel: {@code DIMM<n>} or {@code D<n>} after the channel, or the digit
 *       after the channel letter.
 * </ul>
 *
 * <p>Socket numbers are rebased so the lowest one seen is socket 0 (firmware counts from 0 or 1);
 * slots likewise per channel. A slot with no socket token is on socket 0 when no slot names a
 * socket at all. Anything else is not mapped, and the caller reports the population as counts,
 * to be confirmed by the user.
 */
public final class SlotMapper {
  private static final Pattern SOCKET =
      Pattern.compile("(?:^|[^A-Z0-9])(?:P|CPU|PROC|SOCKET)[ _]?(\\d{1,2})(?![0-9])");
  private static final Pattern CHANNEL =
      Pattern.compile("(?:^|[^A-Z0-9])(?:CHANNEL|CH)[ _]?([A-Z]|\\d{1,2})(?![A-Z0-9])");
  private static final Pattern CHANNEL_SLOT_AFTER =
      Pattern.compile("(?:CHANNEL|CH)[ _]?(?:[A-Z]|\\d{1,2})[ _-]*(?:DIMM|D)[ _]?(\\d{1,2})");
  private static final Pattern DIMM_LETTER =
      Pattern.compile("(?:^|[^A-Z0-9])DIMM[ _-]?([A-Z])[ _]?(\\d{1,2})(?![0-9])");
  private static final Pattern BARE = Pattern.compile("([A-Z])[ _]?(\\d{1,2})");

  private SlotMapper() {}

  /** A slot's raw position before rebasing: socket number when named, channel, slot number. */
  private record Raw(OptionalInt socket, String channel, int slot) {}

  /**
   * Maps every device, or none: the result is empty when any slot's locators fit no pattern,
   * because a partial mapping would misstate a channel's population.
   *
   * @return one position per device, in the same order
   */
  public static Optional<List<SlotPosition>> map(List<MemoryDevice> devices) {
    if (devices.isEmpty()) {
      return Optional.empty();
    }
    List<Raw> raws = new ArrayList<>();
    for (MemoryDevice d : devices) {
      Optional<Raw> r = parse(d.locator(), d.bankLocator());
      if (r.isEmpty()) {
        return Optional.empty();
      }
      raws.add(r.get());
    }
    boolean anySocket = raws.stream().anyMatch(r -> r.socket().isPresent());
    boolean allSocket = raws.stream().allMatch(r -> r.socket().isPresent());
    if (anySocket && !allSocket) {
      return Optional.empty();
    }
    int base =
        anySocket ? raws.stream().mapToInt(r -> r.socket().getAsInt()).min().orElse(0) : 0;
    // Slots count from 0 or 1 depending on the firmware: rebase on the lowest number seen.
    int slotBase = raws.stream().mapToInt(Raw::slot).min().orElse(0);
    List<SlotPosition> out = new ArrayList<>();
    for (Raw r : raws) {
      int socket = anySocket ? r.socket().getAsInt() - base : 0;
      out.add(new SlotPosition(socket, r.channel(), r.slot() - slotBase));
    }
    long distinct = out.stream().distinct().count();
    if (distinct != out.size()) {
      // Two slots at the same place: the pattern read something else than a position.
      return Optional.empty();
    }
    return Optional.of(List.copyOf(out));
  }

  private static Optional<Raw> parse(String locator, String bankLocator) {
    String loc = locator.toUpperCase(Locale.ROOT).strip();
    String bank = bankLocator.toUpperCase(Locale.ROOT).strip();
    OptionalInt socket = OptionalInt.empty();
    for (String s : List.of(loc, bank)) {
      Matcher m = SOCKET.matcher(s);
      if (m.find()) {
        socket = OptionalInt.of(Integer.parseInt(m.group(1)));
        break;
      }
    }
    for (String s : List.of(loc, bank)) {
      Matcher m = CHANNEL.matcher(s);
      if (m.find()) {
        int slot = 0;
        boolean slotFound = false;
        for (String t : List.of(s, loc, bank)) {
          Matcher a = CHANNEL_SLOT_AFTER.matcher(t);
          if (a.find()) {
            slot = Integer.parseInt(a.group(1));
            slotFound = true;
            break;
          }
        }
        if (!slotFound) {
          Matcher d = Pattern.compile("(?:^|[^A-Z0-9])DIMM[ _]?(\\d{1,2})(?![0-9])").matcher(loc);
          if (d.find()) {
            slot = Integer.parseInt(d.group(1));
          }
        }
        return Optional.of(new Raw(socket, stripZeros(m.group(1)), slot));
      }
    }
    for (String s : List.of(loc, bank)) {
      Matcher m = DIMM_LETTER.matcher(s);
      if (m.find()) {
        return Optional.of(new Raw(socket, m.group(1), Integer.parseInt(m.group(2))));
      }
    }
    Matcher m = BARE.matcher(loc);
    if (m.matches()) {
      return Optional.of(new Raw(socket, m.group(1), Integer.parseInt(m.group(2))));
    }
    return Optional.empty();
  }

  private static String stripZeros(String channel) {
    if (channel.chars().allMatch(Character::isDigit)) {
      return Integer.toString(Integer.parseInt(channel));
    }
    return channel;
  }
}
