package dev.numafit.demand;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.util.List;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/** Invariants of the admission steps (FACTS A2). */
class AdmissionProperties {
  private static BigDecimal mi(int n) {
    return Pods.mi(n);
  }

  @Property
  void applyLimitDefaults_anyContainer_keepsWhatItSetsAndRequestsSomething(
      @ForAll boolean setRequest,
      @ForAll boolean setLimit,
      @ForAll @IntRange(min = 1, max = 4096) int request,
      @ForAll @IntRange(min = 1, max = 4096) int extra) {
    ContainerSpec c =
        Pods.app(
            "c",
            setRequest ? Pods.map("memory", mi(request)) : Pods.map(),
            setLimit ? Pods.map("memory", mi(request + extra)) : Pods.map());
    // The LimitRange of "Configure Default Memory Requests and Limits for a Namespace" (K9).
    LimitDefaults docs =
        LimitDefaults.fromItem(
            Pods.map(), Pods.map(), Pods.map("memory", mi(512)), Pods.map("memory", mi(256)));
    ContainerSpec out =
        Admission.applyLimitDefaults(Admission.limitsAsRequests(Pods.pod(List.of(c))), docs)
            .containers()
            .get(0);
    if (setRequest) {
      assertEquals(mi(request), out.requests().get("memory"));
    } else if (setLimit) {
      // K5: with only a limit, the request is the limit, not the namespace default.
      assertEquals(mi(request + extra), out.requests().get("memory"));
    } else {
      assertEquals(mi(256), out.requests().get("memory"));
    }
    if (setLimit) {
      assertEquals(mi(request + extra), out.limits().get("memory"));
    } else {
      assertEquals(mi(512), out.limits().get("memory"));
    }
    assertTrue(out.requests().containsKey("memory"));
  }
}
