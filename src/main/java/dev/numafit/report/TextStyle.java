package dev.numafit.report;

/**
 * How the text reports may look on the output they are written to: ANSI colour only on a
 * terminal when NO_COLOR is not set, and the width of that terminal in columns.
 *
 * @param colour whether ANSI colour codes may be written
 * @param width columns to fit, {@link #MIN_WIDTH} to {@link #MAX_WIDTH}
 */
public record TextStyle(boolean colour, int width) {
  /** Narrower than this, tables would wrap every cell. */
  public static final int MIN_WIDTH = 60;

  /** Wider lines are hard to read, however wide the terminal. */
  public static final int MAX_WIDTH = 120;

  /** No colour, 80 columns: for files, pipes and golden tests. */
  public static final TextStyle PLAIN = new TextStyle(false, 80);

  public TextStyle {
    if (width < MIN_WIDTH || width > MAX_WIDTH) {
      throw new IllegalArgumentException(
          "width must be " + MIN_WIDTH + ".." + MAX_WIDTH + ", was " + width);
    }
  }

  /**
   * The style for standard output: colour when it is a terminal and {@code noColor} (the
   * NO_COLOR variable) is unset or empty; the terminal's {@code columns} when it is a terminal and
   * they are a number, clamped to {@link #MIN_WIDTH}..{@link #MAX_WIDTH}; else {@link #PLAIN}.
   */
  public static TextStyle of(boolean terminal, String noColor, String columns) {
    if (!terminal) {
      return PLAIN;
    }
    int width = PLAIN.width();
    if (columns != null && columns.strip().matches("[0-9]{1,4}")) {
      width = Math.max(MIN_WIDTH, Math.min(MAX_WIDTH, Integer.parseInt(columns.strip())));
    }
    return new TextStyle(noColor == null || noColor.isEmpty(), width);
  }

  /** {@code s} in the ANSI SGR {@code code} when colour is on, else as is. */
  public String paint(String code, String s) {
    return colour && !s.isEmpty() ? "\u001b[" + code + "m" + s + "\u001b[0m" : s;
  }
}
