package dev.numafit.demand;

import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.OptionalLong;
import java.util.Set;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.function.Function;

/**
 * Kubernetes' own arithmetic for what a pod asks of a node, on an admitted {@link PodModel} (run
 * the {@link Admission} steps first).
 *
 * <p>Sources (FACTS A1–A3, A5): KEP-753 "Resources calculation for scheduling and pod admission"
 * and {@code component-helpers/resource/helpers.go} for the sidecar-aware aggregate; "Pod Overhead"
 * for overhead; "Assign Pod-level CPU and memory resources" and KEP-2837 for pod-level resources;
 * "Pod Quality of Service Classes" for QoS; "Resource managers" for exclusive CPUs; the Quantity
 * reference for precision.
 */
public final class PodArithmetic {
  /** Flag when a container requests no CPU (it is then counted as zero). */
  public static final String NO_CPU_REQUEST = "no request for cpu";

  /** Flag when a container requests no memory (it is then counted as zero). */
  public static final String NO_MEMORY_REQUEST = "no request for memory";

  /** Flag when a CPU amount had a precision finer than 1m. */
  public static final String CPU_FINER_THAN_1M = "cpu request finer than 1m rounded up";

  private static final BigDecimal THOUSAND = BigDecimal.valueOf(1000);
  private static final BigDecimal LONG_MAX = BigDecimal.valueOf(Long.MAX_VALUE);

  private PodArithmetic() {}

  /** Whether {@code spec.resources} of a pod may set this resource (cpu, memory, hugepages-*). */
  public static boolean podLevelResource(String name) {
    return name.equals(Resources.CPU)
        || name.equals(Resources.MEMORY)
        || Resources.isHugepages(name);
  }

  /**
   * The pod's effective requests and limits, QoS class, exclusive CPUs and flags.
   *
   * <p>Each container amount is first rounded up to a billionth of its unit (1n), as the API
   * server's quantity parser does with finer values. Sums are then exact; the pod total is rounded
   * up once, CPU to millicores and every other resource to a whole unit, as the scheduler reads it
   * (it sums the containers' quantities and reads the total with MilliValue/Value). So three
   * containers of 0.1m each ask for 1m, not 3m: kubectl describe node agrees (see the
   * differential test). A CPU amount finer than 1m is flagged. Requests do not include the {@code
   * pods} count.
   */
  public static EffectivePod effective(PodModel pod) {
    Set<String> flags = new LinkedHashSet<>();
    PodModel p = roundContainers(pod, flags);

    SortedMap<String, BigDecimal> requests = aggregate(p, ContainerSpec::requests, false);
    for (Map.Entry<String, BigDecimal> e : p.podRequests().entrySet()) {
      if (podLevelResource(e.getKey())) {
        // Pod-level values replace the containers' aggregate (helpers.go, KEP-2837).
        requests.put(e.getKey(), e.getValue());
      } else {
        flags.add("pod-level " + e.getKey() + " ignored: only cpu, memory and hugepages");
      }
    }
    p.overhead().forEach((k, v) -> requests.merge(k, v, BigDecimal::add));

    SortedMap<String, BigDecimal> limits = aggregate(p, ContainerSpec::limits, true);
    for (Map.Entry<String, BigDecimal> e : p.podLimits().entrySet()) {
      if (podLevelResource(e.getKey())) {
        limits.put(e.getKey(), e.getValue());
      }
    }
    // Overhead raises the pod cgroup limit too ("Pod Overhead": 320Mi limit for 200Mi + 120Mi).
    for (Map.Entry<String, BigDecimal> e : p.overhead().entrySet()) {
      limits.computeIfPresent(e.getKey(), (k, v) -> v.add(e.getValue()));
    }

    for (String r : List.of(Resources.CPU, Resources.MEMORY)) {
      if (!p.podRequests().containsKey(r) && anyLongRunningWithout(p, r)) {
        flags.add(r.equals(Resources.CPU) ? NO_CPU_REQUEST : NO_MEMORY_REQUEST);
      }
    }

    QosClass qos = qos(p);
    long exclusive = qos == QosClass.GUARANTEED ? exclusiveCpus(p) : 0;
    return new EffectivePod(
        toUnits(requests, flags), toUnits(limits, flags), qos, exclusive, new ArrayList<>(flags));
  }

  /**
   * Problems that make the API server reject the pod, one sentence each (empty when valid): a
   * request above its limit; a hugepages request that differs from its limit (hugepages cannot be
   * overcommitted, "Manage HugePages"); pod-level requests or limits below the containers'
   * aggregate or a container limit above the pod limit (KEP-2837).
   */
  public static List<String> validate(PodModel pod) {
    List<String> problems = new ArrayList<>();
    List<ContainerSpec> all = new ArrayList<>(pod.initContainers());
    all.addAll(pod.containers());
    for (ContainerSpec c : all) {
      TreeSet<String> names = new TreeSet<>(c.requests().keySet());
      names.addAll(c.limits().keySet());
      for (String r : names) {
        BigDecimal req = c.requests().get(r);
        BigDecimal lim = c.limits().get(r);
        if (Resources.isHugepages(r)) {
          if (lim == null || req == null || req.compareTo(lim) != 0) {
            problems.add(
                String.format(
                    "container \"%s\": %s request %s must equal its limit %s (hugepages cannot be"
                        + " overcommitted)",
                    c.name(), r, show(r, req), show(r, lim)));
          }
        } else if (req != null && lim != null && req.compareTo(lim) > 0) {
          problems.add(
              String.format(
                  "container \"%s\": %s request %s is above its limit %s",
                  c.name(), r, show(r, req), show(r, lim)));
        }
      }
    }
    SortedMap<String, BigDecimal> containerRequests =
        aggregate(pod, ContainerSpec::requests, false);
    for (Map.Entry<String, BigDecimal> e : pod.podLimits().entrySet()) {
      String r = e.getKey();
      BigDecimal agg = containerRequests.get(r);
      if (agg != null && agg.compareTo(e.getValue()) > 0) {
        problems.add(
            String.format(
                "pod-level %s limit %s is below the containers' requests %s",
                r, show(r, e.getValue()), show(r, agg)));
      }
      for (ContainerSpec c : all) {
        BigDecimal lim = c.limits().get(r);
        if (lim != null && lim.compareTo(e.getValue()) > 0) {
          problems.add(
              String.format(
                  "container \"%s\": %s limit %s is above the pod-level limit %s",
                  c.name(), r, show(r, lim), show(r, e.getValue())));
        }
      }
      BigDecimal podReq = pod.podRequests().get(r);
      if (podReq != null && podReq.compareTo(e.getValue()) > 0) {
        problems.add(
            String.format(
                "pod-level %s request %s is above the pod-level limit %s",
                r, show(r, podReq), show(r, e.getValue())));
      }
    }
    for (Map.Entry<String, BigDecimal> e : pod.podRequests().entrySet()) {
      String r = e.getKey();
      BigDecimal agg = containerRequests.get(r);
      if (agg != null && agg.compareTo(e.getValue()) > 0) {
        problems.add(
            String.format(
                "pod-level %s request %s is below the containers' requests %s",
                r, show(r, e.getValue()), show(r, agg)));
      }
    }
    return problems;
  }

  /**
   * Pages of one hugepages resource: {@code hugepages-2Mi} of 80Mi is 40 pages. Empty when the name
   * carries no size or the amount is not a whole number of pages.
   */
  public static OptionalLong hugepages(String resource, long bytes) {
    OptionalLong size = hugepageSize(resource);
    if (size.isEmpty() || bytes % size.getAsLong() != 0) {
      return OptionalLong.empty();
    }
    return OptionalLong.of(bytes / size.getAsLong());
  }

  /** The page size in bytes named by a hugepages resource ({@code hugepages-1Gi} → 1073741824). */
  public static OptionalLong hugepageSize(String resource) {
    if (!Resources.isHugepages(resource)) {
      return OptionalLong.empty();
    }
    String size = resource.substring("hugepages-".length());
    String[] suffixes = {"Ki", "Mi", "Gi", "Ti"};
    for (int i = 0; i < suffixes.length; i++) {
      if (size.endsWith(suffixes[i])) {
        String digits = size.substring(0, size.length() - 2);
        if (!digits.isEmpty()
            && digits.chars().allMatch(Character::isDigit)
            && digits.length() < 10) {
          return OptionalLong.of(Long.parseLong(digits) << (10 * (i + 1)));
        }
      }
    }
    return OptionalLong.empty();
  }

  /**
   * The sidecar-aware aggregate over containers (KEP-753, helpers.go): max(sum of app containers +
   * all sidecars, for each init container in spec order its own amount + the sidecars declared
   * before it, for each sidecar the running sum of sidecars including itself).
   *
   * @param allOrNothing for limits: a resource some container leaves unlimited is left out
   */
  static SortedMap<String, BigDecimal> aggregate(
      PodModel pod,
      Function<ContainerSpec, SortedMap<String, BigDecimal>> amounts,
      boolean allOrNothing) {
    TreeSet<String> names = new TreeSet<>();
    pod.initContainers().forEach(c -> names.addAll(amounts.apply(c).keySet()));
    pod.containers().forEach(c -> names.addAll(amounts.apply(c).keySet()));
    SortedMap<String, BigDecimal> out = new TreeMap<>();
    for (String r : names) {
      if (allOrNothing && !everyContainerHas(pod, amounts, r)) {
        continue;
      }
      BigDecimal app = BigDecimal.ZERO;
      for (ContainerSpec c : pod.containers()) {
        app = app.add(amounts.apply(c).getOrDefault(r, BigDecimal.ZERO));
      }
      BigDecimal sidecars = BigDecimal.ZERO;
      BigDecimal initMax = BigDecimal.ZERO;
      for (ContainerSpec c : pod.initContainers()) {
        BigDecimal own = amounts.apply(c).getOrDefault(r, BigDecimal.ZERO);
        if (c.role() == ContainerRole.SIDECAR) {
          sidecars = sidecars.add(own);
          initMax = initMax.max(sidecars);
        } else {
          initMax = initMax.max(own.add(sidecars));
        }
      }
      out.put(r, app.add(sidecars).max(initMax));
    }
    return out;
  }

  private static boolean everyContainerHas(
      PodModel pod, Function<ContainerSpec, SortedMap<String, BigDecimal>> amounts, String r) {
    for (ContainerSpec c : pod.initContainers()) {
      if (!amounts.apply(c).containsKey(r)) {
        return false;
      }
    }
    for (ContainerSpec c : pod.containers()) {
      if (!amounts.apply(c).containsKey(r)) {
        return false;
      }
    }
    return true;
  }

  private static boolean anyLongRunningWithout(PodModel pod, String r) {
    for (ContainerSpec c : pod.containers()) {
      if (!c.requests().containsKey(r)) {
        return true;
      }
    }
    for (ContainerSpec c : pod.initContainers()) {
      if (c.role() == ContainerRole.SIDECAR && !c.requests().containsKey(r)) {
        return true;
      }
    }
    return false;
  }

  /**
   * QoS from CPU and memory only ("Pod Quality of Service Classes"). Guaranteed: every container
   * sets CPU and memory limits and its requests equal them; BestEffort: no container sets any CPU
   * or memory request or limit; Burstable otherwise. When pod-level resources set CPU or memory,
   * they decide (KEP-2837).
   */
  static QosClass qos(PodModel pod) {
    List<String> compute = List.of(Resources.CPU, Resources.MEMORY);
    boolean podLevel = false;
    for (String r : compute) {
      podLevel |= pod.podRequests().containsKey(r) || pod.podLimits().containsKey(r);
    }
    if (podLevel) {
      for (String r : compute) {
        BigDecimal lim = pod.podLimits().get(r);
        BigDecimal req = pod.podRequests().getOrDefault(r, lim);
        if (lim == null || req.compareTo(lim) != 0) {
          return QosClass.BURSTABLE;
        }
      }
      return QosClass.GUARANTEED;
    }
    List<ContainerSpec> all = new ArrayList<>(pod.initContainers());
    all.addAll(pod.containers());
    boolean any = false;
    boolean guaranteed = true;
    for (ContainerSpec c : all) {
      for (String r : compute) {
        BigDecimal req = c.requests().get(r);
        BigDecimal lim = c.limits().get(r);
        any |= nonZero(req) || nonZero(lim);
        if (lim == null || lim.signum() == 0 || req == null || req.compareTo(lim) != 0) {
          guaranteed = false;
        }
      }
    }
    if (!any) {
      return QosClass.BEST_EFFORT;
    }
    return guaranteed ? QosClass.GUARANTEED : QosClass.BURSTABLE;
  }

  /**
   * Whole CPUs the static CPU manager pins for a Guaranteed pod: the sum of the integer CPU
   * requests of its app containers and sidecars; a fractional request (1.5, 300m) runs in the
   * shared pool ("Resource managers", FACTS A5).
   */
  private static long exclusiveCpus(PodModel pod) {
    long sum = 0;
    List<ContainerSpec> running = new ArrayList<>(pod.containers());
    for (ContainerSpec c : pod.initContainers()) {
      if (c.role() == ContainerRole.SIDECAR) {
        running.add(c);
      }
    }
    for (ContainerSpec c : running) {
      BigDecimal cpu = c.requests().get(Resources.CPU);
      BigDecimal lim = c.limits().get(Resources.CPU);
      if (cpu != null
          && cpu.signum() > 0
          && lim != null
          && cpu.compareTo(lim) == 0
          && cpu.stripTrailingZeros().scale() <= 0) {
        sum += cpu.longValueExact();
      }
    }
    return sum;
  }

  private static boolean nonZero(BigDecimal v) {
    return v != null && v.signum() != 0;
  }

  private static PodModel roundContainers(PodModel pod, Set<String> flags) {
    List<ContainerSpec> init = new ArrayList<>();
    pod.initContainers().forEach(c -> init.add(round(c, flags)));
    List<ContainerSpec> app = new ArrayList<>();
    pod.containers().forEach(c -> app.add(round(c, flags)));
    return new PodModel(
        init,
        app,
        roundMap(pod.overhead(), flags, "overhead"),
        roundMap(pod.podRequests(), flags, "request"),
        roundMap(pod.podLimits(), flags, "limit"),
        pod.runtimeClassName());
  }

  private static ContainerSpec round(ContainerSpec c, Set<String> flags) {
    return new ContainerSpec(
        c.name(),
        c.role(),
        roundMap(c.requests(), flags, "request"),
        roundMap(c.limits(), flags, "limit"));
  }

  private static SortedMap<String, BigDecimal> roundMap(
      SortedMap<String, BigDecimal> m, Set<String> flags, String what) {
    TreeMap<String, BigDecimal> out = new TreeMap<>();
    m.forEach(
        (k, v) -> {
          // The API server keeps quantities to 1n and rounds finer ones up (apimachinery
          // resource.ParseQuantity); rounding to 1m happens only on the pod total.
          BigDecimal r = v.setScale(9, RoundingMode.CEILING);
          if (k.equals(Resources.CPU) && v.setScale(3, RoundingMode.CEILING).compareTo(v) != 0) {
            flags.add(
                "request".equals(what)
                    ? CPU_FINER_THAN_1M
                    : "cpu " + what + " finer than 1m rounded up");
          }
          out.put(k, r);
        });
    return out;
  }

  private static Resources toUnits(SortedMap<String, BigDecimal> amounts, Set<String> flags) {
    TreeMap<String, Long> out = new TreeMap<>();
    amounts.forEach(
        (k, v) -> {
          BigDecimal units = k.equals(Resources.CPU) ? v.multiply(THOUSAND) : v;
          units = units.setScale(0, RoundingMode.CEILING);
          if (units.compareTo(LONG_MAX) > 0) {
            flags.add(k + " total above 2^63-1, capped");
            units = LONG_MAX;
          }
          out.put(k, units.longValueExact());
        });
    return Resources.of(out);
  }

  private static String show(String r, BigDecimal v) {
    return v == null ? "(none)" : Amounts.format(r, v);
  }
}
