package dev.numafit.resource;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class ResourcesTest {
  @Test
  void plus_addsPerResource_andDropsZeros() {
    Resources a = Resources.of("cpu", 500L, "memory", 100L);
    Resources b = Resources.of("cpu", 250L, "memory", -100L);
    assertEquals(Resources.of("cpu", 750L), a.plus(b));
  }

  @Test
  void fitsIn_equalityFits_oneMoreDoesNot() {
    // FACTS check value 16 (kube-scheduler fitsRequest, K19): allocatable 4000m with 3500m
    // requested already leaves room for exactly 500m.
    Resources room = Resources.of("cpu", 4000L).minus(Resources.of("cpu", 3500L));
    assertTrue(Resources.of("cpu", 500L).fitsIn(room));
    assertFalse(Resources.of("cpu", 501L).fitsIn(room));
  }
}
