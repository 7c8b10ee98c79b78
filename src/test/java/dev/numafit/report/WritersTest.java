package dev.numafit.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

class WritersTest {
  private static final JsonMapper JSON = new JsonMapper();

  @Test
  void planText_everyLineFits80Columns_andEndsWithCaution() {
    String text = new PlanTextWriter().render(ReportFixtures.planReport());
    for (String line : text.split("\n")) {
      assertTrue(line.length() <= 80, "too wide (" + line.length() + "): " + line);
    }
    assertTrue(
        text.endsWith(
            "Caution: sized from declared requests. Verify against your hardware's\n"
                + "documentation and a load test; follow your organisation's change practice.\n"),
        text);
  }

  @Test
  void planText_showsShapeCountsOversizeAndBinaryUnits() {
    String text = new PlanTextWriter().render(ReportFixtures.planReport());
    assertTrue(text.contains("  Worker            32 vCPU, 250GiB memory (one per NUMA node)\n"),
        text);
    assertTrue(text.contains("  Workers needed    3 (no packing can use fewer than 2)\n"), text);
    assertTrue(text.contains("  Hosts needed      2\n"), text);
    assertTrue(text.contains("  Utilization       cpu 41.2%, memory 10.0%, pods 6.7%\n"), text);
    assertTrue(
        text.contains(
            "    parcel/Deployment/route-optimizer: over by cpu 8320m, memory 76GiB; smallest\n"
                + "      shape that holds it: 2-nodes.\n"),
        text);
    assertTrue(text.contains("  Not checked: ephemeral-storage, no capacity given.\n"), text);
    assertTrue(text.contains("Plan for the given worker\n"), text);
    // 1.5 relative cost × 2 hosts.
    assertTrue(text.contains("  two-socket    32  250GiB         2        3      2         1   3.0\n"),
        text);
  }

  @Test
  void planJson_hasIssueKeys_sortedAndTyped() {
    JsonNode root = JSON.readTree(new PlanJsonWriter().render(ReportFixtures.planReport()));
    assertEquals(1, root.get("schemaVersion").asInt());
    JsonNode p = root.get("plans").get(0);
    assertEquals("two-socket", p.get("hostProfile").asString());
    assertEquals(32, p.get("worker").get("vcpus").asInt());
    assertEquals(250L << 30, p.get("worker").get("memoryBytes").asLong());
    assertEquals(31830, p.get("worker").get("allocatable").get("cpu").asInt());
    assertEquals(2, p.get("workersPerHost").asInt());
    assertEquals(3, p.get("workersNeeded").asInt());
    assertEquals(2, p.get("lowerBound").asInt());
    assertEquals(2, p.get("hostsNeeded").asInt());
    assertEquals("parcel/Deployment/route-optimizer",
        p.get("oversize").get(0).get("workload").asString());
    assertEquals("2-nodes", p.get("oversize").get(0).get("smallestShape").asString());
    assertEquals("0.4123", p.get("utilization").get("cpu").decimalValue().toPlainString());
    assertEquals("parcel/Deployment/route-api#0",
        p.get("placement").get(0).get("pods").get(0).asString());
    JsonNode w = root.get("plans").get(1);
    assertTrue(w.get("hostProfile").isNull());
    assertTrue(w.get("workersPerHost").isNull());
    assertTrue(w.get("hostsNeeded").isNull());
    assertFalse(w.has("placement"), "placement only when asked");
    assertEquals("3.0", root.get("comparison").get(0).get("totalCost").decimalValue()
        .toPlainString());
    assertEquals("warning", root.get("warnings").get(0).get("severity").asString());
    assertKeysSorted(root);
  }

  @Test
  void planJson_singlePlan_hasNullComparison() {
    PlanReport r =
        new PlanReport(
            ReportFixtures.demand(), List.of(ReportFixtures.workerPlan()), Optional.empty(),
            List.of());
    JsonNode root = JSON.readTree(new PlanJsonWriter().render(r));
    assertTrue(root.get("comparison").isNull());
    assertEquals(0, root.get("warnings").size());
  }

  @Test
  void demandJson_workloadFields_fromTheIssue() {
    DemandReport r = new DemandReport(ReportFixtures.demand(), ReportFixtures.demand().diagnostics());
    JsonNode root = JSON.readTree(new DemandJsonWriter().render(r));
    JsonNode w = root.get("workloads").get(0);
    assertEquals("parcel/Deployment/customs-scanner", w.get("workload").asString());
    assertEquals("manifests/customs-scanner.yaml", w.get("source").get("file").asString());
    assertEquals(3, w.get("source").get("line").asInt());
    // Pod Overhead docs (K1): 2250m, 320Mi = 335544320 bytes.
    assertEquals(2250, w.get("requests").get("cpu").asInt());
    assertEquals(335544320L, w.get("requests").get("memory").asLong());
    assertEquals("Guaranteed", w.get("qos").asString());
    // Peak demand: 2 × 2250m + 16 × 800m = 17300m; the DaemonSet is counted per worker.
    assertEquals(17300, root.get("totals").get("requestsAtPeak").get("cpu").asInt());
    assertEquals(18, root.get("totals").get("podsAtPeak").asInt());
    assertEquals(1, root.get("totals").get("perWorkerPods").asInt());
    assertEquals(3, root.get("skipped").get("total").asInt());
    assertEquals(1, root.get("customNotSized").size());
    assertKeysSorted(root);
  }

  @Test
  void demandText_fitsAndNamesSkippedKinds() {
    String text =
        new DemandTextWriter()
            .render(new DemandReport(ReportFixtures.demand(), List.of()));
    for (String line : text.split("\n")) {
      assertTrue(line.length() <= 80, "too wide: " + line);
    }
    assertTrue(
        text.contains(
            "Skipped 3 objects of 2 kinds that run no pods: ConfigMap 1, Service 2.\n"), text);
    assertTrue(text.contains("  parcel/Deployment/customs-scanner         2     2  2250m   320MiB"
        + "  Guaranteed\n"), text);
    assertTrue(text.contains("peak 16 from\n      HorizontalPodAutoscaler route-api maxReplicas"), text);
  }

  @Test
  void writers_sameReportTwice_sameBytes() {
    PlanReport r = ReportFixtures.planReport();
    assertEquals(new PlanJsonWriter().render(r), new PlanJsonWriter().render(r));
    assertEquals(new PlanTextWriter().render(r), new PlanTextWriter().render(r));
    assertFalse(new PlanJsonWriter().render(r).contains("\r"));
  }

  static void assertKeysSorted(JsonNode n) {
    if (n.isObject()) {
      String prev = "";
      for (String k : n.propertyNames()) {
        assertTrue(prev.compareTo(k) < 0, "keys out of order: " + prev + " then " + k);
        prev = k;
        assertKeysSorted(n.get(k));
      }
    } else if (n.isArray()) {
      n.forEach(WritersTest::assertKeysSorted);
    }
  }
}
