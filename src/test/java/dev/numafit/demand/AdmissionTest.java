package dev.numafit.demand;

import static dev.numafit.demand.Pods.app;
import static dev.numafit.demand.Pods.gi;
import static dev.numafit.demand.Pods.map;
import static dev.numafit.demand.Pods.mi;
import static dev.numafit.demand.Pods.milli;
import static dev.numafit.demand.Pods.pod;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;

class AdmissionTest {
  /** The LimitRange of "Configure Default Memory Requests and Limits for a Namespace" (K9). */
  private static final LimitDefaults DOCS_LIMIT_RANGE =
      LimitDefaults.fromItem(map(), map(), map("memory", mi(512)), map("memory", mi(256)));

  private static ContainerSpec admitted(ContainerSpec c, LimitDefaults d) {
    PodModel p = Admission.applyLimitDefaults(Admission.limitsAsRequests(pod(List.of(c))), d);
    return p.containers().get(0);
  }

  @Test
  void limitsAsRequests_limitOnly_requestEqualsLimit() {
    // "Resource Management for Pods and Containers" (K5): with only a limit, the request is set to
    // the limit.
    ContainerSpec c = admitted(app("c", map(), map("cpu", milli(500))), LimitDefaults.NONE);
    assertEquals(map("cpu", milli(500)), c.requests());
  }

  @Test
  void applyLimitDefaults_nothingSet_gets256MiRequestAnd512MiLimit() {
    // K9: a container that sets nothing gets 256Mi / 512Mi.
    ContainerSpec c = admitted(app("c", map(), map()), DOCS_LIMIT_RANGE);
    assertEquals(map("memory", mi(256)), c.requests());
    assertEquals(map("memory", mi(512)), c.limits());
  }

  @Test
  void applyLimitDefaults_onlyLimit1Gi_request1Gi() {
    // FACTS check value 9 (K9): a container that sets only a 1Gi limit requests 1Gi.
    ContainerSpec c = admitted(app("c", map(), map("memory", gi(1))), DOCS_LIMIT_RANGE);
    assertEquals(map("memory", gi(1)), c.requests());
    assertEquals(map("memory", gi(1)), c.limits());
  }

  @Test
  void applyLimitDefaults_onlyRequest128Mi_limit512Mi() {
    // FACTS check value 10 (K9): a container that sets only a 128Mi request gets the 512Mi limit.
    ContainerSpec c = admitted(app("c", map("memory", mi(128)), map()), DOCS_LIMIT_RANGE);
    assertEquals(map("memory", mi(128)), c.requests());
    assertEquals(map("memory", mi(512)), c.limits());
  }

  @Test
  void fromItem_onlyMax_defaultAndDefaultRequestFromMax() {
    // SetDefaults_LimitRangeItem (K9b): a missing default comes from max, a missing defaultRequest
    // from default.
    LimitDefaults d = LimitDefaults.fromItem(map("cpu", milli(800)), map(), map(), map());
    assertEquals(map("cpu", milli(800)), d.defaultLimit());
    assertEquals(map("cpu", milli(800)), d.defaultRequest());
  }

  @Test
  void fromItem_onlyMin_defaultRequestFromMin() {
    // K9b: with no default, a missing defaultRequest comes from min.
    LimitDefaults d = LimitDefaults.fromItem(map(), map("cpu", milli(200)), map(), map());
    assertEquals(map(), d.defaultLimit());
    assertEquals(map("cpu", milli(200)), d.defaultRequest());
  }

  @Test
  void then_twoLimitRanges_firstWinsPerResource() {
    LimitDefaults a = LimitDefaults.fromItem(map(), map(), map("cpu", milli(500)), map());
    LimitDefaults b =
        LimitDefaults.fromItem(map(), map(), map("cpu", milli(900), "memory", mi(64)), map());
    LimitDefaults both = a.then(b);
    assertEquals(map("cpu", milli(500), "memory", mi(64)), both.defaultLimit());
  }

  @Test
  void applyOverhead_setsPodFixed() {
    PodModel p =
        Admission.applyOverhead(
            pod(List.of(app("c", map(), map()))), map("cpu", milli(250), "memory", mi(120)));
    assertEquals(map("cpu", milli(250), "memory", mi(120)), p.overhead());
  }

  @Test
  void limitsAsRequests_podLimitOnlyAndNoContainerRequest_podRequestEqualsLimit() {
    // KEP-2837 (K6b): if only a pod limit is set and no container requests it, the pod request
    // defaults to the pod limit.
    PodModel p =
        new PodModel(
            List.of(),
            List.of(app("c", map(), map())),
            map(),
            map(),
            map("memory", gi(1)),
            java.util.Optional.empty());
    assertEquals(map("memory", gi(1)), Admission.limitsAsRequests(p).podRequests());
  }
}
