package dev.numafit.pack;

/**
 * Told how far a long step has come, so the command line can show it while it runs. Pure: the
 * core only calls it and never depends on what it does; {@link #NONE} does nothing, and the
 * result of a step never depends on which one is passed. Calls come from the computing thread,
 * in order, and count steps (never time), so a run is the same with or without a listener.
 */
@FunctionalInterface
public interface Progress {
  /** The long steps that report progress. */
  enum Phase {
    /** Packing a large demand: {@code done} of {@code total} pods packed. */
    PACK("packing pods"),
    /** The failure-headroom check: {@code done} of {@code total} sets of failed hosts checked. */
    FAILURES("failure sets checked"),
    /** Exact mode's search: {@code done} nodes of the search tree visited of the node limit. */
    EXACT("exact search, nodes searched"),
    /** The packer's dive over the linear relaxation: {@code done} steps of its allowance. */
    DIVE("packing, relaxation dive, steps");

    private final String words;

    Phase(String words) {
      this.words = words;
    }

    /** What the step does, for a progress line. */
    public String words() {
      return words;
    }
  }

  /** Pods above which packing reports its progress (smaller demands pack in a moment). */
  int PACK_REPORT_ABOVE = 50_000;

  /** Does nothing: no one is watching (standard error is not a terminal). */
  Progress NONE = (phase, done, total) -> { };

  /**
   * @param done units of the phase finished so far
   * @param total units the phase has in all, or 0 when not known in advance
   */
  void update(Phase phase, long done, long total);
}
