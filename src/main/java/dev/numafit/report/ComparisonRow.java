package dev.numafit.report;

import dev.numafit.plan.Plan;
import java.math.BigDecimal;
import java.util.Collections;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * One line of the side-by-side comparison of several plans.
 *
 * @param hostProfile the profile's name, empty for a bare --worker plan
 * @param vcpus the worker's vCPUs
 * @param memoryBytes the worker's configured memory, bytes
 * @param workersPerHost workers one host carries, empty without a host profile
 * @param workersNeeded workers the packing used
 * @param hostsNeeded hosts including failure headroom, empty without a host profile
 * @param oversizeCount workloads whose pod does not fit the worker
 * @param utilization per resource, requested / allocatable over all workers
 * @param relativeCost cost of one host relative to the others, when the profile gives it
 * @param totalCost relative cost × hosts needed, when both are known
 */
public record ComparisonRow(
    Optional<String> hostProfile,
    long vcpus,
    long memoryBytes,
    OptionalInt workersPerHost,
    int workersNeeded,
    OptionalInt hostsNeeded,
    int oversizeCount,
    SortedMap<String, Double> utilization,
    Optional<BigDecimal> relativeCost,
    Optional<BigDecimal> totalCost) {
  public ComparisonRow {
    Objects.requireNonNull(hostProfile, "hostProfile");
    Objects.requireNonNull(workersPerHost, "workersPerHost");
    Objects.requireNonNull(hostsNeeded, "hostsNeeded");
    utilization = Collections.unmodifiableSortedMap(new TreeMap<>(utilization));
    Objects.requireNonNull(relativeCost, "relativeCost");
    Objects.requireNonNull(totalCost, "totalCost");
  }

  /** The row for one plan, with the relative cost of its host when known. */
  public static ComparisonRow of(Plan plan, Optional<BigDecimal> relativeCost) {
    Optional<BigDecimal> total =
        relativeCost.flatMap(
            c ->
                plan.hostsNeeded().isPresent()
                    ? Optional.of(c.multiply(BigDecimal.valueOf(plan.hostsNeeded().getAsInt())))
                    : Optional.empty());
    return new ComparisonRow(
        plan.hostProfile(),
        plan.worker().vcpus(),
        plan.worker().memoryBytes(),
        plan.workersPerHost(),
        plan.workersNeeded(),
        plan.hostsNeeded(),
        plan.oversize().size(),
        plan.utilization(),
        relativeCost,
        total);
  }
}
