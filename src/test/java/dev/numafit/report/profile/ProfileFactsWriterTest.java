package dev.numafit.report.profile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.profile.HostProfileReader;
import dev.numafit.resource.Resources;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

class ProfileFactsWriterTest {
  private static final String FILE = "src/test/resources/profile-show/captured-two-sockets.yaml";

  private static ProfileFacts facts() throws Exception {
    return ProfileFacts.of(FILE, new HostProfileReader().read(Path.of(FILE)));
  }

  @Test
  void of_capturedDdr4Profile_bandwidthPerNodeFromFourChannels() throws Exception {
    // FACTS check value 21 (H1): DDR4-3200 → 25.6 GB/s a channel; 4 channels → 102.4 GB/s.
    assertEquals(
        102_400_000_000L, facts().nodes().get(0).peakBandwidthBytesPerSecond().getAsLong());
  }

  @Test
  void of_eightCoreNode_oneNodeWorkerAndTieredCpuReserve() throws Exception {
    ProfileFacts f = facts();
    assertEquals(8, f.worker().vcpus());
    // 64 GiB node − half the 3 GiB reserve − 512 MiB overhead = 62 GiB, already whole.
    assertEquals(62L << 30, f.worker().memoryBytes());
    // Tiered kube-reserved CPU (issue 2's scale, common practice, from memory): 6% of the first
    // core (60m) + 1% of the second (10m) + 0.5% of the next two (10m) + 0.25% of the other four
    // (10m) = 90m, so 8000m − 90m = 7910m.
    assertEquals(7910L, f.allocatable().allocatable().get(Resources.CPU));
    // maxPods default 110 (FACTS A4, K13).
    assertEquals(110L, f.allocatable().allocatable().get(Resources.PODS));
  }

  @Test
  void text_capturedProfile_matchesGolden() throws Exception {
    String actual = ProfileFactsWriter.text(facts());
    Path golden = Path.of("src/test/resources/profile-show/captured-two-sockets.txt");
    if (Boolean.getBoolean("numafit.regenerateGolden")) {
      Files.writeString(golden, actual, StandardCharsets.UTF_8);
    }
    assertEquals(Files.readString(golden, StandardCharsets.UTF_8), actual);
    assertTrue(actual.lines().allMatch(l -> l.length() <= 80 || l.startsWith("host profile ")), actual);
  }

  @Test
  void json_capturedProfile_matchesGoldenAndIsStable() throws Exception {
    String actual = ProfileFactsWriter.json(facts());
    Path golden = Path.of("src/test/resources/profile-show/captured-two-sockets.json");
    if (Boolean.getBoolean("numafit.regenerateGolden")) {
      Files.writeString(golden, actual, StandardCharsets.UTF_8);
    }
    assertEquals(Files.readString(golden, StandardCharsets.UTF_8), actual);
    assertEquals(actual, ProfileFactsWriter.json(facts()));
  }
}
