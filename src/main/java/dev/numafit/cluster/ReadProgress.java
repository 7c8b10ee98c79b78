package dev.numafit.cluster;

/** Told after each page a list returns, so a terminal can show how far reading has come. */
@FunctionalInterface
public interface ReadProgress {
  /** Does nothing: output is not a terminal. */
  ReadProgress NONE = (type, items, pages, done) -> { };

  /**
   * @param items objects read so far of this type
   * @param pages pages read so far of this type
   * @param done whether the list is complete
   */
  void update(ResourceType type, long items, int pages, boolean done);
}
