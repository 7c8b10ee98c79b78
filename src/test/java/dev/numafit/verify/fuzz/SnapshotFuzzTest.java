package dev.numafit.verify.fuzz;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.code_intelligence.jazzer.junit.FuzzTest;
import dev.numafit.cluster.SnapshotFile;
import dev.numafit.cluster.model.ClusterModel;
import dev.numafit.diag.InputException;
import org.junit.jupiter.api.Timeout;

/**
 * Coverage-guided fuzzing of the snapshot reader: the fuzzer's bytes as a snapshot file. The
 * reader returns a cluster model or throws {@link InputException} whose messages name the file;
 * any other exception is a finding. A model it accepts must write back to a snapshot that reads
 * back equal (nothing accepted that numafit could not write itself); each input within the
 * timeout.
 *
 * <p>Seeds: SnapshotFuzzTestInputs/snapshotReader_anyText_modelOrInputException. Fuzz with
 * bench/fuzz.sh.
 */
class SnapshotFuzzTest {
  @FuzzTest(maxDuration = "15s")
  @Timeout(10)
  void snapshotReader_anyText_modelOrInputException(byte[] data) throws InputException {
    ClusterModel m;
    try {
      m = SnapshotFile.parse(FuzzChecks.text(data), "cluster.json");
    } catch (InputException ex) {
      FuzzChecks.refusalNames(ex, "cluster.json");
      return;
    }
    assertEquals(m, SnapshotFile.parse(SnapshotFile.toText(m), "again.json"));
  }
}
