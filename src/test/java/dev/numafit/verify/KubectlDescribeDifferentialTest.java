package dev.numafit.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.demand.EffectivePod;
import dev.numafit.demand.PodArithmetic;
import dev.numafit.manifest.PodSpecConversion;
import dev.numafit.resource.Resources;
import io.fabric8.kubernetes.api.model.Container;
import io.fabric8.kubernetes.api.model.ContainerBuilder;
import io.fabric8.kubernetes.api.model.Node;
import io.fabric8.kubernetes.api.model.NodeBuilder;
import io.fabric8.kubernetes.api.model.Pod;
import io.fabric8.kubernetes.api.model.PodBuilder;
import io.fabric8.kubernetes.api.model.Quantity;
import io.fabric8.kubernetes.client.server.mock.EnableKubernetesMockClient;
import io.fabric8.kubernetes.client.server.mock.KubernetesMockServer;
import io.fabric8.kubernetes.client.utils.KubernetesSerialization;
import io.fabric8.mockwebserver.http.RecordedRequest;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.net.URLEncoder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Random;
import java.util.TreeMap;
import java.util.concurrent.TimeUnit;
import java.util.logging.LogManager;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Differential test of the effective-request arithmetic against kubectl, the outside oracle:
 * {@code kubectl describe node} prints each pod's CPU and memory requests and limits as computed
 * by Kubernetes' own helper code (sidecars, init containers and overhead included; kubectl 1.29
 * and later know sidecars, so the mock server says it is 1.32).
 *
 * <p>The mock API server (expectations mode) serves one node and a few hundred seeded random pods
 * bound to it; kubectl reads them through a temporary kubeconfig and its describe output is parsed
 * exactly (canonical quantity forms such as {@code 1500500u}). kubectl sums exact values, so its
 * per-pod totals are rounded up to millicores and bytes (what the scheduler reads with
 * MilliValue/Value) and compared with {@link PodArithmetic#effective}, exactly.
 *
 * <p>Left out: pod-level {@code spec.resources}, which kubectl 1.32's describe arithmetic does not
 * read. Limits: kubectl sums the limits of the containers that set one; numafit counts a pod as
 * unlimited when any container leaves the resource unlimited (as the kubelet does for the pod
 * cgroup). Limits are compared exactly where every container sets one, and otherwise the test
 * checks that numafit reports no limit.
 *
 * <p>Skipped, with a message, where no kubectl is on PATH; where there is one it must compare at
 * least 300 pods. Prints the agreement line that docs/verification.md quotes.
 */
@EnableKubernetesMockClient(https = false)
class KubectlDescribeDifferentialTest {
  static {
    try (InputStream in =
        KubectlDescribeDifferentialTest.class.getResourceAsStream("/logging.properties")) {
      LogManager.getLogManager().readConfiguration(in);
    } catch (IOException ex) {
      throw new UncheckedIOException(ex);
    }
  }

  static final KubernetesSerialization JSON = new KubernetesSerialization();
  static final String NODE = "worker-a1";
  static final int PODS = 320;
  static final int CHUNK = 100;
  static final long SEED = 20261202L;

  KubernetesMockServer server;

  @TempDir Path tmp;

  // Written forms as people write them; odd ones on purpose: micro and nano cores, fractions of a
  // byte (memory 400m is 0.4 bytes, Quantity reference), exponents, values finer than 1n (the API
  // server rounds those up to 1n when it parses them).
  static final String[] CPU = {
    "100m", "250m", "1", "2", "0.5", "1.5", "1500500u", "333m", "0.1m", "250u", "7n",
    "0.0000000004", "1e-3", "12e-4", "2.0005", "100000n", "3", "50m", "0.001", "999u"
  };
  static final String[] MEMORY = {
    "128Mi", "1Gi", "1.5Gi", "1e9", "500M", "1500m", "12345", "0.5Ki", "1k", "64Mi",
    "999999999", "0.3", "400m", "2.5e3", "100Ki", "7", "256M", "1.25Mi", "3Gi", "0.9995", "0.5000000004", "0.4999999996"
  };

  @Test
  void describeNode_randomPods_kubectlAndNumafitAgreePodByPod() throws Exception {
    Optional<Path> kubectl = Processes.onPath("kubectl");
    if (kubectl.isEmpty()) {
      System.out.println("SKIPPED: kubectl differential test: no kubectl on PATH");
      Assumptions.abort("no kubectl on PATH: the kubectl differential test did not run");
    }
    List<Pod> pods = randomPods(new Random(SEED), PODS);
    serve(pods);

    Path home = Files.createDirectories(tmp.resolve("home"));
    Path kubeconfig = tmp.resolve("kubeconfig");
    Files.writeString(kubeconfig, kubeconfig(server.url("/").replaceAll("/$", "")));
    Processes.Result r = Processes.run(
        List.of(kubectl.get().toString(), "describe", "node", NODE, "--chunk-size=" + CHUNK),
        tmp, Map.of("KUBECONFIG", kubeconfig.toString(), "HOME", home.toString()),
        Duration.ofSeconds(120));
    assertEquals(0, r.exitCode(), r.stderr());

    Map<String, Row> rows = parseDescribe(r.stdout());
    assertEquals(PODS, rows.size(), "pods in kubectl's table");

    int compared = 0;
    int requestAgree = 0;
    int limitExact = 0;
    int limitUnlimited = 0;
    List<String> disagreements = new ArrayList<>();
    for (Pod pod : pods) {
      String key = pod.getMetadata().getNamespace() + "/" + pod.getMetadata().getName();
      Row row = rows.get(key);
      PodSpecConversion.Result conv = PodSpecConversion.toModel(pod.getSpec(), key);
      assertEquals(List.of(), conv.problems(), key);
      EffectivePod e = PodArithmetic.effective(conv.model());
      compared++;
      long cpuReq = milli(row.cpuRequest());
      long memReq = whole(row.memoryRequest());
      if (cpuReq == e.requests().get(Resources.CPU)
          && memReq == e.requests().get(Resources.MEMORY)) {
        requestAgree++;
      } else {
        disagreements.add(key + " requests: kubectl cpu " + row.cpuRequest() + " memory "
            + row.memoryRequest() + ", numafit " + e.requests());
      }
      for (String res : List.of(Resources.CPU, Resources.MEMORY)) {
        String shown = res.equals(Resources.CPU) ? row.cpuLimit() : row.memoryLimit();
        long kube = res.equals(Resources.CPU) ? milli(shown) : whole(shown);
        if (everyContainerLimits(pod, res)) {
          if (kube == e.limits().get(res)) {
            limitExact++;
          } else {
            disagreements.add(key + " " + res + " limit: kubectl " + shown + ", numafit "
                + e.limits().get(res));
          }
        } else if (e.limits().asMap().containsKey(res)) {
          disagreements.add(key + " " + res + " limit: some container is unlimited, numafit "
              + "still reports " + e.limits().get(res));
        } else {
          limitUnlimited++;
        }
      }
    }
    System.out.printf("kubectl differential: %d pods compared, requests agree on %d;"
        + " limits: %d exact matches, %d unlimited as expected%n",
        compared, requestAgree, limitExact, limitUnlimited);
    assertTrue(compared >= 300, "at least 300 pods compared");
    assertEquals(List.of(), disagreements);
    assertEquals(PODS, requestAgree);

    List<RecordedRequest> reqs = new ArrayList<>();
    RecordedRequest q;
    while ((q = server.takeRequest(10, TimeUnit.MILLISECONDS)) != null) {
      reqs.add(q);
    }
    // Read-only: kubectl describe only ever reads.
    assertTrue(reqs.stream().allMatch(x -> x.getMethod().equals("GET")), reqs.toString());
    // Every page was read: the first and one per continue token.
    assertEquals(PODS / CHUNK + (PODS % CHUNK == 0 ? 0 : 1),
        reqs.stream().filter(x -> x.getPath().startsWith("/api/v1/pods")).count());
  }

  /** kubectl's canonical quantity parser, written here from the grammar (Quantity reference). */
  static BigDecimal quantity(String s) {
    Matcher m = QUANTITY.matcher(s);
    if (!m.matches()) {
      throw new IllegalArgumentException("not a canonical quantity: " + s);
    }
    BigDecimal n = new BigDecimal(m.group(1));
    String suffix = m.group(2) == null ? "" : m.group(2);
    if (suffix.startsWith("e") || suffix.startsWith("E") && suffix.length() > 1) {
      return n.scaleByPowerOfTen(Integer.parseInt(suffix.substring(1)));
    }
    return switch (suffix) {
      case "" -> n;
      case "n" -> n.scaleByPowerOfTen(-9);
      case "u" -> n.scaleByPowerOfTen(-6);
      case "m" -> n.scaleByPowerOfTen(-3);
      case "k" -> n.scaleByPowerOfTen(3);
      case "M" -> n.scaleByPowerOfTen(6);
      case "G" -> n.scaleByPowerOfTen(9);
      case "T" -> n.scaleByPowerOfTen(12);
      case "P" -> n.scaleByPowerOfTen(15);
      case "E" -> n.scaleByPowerOfTen(18);
      default -> n.multiply(BigDecimal.valueOf(2).pow(10 * (1 + "KMGTPE".indexOf(suffix.charAt(0)))));
    };
  }

  static final Pattern QUANTITY =
      Pattern.compile("([+-]?[0-9]+(?:\\.[0-9]*)?|[+-]?\\.[0-9]+)"
          + "([eE][+-]?[0-9]+|Ki|Mi|Gi|Ti|Pi|Ei|n|u|m|k|M|G|T|P|E)?");

  static long milli(String q) {
    return quantity(q).movePointRight(3).setScale(0, RoundingMode.CEILING).longValueExact();
  }

  static long whole(String q) {
    return quantity(q).setScale(0, RoundingMode.CEILING).longValueExact();
  }

  /** One row of describe's "Non-terminated Pods" table. */
  record Row(String cpuRequest, String cpuLimit, String memoryRequest, String memoryLimit) {}

  /** The pods table of {@code kubectl describe node}, keyed namespace/name. */
  static Map<String, Row> parseDescribe(String out) {
    Map<String, Row> rows = new LinkedHashMap<>();
    String[] lines = out.split("\n", -1);
    int i = 0;
    while (i < lines.length && !lines[i].startsWith("Non-terminated Pods:")) {
      i++;
    }
    assertTrue(i < lines.length, "describe output has a pods table:\n" + out);
    i += 3; // title, column header, dashes
    for (; i < lines.length && lines[i].startsWith("  "); i++) {
      // namespace name cpuReq (x%) cpuLim (x%) memReq (x%) memLim (x%) age
      String[] f = lines[i].trim().split("\\s+");
      assertEquals(11, f.length, lines[i]);
      rows.put(f[0] + "/" + f[1], new Row(f[2], f[4], f[6], f[8]));
    }
    return rows;
  }

  static boolean everyContainerLimits(Pod pod, String res) {
    List<Container> all = new ArrayList<>(pod.getSpec().getInitContainers());
    all.addAll(pod.getSpec().getContainers());
    return all.stream().allMatch(c -> c.getResources().getLimits() != null
        && c.getResources().getLimits().containsKey(res));
  }

  /** Seeded random pods bound to the node, Running, as an API server would hand them out. */
  static List<Pod> randomPods(Random rnd, int n) {
    List<Pod> pods = new ArrayList<>();
    for (int i = 0; i < n; i++) {
      List<Container> init = new ArrayList<>();
      int inits = rnd.nextInt(4);
      for (int k = 0; k < inits; k++) {
        boolean sidecar = rnd.nextBoolean();
        ContainerBuilder b = container(rnd, (sidecar ? "side-" : "init-") + k);
        if (sidecar) {
          b.withRestartPolicy("Always");
        }
        init.add(b.build());
      }
      List<Container> app = new ArrayList<>();
      int apps = 1 + rnd.nextInt(3);
      for (int k = 0; k < apps; k++) {
        app.add(container(rnd, "app-" + k).build());
      }
      PodBuilder pb = new PodBuilder()
          .withNewMetadata().withNamespace(i % 3 == 0 ? "billing" : "storefront")
          .withName(String.format("orders-%03d", i)).withUid("uid-" + i).endMetadata()
          .withNewSpec().withNodeName(NODE).withInitContainers(init).withContainers(app)
          .endSpec()
          .withNewStatus().withPhase("Running").endStatus();
      if (rnd.nextInt(4) == 0) {
        Map<String, Quantity> overhead = new TreeMap<>();
        if (rnd.nextBoolean()) {
          overhead.put("cpu", new Quantity(pick(rnd, CPU)));
        }
        overhead.put("memory", new Quantity(pick(rnd, MEMORY)));
        pb.editSpec().withRuntimeClassName("sandboxed").withOverhead(overhead).endSpec();
      }
      Pod pod = pb.build();
      copyLimitsIntoMissingRequests(pod);
      pods.add(pod);
    }
    return pods;
  }

  /**
   * What the API server's defaulting does to a container with a limit and no request
   * ("Resource Management for Pods and Containers": the request is set to the limit). Written
   * here on purpose, not taken from numafit.
   */
  static void copyLimitsIntoMissingRequests(Pod pod) {
    List<Container> all = new ArrayList<>(pod.getSpec().getInitContainers());
    all.addAll(pod.getSpec().getContainers());
    for (Container c : all) {
      Map<String, Quantity> limits = c.getResources().getLimits();
      if (limits == null) {
        continue;
      }
      Map<String, Quantity> requests = c.getResources().getRequests() == null
          ? new TreeMap<>() : new TreeMap<>(c.getResources().getRequests());
      limits.forEach(requests::putIfAbsent);
      c.getResources().setRequests(requests);
    }
  }

  private static ContainerBuilder container(Random rnd, String name) {
    Map<String, Quantity> requests = new TreeMap<>();
    Map<String, Quantity> limits = new TreeMap<>();
    for (String res : List.of("cpu", "memory")) {
      String[] forms = res.equals("cpu") ? CPU : MEMORY;
      switch (rnd.nextInt(4)) {
        case 0 -> { } // neither
        case 1 -> requests.put(res, new Quantity(pick(rnd, forms)));
        case 2 -> limits.put(res, new Quantity(pick(rnd, forms))); // limits only
        default -> {
          String a = pick(rnd, forms);
          String b = pick(rnd, forms);
          boolean aSmaller = quantity(a).compareTo(quantity(b)) <= 0;
          requests.put(res, new Quantity(aSmaller ? a : b));
          limits.put(res, new Quantity(aSmaller ? b : a));
        }
      }
    }
    return new ContainerBuilder().withName(name).withImage("registry.example/orders:1")
        .withNewResources().withRequests(requests.isEmpty() ? null : requests)
        .withLimits(limits.isEmpty() ? null : limits).endResources();
  }

  private static String pick(Random rnd, String[] forms) {
    return forms[rnd.nextInt(forms.length)];
  }

  private void serve(List<Pod> pods) {
    // The kubectl on some machines is a dispatcher choosing its version from /version.
    String version = "{\"major\":\"1\",\"minor\":\"32\",\"gitVersion\":\"v1.32.0\","
        + "\"platform\":\"linux/amd64\"}";
    for (String p : List.of("/version", "/version?timeout=5s", "/version?timeout=32s")) {
      server.expect().get().withPath(p).andReturn(200, version).withHeader("Content-Type", "application/json").always();
    }
    String api = "{\"kind\":\"APIVersions\",\"versions\":[\"v1\"],\"serverAddressByClientCIDRs\":"
        + "[{\"clientCIDR\":\"0.0.0.0/0\",\"serverAddress\":\"127.0.0.1\"}]}";
    String apis = "{\"kind\":\"APIGroupList\",\"apiVersion\":\"v1\",\"groups\":[]}";
    String v1 = "{\"kind\":\"APIResourceList\",\"groupVersion\":\"v1\",\"resources\":["
        + resource("nodes", "node", false, "Node") + ","
        + resource("pods", "pod", true, "Pod") + ","
        + resource("events", "event", true, "Event") + "]}";
    for (String q : List.of("", "?timeout=32s")) {
      server.expect().get().withPath("/api" + q).andReturn(200, api).withHeader("Content-Type", "application/json").always();
      server.expect().get().withPath("/apis" + q).andReturn(200, apis).withHeader("Content-Type", "application/json").always();
      server.expect().get().withPath("/api/v1" + q).andReturn(200, v1).withHeader("Content-Type", "application/json").always();
    }
    Node node = new NodeBuilder()
        .withNewMetadata().withName(NODE).withUid("node-uid-1").endMetadata()
        .withNewStatus()
        .addToCapacity("cpu", new Quantity("64")).addToCapacity("memory", new Quantity("256Gi"))
        .addToCapacity("pods", new Quantity("500"))
        .addToAllocatable("cpu", new Quantity("63")).addToAllocatable("memory",
            new Quantity("250Gi")).addToAllocatable("pods", new Quantity("500"))
        .endStatus().build();
    server.expect().get().withPath("/api/v1/nodes/" + NODE).andReturn(200, JSON.asJson(node)).withHeader("Content-Type", "application/json").always();

    String selector = enc("spec.nodeName=" + NODE
        + ",status.phase!=Succeeded,status.phase!=Failed");
    for (int page = 0; page * CHUNK < pods.size(); page++) {
      int end = Math.min(pods.size(), (page + 1) * CHUNK);
      String cont = end < pods.size() ? "page" + (page + 1) : null;
      String path = page == 0
          ? "/api/v1/pods?fieldSelector=" + selector + "&limit=" + CHUNK
          : "/api/v1/pods?continue=page" + page + "&fieldSelector=" + selector + "&limit="
              + CHUNK;
      server.expect().get().withPath(path)
          .andReturn(200, list("PodList", pods.subList(page * CHUNK, end), cont)).withHeader("Content-Type", "application/json").always();
    }
    // kubectl asks for the node's events twice (by uid and by name) with the field selector
    // terms in map order, which varies: every order is served, all empty.
    for (String uid : List.of("node-uid-1", NODE)) {
      for (List<String> order : permutations(List.of("involvedObject.uid=" + uid,
          "involvedObject.name=" + NODE, "involvedObject.namespace=",
          "involvedObject.kind=Node"))) {
        server.expect().get().withPath("/api/v1/events?fieldSelector="
            + enc(String.join(",", order)) + "&limit=" + CHUNK)
            .andReturn(200, list("EventList", List.of(), null)).withHeader("Content-Type", "application/json").always();
      }
    }
    server.expect().get()
        .withPath("/apis/coordination.k8s.io/v1/namespaces/kube-node-lease/leases/" + NODE)
        .andReturn(404, "{\"kind\":\"Status\",\"apiVersion\":\"v1\",\"status\":\"Failure\","
            + "\"reason\":\"NotFound\",\"code\":404}").withHeader("Content-Type", "application/json").always();
  }

  private static String resource(String name, String singular, boolean namespaced, String kind) {
    return "{\"name\":\"" + name + "\",\"singularName\":\"" + singular + "\",\"namespaced\":"
        + namespaced + ",\"kind\":\"" + kind + "\",\"verbs\":[\"get\",\"list\"]}";
  }

  private static String list(String kind, List<?> items, String cont) {
    Map<String, Object> list = new LinkedHashMap<>();
    list.put("apiVersion", "v1");
    list.put("kind", kind);
    Map<String, Object> meta = new LinkedHashMap<>();
    meta.put("resourceVersion", "1000");
    if (cont != null) {
      meta.put("continue", cont);
    }
    list.put("metadata", meta);
    list.put("items", items);
    return JSON.asJson(list);
  }

  /** Go's url.QueryEscape: spaces as +, everything but unreserved characters escaped. */
  private static String enc(String s) {
    return URLEncoder.encode(s, StandardCharsets.UTF_8);
  }

  private static List<List<String>> permutations(List<String> xs) {
    if (xs.isEmpty()) {
      return List.of(List.of());
    }
    List<List<String>> out = new ArrayList<>();
    for (int i = 0; i < xs.size(); i++) {
      List<String> rest = new ArrayList<>(xs);
      String head = rest.remove(i);
      for (List<String> p : permutations(rest)) {
        List<String> l = new ArrayList<>();
        l.add(head);
        l.addAll(p);
        out.add(l);
      }
    }
    return out;
  }

  private static String kubeconfig(String url) {
    return "apiVersion: v1\nkind: Config\nclusters:\n- name: mock\n  cluster:\n    server: "
        + url + "\ncontexts:\n- name: mock\n  context:\n    cluster: mock\n    user: reader\n"
        + "current-context: mock\nusers:\n- name: reader\n  user:\n    token: not-a-real-token\n";
  }
}
