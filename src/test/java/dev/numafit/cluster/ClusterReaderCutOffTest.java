package dev.numafit.cluster;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.diag.InputException;
import io.fabric8.kubernetes.api.model.Pod;
import io.fabric8.kubernetes.client.ConfigBuilder;
import io.fabric8.kubernetes.client.KubernetesClient;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.OutputStream;
import java.net.InetAddress;
import java.net.ServerSocket;
import java.net.Socket;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;

/**
 * An API server that cuts a page off in the middle: the second page of the pod list is announced
 * with its full Content-Length, only part of the body is sent, and then the server either keeps
 * the connection open and says nothing more, or closes it. The mock server cannot do this (it
 * always sends whole bodies), so this test speaks HTTP/1.1 itself over a plain socket.
 *
 * <p>Either way the read must end within about the request timeout, with one message naming the
 * server, and must not return the first page's pods as if they were all the pods.
 */
class ClusterReaderCutOffTest {
  static {
    ClusterFixtures.quietLogs();
  }

  /** What the server does after the first part of the cut page. */
  enum AfterCut { STAY_SILENT, CLOSE }

  /** A one-thread HTTP/1.1 server: lists are empty except pods, whose page 2 is cut. */
  static final class CuttingServer implements AutoCloseable {
    final ServerSocket socket;
    final AfterCut after;
    final List<String> requests = Collections.synchronizedList(new ArrayList<>());
    final CountDownLatch stop = new CountDownLatch(1);
    final List<Socket> open = Collections.synchronizedList(new ArrayList<>());
    final Thread thread;

    CuttingServer(AfterCut after) throws IOException {
      this.after = after;
      this.socket = new ServerSocket(0, 50, InetAddress.getLoopbackAddress());
      this.thread = new Thread(this::serve, "cutting-api-server");
      thread.setDaemon(true);
      thread.start();
    }

    String url() {
      return "http://127.0.0.1:" + socket.getLocalPort();
    }

    void serve() {
      while (!socket.isClosed()) {
        try {
          Socket s = socket.accept();
          open.add(s);
          Thread t = new Thread(() -> connection(s), "cutting-api-connection");
          t.setDaemon(true);
          t.start();
        } catch (IOException ex) {
          return;
        }
      }
    }

    void connection(Socket s) {
      try (s) {
        BufferedReader in = new BufferedReader(
            new InputStreamReader(s.getInputStream(), StandardCharsets.ISO_8859_1));
        OutputStream out = s.getOutputStream();
        while (true) {
          String line = in.readLine();
          if (line == null) {
            return;
          }
          String header;
          while ((header = in.readLine()) != null && !header.isEmpty()) {
            // GET requests carry no body: the headers are all there is.
          }
          String[] parts = line.split(" ");
          String method = parts[0];
          String path = parts.length > 1 ? parts[1] : "";
          requests.add(method + " " + path);
          if (path.startsWith("/api/v1/pods?") && path.contains("continue=p1")) {
            byte[] body = ClusterFixtures.listJson("PodList", pods(20, 40), null)
                .getBytes(StandardCharsets.UTF_8);
            out.write(head(body.length));
            out.write(body, 0, body.length / 2);
            out.flush();
            if (after == AfterCut.CLOSE) {
              return;
            }
            stop.await();
            return;
          }
          String kind = path.startsWith("/api/v1/pods?") ? "PodList" : "List";
          byte[] body = (path.startsWith("/api/v1/pods?")
              ? ClusterFixtures.listJson(kind, pods(0, 20), "p1")
              : ClusterFixtures.listJson(kind, List.of(), null)).getBytes(StandardCharsets.UTF_8);
          out.write(head(body.length));
          out.write(body);
          out.flush();
        }
      } catch (IOException | InterruptedException ex) {
        // The client went away or the test ended.
      }
    }

    static byte[] head(int length) {
      return ("HTTP/1.1 200 OK\r\nContent-Type: application/json\r\nContent-Length: " + length
          + "\r\n\r\n").getBytes(StandardCharsets.ISO_8859_1);
    }

    static List<Pod> pods(int from, int to) {
      List<Pod> out = new ArrayList<>();
      for (int i = from; i < to; i++) {
        out.add(ClusterFixtures.pod("ledger", "ledger-" + i, null, null, "w" + (i % 3),
            "Running", java.util.Map.of("app", "ledger"),
            ClusterFixtures.container("app", "100m", "64Mi")));
      }
      return out;
    }

    @Override
    public void close() throws IOException {
      stop.countDown();
      socket.close();
      synchronized (open) {
        for (Socket s : open) {
          s.close();
        }
      }
    }
  }

  CuttingServer server;

  @AfterEach
  void stopServer() throws IOException {
    if (server != null) {
      server.close();
    }
  }

  private InputException readFails(AfterCut after, Duration timeout, int retries,
      boolean allowPartial) throws Exception {
    server = new CuttingServer(after);
    ConnectionSettings s = new ConnectionSettings(Optional.empty(), Optional.empty(),
        Optional.empty(), timeout, retries, allowPartial);
    // A generous outer bound only to turn a hang into a failure instead of a stuck build.
    return assertTimeoutPreemptively(Duration.ofSeconds(60), () -> {
      try (KubernetesClient c = ClusterConnector.forConfig(
          new ConfigBuilder().withMasterUrl(server.url()).build(), s)) {
        return assertThrows(InputException.class,
            () -> new ClusterReader(c, s, ReadProgress.NONE, l -> { }).read());
      }
    });
  }

  @Test
  void read_pageCutOffAndConnectionLeftOpen_timesOutNamingTheServer() throws Exception {
    // Before the response deadline this read waited for ever: the client's own timeout ends
    // when the headers arrive.
    InputException ex = readFails(AfterCut.STAY_SILENT, Duration.ofSeconds(2), 0, false);
    assertEquals("error: the API server " + server.url() + " did not answer list pods within"
        + " 2 s (--request-timeout); nothing of its answer was used",
        ClusterReaderFaultTest.message(ex));
    // Page 1 was read, page 2 was asked for and cut: only GET requests were made.
    assertTrue(server.requests.stream().anyMatch(r -> r.contains("continue=p1")),
        server.requests.toString());
    assertTrue(server.requests.stream().allMatch(r -> r.startsWith("GET ")), server.requests
        .toString());
  }

  @Test
  void read_pageCutOffAndConnectionClosed_refusedNamingTheServer() throws Exception {
    // Even under --allow-partial a cut answer stops the read: the pods of page 1 alone would
    // look like a complete, smaller cluster.
    InputException ex = readFails(AfterCut.CLOSE, Duration.ofSeconds(2), 0, true);
    assertEquals("error: the answer of the API server " + server.url() + " to list pods was cut"
        + " off or is not valid JSON; nothing of it was used",
        ClusterReaderFaultTest.message(ex));
  }
}
