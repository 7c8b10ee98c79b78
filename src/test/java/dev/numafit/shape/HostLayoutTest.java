package dev.numafit.shape;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.host.HostProfile;
import dev.numafit.resource.Resources;
import java.util.List;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

/** Where the workers of one host sit, node by node, agreeing with the count per host. */
class HostLayoutTest {
  private static final long MI = 1L << 20;
  private static final long GI = 1L << 30;
  private static final ShapeDeriver DEFAULT = new ShapeDeriver(ShapeOptions.defaults());

  @Test
  void layout_shapeFitsNodes_workersPerNode() {
    // Same host as ShapeDeriverTest: node 0 has 10 vCPUs after 2 reserved cores, node 1 has 12;
    // 60Gi each for workers. 4 vCPU / 16Gi (+512Mi overhead): node 0 holds 2, node 1 holds 3.
    HostProfile p = ShapeDeriverTest.host(2, 1, 12, 8 * GI, 2, 512 * MI, Resources.EMPTY);
    HostLayout layout =
        DEFAULT.layout(p, new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 4, 16 * GI, Resources.EMPTY));
    assertFalse(layout.spanning());
    assertEquals(
        List.of(new HostLayout.Group(List.of(0), 2), new HostLayout.Group(List.of(1), 3)),
        layout.groups());
    assertEquals(5, layout.workers());
  }

  @Test
  void layout_16VcpusOn12CoreNodes_oneWorkerOverTwoNodes() {
    // Common practice, the usual worked example: a 16-vCPU VM on 12-core nodes spans two nodes.
    HostProfile p = ShapeDeriverTest.host(2, 1, 12, 0, 0, 0, Resources.EMPTY);
    HostLayout layout =
        DEFAULT.layout(p, new WorkerShape(ShapeKind.EXPLICIT, 1, 1, 16, 32 * GI, Resources.EMPTY));
    assertTrue(layout.spanning());
    assertEquals(List.of(new HostLayout.Group(List.of(0, 1), 1)), layout.groups());
    assertEquals(layout.groups().get(0), layout.groupOf(1));
  }

  @Property(tries = 200)
  void layout_anyShape_workersEqualWorkersPerHost(
      @ForAll @IntRange(min = 1, max = 2) int sockets,
      @ForAll @IntRange(min = 1, max = 4) int nodesPerSocket,
      @ForAll @IntRange(min = 2, max = 32) int cores,
      @ForAll @IntRange(min = 0, max = 4) int reservedCores,
      @ForAll @IntRange(min = 1, max = 80) int vcpus,
      @ForAll @IntRange(min = 1, max = 300) int memoryGi) {
    HostProfile p =
        ShapeDeriverTest.host(sockets, nodesPerSocket, cores, 8 * GI, reservedCores, 256 * MI,
            Resources.EMPTY);
    WorkerShape shape =
        new WorkerShape(ShapeKind.EXPLICIT, 1, 1, vcpus, memoryGi * GI, Resources.EMPTY);
    HostLayout layout = DEFAULT.layout(p, shape);
    HostFit fit = DEFAULT.workersPerHost(p, shape);
    assertEquals(fit.workersPerHost(), layout.workers());
    // Spanning exactly when the hypervisor has to split each worker.
    assertEquals(fit.split().isPresent(), layout.spanning());
    // Every node is in exactly one group.
    assertEquals(sockets * nodesPerSocket,
        layout.groups().stream().mapToInt(g -> g.nodes().size()).sum());
  }
}
