package dev.numafit.cluster;

import io.fabric8.kubernetes.client.http.AsyncBody;
import io.fabric8.kubernetes.client.http.BasicBuilder;
import io.fabric8.kubernetes.client.http.HttpRequest;
import io.fabric8.kubernetes.client.http.HttpResponse;
import io.fabric8.kubernetes.client.http.Interceptor;
import java.net.URI;
import java.net.http.HttpTimeoutException;
import java.nio.ByteBuffer;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.ScheduledFuture;
import java.util.concurrent.TimeUnit;

/**
 * Enforces the request timeout on the whole answer, body included. The client's own timeout ends
 * when the response headers arrive; an API server that then sends part of a page and falls silent
 * with the connection open would keep a read waiting for ever. This interceptor starts a clock when
 * a request is sent and, if the body is not complete when the timeout has passed since, fails the
 * answer with {@link BodyTimeoutException} and cancels the body, so the list call ends and nothing
 * of the cut answer is used.
 */
final class ResponseDeadline implements Interceptor {
  /** Name under which the interceptor is registered on the HTTP client. */
  static final String NAME = "numafit-response-deadline";

  /** The answer's body did not complete within the request timeout. */
  static final class BodyTimeoutException extends HttpTimeoutException {
    private static final long serialVersionUID = 1L;

    BodyTimeoutException(String message) {
      super(message);
    }
  }

  /** One daemon thread for all clocks: a stuck answer must never keep the process alive. */
  private static final ScheduledExecutorService TIMER =
      Executors.newSingleThreadScheduledExecutor(r -> {
        Thread t = new Thread(r, "numafit-response-deadline");
        t.setDaemon(true);
        return t;
      });

  private final long timeoutNanos;
  /**
   * When the request for each URI was last sent. Keyed by URI because the client hands the
   * interceptor a rebuilt request object after the headers arrive; numafit's reader sends one
   * request at a time, so a URI names one request in flight.
   */
  private final Map<URI, Long> sent = new ConcurrentHashMap<>();

  ResponseDeadline(Duration timeout) {
    this.timeoutNanos = timeout.toNanos();
  }

  @Override
  public void before(BasicBuilder builder, HttpRequest request, RequestTags tags) {
    sent.put(request.uri(), System.nanoTime());
  }

  @Override
  public void after(HttpRequest request, HttpResponse<?> response,
      AsyncBody.Consumer<List<ByteBuffer>> consumer) {
    Long start = sent.remove(request.uri());
    if (!(response.body() instanceof AsyncBody body)) {
      return;
    }
    long left = start == null ? timeoutNanos : timeoutNanos - (System.nanoTime() - start);
    ScheduledFuture<?> clock = TIMER.schedule(() -> {
      // First fail the answer with our reason, then stop the transfer itself.
      body.done().completeExceptionally(new BodyTimeoutException(
          "the response body was not complete within the request timeout"));
      body.cancel();
    }, Math.max(0, left), TimeUnit.NANOSECONDS);
    body.done().whenComplete((ok, failure) -> clock.cancel(false));
  }

  @Override
  public void afterConnectionFailure(HttpRequest request, Throwable failure) {
    sent.remove(request.uri());
  }
}
