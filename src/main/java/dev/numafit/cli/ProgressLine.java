package dev.numafit.cli;

import dev.numafit.cluster.ReadProgress;
import dev.numafit.cluster.ResourceType;
import dev.numafit.pack.Progress;
import java.io.PrintStream;
import java.util.Locale;

/**
 * How far a long step has come, as one line on standard error that overwrites itself ({@code \r})
 * and is cleared when the step ends. Only when standard error is a terminal (Java cannot tell:
 * the launcher passes what {@code [ -t 2 ]} says as {@code -Dnumafit.stderrTty=1}); otherwise
 * every call does nothing, so logs and pipes never see it. Standard output is never touched.
 *
 * <p>Throttled by steps, never by the clock: a line is written only when the whole percentage
 * changes (or, with no known total, every {@link #STRIDE} steps; for a cluster read, every
 * page), so the output is the same however fast the machine is. The line is dimmed only when
 * colour is allowed (NO_COLOR unset); it never uses any other escape sequence.
 */
final class ProgressLine implements Progress, ReadProgress {
  /** Steps between two lines when the total is not known (exact mode's search). */
  static final long STRIDE = 10_000;

  private final PrintStream err;
  private final boolean enabled;
  private final boolean dim;
  /** Characters of the line now on the terminal, 0 when it is clear. */
  private int shown;
  private Object lastPhase;
  private long lastKey = -1;

  /**
   * @param err standard error
   * @param terminal whether standard error is a terminal
   * @param colour whether the line may be dimmed (a terminal and NO_COLOR unset)
   */
  ProgressLine(PrintStream err, boolean terminal, boolean colour) {
    this.err = err;
    this.enabled = terminal;
    this.dim = terminal && colour;
  }

  /** For the console: a terminal when the launcher said so. */
  static ProgressLine of(Console console) {
    return new ProgressLine(console.err(), "1".equals(System.getProperty("numafit.stderrTty")),
        console.colour());
  }

  @Override
  public void update(Progress.Phase phase, long done, long total) {
    if (!enabled) {
      return;
    }
    long key = total > 0 ? done * 100 / total : done / STRIDE;
    if (phase == lastPhase && key == lastKey && done != total) {
      return;
    }
    lastPhase = phase;
    lastKey = key;
    if (total > 0 && done >= total) {
      clear();
      return;
    }
    show(total > 0
        ? String.format(Locale.ROOT, "%s: %,d / %,d (%d%%)", phase.words(), done, total, key)
        : String.format(Locale.ROOT, "%s: %,d", phase.words(), done));
  }

  @Override
  public void update(ResourceType type, long items, int pages, boolean done) {
    if (!enabled) {
      return;
    }
    lastPhase = type;
    lastKey = pages;
    // Each page is a step worth a line (a page holds hundreds of objects); the last one too, so
    // a list of one page still shows, then the line is cleared for the next type.
    show(String.format(Locale.ROOT, "reading %s: %,d read, %d page%s", type.display(), items,
        pages, pages == 1 ? "" : "s"));
    if (done) {
      clear();
    }
  }

  /** Clears the line if one is shown; the next message then starts on a clean line. */
  void clear() {
    if (!enabled || shown == 0) {
      return;
    }
    err.print("\r" + " ".repeat(shown) + "\r");
    err.flush();
    shown = 0;
  }

  private void show(String text) {
    String pad = " ".repeat(Math.max(0, shown - text.length()));
    err.print(dim ? "\r\u001b[2m" + text + "\u001b[0m" + pad : "\r" + text + pad);
    err.flush();
    shown = text.length();
  }
}
