package dev.numafit.demand;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class ReplicaRulesTest {
  @Test
  void scalable_unset_one() {
    // FACTS check value 20 (Deployment concept page, K20): unset replicas default to 1.
    assertEquals(new Replicas(1, 1, "default 1"), ReplicaRules.scalable(null));
    assertEquals(new Replicas(3, 3, "spec.replicas"), ReplicaRules.scalable(3));
  }

  @Test
  void job_neitherSet_one() {
    // FACTS check value 20 (Job concept page, K20): neither completions nor parallelism → both 1.
    assertEquals(1, ReplicaRules.job(null, null).peak());
  }

  @Test
  void job_parallelismAboveCompletions_completionsBound() {
    // K20: pods running at once never exceed the remaining completions.
    assertEquals(new Replicas(3, 3, "spec.completions"), ReplicaRules.job(5, 3));
    assertEquals(new Replicas(5, 5, "spec.parallelism"), ReplicaRules.job(5, 10));
    // A work-queue Job leaves completions unset: parallelism decides.
    assertEquals(4, ReplicaRules.job(4, null).peak());
    // Parallelism 0 pauses the Job (K20).
    assertEquals(0, ReplicaRules.job(0, 5).peak());
  }

  @Test
  void autoscaled_peak_maxReplicasNamingAutoscaler() {
    Replicas r =
        ReplicaRules.autoscaled(ReplicaRules.scalable(2), 10, "shop/web", ReplicaMode.PEAK);
    assertEquals(new Replicas(2, 10, "HorizontalPodAutoscaler shop/web maxReplicas"), r);
  }

  @Test
  void autoscaled_declared_keepsSpecReplicas() {
    Replicas r =
        ReplicaRules.autoscaled(ReplicaRules.scalable(2), 10, "shop/web", ReplicaMode.DECLARED);
    assertEquals(new Replicas(2, 2, "spec.replicas"), r);
  }

  @Test
  void daemonSet_onePerWorker() {
    assertEquals(new Replicas(1, 1, "one per worker"), ReplicaRules.daemonSet());
  }
}
