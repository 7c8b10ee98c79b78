package dev.numafit.demand;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Size;

/** Invariants of the effective-request arithmetic (KEP-753 formula, FACTS A1). */
class PodArithmeticProperties {
  private static ContainerSpec cpu(String name, ContainerRole role, int millis) {
    return new ContainerSpec(
        name, role, Pods.map("cpu", BigDecimal.valueOf(millis, 3)), Pods.map());
  }

  private static List<ContainerSpec> apps(List<Integer> millis) {
    List<ContainerSpec> out = new ArrayList<>();
    for (int i = 0; i < millis.size(); i++) {
      out.add(cpu("app" + i, ContainerRole.APP, millis.get(i)));
    }
    return out;
  }

  private static List<ContainerSpec> inits(List<Integer> millis, List<Boolean> sidecar) {
    List<ContainerSpec> out = new ArrayList<>();
    for (int i = 0; i < millis.size(); i++) {
      boolean s = i < sidecar.size() && sidecar.get(i);
      out.add(cpu("init" + i, s ? ContainerRole.SIDECAR : ContainerRole.INIT, millis.get(i)));
    }
    return out;
  }

  @Property
  void effective_anyPod_atLeastEveryContainerAndTheSteadyState(
      @ForAll @Size(min = 1, max = 5) List<@IntRange(min = 0, max = 100_000) Integer> app,
      @ForAll @Size(max = 5) List<@IntRange(min = 0, max = 100_000) Integer> init,
      @ForAll @Size(max = 5) List<Boolean> sidecar) {
    long total =
        PodArithmetic.effective(Pods.pod(inits(init, sidecar), apps(app))).requests().get("cpu");
    long appSum = app.stream().mapToLong(Integer::longValue).sum();
    long sidecarSum = 0;
    for (int i = 0; i < init.size(); i++) {
      if (i < sidecar.size() && sidecar.get(i)) {
        sidecarSum += init.get(i);
      }
      // Every init container runs at some point, so the pod must hold it.
      assertTrue(total >= init.get(i));
    }
    for (int a : app) {
      assertTrue(total >= a);
    }
    // App containers and all sidecars run together in the steady state.
    assertTrue(total >= appSum + sidecarSum);
  }

  @Property
  void effective_appContainersShuffled_sameRequest(
      @ForAll @Size(min = 1, max = 6) List<@IntRange(min = 0, max = 100_000) Integer> app,
      @ForAll @Size(max = 4) List<@IntRange(min = 0, max = 100_000) Integer> init,
      @ForAll @Size(max = 4) List<Boolean> sidecar) {
    List<Integer> reversed = new ArrayList<>(app);
    Collections.reverse(reversed);
    assertEquals(
        PodArithmetic.effective(Pods.pod(inits(init, sidecar), apps(app))).requests(),
        PodArithmetic.effective(Pods.pod(inits(init, sidecar), apps(reversed))).requests());
  }

  @Property
  void effective_noSidecars_maxOfSumAndLargestInit(
      @ForAll @Size(min = 1, max = 5) List<@IntRange(min = 0, max = 100_000) Integer> app,
      @ForAll @Size(max = 5) List<@IntRange(min = 0, max = 100_000) Integer> init) {
    // KEP-753 without sidecars: Max(Max(initContainers), Sum(Containers)).
    long expected =
        Math.max(
            app.stream().mapToLong(Integer::longValue).sum(),
            init.stream().mapToLong(Integer::longValue).max().orElse(0));
    assertEquals(
        expected,
        PodArithmetic.effective(Pods.pod(inits(init, List.of()), apps(app))).requests().get("cpu"));
  }
}
