package dev.numafit.demand;

import java.math.BigDecimal;
import java.util.List;
import java.util.Optional;
import java.util.SortedMap;
import java.util.TreeMap;

/** Small builders for pod models in tests; amounts in base units (cores, bytes). */
final class Pods {
  static final BigDecimal MI = BigDecimal.valueOf(1L << 20);
  static final BigDecimal GI = BigDecimal.valueOf(1L << 30);

  private Pods() {}

  static BigDecimal cores(String s) {
    return new BigDecimal(s);
  }

  static BigDecimal milli(long m) {
    return BigDecimal.valueOf(m).movePointLeft(3);
  }

  static BigDecimal mi(long n) {
    return MI.multiply(BigDecimal.valueOf(n));
  }

  static BigDecimal gi(long n) {
    return GI.multiply(BigDecimal.valueOf(n));
  }

  static SortedMap<String, BigDecimal> map(Object... pairs) {
    TreeMap<String, BigDecimal> m = new TreeMap<>();
    for (int i = 0; i < pairs.length; i += 2) {
      m.put((String) pairs[i], (BigDecimal) pairs[i + 1]);
    }
    return m;
  }

  static ContainerSpec app(
      String name, SortedMap<String, BigDecimal> req, SortedMap<String, BigDecimal> lim) {
    return new ContainerSpec(name, ContainerRole.APP, req, lim);
  }

  static ContainerSpec init(String name, SortedMap<String, BigDecimal> req) {
    return new ContainerSpec(name, ContainerRole.INIT, req, map());
  }

  static ContainerSpec sidecar(String name, SortedMap<String, BigDecimal> req) {
    return new ContainerSpec(name, ContainerRole.SIDECAR, req, map());
  }

  static PodModel pod(List<ContainerSpec> init, List<ContainerSpec> app) {
    return new PodModel(init, app, map(), map(), map(), Optional.empty());
  }

  static PodModel pod(List<ContainerSpec> app) {
    return pod(List.of(), app);
  }
}
