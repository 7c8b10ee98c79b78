package dev.numafit.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.numafit.diag.SourceRef;
import java.util.List;
import java.util.Optional;
import java.util.OptionalLong;
import org.junit.jupiter.api.Test;

/** The locator patterns docs/profile-capture.md lists, one test per general form. */
class SlotMapperTest {
  private static MemoryDevice slot(String locator, String bank) {
    return new MemoryDevice(
        new SourceRef("t", 1), true, OptionalLong.of(1L << 34), locator, bank, "DDR5", 4800, 4800,
        1);
  }

  private static Optional<List<SlotPosition>> map(String... locatorBankPairs) {
    List<MemoryDevice> devices = new java.util.ArrayList<>();
    for (int i = 0; i < locatorBankPairs.length; i += 2) {
      devices.add(slot(locatorBankPairs[i], locatorBankPairs[i + 1]));
    }
    return SlotMapper.map(devices);
  }

  @Test
  void map_cpuAndDimmLetterDigit_oneBasedSocketsRebased() {
    assertEquals(
        Optional.of(
            List.of(new SlotPosition(0, "A", 0), new SlotPosition(0, "A", 1),
                new SlotPosition(1, "B", 0))),
        map("CPU1_DIMM_A1", "NODE 1", "CPU1_DIMM_A2", "NODE 1", "CPU2_DIMM_B1", "NODE 2"));
  }

  @Test
  void map_packageLetterInLocator_zeroBasedSockets() {
    assertEquals(
        Optional.of(List.of(new SlotPosition(0, "A", 0), new SlotPosition(1, "A", 0))),
        map("P0-DIMMA1", "", "P1-DIMMA1", ""));
  }

  @Test
  void map_channelWordInBankLocator_numberedChannelAndSlot() {
    assertEquals(
        Optional.of(List.of(new SlotPosition(0, "3", 0), new SlotPosition(0, "3", 1))),
        map("DIMM 6", "P0_Node0_Channel3_Dimm0", "DIMM 7", "P0_Node0_Channel3_Dimm1"));
  }

  @Test
  void map_channelLetterWordWithDimmNumber_desktopStyle() {
    assertEquals(
        Optional.of(List.of(new SlotPosition(0, "A", 0), new SlotPosition(0, "B", 0))),
        map("ChannelA-DIMM0", "BANK 0", "ChannelB-DIMM0", "BANK 2"));
  }

  @Test
  void map_procNumberWithBareLetterDigit_mapped() {
    assertEquals(
        Optional.of(List.of(new SlotPosition(0, "A", 0), new SlotPosition(1, "A", 0))),
        map("A1", "PROC 1", "A1", "PROC 2"));
  }

  @Test
  void map_slotNumbersOnly_notMapped() {
    // "PROC 1 DIMM 3" names a socket and a slot but no channel: the population stays counts.
    assertEquals(Optional.empty(), map("PROC 1 DIMM 3", "", "PROC 1 DIMM 4", ""));
  }

  @Test
  void map_oneSlotUnreadable_nothingMapped() {
    assertEquals(Optional.empty(), map("DIMM_A1", "", "Memory Slot 2", ""));
  }

  @Test
  void map_socketOnSomeSlotsOnly_nothingMapped() {
    assertEquals(Optional.empty(), map("CPU1_DIMM_A1", "", "DIMM_B1", ""));
  }

  @Test
  void map_twoSlotsAtOnePlace_nothingMapped() {
    assertEquals(Optional.empty(), map("DIMM_A1", "BANK 0", "DIMM_A1", "BANK 1"));
  }
}
