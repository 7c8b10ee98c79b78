package dev.numafit.cluster;

import java.nio.file.Path;
import java.time.Duration;
import java.util.Objects;
import java.util.Optional;

/**
 * How to reach and read a cluster, as a kubectl user expects.
 *
 * @param kubeconfig {@code --kubeconfig}; empty: KUBECONFIG, then ~/.kube/config, then the
 *     in-cluster service account
 * @param context {@code --context}; empty: the kubeconfig's current context
 * @param namespace {@code --namespace}; empty: all namespaces
 * @param requestTimeout the longest one request may take
 * @param retries how many times a failed request (connection refused, 429, 5xx) is retried, with
 *     doubling backoff from {@link #BACKOFF}
 * @param allowPartial go on when a resource type cannot be read, and say so at the top
 */
public record ConnectionSettings(
    Optional<Path> kubeconfig,
    Optional<String> context,
    Optional<String> namespace,
    Duration requestTimeout,
    int retries,
    boolean allowPartial) {
  /** Default request timeout. */
  public static final Duration DEFAULT_TIMEOUT = Duration.ofSeconds(10);
  /** Default retries: with {@link #CONNECT_TIMEOUT} an unreachable server fails within 30 s. */
  public static final int DEFAULT_RETRIES = 3;
  /** First backoff between retries; it doubles each time. */
  public static final Duration BACKOFF = Duration.ofMillis(250);
  /** The longest a TCP connection may take to open. */
  public static final Duration CONNECT_TIMEOUT = Duration.ofSeconds(5);

  public ConnectionSettings {
    kubeconfig = kubeconfig == null ? Optional.empty() : kubeconfig;
    context = context == null ? Optional.empty() : context;
    namespace = namespace == null ? Optional.empty() : namespace;
    Objects.requireNonNull(requestTimeout, "requestTimeout");
    if (requestTimeout.isNegative() || requestTimeout.isZero()) {
      throw new IllegalArgumentException("request timeout must be positive");
    }
    if (retries < 0 || retries > 10) {
      throw new IllegalArgumentException("retries must be between 0 and 10, got " + retries);
    }
  }

  /** All namespaces, the current context, default timeout and retries. */
  public static ConnectionSettings defaults() {
    return new ConnectionSettings(Optional.empty(), Optional.empty(), Optional.empty(),
        DEFAULT_TIMEOUT, DEFAULT_RETRIES, false);
  }
}
