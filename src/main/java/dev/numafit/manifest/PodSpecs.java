package dev.numafit.manifest;

import dev.numafit.demand.ContainerRole;
import dev.numafit.demand.ContainerSpec;
import dev.numafit.demand.PodModel;
import io.fabric8.kubernetes.api.model.Container;
import io.fabric8.kubernetes.api.model.PodSpec;
import io.fabric8.kubernetes.api.model.Quantity;
import io.fabric8.kubernetes.api.model.ResourceRequirements;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;

/**
 * Turns a fabric8 {@link PodSpec} into the core {@link PodModel}, reading every quantity once
 * through fabric8's {@link Quantity} and reporting an invalid or negative one with its line.
 */
final class PodSpecs {
  static final String EXPECTED = "(expected e.g. 500m, 2, 1.5Gi)";
  private static final BigDecimal LONG_MAX = BigDecimal.valueOf(Long.MAX_VALUE);

  private PodSpecs() {}

  /**
   * @param specPtr JSON Pointer of the pod spec inside the document
   */
  static PodModel toModel(PodSpec spec, String specPtr, ObjectContext ctx) {
    if (spec == null) {
      ctx.error(specPtr, "no pod spec (expected a pod template with spec.containers)");
      return new PodModel(
          List.of(),
          List.of(),
          new TreeMap<>(),
          new TreeMap<>(),
          new TreeMap<>(),
          Optional.empty());
    }
    List<ContainerSpec> init =
        containers(spec.getInitContainers(), specPtr + "/initContainers", true, ctx);
    List<ContainerSpec> app = containers(spec.getContainers(), specPtr + "/containers", false, ctx);
    if (app.isEmpty()) {
      ctx.error(specPtr, "pod spec has no containers (expected at least one in spec.containers)");
    }
    SortedMap<String, BigDecimal> overhead =
        quantities(spec.getOverhead(), specPtr + "/overhead", "overhead", ctx);
    ResourceRequirements podLevel = spec.getResources();
    SortedMap<String, BigDecimal> podRequests = new TreeMap<>();
    SortedMap<String, BigDecimal> podLimits = new TreeMap<>();
    if (podLevel != null) {
      podRequests =
          quantities(
              podLevel.getRequests(),
              specPtr + "/resources/requests",
              "pod-level resources.requests",
              ctx);
      podLimits =
          quantities(
              podLevel.getLimits(),
              specPtr + "/resources/limits",
              "pod-level resources.limits",
              ctx);
    }
    Optional<String> runtimeClass =
        Optional.ofNullable(spec.getRuntimeClassName()).filter(s -> !s.isBlank());
    return new PodModel(init, app, overhead, podRequests, podLimits, runtimeClass);
  }

  private static List<ContainerSpec> containers(
      List<Container> list, String ptr, boolean init, ObjectContext ctx) {
    List<ContainerSpec> out = new ArrayList<>();
    if (list == null) {
      return out;
    }
    for (int i = 0; i < list.size(); i++) {
      Container c = list.get(i);
      String cptr = ptr + "/" + i;
      if (c == null) {
        ctx.error(cptr, "empty container entry (expected a container with a name)");
        continue;
      }
      String name = c.getName() == null ? "#" + i : c.getName();
      ContainerRole role =
          !init
              ? ContainerRole.APP
              : "Always".equals(c.getRestartPolicy()) ? ContainerRole.SIDECAR : ContainerRole.INIT;
      ResourceRequirements r = c.getResources();
      String what = "container \"" + name + "\": resources.";
      SortedMap<String, BigDecimal> requests = new TreeMap<>();
      SortedMap<String, BigDecimal> limits = new TreeMap<>();
      if (r != null) {
        requests =
            quantities(r.getRequests(), cptr + "/resources/requests", what + "requests", ctx);
        limits = quantities(r.getLimits(), cptr + "/resources/limits", what + "limits", ctx);
      }
      out.add(new ContainerSpec(name, role, requests, limits));
    }
    return out;
  }

  /**
   * Exact amounts of a resource map in base units. Each invalid or negative quantity becomes an
   * error naming the field and the value as written.
   *
   * @param what how the map is named in messages ({@code container "app": resources.requests})
   */
  static SortedMap<String, BigDecimal> quantities(
      Map<String, Quantity> map, String ptr, String what, ObjectContext ctx) {
    SortedMap<String, BigDecimal> out = new TreeMap<>();
    if (map == null) {
      return out;
    }
    for (Map.Entry<String, Quantity> e : new TreeMap<>(map).entrySet()) {
      String vptr = ptr + "/" + LocatedDocument.segment(e.getKey());
      Optional<BigDecimal> v = amount(e.getValue(), vptr, what + "." + e.getKey(), ctx);
      v.ifPresent(x -> out.put(e.getKey(), x));
    }
    return out;
  }

  /**
   * Amounts already computed, by the quantity's text. Manifests repeat a few sizes (100m, 64Mi)
   * thousands of times, and fabric8's parsing of each one is the costly part of reading them.
   * Only valid quantities are kept, and only the first {@link #CACHE_LIMIT} distinct ones.
   */
  private static final ConcurrentHashMap<AmountKey, BigDecimal> AMOUNTS = new ConcurrentHashMap<>();

  /** A quantity as fabric8 holds it: the number and the unit suffix as written. */
  private record AmountKey(String amount, String format) {}

  private static final int CACHE_LIMIT = 4096;

  /** {@link Quantity#getNumericalAmount()}, from the cache when the same text was read before. */
  static BigDecimal numericalAmount(Quantity q) {
    String amount = q.getAmount();
    String format = q.getFormat();
    if (amount == null || format == null || q.getClass() != Quantity.class) {
      return q.getNumericalAmount();
    }
    AmountKey key = new AmountKey(amount, format);
    BigDecimal v = AMOUNTS.get(key);
    if (v == null) {
      v = q.getNumericalAmount();
      if (AMOUNTS.size() < CACHE_LIMIT) {
        AMOUNTS.put(key, v);
      }
    }
    return v;
  }

  /** One quantity in base units, or empty after recording an error. */
  static Optional<BigDecimal> amount(Quantity q, String ptr, String field, ObjectContext ctx) {
    BigDecimal v;
    try {
      if (q == null) {
        throw new NumberFormatException("null");
      }
      v = numericalAmount(q);
    } catch (RuntimeException ex) {
      ctx.error(
          ptr, field + " \"" + ctx.written(ptr, q) + "\" is not a Kubernetes quantity " + EXPECTED);
      return Optional.empty();
    }
    if (v.signum() < 0) {
      ctx.error(
          ptr,
          field
              + " \""
              + ctx.written(ptr, q)
              + "\" is negative (expected a quantity of zero or more, e.g. 500m, 2, 1.5Gi)");
      return Optional.empty();
    }
    if (v.compareTo(LONG_MAX) > 0) {
      ctx.error(
          ptr,
          field
              + " \""
              + ctx.written(ptr, q)
              + "\" is larger than a Kubernetes quantity can hold (at most 2^63-1)");
      return Optional.empty();
    }
    if (v.signum() > 0 && v.compareTo(NANO) < 0) {
      // Below 1n the API server rounds up to 1n; taken here directly, because rounding a value
      // such as 9e-823336003 (fabric8 reads "93367320T-823336003" so) would first build a
      // number with hundreds of millions of digits. Found by fuzzing.
      return Optional.of(NANO);
    }
    return Optional.of(v);
  }

  /** 1n, the finest amount the API server keeps. */
  private static final BigDecimal NANO = BigDecimal.ONE.movePointLeft(9);
}
