package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.resource.Resources;
import dev.numafit.shape.KubeletReserve;
import java.math.BigDecimal;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

class PlanOptionsTest {
  private static PlanOptions check(String... args) {
    PlanCommand c = new PlanCommand();
    new CommandLine(c).setCaseInsensitiveEnumValuesAllowed(true).parseArgs(args);
    return PlanOptions.check(c);
  }

  private static List<String> problems(String... args) {
    return assertThrows(UsageException.class, () -> check(args)).problems();
  }

  @Test
  void check_defaults_followTheKubelet() {
    PlanOptions o = check("-f", "x.yaml", "--worker", "cpu=16,memory=64Gi");
    // Kubelet defaults (FACTS A4, K12/K13): eviction memory.available 100Mi,
    // nodefs.available 10%, maxPods 110; kube-reserved empty means the tiered scale.
    assertEquals(KubeletReserve.defaults(), o.reserve());
    assertEquals(Optional.of(Resources.of("cpu", 16000L, "memory", 64L << 30)), o.worker());
    assertEquals(100, o.maxUtilizationPct());
    assertEquals(BigDecimal.ONE, o.growth());
  }

  @Test
  void check_reserveCompute_docsExample_isCarriedThrough() {
    // The reservations of the Reserve Compute Resources page (K11): kube-reserved
    // cpu=1,memory=2Gi,ephemeral-storage=1Gi; system-reserved cpu=500m,memory=1Gi,
    // ephemeral-storage=1Gi; eviction memory.available<500Mi,nodefs.available<10%.
    PlanOptions o =
        check(
            "-f", "x.yaml", "--worker", "cpu=16,memory=32Gi,ephemeral-storage=100Gi",
            "--kube-reserved", "cpu=1,memory=2Gi,ephemeral-storage=1Gi",
            "--system-reserved", "cpu=500m,memory=1Gi,ephemeral-storage=1Gi",
            "--eviction-hard", "memory.available<500Mi,nodefs.available<10%");
    KubeletReserve r = o.reserve();
    assertEquals(
        Optional.of(Resources.of("cpu", 1000L, "memory", 2L << 30, "ephemeral-storage", 1L << 30)),
        r.kubeReserved());
    assertEquals(
        Resources.of("cpu", 500L, "memory", 1L << 30, "ephemeral-storage", 1L << 30),
        r.systemReserved());
    assertEquals(Resources.of("memory", 500L << 20), r.evictionHard());
    assertEquals(Map.of("ephemeral-storage", new BigDecimal("10")), r.evictionHardPercent());
  }

  @Test
  void check_kubeletReserveNone_zeroesEverything() {
    PlanOptions o =
        check("-f", "x.yaml", "--worker", "cpu=8,memory=16Gi", "--kubelet-reserve", "none",
            "--max-pods", "250");
    assertEquals(KubeletReserve.none(250), o.reserve());
  }

  @Test
  void check_hostOnlyOptionsWithoutProfile_areRejected() {
    assertEquals(
        List.of(
            "--host-failures needs --host-profile (without one, plan counts workers, not hosts)",
            "--vcpu-per-thread and --cpu-overcommit need --host-profile (they change how a"
                + " host's cores become vCPUs)"),
        problems(
            "-f", "x.yaml", "--worker", "cpu=8,memory=16Gi", "--host-failures", "1",
            "--vcpu-per-thread"));
  }

  @Test
  void check_workerShapeRules() {
    assertEquals(
        List.of("--worker cpu= must be whole vCPUs, e.g. cpu=16"),
        problems("-f", "x.yaml", "--worker", "cpu=1500m,memory=4Gi"));
    assertEquals(
        List.of("--worker takes no pods=; use --max-pods"),
        problems("-f", "x.yaml", "--worker", "cpu=2,memory=4Gi,pods=30"));
    assertEquals(
        List.of("--kube-reserved takes no pods="),
        problems("-f", "x.yaml", "--worker", "cpu=2,memory=4Gi", "--kube-reserved", "pods=3"));
  }

  @Test
  void check_perWorkerPods_areAllowed() {
    PlanOptions o =
        check("-f", "x.yaml", "--worker", "cpu=8,memory=16Gi", "--per-worker",
            "cpu=250m,memory=512Mi,pods=3");
    assertEquals(Resources.of("cpu", 250L, "memory", 512L << 20, "pods", 3L), o.perWorker());
    assertTrue(o.hostProfiles().isEmpty());
  }
}
