package dev.numafit.verify.fuzz;

import static org.junit.jupiter.api.Assertions.assertNotNull;

import com.code_intelligence.jazzer.junit.FuzzTest;
import dev.numafit.demand.Demand;
import dev.numafit.manifest.ManifestReader;
import dev.numafit.manifest.ReadOptions;
import java.util.TreeMap;
import org.junit.jupiter.api.Timeout;

/**
 * Coverage-guided fuzzing of the manifest reader: the fuzzer's bytes are read as one YAML file
 * and as one JSON file in the same run. The reader must answer with workloads and diagnostics
 * that name their file, never with an exception and never through its own safety net; each
 * input within the timeout.
 *
 * <p>Seeds: ManifestFuzzTestInputs/manifestReader_anyText_diagnosticsNeverAnException (valid
 * manifests and broken ones from the bad-input corpus). Fuzz with bench/fuzz.sh.
 */
class ManifestFuzzTest {
  @FuzzTest(maxDuration = "15s")
  @Timeout(10)
  void manifestReader_anyText_diagnosticsNeverAnException(byte[] data) {
    String text = FuzzChecks.text(data);
    TreeMap<String, String> in = new TreeMap<>();
    in.put("fuzz.yaml", text);
    in.put("fuzz.json", text);
    Demand d = new ManifestReader().readTexts(in, ReadOptions.defaults()).demand();
    assertNotNull(d);
    FuzzChecks.noSafetyNet(d.diagnostics());
  }
}
