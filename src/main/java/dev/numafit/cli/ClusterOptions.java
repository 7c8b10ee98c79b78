package dev.numafit.cli;

import dev.numafit.cluster.ClusterConnector;
import dev.numafit.cluster.ClusterReader;
import dev.numafit.cluster.ConnectionSettings;
import dev.numafit.cluster.SnapshotFile;
import dev.numafit.cluster.model.ClusterModel;
import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import io.fabric8.kubernetes.client.KubernetesClient;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.function.Consumer;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import picocli.CommandLine.Option;

/**
 * Options of every command that reads a cluster: how to connect (as kubectl does) or a snapshot
 * file instead. A Kubernetes client is built only when no snapshot is given.
 */
final class ClusterOptions {
  @Option(
      names = "--snapshot",
      paramLabel = "FILE",
      description = "Read the cluster from a snapshot written by 'numafit snapshot' instead of"
          + " connecting (see docs/snapshot.md).")
  Path snapshot;

  @Option(
      names = "--kubeconfig",
      paramLabel = "FILE",
      description = "Kubeconfig file (default: KUBECONFIG, then ~/.kube/config, then the"
          + " in-cluster service account).")
  Path kubeconfig;

  @Option(names = "--context", paramLabel = "NAME", description = "Kubeconfig context to use.")
  String context;

  @Option(
      names = {"-n", "--namespace"},
      paramLabel = "NS",
      description = "Read only this namespace (default: all namespaces). Nodes are always read.")
  String namespace;

  @Option(
      names = "--request-timeout",
      paramLabel = "DURATION",
      description = "Longest one API request may take, e.g. 10s, 500ms, 1m (default: 10s).")
  String requestTimeout;

  @Option(
      names = "--retries",
      paramLabel = "N",
      description = "Retries of a refused connection, 429 or 5xx answer, with doubling backoff"
          + " from 250ms (default: 3, at most 10).")
  Integer retries;

  @Option(
      names = "--allow-partial",
      description = "Go on when a resource type cannot be read; the report says at the top"
          + " which types are missing and what that leaves out.")
  boolean allowPartial;

  private static final Pattern DURATION = Pattern.compile("(\\d+)(ms|s|m)?");

  /** The connection settings, or a usage error naming the bad value. */
  ConnectionSettings settings() {
    Duration timeout = ConnectionSettings.DEFAULT_TIMEOUT;
    if (requestTimeout != null) {
      Matcher m = DURATION.matcher(requestTimeout.trim().toLowerCase(Locale.ROOT));
      if (!m.matches() || Long.parseLong(m.group(1)) == 0) {
        throw new UsageException("--request-timeout " + requestTimeout
            + ": expected a positive duration such as 10s, 500ms or 1m");
      }
      long n = Long.parseLong(m.group(1));
      String unit = m.group(2) == null ? "s" : m.group(2);
      timeout = switch (unit) {
        case "ms" -> Duration.ofMillis(n);
        case "m" -> Duration.ofMinutes(n);
        default -> Duration.ofSeconds(n);
      };
    }
    int r = retries == null ? ConnectionSettings.DEFAULT_RETRIES : retries;
    if (r < 0 || r > 10) {
      throw new UsageException("--retries " + r + ": expected 0 to 10");
    }
    return new ConnectionSettings(Optional.ofNullable(kubeconfig), Optional.ofNullable(context),
        Optional.ofNullable(namespace).filter(s -> !s.isBlank()), timeout, r, allowPartial);
  }

  /** Whether any connection option was given (they make no sense with --snapshot). */
  boolean connectionGiven() {
    return kubeconfig != null || context != null || requestTimeout != null || retries != null;
  }

  /**
   * The cluster model: from {@code --snapshot}, or read live. Progress goes to standard error
   * only when the launcher says it is a terminal; with {@code verbose} every request is listed.
   */
  ClusterModel load(Console console, boolean verbose) throws InputException {
    if (snapshot != null) {
      if (connectionGiven() || namespace != null || allowPartial) {
        throw new UsageException("--snapshot reads a file: --kubeconfig, --context, --namespace,"
            + " --request-timeout, --retries and --allow-partial apply only to a live read");
      }
      return SnapshotFile.read(snapshot);
    }
    ConnectionSettings s = settings();
    ProgressLine progress = ProgressLine.of(console);
    Consumer<String> log = verbose ? line -> console.err().println("numafit: " + line)
        : line -> { };
    try (KubernetesClient client = ClusterConnector.connect(s, env())) {
      return new ClusterReader(client, s, progress, log).read();
    } finally {
      progress.clear();
    }
  }

  static Map<String, String> env() {
    return System.getenv();
  }

  /** Prints the notes of a read (restarted lists, missing types) on standard error. */
  static void reportNotes(ClusterModel m, Console console) {
    for (String w : m.warnings()) {
      console.report(Diagnostic.warning(null, w));
    }
    for (String missing : m.missing()) {
      console.report(Diagnostic.warning(null, "not read: " + missing));
    }
  }
}
