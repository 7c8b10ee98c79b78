package dev.numafit.demand;

import java.math.BigDecimal;
import java.util.Collections;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * One container's declared requests and limits, exact, in base units: CPU in cores (so {@code 250m}
 * is 0.25), memory and storage in bytes, everything else in counts. Nothing is defaulted here.
 */
public record ContainerSpec(
    String name,
    ContainerRole role,
    SortedMap<String, BigDecimal> requests,
    SortedMap<String, BigDecimal> limits) {
  public ContainerSpec {
    Objects.requireNonNull(name, "name");
    Objects.requireNonNull(role, "role");
    requests = Collections.unmodifiableSortedMap(new TreeMap<>(requests));
    limits = Collections.unmodifiableSortedMap(new TreeMap<>(limits));
  }
}
