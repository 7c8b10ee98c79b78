package dev.numafit.capture;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.numafit.demand.Demand;
import dev.numafit.host.HostProfile;
import dev.numafit.manifest.ManifestReader;
import dev.numafit.manifest.ReadOptions;
import dev.numafit.plan.Plan;
import dev.numafit.plan.PlanInput;
import dev.numafit.plan.Planner;
import dev.numafit.profile.HostProfileReader;
import dev.numafit.resource.Resources;
import dev.numafit.shape.Allocatable;
import dev.numafit.shape.KubeletReserve;
import dev.numafit.shape.ShapeDeriver;
import dev.numafit.shape.ShapeOptions;
import dev.numafit.shape.WorkerShape;
import java.io.ByteArrayInputStream;
import java.math.BigDecimal;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;

/**
 * A profile captured without SMBIOS data goes through the same steps plan takes: profile reader,
 * one-node shape, kubelet allocatable, packing.
 */
class CapturedProfilePlanTest {
  @Test
  void plan_profileCapturedWithoutSmbios_packsOntoOneNodeWorkers() throws Exception {
    CapturedHost h =
        HostCapture.derive(
            new SysfsReader(Fixtures.sysfs("two-sockets")).read(), Optional.empty(), List.of());
    HostProfile profile =
        new HostProfileReader().parse("captured.yaml", ProfileWriter.write(h, "captured"))
            .profile();
    ShapeDeriver deriver = new ShapeDeriver(ShapeOptions.defaults());
    WorkerShape worker = deriver.oneNode(profile);
    Resources allocatable = Allocatable.compute(worker, KubeletReserve.defaults());
    // Tiered kube-reserved for 8 cores (issue 2's scale, common practice, from memory) is 90m.
    assertEquals(7910L, allocatable.get(Resources.CPU));
    Demand demand =
        new ManifestReader()
            .read(
                List.of(Fixtures.path("capture/ten-one-cpu-pods.yaml").toString()),
                new ByteArrayInputStream(new byte[0]),
                ReadOptions.defaults());
    Plan plan =
        new Planner()
            .plan(
                demand,
                new PlanInput(
                    Optional.of(profile.name()),
                    worker,
                    allocatable,
                    OptionalInt.of(deriver.workersPerHost(profile, worker).workersPerHost()),
                    List.of(),
                    Resources.EMPTY,
                    0,
                    100,
                    BigDecimal.ONE,
                    false,
                    List.of(),
                    List.of()));
    // Seven 1-CPU pods fit in 7910m, so ten pods need two workers; one host carries two
    // one-node workers (one per node).
    assertEquals(2, plan.workersNeeded());
    assertEquals(OptionalInt.of(1), plan.hostsNeeded());
  }
}
