package dev.numafit.plan;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * Several plans side by side (one per host profile or worker shape), in the order given.
 *
 * @param rows one row per plan
 */
public record PlanComparison(List<Row> rows) {
  public PlanComparison {
    rows = List.copyOf(rows);
  }

  /**
   * One plan's summary.
   *
   * @param hostProfile the profile's name, empty for a bare --worker plan
   * @param vcpus the worker's vCPUs
   * @param memoryBytes the worker's memory in bytes
   * @param workersPerHost workers one host carries, empty without a profile
   * @param workersNeeded workers the packing used
   * @param hostsNeeded hosts including failure headroom, empty without a profile
   * @param oversizeCount workloads whose pods fit no one-node worker
   * @param utilization per resource, fraction with 4 decimals
   * @param bindingResource the resource that runs out first
   * @param relativeCost the cost of one host relative to the others, when given
   * @param relativeCostTotal {@code relativeCost × hostsNeeded}, when both are known
   */
  public record Row(
      Optional<String> hostProfile,
      long vcpus,
      long memoryBytes,
      OptionalInt workersPerHost,
      int workersNeeded,
      OptionalInt hostsNeeded,
      int oversizeCount,
      SortedMap<String, Double> utilization,
      String bindingResource,
      Optional<BigDecimal> relativeCost,
      Optional<BigDecimal> relativeCostTotal) {
    public Row {
      Objects.requireNonNull(hostProfile, "hostProfile");
      Objects.requireNonNull(workersPerHost, "workersPerHost");
      Objects.requireNonNull(hostsNeeded, "hostsNeeded");
      Objects.requireNonNull(bindingResource, "bindingResource");
      Objects.requireNonNull(relativeCost, "relativeCost");
      Objects.requireNonNull(relativeCostTotal, "relativeCostTotal");
      utilization = Collections.unmodifiableSortedMap(new TreeMap<>(utilization));
    }
  }

  /**
   * Builds the comparison.
   *
   * @param plans plans in the order to show them
   * @param relativeCostByProfile relative cost of one host, by host profile name; profiles absent
   *     here (and bare --worker plans) have no cost
   */
  public static PlanComparison of(List<Plan> plans, Map<String, BigDecimal> relativeCostByProfile) {
    List<Row> rows = new ArrayList<>();
    for (Plan p : plans) {
      Optional<BigDecimal> cost = p.hostProfile().map(relativeCostByProfile::get);
      Optional<BigDecimal> total =
          p.hostsNeeded().isPresent()
              ? cost.map(c -> c.multiply(BigDecimal.valueOf(p.hostsNeeded().getAsInt())))
              : Optional.empty();
      rows.add(
          new Row(
              p.hostProfile(),
              p.worker().vcpus(),
              p.worker().memoryBytes(),
              p.workersPerHost(),
              p.workersNeeded(),
              p.hostsNeeded(),
              p.oversize().size(),
              p.utilization(),
              p.bindingResource(),
              cost,
              total));
    }
    return new PlanComparison(rows);
  }
}
