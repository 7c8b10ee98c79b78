package dev.numafit.cluster;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.cli.Main;
import io.fabric8.kubernetes.client.server.mock.EnableKubernetesMockClient;
import io.fabric8.kubernetes.client.server.mock.KubernetesMockServer;
import io.fabric8.mockwebserver.http.RecordedRequest;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Faults injected between numafit and the API server, through the whole CLI ({@code numafit
 * snapshot}): an expired token, an untrusted certificate, a context that does not exist. Each ends in one clear message, exit code 2 and no
 * snapshot file: never a partial result presented as complete. Every request is a GET.
 */
@EnableKubernetesMockClient
class ClusterFaultsCliTest {
  static {
    ClusterFixtures.quietLogs();
  }

  static final String TOKEN = "fake-token-5be0c2d9e1";

  KubernetesMockServer server;

  @TempDir Path dir;

  record Run(int code, String out, String err) {}

  static Run cli(String... args) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    int code = Main.run(args, new ByteArrayInputStream(new byte[0]),
        new PrintStream(out, true, StandardCharsets.UTF_8),
        new PrintStream(err, true, StandardCharsets.UTF_8));
    return new Run(code, out.toString(StandardCharsets.UTF_8),
        err.toString(StandardCharsets.UTF_8));
  }

  String url() {
    return server.url("").replaceAll("/$", "");
  }

  Path kubeconfig(boolean skipTlsVerify) throws IOException {
    Path f = dir.resolve("kubeconfig");
    Files.writeString(f, String.join("\n", "apiVersion: v1", "kind: Config", "clusters:",
        "- name: mock", "  cluster:", "    server: " + url(),
        skipTlsVerify ? "    insecure-skip-tls-verify: true" : "", "users:", "- name: reader",
        "  user:", "    token: " + TOKEN, "contexts:", "- name: mock",
        "  context: {cluster: mock, user: reader}", "current-context: mock", ""));
    return f;
  }

  Run snapshot(boolean skipTlsVerify, String... extra) throws IOException {
    List<String> args = new ArrayList<>(List.of("snapshot", "--kubeconfig",
        kubeconfig(skipTlsVerify).toString(), "--retries", "1", "--request-timeout", "5s",
        "--out", dir.resolve("cluster.json").toString(), "--verbose"));
    args.addAll(List.of(extra));
    return cli(args.toArray(String[]::new));
  }

  void assertRefusedWhole(Run r) {
    assertEquals(2, r.code(), r.err());
    assertFalse(Files.exists(dir.resolve("cluster.json")), "no snapshot written");
    assertFalse((r.out() + r.err()).contains(TOKEN), "the token is never printed");
    assertFalse(r.err().contains("\tat "), r.err());
  }

  @AfterEach
  void onlyGets() throws InterruptedException {
    RecordedRequest q;
    while ((q = server.takeRequest(10, TimeUnit.MILLISECONDS)) != null) {
      assertEquals("GET", q.getMethod(), q.getPath());
    }
  }

  @Test
  void snapshot_expiredToken_unauthorizedNamedNoFile() throws Exception {
    for (ResourceType t : ResourceType.values()) {
      server.expect().get().withPath(t.path(java.util.Optional.empty()) + "?limit=500")
          .andReturn(401, ClusterFixtures.status(401, "Unauthorized", "Unauthorized")).always();
    }
    Run r = snapshot(true);
    assertRefusedWhole(r);
    assertTrue(r.err().contains("401"), r.err());
    assertTrue(r.err().contains(url()), r.err());
  }

  @Test
  void snapshot_untrustedCertificate_tlsMessageNamingTheServer() throws Exception {
    ClusterFixtures.emptyLists(server, EnumSet.noneOf(ResourceType.class));
    Run r = snapshot(false);
    assertRefusedWhole(r);
    assertTrue(r.err().contains(url()), r.err());
    assertTrue(r.err().toLowerCase().contains("certificate")
        || r.err().toLowerCase().contains("tls"), r.err());
  }

  @Test
  void snapshot_unknownContext_namedNoFile() throws Exception {
    Run r = snapshot(true, "--context", "production-eu");
    assertRefusedWhole(r);
    assertEquals("error: --context production-eu: no such context in the kubeconfig\n",
        r.err());
  }
}
