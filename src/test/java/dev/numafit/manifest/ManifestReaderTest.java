package dev.numafit.manifest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.demand.Demand;
import dev.numafit.demand.QosClass;
import dev.numafit.demand.ReplicaMode;
import dev.numafit.demand.Replicas;
import dev.numafit.demand.Workload;
import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.Severity;
import dev.numafit.resource.Resources;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The reader on small manifests written for each rule. Names are invented; expected values come
 * from the Kubernetes documentation pages named beside them (FACTS.md keys).
 */
class ManifestReaderTest {
  private static final long MIB = 1L << 20;
  private static final InputStream NO_STDIN = new ByteArrayInputStream(new byte[0]);

  @TempDir Path dir;

  private Path write(String name, String text) throws IOException {
    Path p = dir.resolve(name);
    Files.createDirectories(p.getParent());
    Files.writeString(p, text, StandardCharsets.UTF_8);
    return p;
  }

  private static Demand read(ReadOptions opts, Path... paths) {
    List<String> list = java.util.Arrays.stream(paths).map(Path::toString).toList();
    return new ManifestReader().read(list, NO_STDIN, opts);
  }

  private static Demand read(Path... paths) {
    return read(ReadOptions.defaults(), paths);
  }

  private static Workload workload(Demand d, String id) {
    return d.workloads().stream()
        .filter(w -> w.id().toString().equals(id))
        .findFirst()
        .orElseThrow(
            () -> new AssertionError(id + " not in " + d.workloads() + "\n" + d.diagnostics()));
  }

  private static List<String> messages(Demand d, Severity s) {
    return d.diagnostics().stream()
        .filter(x -> x.severity() == s)
        .map(Diagnostic::format)
        .collect(Collectors.toList());
  }

  private static final String OVERHEAD_DOCS =
      """
      apiVersion: node.k8s.io/v1
      kind: RuntimeClass
      metadata:
        name: sandboxed
      handler: sandboxed
      overhead:
        podFixed:
          memory: "120Mi"
          cpu: "250m"
      ---
      apiVersion: v1
      kind: Pod
      metadata:
        name: test-pod
      spec:
        runtimeClassName: sandboxed
        containers:
        - name: first-ctr
          image: example.invalid/app:1
          resources:
            limits:
              cpu: 500m
              memory: 100Mi
        - name: web-ctr
          image: example.invalid/app:1
          resources:
            limits:
              cpu: 1500m
              memory: 100Mi
      """;

  @Test
  void read_overheadDocsExampleAsManifest_2250mAnd320Mi() throws IOException {
    // FACTS check value 1, "Pod Overhead" (K1): the docs' RuntimeClass (250m, 120Mi) and pod
    // (limits 500m/100Mi and 1500m/100Mi); the node shows 2250m and 320Mi requested and the pod
    // cgroup limit is 335544320 bytes. (The RuntimeClass is renamed here.)
    Demand d = read(write("overhead.yaml", OVERHEAD_DOCS));
    Workload w = workload(d, "default/Pod/test-pod");
    assertEquals(Resources.of("cpu", 2250L, "memory", 320 * MIB), w.pod().requests());
    assertEquals(335544320L, w.pod().limits().get("memory"));
    assertEquals(List.of(), messages(d, Severity.ERROR));
    assertEquals(List.of(), messages(d, Severity.WARNING));
  }

  @Test
  void read_runtimeClassMissing_overheadUnknownWarning() throws IOException {
    String podOnly = OVERHEAD_DOCS.substring(OVERHEAD_DOCS.indexOf("---") + 4);
    Path f = write("pod.yaml", podOnly);
    Demand d = read(f);
    Workload w = workload(d, "default/Pod/test-pod");
    // FACTS check value 2 (K1): without its overhead the pod is 2000m and 200Mi.
    assertEquals(Resources.of("cpu", 2000L, "memory", 200 * MIB), w.pod().requests());
    assertTrue(w.flags().contains("overhead unknown: RuntimeClass sandboxed not in input"));
    assertEquals(
        List.of(
            f
                + ":2: warning: default/Pod/test-pod: RuntimeClass \"sandboxed\" is not"
                + " in the input, so its pod overhead is unknown and counted as zero"),
        messages(d, Severity.WARNING));
  }

  private static String pod(String name, String resources) {
    return """
           apiVersion: v1
           kind: Pod
           metadata:
             name: %s
           spec:
             containers:
             - name: app
               resources:
           %s
           """
        .formatted(name, resources.indent(6).stripTrailing());
  }

  @Test
  void read_quantityForms_checkValue4() throws IOException {
    // FACTS check value 4 (Quantity reference K10, K5): 123Mi = 128974848 bytes; 129M, 129e6 and
    // 128974848000m are written out below with their exact values.
    String yaml =
        String.join(
            "---\n",
            pod("mi", "requests: {memory: 123Mi}"),
            pod("mega", "requests: {memory: 129M}"),
            pod("exp", "requests: {memory: 129e6}"),
            pod("expquoted", "requests: {memory: \"129e6\"}"),
            pod("milli", "requests: {memory: 128974848000m}"));
    Demand d = read(write("q.yaml", yaml));
    assertEquals(128974848L, workload(d, "default/Pod/mi").pod().requests().get("memory"));
    assertEquals(129000000L, workload(d, "default/Pod/mega").pod().requests().get("memory"));
    assertEquals(129000000L, workload(d, "default/Pod/exp").pod().requests().get("memory"));
    assertEquals(129000000L, workload(d, "default/Pod/expquoted").pod().requests().get("memory"));
    assertEquals(128974848L, workload(d, "default/Pod/milli").pod().requests().get("memory"));
  }

  @Test
  void read_quantityForms_checkValue5() throws IOException {
    // FACTS check value 5 (K10, K5): cpu 0.1 = 100m; 1.5 = 1500m; 1.5Gi = 1536Mi; 0.1m rounds up
    // to 1m; memory 400m is 0.4 bytes (read as 1 byte once rounded up).
    String yaml =
        String.join(
            "---\n",
            pod("tenth", "requests: {cpu: 0.1}"),
            pod("oneandahalf", "requests: {cpu: \"1.5\", memory: 1.5Gi}"),
            pod("tiny", "requests: {cpu: 0.1m}"),
            pod("fraction", "requests: {memory: 400m}"));
    Demand d = read(write("q5.yaml", yaml));
    assertEquals(100L, workload(d, "default/Pod/tenth").pod().requests().get("cpu"));
    Workload half = workload(d, "default/Pod/oneandahalf");
    assertEquals(1500L, half.pod().requests().get("cpu"));
    assertEquals(1536 * MIB, half.pod().requests().get("memory"));
    Workload tiny = workload(d, "default/Pod/tiny");
    assertEquals(1L, tiny.pod().requests().get("cpu"));
    assertTrue(tiny.pod().flags().contains("cpu request finer than 1m rounded up"));
    assertEquals(1L, workload(d, "default/Pod/fraction").pod().requests().get("memory"));
  }

  @Test
  void amount_memory400m_pointFourBytes() {
    // FACTS A3 (K5): memory 400m is 0.4 bytes, exactly, before any rounding.
    LocatedDocument doc =
        new LocatedDocument(
            "x.yaml",
            tools.jackson.databind.node.JsonNodeFactory.instance.objectNode(),
            java.util.Map.of(),
            1);
    ObjectContext ctx = new ObjectContext(doc, "default/Pod/x");
    assertEquals(
        0,
        new java.math.BigDecimal("0.4")
            .compareTo(
                PodSpecs.amount(
                        new io.fabric8.kubernetes.api.model.Quantity("400m"), "/m", "memory", ctx)
                    .orElseThrow()));
  }

  @Test
  void read_limitRangeDefaults_docsValues() throws IOException {
    // "Configure Default Memory Requests and Limits for a Namespace" (K9): default 512Mi,
    // defaultRequest 256Mi.
    String yaml =
        """
        apiVersion: v1
        kind: LimitRange
        metadata:
          name: mem-limit-range
          namespace: team-a
        spec:
          limits:
          - default:
              memory: 512Mi
            defaultRequest:
              memory: 256Mi
            type: Container
        ---
        """
            + String.join(
                "---\n",
                pod("nothing", "{}").replace("name: nothing", "name: nothing\n  namespace: team-a"),
                pod("limit-only", "limits: {memory: 1Gi}")
                    .replace("name: limit-only", "name: limit-only\n  namespace: team-a"),
                pod("request-only", "requests: {memory: 128Mi}")
                    .replace("name: request-only", "name: request-only\n  namespace: team-a"),
                pod("elsewhere", "{}"));
    Demand d = read(write("lr.yaml", yaml));
    Workload nothing = workload(d, "team-a/Pod/nothing");
    assertEquals(256 * MIB, nothing.pod().requests().get("memory"));
    assertEquals(512 * MIB, nothing.pod().limits().get("memory"));
    assertTrue(nothing.flags().contains("LimitRange defaults of namespace team-a applied"));
    // FACTS check value 9: only a 1Gi limit → request 1Gi.
    assertEquals(1024 * MIB, workload(d, "team-a/Pod/limit-only").pod().requests().get("memory"));
    // FACTS check value 10: only a 128Mi request → limit 512Mi.
    Workload requestOnly = workload(d, "team-a/Pod/request-only");
    assertEquals(128 * MIB, requestOnly.pod().requests().get("memory"));
    assertEquals(512 * MIB, requestOnly.pod().limits().get("memory"));
    // Another namespace is untouched.
    assertEquals(0L, workload(d, "default/Pod/elsewhere").pod().requests().get("memory"));
  }

  @Test
  void read_limitRangeOnlyMax_defaultsFromMax() throws IOException {
    // SetDefaults_LimitRangeItem (K9b): default from max, defaultRequest from default.
    String yaml =
        """
        apiVersion: v1
        kind: LimitRange
        metadata: {name: cpu-max}
        spec:
          limits:
          - type: Container
            max: {cpu: 800m}
        ---
        """
            + pod("plain", "{}");
    Workload w = workload(read(write("max.yaml", yaml)), "default/Pod/plain");
    assertEquals(800L, w.pod().requests().get("cpu"));
    assertEquals(800L, w.pod().limits().get("cpu"));
  }

  private static final String SIDECAR_POD =
      """
      apiVersion: v1
      kind: Pod
      metadata: {name: %s}
      spec:
        initContainers:
        %s
        containers:
        - name: web
          resources: {requests: {cpu: 300m}}
      """;

  @Test
  void read_sidecarOrder_checkValue13() throws IOException {
    // FACTS check value 13 (KEP-753 / helpers.go): [sidecar 800m, init 500m] + app 300m = 1300m;
    // the other order gives 1100m.
    String sidecar = "{name: proxy, restartPolicy: Always, resources: {requests: {cpu: 800m}}}";
    String init = "{name: migrate, resources: {requests: {cpu: 500m}}}";
    String yaml =
        SIDECAR_POD.formatted("first", "- " + sidecar + "\n  - " + init)
            + "---\n"
            + SIDECAR_POD.formatted("second", "- " + init + "\n  - " + sidecar);
    Demand d = read(write("sidecar.yaml", yaml));
    assertEquals(1300L, workload(d, "default/Pod/first").pod().requests().get("cpu"));
    assertEquals(1100L, workload(d, "default/Pod/second").pod().requests().get("cpu"));
  }

  private static final String AUTOSCALED =
      """
      apiVersion: apps/v1
      kind: Deployment
      metadata: {name: storefront, namespace: shop}
      spec:
        replicas: 2
        template:
          spec:
            containers: [{name: web, resources: {requests: {cpu: 250m, memory: 64Mi}}}]
      ---
      apiVersion: autoscaling/v1
      kind: HorizontalPodAutoscaler
      metadata: {name: storefront, namespace: shop}
      spec:
        scaleTargetRef: {apiVersion: apps/v1, kind: Deployment, name: storefront}
        minReplicas: 2
        maxReplicas: 10
        targetCPUUtilizationPercentage: 70
      ---
      apiVersion: apps/v1
      kind: StatefulSet
      metadata: {name: ledger, namespace: shop}
      spec:
        template:
          spec:
            containers: [{name: db, resources: {requests: {cpu: "1", memory: 1Gi}}}]
      ---
      apiVersion: autoscaling/v2
      kind: HorizontalPodAutoscaler
      metadata: {name: ledger-scaler, namespace: shop}
      spec:
        scaleTargetRef: {apiVersion: apps/v1, kind: StatefulSet, name: ledger}
        maxReplicas: 6
        metrics:
        - type: Resource
          resource: {name: cpu, target: {type: Utilization, averageUtilization: 60}}
      """;

  @Test
  void read_autoscalersV1AndV2_peakIsMaxReplicas() throws IOException {
    Demand d = read(write("hpa.yaml", AUTOSCALED));
    assertEquals(
        new Replicas(2, 10, "HorizontalPodAutoscaler shop/storefront maxReplicas"),
        workload(d, "shop/Deployment/storefront").replicas());
    // FACTS check value 20 (K20): unset StatefulSet replicas → 1 declared.
    assertEquals(
        new Replicas(1, 6, "HorizontalPodAutoscaler shop/ledger-scaler maxReplicas"),
        workload(d, "shop/StatefulSet/ledger").replicas());
    assertEquals(List.of(), messages(d, Severity.WARNING));
  }

  @Test
  void read_autoscalersDeclaredMode_specReplicas() throws IOException {
    Demand d = read(new ReadOptions(ReplicaMode.DECLARED, false), write("hpa.yaml", AUTOSCALED));
    assertEquals(
        new Replicas(2, 2, "spec.replicas"), workload(d, "shop/Deployment/storefront").replicas());
    assertEquals(
        new Replicas(1, 1, "default 1"), workload(d, "shop/StatefulSet/ledger").replicas());
  }

  @Test
  void read_jobsAndCronJobs_podsAtOnce() throws IOException {
    String job =
        """
        apiVersion: batch/v1
        kind: Job
        metadata: {name: %s}
        spec:
          %s
          template:
            spec:
              restartPolicy: Never
              containers: [{name: run, resources: {requests: {cpu: 100m}}}]
        """;
    String yaml =
        String.join(
            "---\n",
            job.formatted("queue", "parallelism: 4"),
            job.formatted("bounded", "parallelism: 5\n  completions: 2"),
            job.formatted("plain", "backoffLimit: 6"),
            """
            apiVersion: batch/v1beta1
            kind: CronJob
            metadata: {name: nightly}
            spec:
              schedule: "0 3 * * *"
              jobTemplate:
                spec:
                  parallelism: 3
                  template:
                    spec:
                      restartPolicy: OnFailure
                      containers: [{name: run, resources: {requests: {cpu: 100m}}}]
            """);
    Path f = write("jobs.yaml", yaml);
    Demand d = read(f);
    // K20: parallelism pods at once; never more than completions.
    assertEquals(4, workload(d, "default/Job/queue").replicas().peak());
    assertEquals(2, workload(d, "default/Job/bounded").replicas().peak());
    // FACTS check value 20 (K20): neither field → 1.
    assertEquals(1, workload(d, "default/Job/plain").replicas().peak());
    // A CronJob counts one Job of its template.
    assertEquals(3, workload(d, "default/CronJob/nightly").replicas().peak());
    assertTrue(
        messages(d, Severity.NOTE)
            .contains(
                f
                    + ":33: note: default/CronJob/nightly: old"
                    + " apiVersion batch/v1beta1 (now batch/v1); read with the current schema"),
        messages(d, Severity.NOTE).toString());
  }

  @Test
  void read_daemonSet_perWorker() throws IOException {
    String yaml =
        """
        apiVersion: apps/v1
        kind: DaemonSet
        metadata: {name: log-shipper, namespace: ops}
        spec:
          template:
            spec:
              containers: [{name: ship, resources: {requests: {cpu: 50m, memory: 32Mi}}}]
        """;
    Workload w = workload(read(write("ds.yaml", yaml)), "ops/DaemonSet/log-shipper");
    assertTrue(w.perWorker());
    assertEquals(new Replicas(1, 1, "one per worker"), w.replicas());
  }

  @Test
  void read_sameObjectTwice_laterWinsWithWarningNamingBoth() throws IOException {
    String deployment =
        """
        apiVersion: apps/v1
        kind: Deployment
        metadata: {name: api}
        spec:
          replicas: %d
          template:
            spec:
              containers: [{name: api, resources: {requests: {cpu: 100m}}}]
        """;
    Path a = write("a/api.yaml", deployment.formatted(2));
    Path b = write("b/api.yaml", deployment.formatted(5));
    Demand d = read(dir);
    assertEquals(1, d.workloads().size());
    assertEquals(5, workload(d, "default/Deployment/api").replicas().peak());
    assertEquals(
        List.of(
            b
                + ":2: warning: default/Deployment/api is defined twice, at "
                + a
                + ":2 and at "
                + b
                + ":2; the later definition is used"),
        messages(d, Severity.WARNING));
  }

  @Test
  void read_malformedDocument_errorWithLineAndRestOfFileRead() throws IOException {
    String yaml =
        pod("before", "requests: {cpu: 100m}")
            + "---\n"
            + "apiVersion: v1\nkind: Pod\nmetadata: {name: broken\nspec: {}\n"
            + "---\n"
            + pod("after", "requests: {cpu: 200m}");
    Path f = write("mixed.yaml", yaml);
    Demand d = read(f);
    List<String> errors = messages(d, Severity.ERROR);
    assertEquals(1, errors.size(), errors.toString());
    // The parser notices the unclosed mapping of line 13 on line 14.
    assertEquals(
        f
            + ":14: error: malformed YAML: expected ',' or '}', but got : (while parsing a"
            + " flow mapping started on line 13)",
        errors.get(0));
    assertEquals(100L, workload(d, "default/Pod/before").pod().requests().get("cpu"));
    assertEquals(200L, workload(d, "default/Pod/after").pod().requests().get("cpu"));
  }

  @Test
  void read_tabIndentation_errorOnTheTabLine() throws IOException {
    Path f = write("tab.yaml", "apiVersion: v1\nkind: Pod\nmetadata:\n\tname: x\n");
    Demand d = read(f);
    assertEquals(
        List.of(
            f
                + ":4: error: malformed YAML: found character a tab that cannot start"
                + " any token. (Do not use tabs for indentation) (YAML indents with spaces only)"),
        messages(d, Severity.ERROR));
  }

  @Test
  void read_replicasThree_errorOnTheReplicasLine() throws IOException {
    Path f =
        write(
            "three.yaml",
            """
            apiVersion: apps/v1
            kind: Deployment
            metadata:
              name: web
            spec:
              replicas: three
              template:
                spec:
                  containers: [{name: web}]
            """);
    Demand d = read(f);
    assertEquals(
        List.of(
            f
                + ":6: error: default/Deployment/web: spec.replicas expects an integer,"
                + " got \"three\""),
        messages(d, Severity.ERROR));
    assertTrue(d.workloads().isEmpty());
  }

  @Test
  void read_invalidQuantity_errorNamingFileLineObjectContainerFieldAndValue() throws IOException {
    Path f = write("abc.yaml", pod("calc", "requests:\n  cpu: abc\n  memory: 64Mi"));
    Demand d = read(f);
    assertEquals(
        List.of(
            f
                + ":10: error: default/Pod/calc: container \"app\": resources.requests.cpu"
                + " \"abc\" is not a Kubernetes quantity (expected e.g. 500m, 2, 1.5Gi)"),
        messages(d, Severity.ERROR));
    assertTrue(d.workloads().isEmpty());
  }

  @Test
  void read_negativeQuantity_error() throws IOException {
    Path f = write("neg.yaml", pod("neg", "limits:\n  memory: -1Gi"));
    Demand d = read(f);
    assertEquals(
        List.of(
            f
                + ":10: error: default/Pod/neg: container \"app\": resources.limits.memory \"-1Gi\""
                + " is negative (expected a quantity of zero or more, e.g. 500m, 2, 1.5Gi)"),
        messages(d, Severity.ERROR));
  }

  @Test
  void read_folderWithOneBadFile_validRestStillRead() throws IOException {
    write("apps/1-good.yaml", pod("good", "requests: {cpu: 100m}"));
    write("apps/2-bad.yaml", pod("bad", "requests: {cpu: lots}"));
    write(
        "apps/3-good.json",
        """
        {"apiVersion": "v1", "kind": "Pod", "metadata": {"name": "alsogood"},
         "spec": {"containers": [{"name": "c", "resources": {"requests": {"cpu": "300m"}}}]}}
        """);
    write("apps/notes.txt", "not a manifest");
    Demand d = read(dir.resolve("apps"));
    assertEquals(
        List.of("default/Pod/alsogood", "default/Pod/good"),
        d.workloads().stream().map(w -> w.id().toString()).toList());
    assertEquals(1, messages(d, Severity.ERROR).size());
  }

  @Test
  void read_missingPath_error() {
    Path missing = dir.resolve("nope.yaml");
    Demand d = read(missing);
    assertEquals(
        List.of(
            missing
                + ": error: no such file or directory (expected a .yaml, .yml or"
                + " .json file, a directory, or - for standard input)"),
        messages(d, Severity.ERROR));
  }

  @Test
  void read_emptyFileCommentsAndValues_warnAndNoteWithoutErrors() throws IOException {
    Path empty = write("empty.yaml", "\n\n");
    Path values = write("values.yaml", "replicaCount: 3\nimage: {tag: latest}\n");
    Path comments =
        write(
            "comments.yaml",
            "# only a comment\n---\n# another\n---\n" + pod("p", "requests: {cpu: 1}"));
    Demand d = read(empty, values, comments);
    assertEquals(List.of(empty + ": warning: empty file"), messages(d, Severity.WARNING));
    List<String> notes = messages(d, Severity.NOTE);
    assertTrue(
        notes.contains(values + ":1: note: not a Kubernetes object (no kind), skipped"),
        notes.toString());
    assertTrue(
        notes.stream().anyMatch(n -> n.startsWith(comments + ": note: skipped ")),
        notes.toString());
    assertEquals(List.of(), messages(d, Severity.ERROR));
    assertEquals(1000L, workload(d, "default/Pod/p").pod().requests().get("cpu"));
  }

  @Test
  void read_stdinJsonObjectsBackToBack_bothRead() {
    String json =
        """
        {"apiVersion": "v1", "kind": "Service", "metadata": {"name": "s"}}
        {"apiVersion": "v1", "kind": "Pod", "metadata": {"name": "p"},
         "spec": {"containers": [{"name": "c", "resources": {"requests": {"cpu": "2"}}}]}}
        """;
    Demand d =
        new ManifestReader()
            .read(
                List.of("-"),
                new ByteArrayInputStream(json.getBytes(StandardCharsets.UTF_8)),
                ReadOptions.defaults());
    Workload w = workload(d, "default/Pod/p");
    assertEquals("<stdin>:2", w.source().toString());
    assertEquals(2000L, w.pod().requests().get("cpu"));
    assertEquals(java.util.Map.of("Service", 1), d.skippedByKind());
  }

  @Test
  void read_listKinds_itemsRead() throws IOException {
    String yaml =
        """
        apiVersion: v1
        kind: List
        items:
        - apiVersion: v1
          kind: Service
          metadata: {name: front}
        - apiVersion: apps/v1
          kind: Deployment
          metadata: {name: front}
          spec:
            template:
              spec:
                containers: [{name: web, resources: {requests: {cpu: 100m}}}]
        ---
        apiVersion: apps/v1
        kind: DeploymentList
        items:
        - metadata: {name: back}
          spec:
            template:
              spec:
                containers: [{name: api, resources: {requests: {cpu: 200m}}}]
        """;
    Path f = write("lists.yaml", yaml);
    Demand d = read(f);
    Workload front = workload(d, "default/Deployment/front");
    // The source line is the line of the item's kind.
    assertEquals(f + ":8", front.source().toString());
    assertEquals(200L, workload(d, "default/Deployment/back").pod().requests().get("cpu"));
    assertEquals(java.util.Map.of("Service", 1), d.skippedByKind());
  }

  @Test
  void read_oldAndUnknownApiVersions_noteAndWarning() throws IOException {
    String yaml =
        """
        apiVersion: extensions/v1beta1
        kind: Deployment
        metadata: {name: legacy}
        spec:
          template:
            spec:
              containers: [{name: a, resources: {requests: {cpu: 100m}}}]
        ---
        apiVersion: apps/v9
        kind: Deployment
        metadata: {name: future}
        spec:
          template:
            spec:
              containers: [{name: a, resources: {requests: {cpu: 100m}}}]
        """;
    Path f = write("versions.yaml", yaml);
    Demand d = read(f);
    assertEquals(2, d.workloads().size());
    assertTrue(
        messages(d, Severity.NOTE)
            .contains(
                f
                    + ":2: note: default/Deployment/legacy: old apiVersion extensions/v1beta1 (now"
                    + " apps/v1); read with the current schema"));
    assertEquals(
        List.of(
            f
                + ":10: warning: default/Deployment/future: unknown apiVersion apps/v9"
                + " for Deployment (expected apps/v1); read as apps/v1"),
        messages(d, Severity.WARNING));
  }

  private static final String CUSTOM =
      """
      apiVersion: example.invalid/v1
      kind: ComputeCluster
      metadata: {name: grid, namespace: research}
      spec:
        head:
          template:
            spec:
              containers: [{name: head, resources: {requests: {cpu: "2", memory: 4Gi}}}]
        workerGroups:
        - replicas: 3
          template:
            spec:
              containers: [{name: worker, resources: {requests: {cpu: "4", memory: 8Gi}}}]
      """;

  @Test
  void read_customResourceWithTemplates_listedNotSized() throws IOException {
    Demand d = read(write("custom.yaml", CUSTOM));
    assertTrue(d.workloads().isEmpty());
    assertEquals(
        List.of(
            "research/ComputeCluster/grid[spec.head]",
            "research/ComputeCluster/grid[spec.workerGroups[0]]"),
        d.unsizedCustom().stream().map(w -> w.id().toString()).toList());
    Workload worker = d.unsizedCustom().get(1);
    assertEquals(3, worker.replicas().peak());
    assertTrue(worker.guess());
    assertEquals(1, d.unsizedCustom().get(0).replicas().peak());
  }

  @Test
  void read_customResourceIncluded_sizedAsGuess() throws IOException {
    Demand d = read(new ReadOptions(ReplicaMode.PEAK, true), write("custom.yaml", CUSTOM));
    assertTrue(d.unsizedCustom().isEmpty());
    Workload worker = workload(d, "research/ComputeCluster/grid[spec.workerGroups[0]]");
    assertTrue(worker.guess());
    assertTrue(worker.flags().contains("sized from a custom resource: a guess"));
    assertEquals(4000L, worker.pod().requests().get("cpu"));
  }

  @Test
  void read_hugepagesRequestDiffersFromLimit_error() throws IOException {
    // FACTS check value 26 (K5, K17): a hugepages request that differs from its limit is invalid.
    Path f =
        write(
            "huge.yaml",
            pod(
                "huge",
                "requests: {memory: 1Gi, hugepages-2Mi: 80Mi}\n"
                    + "limits: {memory: 1Gi, hugepages-2Mi: 100Mi}"));
    Demand d = read(f);
    assertEquals(
        List.of(
            f
                + ":2: error: default/Pod/huge: container \"app\": hugepages-2Mi request"
                + " 80Mi must equal its limit 100Mi (hugepages cannot be overcommitted)"),
        messages(d, Severity.ERROR));
  }

  @Test
  void read_podLevelLimitBelowContainers_error() throws IOException {
    // FACTS check value 15 (KEP-2837, K6b): a 100Gi pod limit over two containers limited to 60Gi.
    Path f =
        write(
            "podlevel.yaml",
            """
            apiVersion: v1
            kind: Pod
            metadata: {name: big}
            spec:
              resources: {limits: {memory: 100Gi}}
              containers:
              - {name: a, resources: {limits: {memory: 60Gi}}}
              - {name: b, resources: {limits: {memory: 60Gi}}}
            """);
    Demand d = read(f);
    assertEquals(
        List.of(
            f
                + ":2: error: default/Pod/big: pod-level memory limit 100Gi is below the"
                + " containers' requests 120Gi"),
        messages(d, Severity.ERROR));
  }

  @Test
  void read_exclusiveCpusLimitsOnly_checkValue11() throws IOException {
    // FACTS check value 11 (K15): limits cpu "2", memory 200Mi → Guaranteed, 2 exclusive CPUs.
    Workload w =
        workload(
            read(write("pin.yaml", pod("pinned", "limits: {cpu: \"2\", memory: 200Mi}"))),
            "default/Pod/pinned");
    assertEquals(QosClass.GUARANTEED, w.pod().qos());
    assertEquals(2, w.pod().exclusiveCpus());
  }

  @Test
  void read_sameInputTwice_sameDemand() throws IOException {
    write("x/a.yaml", AUTOSCALED);
    write("x/b.yaml", CUSTOM);
    write("x/c.yaml", pod("bad", "requests: {cpu: lots}"));
    assertEquals(read(dir), read(dir));
    assertFalse(read(dir).diagnostics().isEmpty());
  }

  @Test
  void read_crlfAndAnchors_sameAsLf() throws IOException {
    String lf =
        """
        apiVersion: v1
        kind: Pod
        metadata:
          name: anchored
        spec:
          containers:
          - name: a
            resources:
              requests: &sizes {cpu: 100m, memory: 64Mi}
              limits: *sizes
        """;
    Workload unix = workload(read(write("lf.yaml", lf)), "default/Pod/anchored");
    Demand crlf = read(write("crlf.yaml", lf.replace("\n", "\r\n")));
    assertEquals(unix.pod(), workload(crlf, "default/Pod/anchored").pod());
    assertEquals(unix.source().line(), workload(crlf, "default/Pod/anchored").source().line());
    // The alias repeats the anchored requests as limits: request = limit → Guaranteed (K8).
    assertEquals(QosClass.GUARANTEED, unix.pod().qos());
  }

  @Test
  void read_containersAsMapping_errorNamingFieldAndLine() throws IOException {
    Path f =
        write(
            "shape.yaml",
            """
            apiVersion: apps/v1
            kind: Deployment
            metadata: {name: odd}
            spec:
              template:
                spec:
                  containers:
                    web: {image: example.invalid/app:1}
            """);
    assertEquals(
        List.of(
            f
                + ":8: error: default/Deployment/odd: spec.template.spec.containers"
                + " expects a list, got a mapping"),
        messages(read(f), Severity.ERROR));
  }

  @Test
  void read_autoscalerWithoutTarget_noteAndIgnored() throws IOException {
    Path f =
        write(
            "lonely.yaml",
            """
            apiVersion: autoscaling/v2
            kind: HorizontalPodAutoscaler
            metadata: {name: lonely, namespace: shop}
            spec:
              scaleTargetRef: {apiVersion: apps/v1, kind: Deployment, name: gone}
              maxReplicas: 4
            """);
    Demand d = read(f);
    assertEquals(
        List.of(
            f
                + ":2: note: HorizontalPodAutoscaler shop/lonely targets Deployment gone, which is"
                + " not a Deployment, ReplicaSet, StatefulSet or ReplicationController in the"
                + " input; ignored"),
        messages(d, Severity.NOTE));
  }

  @Test
  void read_stdinYaml_shownAsStdin() {
    String yaml = pod("piped", "requests: {cpu: 250m}");
    Demand d =
        new ManifestReader()
            .read(
                List.of("-"),
                new ByteArrayInputStream(yaml.getBytes(StandardCharsets.UTF_8)),
                ReadOptions.defaults());
    assertEquals("<stdin>:2", workload(d, "default/Pod/piped").source().toString());
  }

  @Test
  void read_autoscalerMaxZeroWithoutMin_errorBecauseMinDefaultsToOne() throws IOException {
    // FACTS check value 20 (HPA API reference, K20): unset minReplicas is 1, and maxReplicas must
    // be at least minReplicas, so maxReplicas 0 without minReplicas is invalid.
    Path f =
        write(
            "zero.yaml",
            """
            apiVersion: autoscaling/v2
            kind: HorizontalPodAutoscaler
            metadata: {name: zero}
            spec:
              scaleTargetRef: {kind: Deployment, name: web}
              maxReplicas: 0
            """);
    assertEquals(
        List.of(
            f
                + ":6: error: default/HorizontalPodAutoscaler/zero: spec.maxReplicas 0 is"
                + " below minReplicas 1 (the default) (expected maxReplicas >= minReplicas)"),
        messages(read(f), Severity.ERROR));
  }

  @Test
  void read_twoAutoscalersOneTarget_largestMaxWithWarning() throws IOException {
    String second =
        """
        ---
        apiVersion: autoscaling/v2
        kind: HorizontalPodAutoscaler
        metadata: {name: storefront-burst, namespace: shop}
        spec:
          scaleTargetRef: {kind: Deployment, name: storefront}
          maxReplicas: 25
        """;
    Path f = write("two.yaml", AUTOSCALED + second);
    Demand d = read(f);
    assertEquals(
        new Replicas(2, 25, "HorizontalPodAutoscaler shop/storefront-burst maxReplicas"),
        workload(d, "shop/Deployment/storefront").replicas());
    assertEquals(
        List.of(
            f
                + ":2: warning: shop/Deployment/storefront is the target of 2"
                + " HorizontalPodAutoscalers; the largest maxReplicas (shop/storefront-burst) is"
                + " used"),
        messages(d, Severity.WARNING));
  }

  @Test
  void read_quantityWithTwoSuffixes_errorNamingField() throws IOException {
    // Quantity reference (K10): a number takes one suffix, a unit or an exponent, not both.
    Path f = write("suffix.yaml", pod("twice", "requests: {cpu: 1e3m}"));
    assertEquals(
        List.of(
            f
                + ":9: error: default/Pod/twice: spec.containers[0].resources.requests.cpu expects"
                + " a Kubernetes quantity (expected e.g. 500m, 2, 1.5Gi), got \"1e3m\""),
        messages(read(f), Severity.ERROR));
  }

  @Test
  void read_duplicateKey_warningAndLaterValueUsed() throws IOException {
    Path f =
        write(
            "dupkey.yaml",
            """
            apiVersion: apps/v1
            kind: Deployment
            metadata: {name: twice}
            spec:
              replicas: 2
              replicas: 4
              template:
                spec:
                  containers: [{name: a}]
            """);
    Demand d = read(f);
    assertEquals(4, workload(d, "default/Deployment/twice").replicas().peak());
    assertEquals(
        List.of(
            f + ":6: warning: duplicate key \"replicas\" in one mapping; the later value is used"),
        messages(d, Severity.WARNING));
  }

  @Test
  void read_twoLimitRangesWithDefaults_warningAndFirstByNameWins() throws IOException {
    String range =
        """
        apiVersion: v1
        kind: LimitRange
        metadata: {name: %s}
        spec:
          limits:
          - type: Container
            default: {cpu: %s}
        ---
        """;
    Path f =
        write(
            "ranges.yaml",
            range.formatted("b-range", "900m")
                + range.formatted("a-range", "500m")
                + pod("plain", "{}"));
    Demand d = read(f);
    assertEquals(500L, workload(d, "default/Pod/plain").pod().limits().get("cpu"));
    // "Limit Ranges" (kubernetes.io/docs/concepts/policy/limit-range/): with two or more
    // LimitRanges in a namespace, which default is applied is not deterministic.
    assertEquals(
        List.of(
            f
                + ":10: warning: namespace default has 2 LimitRanges with container defaults;"
                + " Kubernetes applies them in no fixed order, so the first by name (a-range) wins"
                + " here for each resource it sets"),
        messages(d, Severity.WARNING));
  }
}
