package dev.numafit.cli;

import picocli.CommandLine.Option;

/**
 * The kubelet's share of each worker, as plan and check take it: reservations, eviction
 * threshold, maxPods and the demand every worker carries outside the manifests. Values are kept
 * as typed; {@link PlanOptions} parses and checks them.
 */
final class KubeletOptions {
  @Option(
      names = "--kube-reserved",
      paramLabel = "cpu=Q,memory=Q",
      description = "kube-reserved on each worker (default: the tiered scale in docs/shapes.md).")
  String kubeReserved;

  @Option(
      names = "--system-reserved",
      paramLabel = "cpu=Q,memory=Q",
      description = "system-reserved on each worker (default: none).")
  String systemReserved;

  @Option(
      names = "--eviction-hard",
      paramLabel = "memory.available=Q",
      description = "Hard eviction threshold (default: memory.available=100Mi).")
  String evictionHard;

  @Option(
      names = "--max-pods",
      paramLabel = "N",
      description = "The kubelet's maxPods (default: 110).")
  Integer maxPods;

  @Option(
      names = "--kubelet-reserve",
      paramLabel = "none",
      description =
          "none: no kube-reserved, system-reserved or eviction threshold (allocatable equals"
              + " capacity).")
  String kubeletReserve;

  @Option(
      names = "--per-worker",
      paramLabel = "cpu=Q,memory=Q[,pods=N]",
      description = "Demand on every worker that is not in the manifests (node agents).")
  String perWorker;
}
