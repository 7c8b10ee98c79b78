package dev.numafit.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import java.util.List;
import java.util.OptionalLong;
import org.junit.jupiter.api.Test;

class DmidecodeParserTest {
  private static final long GIB = 1L << 30;

  private static String record(String handle, String... fields) {
    StringBuilder b = new StringBuilder("Handle " + handle + ", DMI type 17, 92 bytes\n");
    b.append("Memory Device\n");
    for (String f : fields) {
      b.append('\t').append(f).append('\n');
    }
    return b.append('\n').toString();
  }

  @Test
  void parse_sizeForms_matchDmidecodeOutputForEachRawValue() throws Exception {
    // FACTS check value 24 (dmidecode.c, H4): Size 0x0000 prints "No Module Installed", 0xFFFF
    // "Unknown", 0x4000 (16384 MB) "16 GB", 0x7FFF with Extended Size 0x10000 MB "64 GB"; the
    // GB are binary. Speed 3200 prints "3200 MT/s", attributes 0x02 "Rank: 2".
    String text =
        record("0x0001", "Size: No Module Installed", "Locator: A1")
            + record("0x0002", "Size: Unknown", "Locator: A2")
            + record("0x0003", "Size: 16 GB", "Locator: B1", "Speed: 3200 MT/s", "Rank: 2")
            + record("0x0004", "Size: 64 GB", "Locator: B2", "Type: DDR5")
            + record("0x0005", "Size: 16384 MB", "Locator: C1");
    List<MemoryDevice> d = DmidecodeParser.parse(TextFile.of("t.txt", text));
    assertEquals(5, d.size());
    assertFalse(d.get(0).installed());
    assertEquals(OptionalLong.empty(), d.get(0).sizeBytes());
    assertTrue(d.get(1).installed());
    assertEquals(OptionalLong.empty(), d.get(1).sizeBytes());
    assertEquals(OptionalLong.of(16 * GIB), d.get(2).sizeBytes());
    assertEquals(3200, d.get(2).speedMts());
    assertEquals(2, d.get(2).rank());
    assertEquals(OptionalLong.of(64 * GIB), d.get(3).sizeBytes());
    assertEquals("DDR5", d.get(3).type());
    assertEquals(OptionalLong.of(16 * GIB), d.get(4).sizeBytes());
  }

  @Test
  void parse_unknownSpeedAndRank_areZero() throws Exception {
    // FACTS B4 (H4): Speed 0 and Rank 0 print "Unknown".
    List<MemoryDevice> d =
        DmidecodeParser.parse(
            TextFile.of(
                "t.txt",
                record(
                    "0x0001",
                    "Size: 8 GB",
                    "Speed: Unknown",
                    "Rank: Unknown",
                    "Configured Memory Speed: Unknown")));
    assertEquals(0, d.get(0).speedMts());
    assertEquals(0, d.get(0).rank());
    assertEquals(0, d.get(0).configuredSpeedMts());
  }

  @Test
  void parse_olderFieldNamesAndUnits_readAsTheSameNumbers() throws Exception {
    // Older dmidecode releases print "Configured Clock Speed" and the unit MHz for the same
    // transfer-rate figure (from memory; FACTS B4 describes the current names).
    List<MemoryDevice> d =
        DmidecodeParser.parse(
            TextFile.of(
                "t.txt",
                record(
                    "0x0001",
                    "Size: 16384 MB",
                    "Locator: DIMM_A1",
                    "Bank Locator: Not Specified",
                    "Speed: 2666 MHz",
                    "Configured Clock Speed: 2400 MHz")));
    assertEquals(2666, d.get(0).speedMts());
    assertEquals(2400, d.get(0).configuredSpeedMts());
    assertEquals("", d.get(0).bankLocator());
    assertEquals("DIMM_A1", d.get(0).label());
  }

  @Test
  void parse_fixture_readsLocatorsAndConfiguredSpeed() throws Exception {
    List<MemoryDevice> d = DmidecodeParser.parse(Fixtures.text("capture/one-node-unbalanced.dmidecode.txt"));
    assertEquals(4, d.size());
    assertEquals("DIMM_B1", d.get(1).locator());
    assertEquals("BANK 1", d.get(1).bankLocator());
    assertEquals(3200, d.get(1).speedMts());
    assertEquals(2933, d.get(1).configuredSpeedMts());
    assertFalse(d.get(3).installed());
    assertEquals(5, d.get(0).source().line());
  }

  @Test
  void parse_crlfInput_readsLikeLf() throws Exception {
    String lf = record("0x0001", "Size: 8 GB", "Locator: A1", "Speed: 3200 MT/s");
    assertEquals(
        DmidecodeParser.parse(TextFile.of("t.txt", lf)),
        DmidecodeParser.parse(TextFile.of("t.txt", lf.replace("\n", "\r\n"))));
  }

  @Test
  void parse_otherDmiType_errorAtItsHandleLine() throws Exception {
    TextFile f = Fixtures.text("capture/processor.dmidecode.txt");
    InputException e = assertThrows(InputException.class, () -> DmidecodeParser.parse(f));
    assertEquals(
        List.of(
            f.name() + ":5: error: expected DMI type 17 (Memory Device) records as printed by"
                + " dmidecode -t 17, got DMI type 4 and no type 17 record"),
        formatted(e));
  }

  @Test
  void parse_emptyFile_errorAtLineOne() throws Exception {
    TextFile f = Fixtures.text("capture/empty.txt");
    InputException e = assertThrows(InputException.class, () -> DmidecodeParser.parse(f));
    assertEquals(
        List.of(
            f.name() + ":1: error: empty file: expected the output of dmidecode -t 17 (records"
                + " starting \"Handle 0x..., DMI type 17, ... bytes\")"),
        formatted(e));
  }

  @Test
  void parse_badValues_everyErrorWithItsLine() {
    String text =
        record("0x0001", "Size: lots", "Locator: A1")
            + record("0x0002", "Size: 8 GB", "Speed: fast", "Rank: two");
    InputException e =
        assertThrows(InputException.class, () -> DmidecodeParser.parse(TextFile.of("m.txt", text)));
    assertEquals(
        List.of(
            "m.txt:3: error: expected Size as a number with bytes, kB, MB, GB or TB, \"No Module"
                + " Installed\" or \"Unknown\", got \"lots\"",
            "m.txt:9: error: expected Speed such as \"3200 MT/s\" or \"Unknown\", got \"fast\"",
            "m.txt:10: error: expected Rank as a whole number or \"Unknown\", got \"two\""),
        formatted(e));
  }

  @Test
  void parse_recordCutBeforeSize_errorAtHandle() {
    String text = "# dmidecode 3.5\n\nHandle 0x0011, DMI type 17, 92 bytes\nMemory Device\n";
    InputException e =
        assertThrows(InputException.class, () -> DmidecodeParser.parse(TextFile.of("m.txt", text)));
    assertEquals(
        List.of(
            "m.txt:3: error: memory device record has no \"Size:\" line: expected one such as"
                + " \"Size: 16 GB\" or \"Size: No Module Installed\" (truncated file?)"),
        formatted(e));
  }

  @Test
  void parse_fullDumpWithOtherTypes_keepsOnlyType17() throws Exception {
    String text =
        "Handle 0x0004, DMI type 4, 48 bytes\nProcessor Information\n\tVersion: Example CPU\n\n"
            + record("0x0011", "Size: 32 GB", "Locator: A1");
    List<MemoryDevice> d = DmidecodeParser.parse(TextFile.of("m.txt", text));
    assertEquals(1, d.size());
    assertEquals(OptionalLong.of(32 * GIB), d.get(0).sizeBytes());
  }

  private static List<String> formatted(InputException e) {
    return e.diagnostics().stream().map(Diagnostic::format).toList();
  }
}
