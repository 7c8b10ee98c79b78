package dev.numafit.cluster;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.diag.SourceRef;
import io.fabric8.kubernetes.client.Config;
import io.fabric8.kubernetes.client.KubernetesClient;
import io.fabric8.kubernetes.client.KubernetesClientBuilder;
import io.fabric8.kubernetes.client.KubernetesClientException;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.Optional;

/**
 * The only place numafit builds a Kubernetes client. Connection settings follow kubectl: {@code
 * --kubeconfig}, else KUBECONFIG, else ~/.kube/config, else the in-cluster service account; {@code
 * --context} picks a context. Timeouts and the bounded retry count are set on the {@link Config}
 * object itself (the client ignores {@code -Dkubernetes.*} properties once a kubeconfig is read).
 */
public final class ClusterConnector {
  private ClusterConnector() {}

  /**
   * A client for the cluster the settings name.
   *
   * @param env the process environment (KUBECONFIG, HOME, KUBERNETES_SERVICE_HOST)
   * @throws InputException when no configuration can be found or the kubeconfig or context is
   *     wrong
   */
  public static KubernetesClient connect(ConnectionSettings s, Map<String, String> env)
      throws InputException {
    return forConfig(config(s, env), s);
  }

  /**
   * A client for {@code base} with the settings' timeouts and retries (tests pass a mock's). The
   * request timeout covers the whole answer, body included ({@link ResponseDeadline}).
   */
  public static KubernetesClient forConfig(Config base, ConnectionSettings s) {
    long timeout = s.requestTimeout().toMillis();
    base.setRequestTimeout((int) Math.min(Integer.MAX_VALUE, timeout));
    base.setConnectionTimeout(
        (int) Math.min(timeout, ConnectionSettings.CONNECT_TIMEOUT.toMillis()));
    base.setRequestRetryBackoffLimit(s.retries());
    base.setRequestRetryBackoffInterval((int) ConnectionSettings.BACKOFF.toMillis());
    // The client's timeout stops at the response headers; the interceptor holds the body to it.
    ResponseDeadline deadline = new ResponseDeadline(s.requestTimeout());
    return new KubernetesClientBuilder().withConfig(base)
        .withHttpClientBuilderConsumer(b -> b.addOrReplaceInterceptor(ResponseDeadline.NAME,
            deadline))
        .build();
  }

  /** The client configuration for the settings. */
  static Config config(ConnectionSettings s, Map<String, String> env) throws InputException {
    String context = s.context().orElse(null);
    Config c;
    try {
      if (s.kubeconfig().isPresent()) {
        Path file = s.kubeconfig().get();
        String text;
        try {
          text = Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException ex) {
          throw new InputException(Diagnostic.error(new SourceRef(file.toString(), 0),
              "cannot read kubeconfig: " + describe(ex)));
        }
        c = Config.fromKubeconfig(context, text, file.toString());
      } else {
        boolean hasKubeconfig = kubeconfigFiles(env).stream().anyMatch(Files::isRegularFile);
        boolean inCluster = env.containsKey("KUBERNETES_SERVICE_HOST");
        if (!hasKubeconfig && !inCluster) {
          throw new InputException(Diagnostic.error(null,
              "no cluster configured: no kubeconfig (KUBECONFIG, ~/.kube/config) and not running"
                  + " in a pod; give --kubeconfig FILE or --snapshot FILE"));
        }
        c = Config.autoConfigure(context);
      }
    } catch (KubernetesClientException | IllegalArgumentException ex) {
      throw new InputException(Diagnostic.error(null,
          "cannot load the cluster configuration: " + ex.getMessage()));
    }
    if (context != null && (c.getCurrentContext() == null
        || !context.equals(c.getCurrentContext().getName()))) {
      throw new InputException(Diagnostic.error(null,
          "--context " + context + ": no such context in the kubeconfig"));
    }
    if (c.getMasterUrl() == null || c.getMasterUrl().isBlank()) {
      throw new InputException(Diagnostic.error(null,
          "the kubeconfig names no server for the current context"));
    }
    return c;
  }

  private static java.util.List<Path> kubeconfigFiles(Map<String, String> env) {
    String list = env.get("KUBECONFIG");
    if (list != null && !list.isBlank()) {
      return java.util.Arrays.stream(list.split(java.io.File.pathSeparator))
          .filter(p -> !p.isBlank()).map(Path::of).toList();
    }
    return Optional.ofNullable(env.get("HOME")).or(() -> Optional.ofNullable(
            System.getProperty("user.home")))
        .map(h -> java.util.List.of(Path.of(h, ".kube", "config"))).orElse(java.util.List.of());
  }

  private static String describe(IOException ex) {
    String kind = ex.getClass().getSimpleName();
    return switch (kind) {
      case "NoSuchFileException" -> "no such file";
      case "AccessDeniedException" -> "permission denied";
      default -> ex.getMessage() == null ? kind : ex.getMessage();
    };
  }
}
