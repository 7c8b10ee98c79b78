package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * {@code numafit plan} at the default effort, through {@link Main#run}, on published vector
 * instances written as pods ({@link PublishedAsPods}): the worker count is the proven optimum.
 */
class PlanPublishedInstanceTest {
  @TempDir Path dir;

  @ParameterizedTest(name = "{0}")
  @CsvSource({
    // file, capacity per dimension, proven optimum: OPT column of
    // results_data/Panigrahy_summary_known.csv in Vectorpack/experiments_vector_paper
    // (bench/SOURCE.md in the test resources). Both need the packer's dive over the linear
    // relaxation: the local search alone stops one worker above.
    "class6_120_3_1.vbp, 150, 51",
    "class7_120_3_3.vbp, 150, 50",
  })
  void plan_defaultEffort_reachesProvenOptimum(String file, int cap, int optimum)
      throws IOException {
    Path manifest = PublishedAsPods.write(dir, file);
    CliRun r = CliRun.of("plan", "-f", manifest.toString(), "--worker",
        "cpu=" + cap + ",memory=" + cap + "Gi,example.com/slots=" + cap, "--kubelet-reserve",
        "none", "--max-pods", "1000", "-o", "json");
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("\"workersNeeded\": " + optimum + ","), r.out());
  }
}
