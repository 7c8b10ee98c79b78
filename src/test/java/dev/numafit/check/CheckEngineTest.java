package dev.numafit.check;

import static dev.numafit.check.CheckFixture.GI;
import static dev.numafit.check.CheckFixture.MI;
import static dev.numafit.check.CheckFixture.deployment;
import static dev.numafit.check.CheckFixture.docsNode;
import static dev.numafit.check.CheckFixture.findings;
import static dev.numafit.check.CheckFixture.input;
import static dev.numafit.check.CheckFixture.read;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.diag.SourceRef;
import dev.numafit.fit.SpanningRoom;
import dev.numafit.resource.Resources;
import java.math.BigDecimal;
import java.util.List;
import java.util.OptionalInt;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;

class CheckEngineTest {
  private static List<Rule> rules(List<Finding> fs) {
    return fs.stream().map(Finding::rule).toList();
  }

  private static String requests(String cpu, String memory) {
    return "          resources:\n"
        + "            requests:\n"
        + "              cpu: \"" + cpu + "\"\n"
        + "              memory: " + memory + "\n";
  }

  private static String guaranteed(String cpu, String memory) {
    return requests(cpu, memory)
        + "            limits:\n"
        + "              cpu: \"" + cpu + "\"\n"
        + "              memory: " + memory + "\n";
  }

  @Test
  void run_podEqualToAllocatable_fits() {
    // Docs node allocatable 14.5 CPU, 28.5Gi (FACTS check value 6); equality fits (FACTS A7,
    // fit.go: it fails only when allocatable < request).
    assertEquals(List.of(), findings(deployment("exact", 1, requests("14500m", "28.5Gi"))));
  }

  @Test
  void run_podOneMillicoreOverAllocatable_reportsExcessPerResource() {
    // FACTS check value 16: 1m over what is left is "Insufficient cpu"; 14.5 CPU + 1m.
    List<Finding> fs = findings(deployment("big", 1, requests("14501m", "29Gi")));
    assertEquals(List.of(Rule.POD_EXCEEDS_WORKER), rules(fs));
    Finding f = fs.get(0);
    // Allocatable memory is exactly 32Gi − 2Gi − 1Gi − 500Mi = 29196Mi (the docs round it to
    // 28.5Gi), so 29Gi is 500Mi over; 14501m − 14500m = 1m over.
    assertEquals(Resources.of("cpu", 1L, "memory", 500 * MI), f.amounts());
    // Line 13 of the manifest is the container's "resources:" key (see CheckFixture.deployment).
    assertEquals(new SourceRef("change.yaml", 13), f.location());
    assertEquals("shop/Deployment/big", f.subject());
  }

  @Test
  void run_guaranteedIntegerCpuAboveFloorOfAllocatable_reportsExclusiveCpus() {
    // FACTS check value 11: a Guaranteed pod with integer CPU gets exclusive CPUs under the static
    // policy; 15 pinned against floor(14.5) = 14 whole CPUs → 1 CPU over.
    List<Finding> fs = findings(deployment("pinned", 1, guaranteed("15", "1Gi")));
    assertTrue(rules(fs).contains(Rule.EXCLUSIVE_CPUS_EXCEED_WORKER), fs.toString());
    Finding f = fs.stream().filter(x -> x.rule() == Rule.EXCLUSIVE_CPUS_EXCEED_WORKER)
        .findFirst().orElseThrow();
    assertEquals(Resources.of("cpu", 1000L), f.amounts());
  }

  @Test
  void run_guaranteedFractionalCpu_noExclusiveFinding() {
    // FACTS check value 12: Guaranteed with cpu 1.5 runs in the shared pool, pins nothing.
    assertEquals(List.of(), findings(deployment("shared", 1, guaranteed("1.5", "1Gi"))));
  }

  @Test
  void run_guaranteedFourteenCpus_fitsFloorOfAllocatable() {
    // floor(14.5) = 14 whole CPUs (FACTS check value 6): a 14-CPU Guaranteed pod fits.
    assertEquals(List.of(), findings(deployment("fourteen", 1, guaranteed("14", "1Gi"))));
  }

  @Test
  void run_hugepagesWithinCapacity_fits() {
    // FACTS check value 26: hugepages-2Mi 80Mi is 40 pages; request equals limit (K17).
    String res = "          resources:\n"
        + "            requests: {cpu: 500m, memory: 1Gi, hugepages-2Mi: 80Mi}\n"
        + "            limits: {hugepages-2Mi: 80Mi}\n";
    CheckInput in = input(read(deployment("pages", 1, res)),
        docsNode(Resources.of("hugepages-2Mi", GI)), List.of(), OptionalInt.empty());
    assertEquals(List.of(), CheckEngine.run(in, CheckOptions.defaults()));
  }

  @Test
  void run_hugepagesAboveCapacity_reportsExcessOfThatSize() {
    String res = "          resources:\n"
        + "            requests: {cpu: 500m, memory: 1Gi, hugepages-2Mi: 2Gi}\n"
        + "            limits: {hugepages-2Mi: 2Gi}\n";
    CheckInput in = input(read(deployment("pages", 1, res)),
        docsNode(Resources.of("hugepages-2Mi", GI)), List.of(), OptionalInt.empty());
    List<Finding> fs = CheckEngine.run(in, CheckOptions.defaults());
    assertEquals(List.of(Rule.HUGEPAGES_EXCEED_WORKER), rules(fs));
    // 2Gi requested against 1Gi pre-allocated → 1Gi over.
    assertEquals(Resources.of("hugepages-2Mi", GI), fs.get(0).amounts());
  }

  @Test
  void run_hugepagesWithoutCapacity_comparedWithMemory() {
    // No hugepages capacity: pages come out of the worker's memory. 28Gi + 1Gi = 29Gi against the
    // docs node's 29196Mi allocatable memory (32Gi − 2Gi − 1Gi − 500Mi) → 500Mi over.
    String res = "          resources:\n"
        + "            requests: {cpu: 500m, memory: 28Gi, hugepages-1Gi: 1Gi}\n"
        + "            limits: {hugepages-1Gi: 1Gi}\n";
    List<Finding> fs = findings(deployment("pages", 1, res));
    assertEquals(List.of(Rule.HUGEPAGES_EXCEED_WORKER), rules(fs));
    assertEquals(Resources.of("memory", 500 * MI), fs.get(0).amounts());
  }

  @Test
  void run_containerWithoutRequests_warnsAtItsLine() {
    String yaml = deployment("blind", 1, "          ports: [{containerPort: 8080}]\n");
    List<Finding> fs = findings(yaml);
    assertEquals(List.of(Rule.MISSING_REQUEST), rules(fs));
    // No resources block: the finding points at the container entry, line 11.
    assertEquals(new SourceRef("change.yaml", 11), fs.get(0).location());
    assertTrue(fs.get(0).message().contains("container \"app\" has no cpu or memory request"),
        fs.get(0).message());
  }

  @Test
  void run_limitsOnly_requestsDefaultToLimits_noWarning() {
    // FACTS check value 11 / K5: a container with only limits requests its limits.
    String res = "          resources:\n            limits: {cpu: \"2\", memory: 200Mi}\n";
    assertEquals(List.of(), findings(deployment("limits-only", 1, res)));
  }

  @Test
  void run_limitRangeDefaultRequest_noMissingRequestWarning() {
    // FACTS check value 10 (K9): a LimitRange defaultRequest supplies the memory request.
    String yaml = "apiVersion: v1\nkind: LimitRange\nmetadata: {name: defaults, namespace: shop}\n"
        + "spec:\n  limits:\n    - type: Container\n"
        + "      default: {cpu: 500m, memory: 512Mi}\n"
        + "      defaultRequest: {cpu: 250m, memory: 256Mi}\n---\n"
        + deployment("defaulted", 1, "          ports: [{containerPort: 80}]\n");
    assertEquals(List.of(), findings(yaml));
  }

  @Test
  void run_limitTwiceRequest_noRatioWarning() {
    // FACTS check value 3 (K5): 250m/64Mi requests with 500m/128Mi limits, a ratio of 2.
    String res = "          resources:\n"
        + "            requests: {cpu: 250m, memory: 64Mi}\n"
        + "            limits: {cpu: 500m, memory: 128Mi}\n";
    assertEquals(List.of(), findings(deployment("modest", 1, res)));
  }

  @Test
  void run_limitTenTimesRequest_warnsAboveRatio() {
    String res = "          resources:\n"
        + "            requests: {cpu: 100m, memory: 64Mi}\n"
        + "            limits: {cpu: \"1\", memory: 128Mi}\n";
    List<Finding> fs = findings(deployment("bursty", 1, res));
    assertEquals(List.of(Rule.LIMIT_REQUEST_RATIO), rules(fs));
    // 1 CPU ÷ 100m = 10, above the default ratio 4; memory 128Mi ÷ 64Mi = 2 is not.
    assertEquals("container \"app\" cpu limit 1 is 10× its request 100m (above 4×)",
        fs.get(0).message());
  }

  @Test
  void run_podLargerThanWidestSpanningShape_reportsNeverRuns() {
    // A spanning room of exactly two docs nodes (29 CPU, 57Gi allocatable): a 30-CPU pod fits
    // neither the one-node worker nor the spanning one.
    List<SpanningRoom> span =
        List.of(new SpanningRoom("2-nodes", Resources.of("cpu", 29000L, "memory", 57 * GI,
            "pods", 110L)));
    CheckInput in = input(read(deployment("huge", 1, requests("30", "1Gi"))),
        docsNode(Resources.EMPTY), span, OptionalInt.empty());
    List<Finding> fs = CheckEngine.run(in, CheckOptions.defaults());
    assertEquals(List.of(Rule.POD_EXCEEDS_WORKER, Rule.POD_EXCEEDS_HOST), rules(fs));
    assertEquals(Resources.of("cpu", 1000L), fs.get(1).amounts());
  }

  @Test
  void run_podFitsSpanningShape_namesSmallestShape() {
    List<SpanningRoom> span =
        List.of(new SpanningRoom("2-nodes", Resources.of("cpu", 29000L, "memory", 57 * GI,
            "pods", 110L)));
    CheckInput in = input(read(deployment("wide", 1, requests("20", "1Gi"))),
        docsNode(Resources.EMPTY), span, OptionalInt.empty());
    List<Finding> fs = CheckEngine.run(in, CheckOptions.defaults());
    assertEquals(List.of(Rule.POD_EXCEEDS_WORKER), rules(fs));
    assertTrue(fs.get(0).message().endsWith("spans two NUMA nodes"), fs.get(0).message());
  }

  @Test
  void run_moreHostsThanFleet_reportsCapacityAtReplicasLine() {
    // 10 pods of 8 CPU: one per docs worker (8 + 8 > 14.5), so 10 workers; 2 workers per host
    // → 5 hosts, over a fleet of 4 by 1.
    CheckInput in = input(read(deployment("fleet", 10, requests("8", "1Gi"))),
        docsNode(Resources.EMPTY), List.of(), OptionalInt.of(2));
    CheckOptions opts = new CheckOptions(CheckOptions.DEFAULT_LIMIT_RATIO, OptionalInt.of(4),
        CheckOptions.defaultFailOn(true), false);
    List<Finding> fs = CheckEngine.run(in, opts);
    assertEquals(List.of(Rule.FLEET_CAPACITY), rules(fs));
    assertEquals(Resources.of("hosts", 1L), fs.get(0).amounts());
    // Line 7 holds "replicas: 10".
    assertEquals(new SourceRef("change.yaml", 7), fs.get(0).location());
  }

  @Test
  void run_fleetLargeEnough_noCapacityFinding() {
    CheckInput in = input(read(deployment("fleet", 10, requests("8", "1Gi"))),
        docsNode(Resources.EMPTY), List.of(), OptionalInt.of(2));
    CheckOptions opts = new CheckOptions(CheckOptions.DEFAULT_LIMIT_RATIO, OptionalInt.of(5),
        CheckOptions.defaultFailOn(true), false);
    assertEquals(List.of(), CheckEngine.run(in, opts));
  }

  @Test
  void run_customRatio_changesThreshold() {
    String res = "          resources:\n"
        + "            requests: {cpu: 250m, memory: 64Mi}\n"
        + "            limits: {cpu: 500m, memory: 128Mi}\n";
    CheckInput in = input(read(deployment("modest", 1, res)), docsNode(Resources.EMPTY),
        List.of(), OptionalInt.empty());
    // Ratio 2 is not above 1.5: both cpu and memory are flagged in one finding.
    CheckOptions opts = new CheckOptions(new BigDecimal("1.5"), OptionalInt.empty(),
        new TreeSet<>(), false);
    List<Finding> fs = CheckEngine.run(in, opts);
    assertEquals(List.of(Rule.LIMIT_REQUEST_RATIO), rules(fs));
  }
}
