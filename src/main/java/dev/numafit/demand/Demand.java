package dev.numafit.demand;

import dev.numafit.diag.Diagnostic;
import java.util.List;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * Everything read from the manifests: the workloads (sorted by id), custom resources with pod
 * templates that were not sized, objects skipped by kind, and diagnostics.
 *
 * @param unsizedCustom custom workloads found but not sized (without --include-custom)
 * @param skippedByKind objects that run no pods, counted per kind
 */
public record Demand(
    List<Workload> workloads,
    List<Workload> unsizedCustom,
    SortedMap<String, Integer> skippedByKind,
    List<Diagnostic> diagnostics) {
  public Demand {
    workloads = List.copyOf(workloads);
    unsizedCustom = List.copyOf(unsizedCustom);
    skippedByKind = java.util.Collections.unmodifiableSortedMap(new TreeMap<>(skippedByKind));
    diagnostics = List.copyOf(diagnostics);
  }
}
