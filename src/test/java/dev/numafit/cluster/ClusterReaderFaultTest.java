package dev.numafit.cluster;

import static dev.numafit.cluster.ClusterFixtures.listJson;
import static dev.numafit.cluster.ClusterFixtures.status;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.cluster.model.ClusterModel;
import dev.numafit.diag.InputException;
import io.fabric8.kubernetes.api.model.Pod;
import io.fabric8.kubernetes.api.model.apps.Deployment;
import io.fabric8.kubernetes.api.model.apps.ReplicaSet;
import io.fabric8.kubernetes.client.ConfigBuilder;
import io.fabric8.kubernetes.client.KubernetesClient;
import io.fabric8.kubernetes.client.server.mock.EnableKubernetesMockClient;
import io.fabric8.kubernetes.client.server.mock.KubernetesMockServer;
import io.fabric8.mockwebserver.http.RecordedRequest;
import java.net.ServerSocket;
import java.time.Duration;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;

/**
 * Paging and faults against the mock API server in expectations mode (CRUD mode ignores limit and
 * continue). Each fault ends in the documented message or a complete result, never a silent
 * partial one.
 */
@EnableKubernetesMockClient
class ClusterReaderFaultTest {
  static {
    ClusterFixtures.quietLogs();
  }

  KubernetesMockServer server;
  KubernetesClient client;

  static final int PODS = 3000;
  static final String PODS_PATH = "/api/v1/pods?limit=500";

  /**
   * 3,000 pods of the hotel-reservation Deployments spread over three namespaces and 30 nodes,
   * in the order an API server would page them.
   */
  static final List<Pod> POD_FIXTURE = new ArrayList<>();
  static final List<ReplicaSet> RS_FIXTURE = new ArrayList<>();

  static {
    List<Deployment> ds = ClusterFixtures.hotelDeployments();
    for (int ns = 0; ns < 3; ns++) {
      for (Deployment d : ds) {
        d.getMetadata().setNamespace("hotel-" + ns);
        RS_FIXTURE.add(ClusterFixtures.replicaSetFor(d, "7b9c" + ns));
      }
    }
    for (int i = 0; i < PODS; i++) {
      ReplicaSet rs = RS_FIXTURE.get(i % RS_FIXTURE.size());
      POD_FIXTURE.add(ClusterFixtures.podFor(rs, Integer.toString(i, 36), "w" + (i % 30)));
    }
  }

  private static String continuePath(String token) {
    return "/api/v1/pods?continue=" + token + "&limit=500";
  }

  /** Serves the pods in pages of 500 with tokens p1..p5; other types empty. */
  private void servePages(int times) {
    for (int page = 0; page < PODS / 500; page++) {
      String cont = page + 1 < PODS / 500 ? "p" + (page + 1) : null;
      String body = listJson("PodList", POD_FIXTURE.subList(page * 500, page * 500 + 500), cont);
      String path = page == 0 ? PODS_PATH : continuePath("p" + page);
      server.expect().get().withPath(path).andReturn(200, body).times(times);
    }
  }

  private void serveReplicaSets() {
    server.expect().get().withPath("/apis/apps/v1/replicasets?limit=500")
        .andReturn(200, listJson("ReplicaSetList", RS_FIXTURE, null)).always();
  }

  private KubernetesClient clientWith(int retries, Duration timeout) {
    return ClusterConnector.forConfig(new ConfigBuilder(client.getConfiguration()).build(),
        new ConnectionSettings(Optional.empty(), Optional.empty(), Optional.empty(), timeout,
            retries, false));
  }

  private ClusterModel read(KubernetesClient c, boolean allowPartial, int retries)
      throws InputException {
    ConnectionSettings s = new ConnectionSettings(Optional.empty(), Optional.empty(),
        Optional.empty(), Duration.ofSeconds(5), retries, allowPartial);
    return new ClusterReader(c, s, ReadProgress.NONE, line -> { }).read();
  }

  private List<RecordedRequest> requests() throws InterruptedException {
    List<RecordedRequest> out = new ArrayList<>();
    RecordedRequest r;
    while ((r = server.takeRequest(10, TimeUnit.MILLISECONDS)) != null) {
      out.add(r);
    }
    return out;
  }

  @Test
  void read_threeThousandPodsInSixPages_readsEveryPodOnceWithGetOnly() throws Exception {
    servePages(1);
    serveReplicaSets();
    ClusterFixtures.emptyLists(server, EnumSet.of(ResourceType.PODS, ResourceType.REPLICA_SETS));
    List<long[]> progress = new ArrayList<>();
    ClusterModel m = new ClusterReader(client, ConnectionSettings.defaults(),
        (type, items, pages, done) -> {
          if (type == ResourceType.PODS) {
            progress.add(new long[] {items, pages});
          }
        }, line -> { }).read();
    assertEquals(PODS, m.pods().size());
    assertEquals(PODS, m.pods().stream().map(p -> p.id()).distinct().count());
    // 57 ReplicaSets of 19 Deployments in 3 namespaces: every pod resolves to a Deployment.
    assertEquals(57, m.pods().stream().map(p -> p.workload()).distinct().count());
    assertTrue(m.pods().stream().allMatch(p -> p.workload().kind().equals("Deployment")));
    assertEquals(6, progress.size());
    assertEquals(PODS, progress.get(5)[0]);
    List<RecordedRequest> reqs = requests();
    assertTrue(reqs.stream().allMatch(r -> r.getMethod().equals("GET")));
    assertEquals(6, reqs.stream().filter(r -> r.getPath().startsWith("/api/v1/pods")).count());
    assertTrue(m.missing().isEmpty() && m.warnings().isEmpty(), m.warnings().toString());
    // The snapshot of the paged read reads back equal.
    assertEquals(m, SnapshotFile.parse(SnapshotFile.toText(m), "paged.json"));
  }

  @Test
  void read_continueTokenExpires_restartsOnceAndSaysSo() throws Exception {
    // Page 3's token expires once: the first pass stops there, the second reads everything.
    server.expect().get().withPath(continuePath("p3"))
        .andReturn(410, status(410, "Expired", "The provided continue parameter is too old"))
        .once();
    servePages(2);
    serveReplicaSets();
    ClusterFixtures.emptyLists(server, EnumSet.of(ResourceType.PODS, ResourceType.REPLICA_SETS));
    ClusterModel m = read(client, false, 1);
    assertEquals(PODS, m.pods().size());
    assertEquals(PODS, m.pods().stream().map(p -> p.id()).distinct().count());
    assertEquals(List.of("pods: the continue token expired (410 Gone) after 1500 objects; the"
        + " list was restarted from the top"), m.warnings());
  }

  @Test
  void read_continueTokenExpiresTwice_stops() throws Exception {
    server.expect().get().withPath(continuePath("p3"))
        .andReturn(410, status(410, "Expired", "too old")).always();
    servePages(2);
    serveReplicaSets();
    ClusterFixtures.emptyLists(server, EnumSet.of(ResourceType.PODS, ResourceType.REPLICA_SETS));
    InputException ex = assertThrows(InputException.class, () -> read(client, false, 1));
    assertTrue(message(ex).contains("expired the continue token of list pods twice"),
        message(ex));
  }

  @Test
  void read_forbiddenBudgets_namesVerbResourceAndRbacDoc() throws Exception {
    server.expect().get().withPath("/apis/policy/v1/poddisruptionbudgets?limit=500")
        .andReturn(403, status(403, "Forbidden", "poddisruptionbudgets.policy is forbidden"))
        .always();
    ClusterFixtures.emptyLists(server, EnumSet.of(ResourceType.POD_DISRUPTION_BUDGETS));
    InputException ex = assertThrows(InputException.class, () -> read(client, false, 1));
    assertEquals("error: the API server " + server.url("").replaceAll("/$", "")
        + " refused to list policy/poddisruptionbudgets (403 Forbidden:"
        + " poddisruptionbudgets.policy is forbidden); numafit needs the verb list on"
        + " policy/poddisruptionbudgets: docs/rbac.md has a minimal read-only ClusterRole",
        message(ex));
  }

  @Test
  void read_forbiddenBudgetsWithAllowPartial_listsTheMissingType() throws Exception {
    server.expect().get().withPath("/apis/policy/v1/poddisruptionbudgets?limit=500")
        .andReturn(403, status(403, "Forbidden", "forbidden")).always();
    ClusterFixtures.emptyLists(server, EnumSet.of(ResourceType.POD_DISRUPTION_BUDGETS));
    ClusterModel m = read(client, true, 1);
    assertEquals(List.of("policy/poddisruptionbudgets: 403 Forbidden (the drain plan ignores"
        + " disruption budgets)"), m.missing());
  }

  @Test
  void read_tooManyRequestsThenSuccess_completeResult() throws Exception {
    server.expect().get().withPath(PODS_PATH)
        .andReturn(429, status(429, "TooManyRequests", "slow down")).once();
    servePages(1);
    serveReplicaSets();
    ClusterFixtures.emptyLists(server, EnumSet.of(ResourceType.PODS, ResourceType.REPLICA_SETS));
    try (KubernetesClient c = clientWith(2, Duration.ofSeconds(5))) {
      ClusterModel m = read(c, false, 2);
      assertEquals(PODS, m.pods().size());
    }
  }

  @Test
  void read_serverErrorThreeTimes_stopsAfterTheRetries() throws Exception {
    server.expect().get().withPath("/api/v1/nodes?limit=500")
        .andReturn(500, status(500, "InternalError", "etcd unavailable")).times(3);
    ClusterFixtures.emptyLists(server, EnumSet.of(ResourceType.NODES));
    try (KubernetesClient c = clientWith(2, Duration.ofSeconds(5))) {
      InputException ex = assertThrows(InputException.class, () -> read(c, false, 2));
      assertTrue(message(ex).contains("answered list nodes with 500: etcd unavailable after 2"
          + " retries"), message(ex));
    }
    // One try and two retries, then no further request.
    assertEquals(3, requests().size());
  }

  @Test
  void read_slowAnswerPastTimeout_namesTheTimeout() throws Exception {
    server.expect().get().delay(3, TimeUnit.SECONDS).withPath("/api/v1/nodes?limit=500")
        .andReturn(200, listJson("NodeList", List.of(), null)).always();
    ClusterFixtures.emptyLists(server, EnumSet.of(ResourceType.NODES));
    try (KubernetesClient c = clientWith(0, Duration.ofSeconds(1))) {
      ConnectionSettings s = new ConnectionSettings(Optional.empty(), Optional.empty(),
          Optional.empty(), Duration.ofSeconds(1), 0, false);
      InputException ex = assertThrows(InputException.class,
          () -> new ClusterReader(c, s, ReadProgress.NONE, l -> { }).read());
      assertTrue(message(ex).endsWith("did not answer list nodes within 1 s"
          + " (--request-timeout)"), message(ex));
    }
  }

  @Test
  void read_truncatedBody_stopsWithoutUsingIt() throws Exception {
    String whole = listJson("PodList", POD_FIXTURE.subList(0, 20), null);
    server.expect().get().withPath(PODS_PATH)
        .andReturn(200, whole.substring(0, whole.length() / 2)).always();
    serveReplicaSets();
    ClusterFixtures.emptyLists(server, EnumSet.of(ResourceType.PODS, ResourceType.REPLICA_SETS));
    InputException ex = assertThrows(InputException.class, () -> read(client, true, 0));
    assertTrue(message(ex).contains("to list pods was cut off or is not valid JSON"),
        message(ex));
  }

  @Test
  void read_connectionRefused_failsFastNamingTheServer() throws Exception {
    int port;
    try (ServerSocket s = new ServerSocket(0)) {
      port = s.getLocalPort();
    }
    String url = "https://127.0.0.1:" + port;
    ConnectionSettings s = new ConnectionSettings(Optional.empty(), Optional.empty(),
        Optional.empty(), Duration.ofSeconds(2), 1, false);
    long start = System.nanoTime();
    try (KubernetesClient c = ClusterConnector.forConfig(
        new ConfigBuilder().withMasterUrl(url).withTrustCerts(true).build(), s)) {
      InputException ex = assertThrows(InputException.class,
          () -> new ClusterReader(c, s, ReadProgress.NONE, l -> { }).read());
      assertEquals("error: cannot reach the API server " + url
          + ": connection refused (after 1 retries)", message(ex));
    }
    // One retry after 250 ms: far inside the 30 s the issue allows (not a timing test: a
    // generous bound only to catch an unbounded retry loop).
    assertTrue(System.nanoTime() - start < Duration.ofSeconds(20).toNanos());
  }

  static String message(InputException ex) {
    return ex.diagnostics().get(0).format();
  }
}
