package dev.numafit.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.demand.Demand;
import dev.numafit.demand.PodArithmetic;
import dev.numafit.demand.Workload;
import dev.numafit.diag.Severity;
import dev.numafit.manifest.ManifestReader;
import dev.numafit.manifest.ReadOptions;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Inputs that look odd but are valid and must simply work, with the same result as plain ones. */
class OddButValidInputTest {
  @TempDir Path tmp;

  static final String POD = "apiVersion: v1\nkind: Pod\nmetadata:\n  name: receipt\n"
      + "  namespace: billing\nspec:\n  containers:\n  - name: c\n    image: registry.example/r:1\n"
      + "    resources:\n      requests: {cpu: 250m, memory: 128Mi}\n";

  Demand read(String name, byte[] bytes) throws Exception {
    Path f = tmp.resolve(name);
    Files.write(f, bytes);
    return new ManifestReader().read(List.of(f.toString()), null, ReadOptions.defaults());
  }

  static Workload only(Demand d) {
    assertEquals(1, d.workloads().size(), d.toString());
    return d.workloads().get(0);
  }

  void assertPlain(Demand d) {
    assertTrue(d.diagnostics().stream().noneMatch(x -> x.severity() == Severity.ERROR),
        d.diagnostics().toString());
    Workload w = only(d);
    assertEquals("billing/Pod/receipt", w.id().toString());
    // 250m and 128Mi as written (Quantity reference: 128Mi = 134217728 bytes).
    assertEquals(250, w.pod().requests().get("cpu"));
    assertEquals(134_217_728L, w.pod().requests().get("memory"));
  }

  @Test
  void read_crlfLineEnds_sameAsLf() throws Exception {
    assertPlain(read("crlf.yaml", POD.replace("\n", "\r\n").getBytes(StandardCharsets.UTF_8)));
  }

  @Test
  void read_utf8ByteOrderMark_sameAsWithout() throws Exception {
    assertPlain(read("bom.yaml", ("\uFEFF" + POD).getBytes(StandardCharsets.UTF_8)));
  }

  @Test
  void read_utf16LittleAndBigEndianWithByteOrderMark_sameAsUtf8() throws Exception {
    // YAML 1.2 section 5.2 allows UTF-16 with a byte order mark.
    assertPlain(read("le.yaml", ("\uFEFF" + POD).getBytes(StandardCharsets.UTF_16LE)));
    assertPlain(read("be.yaml", POD.getBytes(StandardCharsets.UTF_16))); // Java writes a BE BOM
  }

  @Test
  void read_cpuFinerThanOneMillicore_roundedUpWithAFlag() throws Exception {
    // Quantity reference: precision finer than 1m is rounded up (0.1m becomes 1m).
    Workload w = only(read("fine.yaml", POD.replace("cpu: 250m", "cpu: 0.1m")
        .getBytes(StandardCharsets.UTF_8)));
    assertEquals(1, w.pod().requests().get("cpu"));
    assertTrue(w.pod().flags().contains(PodArithmetic.CPU_FINER_THAN_1M));
  }

  @Test
  void read_twoJsonObjectsBackToBack_bothRead() throws Exception {
    String a = "{\"apiVersion\":\"v1\",\"kind\":\"Pod\",\"metadata\":{\"name\":\"a\","
        + "\"namespace\":\"billing\"},\"spec\":{\"containers\":[{\"name\":\"c\","
        + "\"resources\":{\"requests\":{\"cpu\":\"100m\"}}}]}}";
    Demand d = read("two.json", (a + a.replace("\"a\"", "\"b\"")).getBytes(StandardCharsets.UTF_8));
    assertEquals(List.of("billing/Pod/a", "billing/Pod/b"),
        d.workloads().stream().map(w -> w.id().toString()).toList());
  }

  @Test
  void read_flowStyleWithTrailingCommas_sameAsBlockStyle() throws Exception {
    // YAML 1.2 flow collections may end with a comma before the closing bracket.
    String flow = "{apiVersion: v1, kind: Pod, metadata: {name: receipt, namespace: billing,},"
        + " spec: {containers: [{name: c, image: registry.example/r:1, resources: {requests:"
        + " {cpu: 250m, memory: 128Mi,},},},],},}\n";
    assertPlain(read("flow.yaml", flow.getBytes(StandardCharsets.UTF_8)));
  }
}
