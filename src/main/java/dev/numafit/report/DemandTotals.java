package dev.numafit.report;

import dev.numafit.demand.Demand;
import dev.numafit.demand.Workload;
import dev.numafit.resource.Resources;

/**
 * Demand summed at peak: pods and requests of every replicated workload (peak × per-pod requests),
 * and separately what the per-worker workloads (DaemonSets) put on each worker.
 *
 * @param requestsAtPeak cpu in millicores, the rest in bytes or counts
 */
public record DemandTotals(
    long podsAtPeak, Resources requestsAtPeak, long perWorkerPods, Resources perWorkerRequests) {
  /** Sums the demand's workloads. */
  public static DemandTotals of(Demand d) {
    long pods = 0;
    Resources req = Resources.EMPTY;
    long wPods = 0;
    Resources wReq = Resources.EMPTY;
    for (Workload w : d.workloads()) {
      if (w.perWorker()) {
        wPods++;
        wReq = wReq.plus(w.pod().requests());
      } else {
        pods += w.replicas().peak();
        req = req.plus(w.pod().requests().times(w.replicas().peak()));
      }
    }
    return new DemandTotals(pods, req, wPods, wReq);
  }
}
