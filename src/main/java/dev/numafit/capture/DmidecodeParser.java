package dev.numafit.capture;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.diag.SourceRef;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalLong;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads SMBIOS type 17 "Memory Device" records as {@code dmidecode -t 17} prints them (FACTS B4,
 * dmidecode's implementation of DMTF DSP0134 §7.18). Each record starts at a line
 * {@code Handle 0x0040, DMI type 17, 84 bytes}; the fields used are indented {@code Key: value}
 * lines: Size, Locator, Bank Locator, Type, Speed, Configured Memory Speed (older dmidecode:
 * Configured Clock Speed) and Rank.
 *
 * <p>Records of other types (a full {@code dmidecode} dump) are skipped; a file with no type 17
 * record at all is an error.
 */
public final class DmidecodeParser {
  private static final Pattern HANDLE =
      Pattern.compile("Handle\\s+0x[0-9A-Fa-f]+,\\s+DMI type\\s+(\\d+),\\s+(\\d+)\\s+bytes");
  private static final Pattern FIELD = Pattern.compile("\\s+([^:]+):\\s*(.*)");
  private static final Pattern SIZE = Pattern.compile("(\\d+)\\s+(bytes|kB|MB|GB|TB)");
  private static final Pattern SPEED = Pattern.compile("(\\d+)\\s+(MT/s|MHz)");

  private DmidecodeParser() {}

  /**
   * Parses every type 17 record of the text.
   *
   * @throws InputException every malformed field, each as {@code file:line: error: ...}
   */
  public static List<MemoryDevice> parse(TextFile file) throws InputException {
    if (file.isEmpty()) {
      throw new InputException(
          Diagnostic.error(
              file.at(1),
              "empty file: expected the output of dmidecode -t 17 (records starting"
                  + " \"Handle 0x..., DMI type 17, ... bytes\")"));
    }
    List<Diagnostic> errors = new ArrayList<>();
    List<MemoryDevice> devices = new ArrayList<>();
    int firstOtherType = 0;
    int otherTypeValue = -1;
    Record current = null;
    for (int i = 0; i < file.lines().size(); i++) {
      String line = file.lines().get(i);
      Matcher h = HANDLE.matcher(line.strip());
      if (h.matches()) {
        finish(current, devices, errors);
        current = null;
        int type = Integer.parseInt(h.group(1));
        if (type == 17) {
          current = new Record(file.at(i + 1));
        } else if (firstOtherType == 0) {
          firstOtherType = i + 1;
          otherTypeValue = type;
        }
        continue;
      }
      if (current == null) {
        continue;
      }
      Matcher f = FIELD.matcher(line);
      if (!f.matches()) {
        continue;
      }
      current.field(f.group(1).strip(), f.group(2).strip(), file.at(i + 1), errors);
    }
    finish(current, devices, errors);
    if (devices.isEmpty() && errors.isEmpty()) {
      if (firstOtherType > 0) {
        errors.add(
            Diagnostic.error(
                file.at(firstOtherType),
                "expected DMI type 17 (Memory Device) records as printed by dmidecode -t 17, got"
                    + " DMI type " + otherTypeValue + " and no type 17 record"));
      } else {
        errors.add(
            Diagnostic.error(
                file.at(1),
                "expected records starting \"Handle 0x..., DMI type 17, ... bytes\" (dmidecode"
                    + " -t 17), found none"));
      }
    }
    if (!errors.isEmpty()) {
      throw new InputException(errors);
    }
    return List.copyOf(devices);
  }

  private static void finish(Record r, List<MemoryDevice> out, List<Diagnostic> errors) {
    if (r == null) {
      return;
    }
    if (!r.sizeSeen) {
      errors.add(
          Diagnostic.error(
              r.source,
              "memory device record has no \"Size:\" line: expected one such as \"Size: 16 GB\""
                  + " or \"Size: No Module Installed\" (truncated file?)"));
      return;
    }
    if (r.failed) {
      return;
    }
    out.add(
        new MemoryDevice(
            r.source,
            r.installed,
            r.size,
            r.locator,
            r.bankLocator,
            r.type,
            r.speed,
            r.configuredSpeed,
            r.rank));
  }

  /** The fields of one record as they are read. */
  private static final class Record {
    final SourceRef source;
    boolean sizeSeen;
    boolean installed;
    boolean failed;
    OptionalLong size = OptionalLong.empty();
    String locator = "";
    String bankLocator = "";
    String type = "";
    int speed;
    int configuredSpeed;
    int rank;

    Record(SourceRef source) {
      this.source = source;
    }

    void field(String key, String value, SourceRef at, List<Diagnostic> errors) {
      switch (key) {
        case "Size" -> size(value, at, errors);
        case "Locator" -> locator = known(value) ? value : "";
        case "Bank Locator" -> bankLocator = known(value) ? value : "";
        case "Type" -> type = known(value) ? value : "";
        case "Speed" -> speed = speed(key, value, at, errors);
        case "Configured Memory Speed", "Configured Clock Speed" ->
            configuredSpeed = speed(key, value, at, errors);
        case "Rank" -> rank = rank(value, at, errors);
        default -> {
          // Other fields (widths, serial numbers, voltages) do not affect sizing.
        }
      }
    }

    private void size(String value, SourceRef at, List<Diagnostic> errors) {
      sizeSeen = true;
      if (value.equalsIgnoreCase("No Module Installed") || value.equalsIgnoreCase("Not Installed")) {
        installed = false;
        return;
      }
      installed = true;
      if (value.equalsIgnoreCase("Unknown")) {
        return;
      }
      Matcher m = SIZE.matcher(value);
      if (!m.matches() || m.group(1).length() > 12) {
        fail(
            errors,
            at,
            "expected Size as a number with bytes, kB, MB, GB or TB, \"No Module Installed\" or"
                + " \"Unknown\", got \"" + value + "\"");
        return;
      }
      long n = Long.parseLong(m.group(1));
      // dmidecode's kB, MB, GB and TB are binary multiples (FACTS B4).
      int shift =
          switch (m.group(2)) {
            case "kB" -> 10;
            case "MB" -> 20;
            case "GB" -> 30;
            case "TB" -> 40;
            default -> 0;
          };
      if (n > (Long.MAX_VALUE >> shift)) {
        fail(errors, at, "Size " + value + " is too large");
        return;
      }
      size = OptionalLong.of(n << shift);
    }

    private int speed(String key, String value, SourceRef at, List<Diagnostic> errors) {
      if (!known(value)) {
        return 0;
      }
      Matcher m = SPEED.matcher(value);
      if (!m.matches() || m.group(1).length() > 6) {
        fail(
            errors,
            at,
            "expected " + key + " such as \"3200 MT/s\" or \"Unknown\", got \"" + value + "\"");
        return 0;
      }
      // Older dmidecode releases printed the transfer rate with the unit "MHz" (from memory);
      // the number is the same MT/s figure.
      return Integer.parseInt(m.group(1));
    }

    private int rank(String value, SourceRef at, List<Diagnostic> errors) {
      if (!known(value)) {
        return 0;
      }
      if (value.length() > 3 || !value.chars().allMatch(Character::isDigit)) {
        fail(errors, at, "expected Rank as a whole number or \"Unknown\", got \"" + value + "\"");
        return 0;
      }
      return Integer.parseInt(value);
    }

    private void fail(List<Diagnostic> errors, SourceRef at, String message) {
      failed = true;
      errors.add(Diagnostic.error(at, message));
    }

    private static boolean known(String value) {
      String v = value.toLowerCase(Locale.ROOT);
      return !(v.isEmpty() || v.equals("unknown") || v.equals("not specified") || v.equals("none"));
    }
  }
}
