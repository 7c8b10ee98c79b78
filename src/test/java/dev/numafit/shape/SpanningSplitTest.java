package dev.numafit.shape;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.util.List;
import org.junit.jupiter.api.Test;

class SpanningSplitTest {
  private static final long GI = 1L << 30;

  @Test
  void of_16VcpusOn12CoreNodes_twoHalvesOf8() {
    // Common practice, the usual worked example: a 16-vCPU VM on 12-core nodes is split by
    // the hypervisor into two virtual NUMA nodes of 8 vCPUs.
    SpanningSplit s = SpanningSplit.of(16, 64 * GI, 12, 96 * GI);
    assertEquals(List.of(8L, 8L), s.vcpusPerNode());
    assertEquals(List.of(32 * GI, 32 * GI), s.memoryBytesPerNode());
    assertEquals(
        "a 16-vCPU worker on nodes of 12 vCPUs is split by the hypervisor into 2 virtual NUMA"
            + " nodes of 8 vCPUs each (common practice); its memory is split the same way and a"
            + " pod on it may reach remote memory",
        s.describe(12));
  }

  @Test
  void of_memoryWiderThanANode_spansForMemory() {
    // 8 vCPUs fit one 12-core node, but 100Gi does not fit 64Gi nodes: two nodes of 4 vCPUs.
    SpanningSplit s = SpanningSplit.of(8, 100 * GI, 12, 64 * GI);
    assertEquals(List.of(4L, 4L), s.vcpusPerNode());
  }

  @Test
  void of_unevenCount_largerPartsFirst() {
    SpanningSplit s = SpanningSplit.of(25, 30 * GI, 12, 96 * GI);
    assertEquals(List.of(9L, 8L, 8L), s.vcpusPerNode());
    assertEquals(List.of(10 * GI, 10 * GI, 10 * GI), s.memoryBytesPerNode());
  }

  @Test
  void of_fitsOneNode_doesNotSpan() {
    assertFalse(SpanningSplit.of(12, 64 * GI, 12, 64 * GI).spans());
  }
}
