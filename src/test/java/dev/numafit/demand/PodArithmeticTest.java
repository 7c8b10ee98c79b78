package dev.numafit.demand;

import static dev.numafit.demand.Pods.app;
import static dev.numafit.demand.Pods.cores;
import static dev.numafit.demand.Pods.gi;
import static dev.numafit.demand.Pods.init;
import static dev.numafit.demand.Pods.map;
import static dev.numafit.demand.Pods.mi;
import static dev.numafit.demand.Pods.milli;
import static dev.numafit.demand.Pods.pod;
import static dev.numafit.demand.Pods.sidecar;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.math.BigDecimal;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.resource.Resources;
import java.util.List;
import java.util.Optional;
import java.util.OptionalLong;
import org.junit.jupiter.api.Test;

class PodArithmeticTest {
  private static final long MIB = 1L << 20;

  /** The pod of the "Pod Overhead" docs page: two containers with limits only. */
  private static PodModel overheadDocsPod(boolean withOverhead) {
    PodModel p =
        new PodModel(
            List.of(),
            List.of(
                app("first-ctr", map(), map("cpu", milli(500), "memory", mi(100))),
                app("second-ctr", map(), map("cpu", milli(1500), "memory", mi(100)))),
            withOverhead ? map("cpu", milli(250), "memory", mi(120)) : map(),
            map(),
            map(),
            Optional.of("sandboxed"));
    return Admission.limitsAsRequests(p);
  }

  @Test
  void effective_overheadDocsExample_requests2250mAnd320Mi() {
    EffectivePod e = PodArithmetic.effective(overheadDocsPod(true));
    // FACTS check value 1, "Pod Overhead" (K1): the node shows 2250m and 320Mi requested.
    assertEquals(2250, e.requests().get("cpu"));
    assertEquals(320 * MIB, e.requests().get("memory"));
    // Same page: the pod cgroup memory.limit_in_bytes is 335544320 (limits 200Mi + 120Mi overhead).
    assertEquals(335544320L, e.limits().get("memory"));
    assertEquals(QosClass.GUARANTEED, e.qos());
  }

  @Test
  void effective_overheadDocsExampleWithoutOverhead_requests2000mAnd200Mi() {
    EffectivePod e = PodArithmetic.effective(overheadDocsPod(false));
    // FACTS check value 2, "Pod Overhead" (K1): the containers alone total 2000m and 200Mi.
    assertEquals(Resources.of("cpu", 2000L, "memory", 200 * MIB), e.requests());
  }

  @Test
  void effective_twoContainersDocsExample_requests500mAnd128MiLimits1CpuAnd256Mi() {
    // FACTS check value 3, "Resource Management for Pods and Containers" (K5): two containers each
    // requesting 250m/64Mi with limits 500m/128Mi.
    PodModel p =
        pod(
            List.of(
                app(
                    "app",
                    map("cpu", milli(250), "memory", mi(64)),
                    map("cpu", milli(500), "memory", mi(128))),
                app(
                    "log-aggregator",
                    map("cpu", milli(250), "memory", mi(64)),
                    map("cpu", milli(500), "memory", mi(128)))));
    EffectivePod e = PodArithmetic.effective(p);
    assertEquals(Resources.of("cpu", 500L, "memory", 128 * MIB), e.requests());
    assertEquals(Resources.of("cpu", 1000L, "memory", 256 * MIB), e.limits());
    assertEquals(QosClass.BURSTABLE, e.qos());
  }

  @Test
  void effective_sidecarDeclaredBeforeInit_1300m() {
    // FACTS check value 13, derived from KEP-753 and helpers.go (K3/K4): init containers
    // [sidecar 800m, init 500m], app 300m: the init container runs beside the sidecar,
    // 500m + 800m = 1300m, more than the steady 300m + 800m.
    PodModel p =
        pod(
            List.of(
                sidecar("proxy", map("cpu", milli(800))), init("migrate", map("cpu", milli(500)))),
            List.of(app("web", map("cpu", milli(300)), map())));
    assertEquals(1300, PodArithmetic.effective(p).requests().get("cpu"));
  }

  @Test
  void effective_initDeclaredBeforeSidecar_1100m() {
    // FACTS check value 13, swapped: the init container runs alone (500m), so the steady state
    // 300m + 800m = 1100m decides. Order matters (K4).
    PodModel p =
        pod(
            List.of(
                init("migrate", map("cpu", milli(500))), sidecar("proxy", map("cpu", milli(800)))),
            List.of(app("web", map("cpu", milli(300)), map())));
    assertEquals(1100, PodArithmetic.effective(p).requests().get("cpu"));
  }

  @Test
  void effective_initSidecarInit_1000m() {
    // FACTS check value 14, derived from K3/K4: [init 1000m, sidecar 200m, init 500m], app 300m →
    // max(1000, 200 + 500, 300 + 200) = 1000m.
    PodModel p =
        pod(
            List.of(
                init("a", map("cpu", milli(1000))),
                sidecar("s", map("cpu", milli(200))),
                init("b", map("cpu", milli(500)))),
            List.of(app("web", map("cpu", milli(300)), map())));
    assertEquals(1000, PodArithmetic.effective(p).requests().get("cpu"));
  }

  @Test
  void effective_limitsOnlyTwoCpus_guaranteedWithTwoExclusiveCpus() {
    // FACTS check value 11, "Resource managers" (K15): a container with only limits cpu "2" and
    // memory 200Mi is Guaranteed and the static policy grants it 2 exclusive CPUs.
    PodModel p =
        Admission.limitsAsRequests(
            pod(List.of(app("c", map(), map("cpu", cores("2"), "memory", mi(200))))));
    EffectivePod e = PodArithmetic.effective(p);
    assertEquals(QosClass.GUARANTEED, e.qos());
    assertEquals(2, e.exclusiveCpus());
    assertEquals(Resources.of("cpu", 2000L, "memory", 200 * MIB), e.requests());
  }

  @Test
  void effective_guaranteedFractionalCpu_noExclusiveCpus() {
    // FACTS check value 12 (K15): Guaranteed with cpu 1.5 runs in the shared pool.
    PodModel p =
        Admission.limitsAsRequests(
            pod(List.of(app("c", map(), map("cpu", cores("1.5"), "memory", mi(200))))));
    EffectivePod e = PodArithmetic.effective(p);
    assertEquals(QosClass.GUARANTEED, e.qos());
    assertEquals(0, e.exclusiveCpus());
  }

  @Test
  void effective_burstableIntegerCpu_noExclusiveCpus() {
    // K15: only Guaranteed pods get exclusive CPUs.
    PodModel p = pod(List.of(app("c", map("cpu", cores("2")), map("cpu", cores("4")))));
    assertEquals(0, PodArithmetic.effective(p).exclusiveCpus());
  }

  @Test
  void effective_nothingSet_bestEffortWithNoRequestFlags() {
    // "Pod Quality of Service Classes" (K8): no CPU or memory request or limit → BestEffort.
    EffectivePod e = PodArithmetic.effective(pod(List.of(app("c", map(), map()))));
    assertEquals(QosClass.BEST_EFFORT, e.qos());
    assertTrue(e.requests().isEmpty());
    assertEquals(List.of(PodArithmetic.NO_CPU_REQUEST, PodArithmetic.NO_MEMORY_REQUEST), e.flags());
  }

  @Test
  void effective_extendedResourceOnly_bestEffort() {
    // K8: resources other than cpu and memory do not count for QoS.
    EffectivePod e =
        PodArithmetic.effective(
            pod(
                List.of(
                    app(
                        "c",
                        map("example.com/accel", cores("1")),
                        map("example.com/accel", cores("1"))))));
    assertEquals(QosClass.BEST_EFFORT, e.qos());
    assertEquals(1, e.requests().get("example.com/accel"));
  }

  @Test
  void effective_containerWithoutLimit_podUnlimitedForThatResource() {
    // "Sidecar Containers" (K2): a resource without a limit is the highest limit.
    PodModel p =
        pod(
            List.of(
                app(
                    "a",
                    map("cpu", milli(100), "memory", mi(10)),
                    map("cpu", milli(200), "memory", mi(20))),
                app("b", map("cpu", milli(100), "memory", mi(10)), map("memory", mi(20)))));
    EffectivePod e = PodArithmetic.effective(p);
    assertEquals(Resources.of("memory", 40 * MIB), e.limits());
  }

  @Test
  void effective_podLevelRequests_replaceAggregateThenOverheadAdded() {
    // "Assign Pod-level CPU and memory resources" (K6) and helpers.go (K4): pod-level values
    // replace
    // the containers' aggregate; overhead is added after.
    PodModel p =
        new PodModel(
            List.of(),
            List.of(
                app("a", map("cpu", milli(100)), map()), app("b", map("cpu", milli(100)), map())),
            map("cpu", milli(50)),
            map("cpu", cores("1"), "memory", mi(100)),
            map("cpu", cores("1"), "memory", mi(100)),
            Optional.empty());
    EffectivePod e = PodArithmetic.effective(p);
    assertEquals(1050, e.requests().get("cpu"));
    assertEquals(100 * MIB, e.requests().get("memory"));
    // Pod-level resources decide the QoS class (KEP-2837): requests equal limits → Guaranteed.
    assertEquals(QosClass.GUARANTEED, e.qos());
    assertFalse(e.flags().contains(PodArithmetic.NO_MEMORY_REQUEST));
  }

  @Test
  void effective_cpuFinerThanOneMilli_roundedUpWithFlag() {
    // FACTS check value 5 (Quantity reference, K10): 0.1m rounds up to 1m.
    EffectivePod e =
        PodArithmetic.effective(
            pod(List.of(app("c", map("cpu", milli(1).divide(cores("10"))), map()))));
    assertEquals(1, e.requests().get("cpu"));
    assertTrue(e.flags().contains(PodArithmetic.CPU_FINER_THAN_1M));
  }

  @Test
  void effective_threeContainersOfATenthMillicore_sumRoundedUpOnceToOneMillicore() {
    // Regression (found by the kubectl differential test): kubectl describe node prints 300u for
    // three containers of 0.1m, and the scheduler reads the pod total with MilliValue, rounding
    // the exact sum up once: 1m, not 3m (pkg/scheduler/framework/types.go, calculateResource).
    BigDecimal tenth = milli(1).divide(cores("10"));
    EffectivePod e =
        PodArithmetic.effective(
            pod(
                List.of(
                    app("a", map("cpu", tenth), map()),
                    app("b", map("cpu", tenth), map()),
                    app("c", map("cpu", tenth), map()))));
    assertEquals(1, e.requests().get("cpu"));
    assertTrue(e.flags().contains(PodArithmetic.CPU_FINER_THAN_1M));
  }

  @Test
  void effective_amountFinerThanOneNano_eachRoundedUpToOneNanoBeforeSumming() {
    // apimachinery resource.ParseQuantity rounds a value finer than 1n up to 1n when the API
    // server reads the pod: memory 0.5000000004 is kept as 500000001n and 0.4999999996 as
    // 500000000n; their sum 1000000001n is read as 2 bytes (an exact sum of 1.0 would be 1).
    EffectivePod e =
        PodArithmetic.effective(
            pod(List.of(app("a", map("memory", cores("0.5000000004")), map()),
                app("b", map("memory", cores("0.4999999996")), map()))));
    assertEquals(2, e.requests().get("memory"));
  }

  @Test
  void effective_memoryFractions_summedExactlyThenRoundedUpOnce() {
    // FACTS A3: memory 400m is 0.4 bytes; two such containers total 0.8 bytes, read as 1 byte.
    EffectivePod e =
        PodArithmetic.effective(
            pod(
                List.of(
                    app("a", map("memory", cores("0.4")), map()),
                    app("b", map("memory", cores("0.4")), map()))));
    assertEquals(1, e.requests().get("memory"));
  }

  @Test
  void validate_podLimitBelowContainerLimits_invalid() {
    // FACTS check value 15 (KEP-2837, K6b): a 100Gi pod limit with two containers limited to 60Gi
    // is invalid (their requests, defaulted from the limits, sum to 120Gi).
    PodModel p =
        Admission.limitsAsRequests(
            new PodModel(
                List.of(),
                List.of(
                    app("a", map(), map("memory", gi(60))), app("b", map(), map("memory", gi(60)))),
                map(),
                map(),
                map("memory", gi(100)),
                Optional.empty()));
    List<String> problems = PodArithmetic.validate(p);
    assertTrue(
        problems.contains(
            "pod-level memory limit 100Gi is below the containers' requests" + " 120Gi"),
        problems.toString());
  }

  @Test
  void validate_hugepagesRequestDiffersFromLimit_invalid() {
    // FACTS check value 26 ("Manage HugePages", K17): a hugepages request must equal its limit.
    PodModel p =
        pod(
            List.of(
                app(
                    "c",
                    map("hugepages-2Mi", mi(80), "memory", mi(10)),
                    map("hugepages-2Mi", mi(100), "memory", mi(10)))));
    assertEquals(
        List.of(
            "container \"c\": hugepages-2Mi request 80Mi must equal its limit 100Mi"
                + " (hugepages cannot be overcommitted)"),
        PodArithmetic.validate(p));
  }

  @Test
  void validate_hugepagesLimitOnly_validAfterDefaulting() {
    // K17: if only a limit is set, the request defaults to it.
    PodModel p =
        Admission.limitsAsRequests(
            pod(
                List.of(
                    app(
                        "c",
                        map("memory", mi(10)),
                        map("hugepages-2Mi", mi(80), "memory", mi(10))))));
    assertEquals(List.of(), PodArithmetic.validate(p));
    assertEquals(80 * MIB, PodArithmetic.effective(p).requests().get("hugepages-2Mi"));
  }

  @Test
  void hugepages_80MiOf2Mi_40Pages() {
    // FACTS check value 26 (K5, K17): hugepages-2Mi: 80Mi is 40 pages.
    assertEquals(OptionalLong.of(40), PodArithmetic.hugepages("hugepages-2Mi", 80 * MIB));
    assertEquals(OptionalLong.of(1L << 30), PodArithmetic.hugepageSize("hugepages-1Gi"));
    assertEquals(OptionalLong.empty(), PodArithmetic.hugepageSize("memory"));
  }

  @Test
  void validate_requestAboveLimit_invalid() {
    PodModel p = pod(List.of(app("c", map("cpu", cores("2")), map("cpu", cores("1")))));
    assertEquals(
        List.of("container \"c\": cpu request 2 is above its limit 1"), PodArithmetic.validate(p));
  }
}
