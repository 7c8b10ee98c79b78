package dev.numafit.verify.fuzz;

import static org.junit.jupiter.api.Assertions.assertNotNull;

import com.code_intelligence.jazzer.junit.FuzzTest;
import dev.numafit.diag.InputException;
import dev.numafit.profile.HostProfileReader;
import org.junit.jupiter.api.Timeout;

/**
 * Coverage-guided fuzzing of the host-profile reader: the fuzzer's bytes as a profile file. The
 * reader returns a validated profile or throws {@link InputException} whose messages name the
 * file; any other exception is a finding; each input within the timeout.
 *
 * <p>Seeds: HostProfileFuzzTestInputs/hostProfileReader_anyText_profileOrInputException. Fuzz
 * with bench/fuzz.sh.
 */
class HostProfileFuzzTest {
  @FuzzTest(maxDuration = "15s")
  @Timeout(10)
  void hostProfileReader_anyText_profileOrInputException(byte[] data) {
    try {
      assertNotNull(new HostProfileReader().parse("host.yaml", FuzzChecks.text(data)));
    } catch (InputException ex) {
      FuzzChecks.refusalNames(ex, "host.yaml");
    }
  }
}
