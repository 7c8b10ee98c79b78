package dev.numafit.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

/**
 * The benchmark workload: 5,000 Deployments of mixed sizes, 150,000 pods in all, each pod with one
 * init container and two app containers. Invented for benchmarking (a made-up retailer's
 * services); generated from a fixed seed, so every run sees the same workload.
 *
 * <p>The same numbers feed the YAML generator ({@link WorkloadGenerator}) and the packer
 * benchmark, which uses the effective pod request the Kubernetes rule gives (FACTS A1: max of the
 * init container and the sum of the app containers, no sidecars here).
 */
public final class SyntheticFleet {
  /** Deployments in the workload. */
  public static final int DEPLOYMENTS = 5_000;

  /** Pods in the workload (replicas summed). */
  public static final int PODS = 150_000;

  private static final long MI = 1L << 20;

  /**
   * One Deployment.
   *
   * @param initCpu init container cpu request, millicores
   * @param initMemory init container memory request, bytes
   * @param appCpu the two app containers' cpu requests, millicores
   * @param appMemory the two app containers' memory requests, bytes
   */
  public record Deployment(
      String namespace,
      String name,
      int replicas,
      long initCpu,
      long initMemory,
      long[] appCpu,
      long[] appMemory) {
    /** Effective pod cpu request: max(init, sum of apps), millicores. */
    public long podCpu() {
      return Math.max(initCpu, appCpu[0] + appCpu[1]);
    }

    /** Effective pod memory request, bytes. */
    public long podMemory() {
      return Math.max(initMemory, appMemory[0] + appMemory[1]);
    }
  }

  private SyntheticFleet() {}

  /** The fixed workload. */
  public static List<Deployment> deployments() {
    SplittableRandom rnd = new SplittableRandom(20_251_202L);
    // Size classes, common shapes of web, worker and data services (millicores, MiB).
    long[][] classes = {
      {50, 64}, {100, 128}, {250, 256}, {250, 512}, {500, 512}, {500, 1024}, {1000, 2048},
      {1000, 4096}, {2000, 4096}, {2000, 8192}, {4000, 8192}, {4000, 16384}
    };
    String[] namespaces = {"storefront", "checkout", "catalog", "search", "payments", "shipping",
        "loyalty", "reviews"};
    List<Deployment> out = new ArrayList<>(DEPLOYMENTS);
    int podsLeft = PODS;
    for (int i = 0; i < DEPLOYMENTS; i++) {
      int remainingDeployments = DEPLOYMENTS - i;
      // Mean 30 replicas; the last Deployment takes whatever makes the total exactly 150,000.
      int replicas =
          remainingDeployments == 1
              ? podsLeft
              : Math.max(1, Math.min(podsLeft - (remainingDeployments - 1), 10 + rnd.nextInt(41)));
      podsLeft -= replicas;
      // Small classes are far more common than large ones.
      int c = (int) Math.min(classes.length - 1, Math.floor(-Math.log(1 - rnd.nextDouble()) * 3));
      // Jitter each class by -50%..+50% (cpu in steps of 10m, memory in steps of 16Mi) so the
      // pods come in many sizes, as in a real fleet, not in twelve.
      long cpu = Math.max(10, classes[c][0] * (50 + rnd.nextInt(101)) / 100 / 10 * 10);
      long memMi = Math.max(16, classes[c][1] * (50 + rnd.nextInt(101)) / 100 / 16 * 16);
      long mem = memMi * MI;
      long share = 30 + rnd.nextInt(41); // first app container's share, percent
      long[] appCpu = {cpu * share / 100, cpu - cpu * share / 100};
      long firstMi = memMi * share / 100;
      long[] appMem = {firstMi * MI, mem - firstMi * MI};
      long initCpu = rnd.nextInt(4) == 0 ? cpu * 2 : 100;
      long initMem = 64 * MI;
      out.add(
          new Deployment(
              namespaces[i % namespaces.length],
              String.format("svc-%04d", i),
              replicas,
              initCpu,
              initMem,
              appCpu,
              appMem));
    }
    return out;
  }

  /** One item per pod: {cpu millicores, memory bytes, pods 1}, Deployments in order. */
  public static long[][] podItems() {
    long[][] items = new long[PODS][];
    int i = 0;
    for (Deployment d : deployments()) {
      long[] row = {d.podCpu(), d.podMemory(), 1};
      for (int r = 0; r < d.replicas(); r++) {
        items[i++] = row;
      }
    }
    return items;
  }
}
