package dev.numafit.verify.fuzz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.code_intelligence.jazzer.junit.FuzzTest;
import dev.numafit.demand.Demand;
import dev.numafit.demand.PodArithmetic;
import dev.numafit.diag.Severity;
import dev.numafit.manifest.ManifestReader;
import dev.numafit.manifest.PodSpecConversion;
import dev.numafit.manifest.ReadOptions;
import io.fabric8.kubernetes.api.model.PodSpec;
import io.fabric8.kubernetes.api.model.PodSpecBuilder;
import io.fabric8.kubernetes.api.model.Quantity;
import java.util.TreeMap;
import org.junit.jupiter.api.Timeout;
import tools.jackson.databind.json.JsonMapper;

/**
 * Coverage-guided fuzzing of the quantity path: one amount, taken as text from the fuzzer, is
 * written as a container's CPU request and memory request and limit and read twice, through the
 * manifest reader (a Pod in a JSON file) and through the pod-spec conversion the cluster reader
 * uses (a fabric8 Quantity). Either the pod is sized or the amount is refused with a message
 * naming the file and the object; no other exception, and each input within the timeout.
 *
 * <p>Seeds: QuantityFuzzTestInputs/quantityPath_anyAmount_sizedOrRefused. Fuzz with
 * bench/fuzz.sh.
 */
class QuantityFuzzTest {
  private static final JsonMapper JSON = JsonMapper.builder().build();

  @FuzzTest(maxDuration = "15s")
  @Timeout(10)
  void quantityPath_anyAmount_sizedOrRefused(byte[] data) {
    String amount = FuzzChecks.text(data);
    String q = JSON.writeValueAsString(amount);
    String pod = "{\"apiVersion\":\"v1\",\"kind\":\"Pod\",\"metadata\":{\"name\":\"meter\","
        + "\"namespace\":\"tariffs\"},\"spec\":{\"containers\":[{\"name\":\"c\",\"resources\":"
        + "{\"requests\":{\"cpu\":" + q + ",\"memory\":" + q + "},\"limits\":{\"memory\":" + q
        + "}}}]}}";
    TreeMap<String, String> in = new TreeMap<>();
    in.put("meter.json", pod);
    Demand d = new ManifestReader().readTexts(in, ReadOptions.defaults()).demand();
    FuzzChecks.noSafetyNet(d.diagnostics());
    boolean refused = d.diagnostics().stream().anyMatch(x -> x.severity() == Severity.ERROR);
    // Sized once, or refused with a message at the Pod's file.
    assertEquals(refused ? 0 : 1, d.workloads().size(), d.diagnostics().toString());
    assertTrue(d.diagnostics().stream().allMatch(x -> x.format().startsWith("meter.json:")),
        d.diagnostics().toString());

    Quantity quantity;
    try {
      quantity = new Quantity(amount);
    } catch (IllegalArgumentException ex) {
      // fabric8 itself refuses this text (an empty amount) before numafit sees it.
      return;
    }
    PodSpec spec = new PodSpecBuilder().addNewContainer().withName("c").withNewResources()
        .addToRequests("cpu", quantity).addToRequests("memory", quantity)
        .addToLimits("memory", quantity).endResources().endContainer().build();
    PodSpecConversion.Result r = PodSpecConversion.toModel(spec, "tariffs/Pod/meter");
    if (r.problems().isEmpty()) {
      assertNotNull(PodArithmetic.effective(r.model()));
    } else {
      assertTrue(r.problems().stream().allMatch(p -> p.contains("tariffs/Pod/meter")),
          r.problems().toString());
    }
  }
}
