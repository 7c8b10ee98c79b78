package dev.numafit.demand;

import java.math.BigDecimal;
import java.util.Collections;
import java.util.Map;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * The defaults a LimitRange item of type {@code Container} gives to containers of its namespace,
 * exact and in base units (CPU in cores, memory in bytes).
 *
 * @param defaultRequest the request set on a container that declares none for a resource
 * @param defaultLimit the limit set on a container that declares none (the item's {@code default})
 */
public record LimitDefaults(
    SortedMap<String, BigDecimal> defaultRequest, SortedMap<String, BigDecimal> defaultLimit) {
  /** Defaults that change nothing. */
  public static final LimitDefaults NONE = new LimitDefaults(new TreeMap<>(), new TreeMap<>());

  public LimitDefaults {
    defaultRequest = Collections.unmodifiableSortedMap(new TreeMap<>(defaultRequest));
    defaultLimit = Collections.unmodifiableSortedMap(new TreeMap<>(defaultLimit));
  }

  /**
   * The defaults of one LimitRange item as the API server stores them. Kubernetes' {@code
   * SetDefaults_LimitRangeItem} (pkg/apis/core/v1/defaults.go, FACTS A2 K9b) fills a missing {@code
   * default} from {@code max}, then a missing {@code defaultRequest} from {@code default}, else
   * from {@code min}; each resource on its own.
   */
  public static LimitDefaults fromItem(
      Map<String, BigDecimal> max,
      Map<String, BigDecimal> min,
      Map<String, BigDecimal> defaultLimit,
      Map<String, BigDecimal> defaultRequest) {
    TreeMap<String, BigDecimal> limit = new TreeMap<>(defaultLimit);
    max.forEach(limit::putIfAbsent);
    TreeMap<String, BigDecimal> request = new TreeMap<>(defaultRequest);
    limit.forEach(request::putIfAbsent);
    min.forEach(request::putIfAbsent);
    return new LimitDefaults(request, limit);
  }

  /**
   * These defaults, with {@code later}'s filling only resources these leave unset. The LimitRange
   * admission plugin applies every LimitRange of a namespace in turn and never overwrites a value
   * already set, so the first one (in name order) wins per resource.
   */
  public LimitDefaults then(LimitDefaults later) {
    TreeMap<String, BigDecimal> request = new TreeMap<>(defaultRequest);
    later.defaultRequest.forEach(request::putIfAbsent);
    TreeMap<String, BigDecimal> limit = new TreeMap<>(defaultLimit);
    later.defaultLimit.forEach(limit::putIfAbsent);
    return new LimitDefaults(request, limit);
  }

  public boolean isEmpty() {
    return defaultRequest.isEmpty() && defaultLimit.isEmpty();
  }
}
