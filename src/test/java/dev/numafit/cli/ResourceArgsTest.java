package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.numafit.resource.Resources;
import org.junit.jupiter.api.Test;

class ResourceArgsTest {
  @Test
  void parse_quantityForms_giveKubernetesValues() {
    // FACTS check value 4 (Quantity docs, K10): 123Mi = 128974848 bytes, 129M = 129e6 =
    // 129000000, 128974848000m = 128974848.
    assertEquals(128974848L, ResourceArgs.amount("memory", "123Mi"));
    assertEquals(129000000L, ResourceArgs.amount("memory", "129M"));
    assertEquals(129000000L, ResourceArgs.amount("memory", "129e6"));
    assertEquals(128974848L, ResourceArgs.amount("memory", "128974848000m"));
  }

  @Test
  void parse_cpu_inMillicoresRoundedUp() {
    // FACTS check value 5 (K10): cpu 0.1 = 100m, 1.5 = 1500m, 0.1m rounds up to 1m.
    assertEquals(100L, ResourceArgs.amount("cpu", "0.1"));
    assertEquals(1500L, ResourceArgs.amount("cpu", "1.5"));
    assertEquals(1L, ResourceArgs.amount("cpu", "0.1m"));
  }

  @Test
  void parse_memoryFraction_roundsUpToWholeByte() {
    // FACTS check value 5 (K10): memory 400m is 0.4 bytes; the scheduler counts whole bytes.
    assertEquals(1L, ResourceArgs.amount("memory", "400m"));
  }

  @Test
  void parse_workerList_buildsVector() {
    // 16 vCPU, 64Gi = 64 × 2^30 bytes, one device: the issue's own --worker example.
    assertEquals(
        Resources.of("cpu", 16000L, "memory", 68719476736L, "example.com/accel", 2L),
        ResourceArgs.parse("cpu=16,memory=64Gi,example.com/accel=2"));
  }

  @Test
  void parse_badItems_nameTheItemAndWhatIsAccepted() {
    assertEquals(
        "memory=64GG: not a Kubernetes quantity (expected e.g. 500m, 2, 64Gi)",
        assertThrows(IllegalArgumentException.class, () -> ResourceArgs.parse("memory=64GG"))
            .getMessage());
    assertEquals(
        "cpu=-1: must not be negative",
        assertThrows(IllegalArgumentException.class, () -> ResourceArgs.parse("cpu=-1"))
            .getMessage());
    assertEquals(
        "\"cpu\" is not name=amount (expected e.g. cpu=16,memory=64Gi)",
        assertThrows(IllegalArgumentException.class, () -> ResourceArgs.parse("cpu"))
            .getMessage());
    assertEquals(
        "\"cpu\" is given twice",
        assertThrows(IllegalArgumentException.class, () -> ResourceArgs.parse("cpu=1,cpu=2"))
            .getMessage());
  }

  @Test
  void parseEviction_kubeletSyntaxAndOurs_giveSameAmount() {
    // K11's example threshold memory.available<500Mi, written the kubelet's way and ours.
    Resources expected = Resources.of("memory", 500L * 1024 * 1024);
    assertEquals(expected, ResourceArgs.parseEviction("memory.available<500Mi").amounts());
    assertEquals(expected, ResourceArgs.parseEviction("memory.available=500Mi").amounts());
  }

  @Test
  void parseEviction_percentage_keptAsPercentOfCapacity() {
    // K11's example threshold nodefs.available<10%: a share of the node's disk.
    ResourceArgs.Eviction e =
        ResourceArgs.parseEviction("memory.available<500Mi,nodefs.available<10%");
    assertEquals(
        java.util.Map.of("ephemeral-storage", new java.math.BigDecimal("10")), e.percent());
    assertEquals(Resources.of("memory", 500L * 1024 * 1024), e.amounts());
  }

  @Test
  void parseEviction_unknownSignal_isRejected() {
    assertEquals(
        "unknown eviction signal \"pid.available\" (expected memory.available or"
            + " nodefs.available)",
        assertThrows(
                IllegalArgumentException.class,
                () -> ResourceArgs.parseEviction("pid.available=10"))
            .getMessage());
  }
}
