package dev.numafit.cluster;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.fabric8.kubernetes.client.KubernetesClient;
import io.fabric8.kubernetes.client.server.mock.EnableKubernetesMockClient;
import io.fabric8.kubernetes.client.server.mock.KubernetesMockServer;
import io.fabric8.mockwebserver.http.RecordedRequest;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.EnumSet;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.JsonNode;
import tools.jackson.dataformat.yaml.YAMLMapper;

/**
 * Every request numafit makes is inside the ClusterRole published in docs/rbac.md: the test reads
 * the role from the document's first YAML block and the requests from the mock server's record.
 */
@EnableKubernetesMockClient
class RbacDocTest {
  static {
    ClusterFixtures.quietLogs();
  }

  KubernetesMockServer server;
  KubernetesClient client;

  /** (verb, group/resource) pairs the documented role grants. */
  static Set<String> documentedRole() throws Exception {
    String doc = Files.readString(Path.of("docs/rbac.md"));
    Matcher m = Pattern.compile("```yaml\n(.*?)```", Pattern.DOTALL).matcher(doc);
    assertTrue(m.find(), "docs/rbac.md has a YAML block");
    JsonNode role = new YAMLMapper().readTree(m.group(1));
    assertEquals("ClusterRole", role.get("kind").asString());
    Set<String> granted = new TreeSet<>();
    for (JsonNode rule : role.get("rules")) {
      for (JsonNode g : rule.get("apiGroups")) {
        for (JsonNode r : rule.get("resources")) {
          for (JsonNode v : rule.get("verbs")) {
            granted.add(v.asString() + " " + (g.asString().isEmpty() ? "" : g.asString() + "/")
                + r.asString());
          }
        }
      }
    }
    return granted;
  }

  /**
   * The RBAC verb and resource of one request: a GET of a collection is {@code list}, of one
   * named object {@code get} ("Authorization" / "Determine the Request Verb" in the Kubernetes
   * docs).
   */
  static String verbAndResource(RecordedRequest r) {
    String path = r.getPath().replaceAll("\\?.*", "");
    String[] s = path.substring(1).split("/");
    int i;
    String group;
    if (s[0].equals("api")) {
      group = "";
      i = 2;
    } else {
      group = s[1] + "/";
      i = 3;
    }
    if (s[i].equals("namespaces") && s.length > i + 2) {
      i += 2;
    }
    String verb = switch (r.getMethod()) {
      case "GET" -> s.length == i + 1 ? "list" : "get";
      default -> r.getMethod().toLowerCase();
    };
    return verb + " " + group + s[i];
  }

  @Test
  void read_everyRequest_isAListInsideTheDocumentedRole() throws Exception {
    ClusterFixtures.emptyLists(server, EnumSet.noneOf(ResourceType.class));
    new ClusterReader(client, ConnectionSettings.defaults(), ReadProgress.NONE, l -> { }).read();
    Set<String> role = documentedRole();
    Set<String> used = new TreeSet<>();
    RecordedRequest r;
    while ((r = server.takeRequest(10, TimeUnit.MILLISECONDS)) != null) {
      assertEquals("GET", r.getMethod(), r.getPath());
      used.add(verbAndResource(r));
    }
    assertEquals(ResourceType.values().length, used.size(), used.toString());
    assertTrue(role.containsAll(used), "outside the role: " + used + " vs " + role);
    // Minimal: the role grants nothing the tool does not use.
    assertEquals(used, role);
  }

  @Test
  void read_namespaced_staysInsideTheDocumentedRole() throws Exception {
    for (ResourceType t : ResourceType.values()) {
      server.expect().get().withPath(t.path(Optional.of("shop")) + "?limit=500")
          .andReturn(200, ClusterFixtures.listJson(ClusterFixtures.kindOf(t),
              java.util.List.of(), null)).always();
    }
    ConnectionSettings s = new ConnectionSettings(Optional.empty(), Optional.empty(),
        Optional.of("shop"), ConnectionSettings.DEFAULT_TIMEOUT, 1, false);
    new ClusterReader(client, s, ReadProgress.NONE, l -> { }).read();
    Set<String> role = documentedRole();
    RecordedRequest r;
    int n = 0;
    while ((r = server.takeRequest(10, TimeUnit.MILLISECONDS)) != null) {
      assertTrue(role.contains(verbAndResource(r)), r.getPath());
      n++;
    }
    assertEquals(ResourceType.values().length, n);
  }
}
