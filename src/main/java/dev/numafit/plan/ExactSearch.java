package dev.numafit.plan;

/**
 * How the exact mode ({@code plan --exact}) ended for one plan: whether the worker count is proved
 * to be the minimum, the search effort spent, and the best lower bound known.
 *
 * @param provedOptimal true when no packing of the pods uses fewer workers ("proved optimal");
 *     false when the node limit ran out first ("best found within the effort limit")
 * @param nodes search nodes spent (pod placements tried); 0 when the heuristic packing already
 *     met the lower bound
 * @param lowerBound no packing uses fewer workers; equal to the workers needed when proved
 *     (the plan's {@code lowerBound} carries the same value)
 */
public record ExactSearch(boolean provedOptimal, long nodes, int lowerBound) {
  public ExactSearch {
    if (nodes < 0) {
      throw new IllegalArgumentException("nodes must be >= 0, was " + nodes);
    }
    if (lowerBound < 0) {
      throw new IllegalArgumentException("lowerBound must be >= 0, was " + lowerBound);
    }
  }
}
