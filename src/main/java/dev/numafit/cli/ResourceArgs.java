package dev.numafit.cli;

import dev.numafit.resource.Resources;
import io.fabric8.kubernetes.api.model.Quantity;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.Map;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.regex.Pattern;

/**
 * Parses the {@code name=quantity[,name=quantity...]} lists of {@code --worker}, {@code
 * --kube-reserved}, {@code --system-reserved}, {@code --per-worker} and {@code --eviction-hard}
 * with fabric8's {@link Quantity}, rounding up as the scheduler does: CPU to millicores, every
 * other resource to whole bytes or counts.
 */
final class ResourceArgs {
  /** A resource name as Kubernetes allows it: a DNS prefix and a slash optional. */
  private static final Pattern NAME =
      Pattern.compile("([a-z0-9]([-a-z0-9.]*[a-z0-9])?/)?[A-Za-z0-9]([-A-Za-z0-9_.]*[A-Za-z0-9])?");

  private static final Map<String, String> EVICTION_SIGNALS =
      Map.of("memory.available", Resources.MEMORY, "nodefs.available", Resources.EPHEMERAL_STORAGE);

  private ResourceArgs() {}

  /**
   * The list as a resource vector, integers in Kubernetes units.
   *
   * @throws IllegalArgumentException with a message naming the item, its value and what is
   *     accepted
   */
  static Resources parse(String list) {
    Map<String, Long> out = new TreeMap<>();
    for (Map.Entry<String, String> e : split(list, "=").entrySet()) {
      String name = e.getKey();
      if (!NAME.matcher(name).matches()) {
        throw new IllegalArgumentException(
            "\"" + name + "\" is not a resource name (expected e.g. cpu, memory, pods,"
                + " hugepages-2Mi, example.com/device)");
      }
      out.put(name, amount(name, e.getValue()));
    }
    return Resources.of(out);
  }

  /**
   * Hard eviction thresholds: amounts by resource, and percentages of capacity by resource.
   *
   * @param amounts memory.available as {@code memory}, nodefs.available as {@code
   *     ephemeral-storage}, in bytes
   * @param percent the same resources given as a percentage of capacity (0..100)
   */
  record Eviction(Resources amounts, SortedMap<String, BigDecimal> percent) {}

  /**
   * A kubelet eviction threshold list, {@code memory.available=500Mi,nodefs.available=10%} (the
   * kubelet's own {@code memory.available<500Mi} is accepted too): memory.available becomes {@code
   * memory}, nodefs.available becomes {@code ephemeral-storage}.
   */
  static Eviction parseEviction(String list) {
    Map<String, Long> out = new TreeMap<>();
    SortedMap<String, BigDecimal> pct = new TreeMap<>();
    for (Map.Entry<String, String> e : split(list.replace('<', '='), "=").entrySet()) {
      String resource = EVICTION_SIGNALS.get(e.getKey());
      if (resource == null) {
        throw new IllegalArgumentException(
            "unknown eviction signal \"" + e.getKey()
                + "\" (expected memory.available or nodefs.available)");
      }
      String v = e.getValue();
      if (v.endsWith("%")) {
        BigDecimal p;
        try {
          p = new BigDecimal(v.substring(0, v.length() - 1));
        } catch (NumberFormatException ex) {
          p = null;
        }
        if (p == null || p.signum() < 0 || p.compareTo(BigDecimal.valueOf(100)) > 0) {
          throw new IllegalArgumentException(
              e.getKey() + "=" + v + ": expected a percentage from 0% to 100%");
        }
        pct.put(resource, p);
      } else {
        out.put(resource, amount(resource, v));
      }
    }
    return new Eviction(Resources.of(out), pct);
  }

  private static Map<String, String> split(String list, String sep) {
    Map<String, String> items = new TreeMap<>();
    for (String item : list.split(",", -1)) {
      String t = item.strip();
      int eq = t.indexOf(sep);
      if (eq <= 0 || eq == t.length() - 1) {
        throw new IllegalArgumentException(
            "\"" + t + "\" is not name=amount (expected e.g. cpu=16,memory=64Gi)");
      }
      String name = t.substring(0, eq).strip();
      if (items.put(name, t.substring(eq + 1).strip()) != null) {
        throw new IllegalArgumentException("\"" + name + "\" is given twice");
      }
    }
    return items;
  }

  /** One quantity in integer Kubernetes units: millicores for cpu, whole units otherwise. */
  static long amount(String name, String value) {
    BigDecimal n;
    try {
      n = new Quantity(value).getNumericalAmount();
    } catch (RuntimeException ex) {
      n = null;
    }
    if (n == null || !value.matches("[-+]?[0-9.]+([eE][-+]?[0-9]+)?[A-Za-z]*")) {
      throw new IllegalArgumentException(
          name + "=" + value + ": not a Kubernetes quantity (expected e.g. 500m, 2, 64Gi)");
    }
    if (n.signum() < 0) {
      throw new IllegalArgumentException(name + "=" + value + ": must not be negative");
    }
    if (name.equals(Resources.CPU)) {
      n = n.multiply(BigDecimal.valueOf(1000));
    }
    try {
      return n.setScale(0, RoundingMode.CEILING).longValueExact();
    } catch (ArithmeticException ex) {
      throw new IllegalArgumentException(name + "=" + value + ": too large");
    }
  }
}
