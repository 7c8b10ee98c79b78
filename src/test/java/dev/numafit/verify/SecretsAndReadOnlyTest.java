package dev.numafit.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.cli.Main;
import io.fabric8.kubernetes.api.model.NodeBuilder;
import io.fabric8.kubernetes.api.model.PodBuilder;
import io.fabric8.kubernetes.api.model.Quantity;
import io.fabric8.kubernetes.client.KubernetesClient;
import io.fabric8.kubernetes.client.server.mock.EnableKubernetesMockClient;
import io.fabric8.kubernetes.client.server.mock.KubernetesMockServer;
import io.fabric8.mockwebserver.http.RecordedRequest;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.InputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.logging.LogManager;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Credentials from the kubeconfig never reach any output: every stream and file of a run with
 * {@code --verbose} is searched for a known fake token and password. The same runs only read: the
 * mock server records no request other than GET.
 */
@EnableKubernetesMockClient(crud = true)
class SecretsAndReadOnlyTest {
  static final String TOKEN = "fake-token-9d41c07b3e";
  static final String PASSWORD = "fake-password-52ae91";

  KubernetesMockServer server;
  KubernetesClient client;

  @TempDir Path dir;

  static String[] run(String... args) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    int code = Main.run(args, new ByteArrayInputStream(new byte[0]),
        new PrintStream(out, true, StandardCharsets.UTF_8),
        new PrintStream(err, true, StandardCharsets.UTF_8));
    return new String[] {Integer.toString(code), out.toString(StandardCharsets.UTF_8),
        err.toString(StandardCharsets.UTF_8)};
  }

  @Test
  void snapshotAndReview_verbose_noCredentialInAnyOutputAndOnlyGets() throws Exception {
    try (InputStream in = getClass().getResourceAsStream("/logging.properties")) {
      LogManager.getLogManager().readConfiguration(in);
    }
    client.nodes().resource(new NodeBuilder().withNewMetadata().withName("w1")
        .addToLabels("pool", "general").endMetadata().withNewStatus()
        .addToAllocatable("cpu", new Quantity("8")).addToAllocatable("memory", new Quantity("32Gi"))
        .addToAllocatable("pods", new Quantity("110")).endStatus().build()).create();
    client.pods().inNamespace("billing").resource(new PodBuilder().withNewMetadata()
        .withNamespace("billing").withName("ledger-1").endMetadata().withNewSpec()
        .withNodeName("w1").addNewContainer().withName("app").withNewResources()
        .addToRequests("cpu", new Quantity("500m")).endResources().endContainer().endSpec()
        .withNewStatus().withPhase("Running").endStatus().build()).create();
    while (server.takeRequest(10, TimeUnit.MILLISECONDS) != null) {
      // the fixture's own POSTs are not numafit's
    }
    Path kubeconfig = dir.resolve("kubeconfig");
    Files.writeString(kubeconfig, String.join("\n", "apiVersion: v1", "kind: Config",
        "clusters:", "- name: mock", "  cluster:",
        "    server: " + server.url("").replaceAll("/$", ""),
        "    insecure-skip-tls-verify: true", "users:", "- name: reader", "  user:",
        "    token: " + TOKEN, "    username: auditor", "    password: " + PASSWORD,
        "contexts:", "- name: mock", "  context: {cluster: mock, user: reader}",
        "current-context: mock", ""));
    Path snapshot = dir.resolve("cluster.json");
    List<String> outputs = new ArrayList<>();
    String[] s = run("snapshot", "--kubeconfig", kubeconfig.toString(), "--out",
        snapshot.toString(), "--verbose");
    assertEquals("0", s[0], s[2]);
    assertTrue(s[2].contains("numafit: GET "), "verbose lists the requests: " + s[2]);
    outputs.add(s[1]);
    outputs.add(s[2]);
    outputs.add(Files.readString(snapshot));
    for (String format : List.of("text", "json")) {
      String[] r = run("review", "--kubeconfig", kubeconfig.toString(), "--pool",
          "pool=general", "--verbose", "-o", format);
      assertEquals("0", r[0], r[2]);
      outputs.add(r[1]);
      outputs.add(r[2]);
    }
    for (String o : outputs) {
      assertFalse(o.contains(TOKEN), "token in output:\n" + o);
      assertFalse(o.contains(PASSWORD), "password in output:\n" + o);
    }
    List<RecordedRequest> reqs = new ArrayList<>();
    RecordedRequest q;
    while ((q = server.takeRequest(10, TimeUnit.MILLISECONDS)) != null) {
      reqs.add(q);
    }
    assertFalse(reqs.isEmpty());
    assertTrue(reqs.stream().allMatch(x -> x.getMethod().equals("GET")), reqs.toString());
  }
}
