package dev.numafit.cluster;

import dev.numafit.resource.Resources;
import io.fabric8.kubernetes.api.model.Quantity;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.Map;
import java.util.TreeMap;

/** Node quantities to integer units: cpu rounded up to millicores, the rest up to whole units. */
final class Quantities {
  private static final BigDecimal THOUSAND = BigDecimal.valueOf(1000);

  private Quantities() {}

  /**
   * @param problems receives one sentence per quantity that cannot be read (it is left out)
   */
  static Resources of(Map<String, Quantity> map, String what, java.util.List<String> problems) {
    TreeMap<String, Long> out = new TreeMap<>();
    if (map == null) {
      return Resources.EMPTY;
    }
    for (Map.Entry<String, Quantity> e : new TreeMap<>(map).entrySet()) {
      try {
        BigDecimal v = e.getValue().getNumericalAmount();
        if (Resources.CPU.equals(e.getKey())) {
          v = v.multiply(THOUSAND);
        }
        out.put(e.getKey(), v.setScale(0, RoundingMode.CEILING).longValueExact());
      } catch (RuntimeException ex) {
        problems.add(what + ": " + e.getKey() + " \"" + e.getValue()
            + "\" is not a Kubernetes quantity; left out");
      }
    }
    return Resources.of(out);
  }
}
