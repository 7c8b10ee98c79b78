package dev.numafit.report;

/** Line wrapping for the text reports, which aim at an 80-column terminal. */
final class TextSupport {
  static final int WIDTH = 80;

  /** The caution printed at the end of every plan, in text output. */
  static final String CAUTION = Caution.TEXT;

  private TextSupport() {}

  /**
   * {@code text} wrapped at word boundaries to {@link #WIDTH} columns, the first line after {@code
   * first}, the rest after {@code next}; a word longer than a line is kept whole.
   */
  static String wrap(String first, String next, String text) {
    return wrap(WIDTH, first, next, text);
  }

  /** {@link #wrap(String, String, String)} at {@code width} columns. */
  static String wrap(int width, String first, String next, String text) {
    StringBuilder out = new StringBuilder();
    StringBuilder line = new StringBuilder(first);
    boolean lineHasWord = false;
    for (String word : text.split(" ")) {
      if (word.isEmpty()) {
        continue;
      }
      if (lineHasWord && line.length() + 1 + word.length() > width) {
        out.append(line).append('\n');
        line = new StringBuilder(next);
        lineHasWord = false;
      }
      if (lineHasWord) {
        line.append(' ');
      }
      line.append(word);
      lineHasWord = true;
    }
    out.append(line.toString().stripTrailing()).append('\n');
    return out.toString();
  }

  /**
   * {@code items} joined by {@code ", "} and wrapped to {@link #WIDTH} columns without breaking an
   * item, the first line after {@code first}, the rest after {@code next}.
   */
  static String wrapItems(String first, String next, java.util.List<String> items) {
    return wrapItems(WIDTH, first, next, items);
  }

  /** {@link #wrapItems(String, String, java.util.List)} at {@code width} columns. */
  static String wrapItems(int width, String first, String next, java.util.List<String> items) {
    StringBuilder out = new StringBuilder();
    StringBuilder line = new StringBuilder(first);
    boolean lineHasItem = false;
    for (int i = 0; i < items.size(); i++) {
      String item = items.get(i) + (i < items.size() - 1 ? "," : "");
      if (lineHasItem && line.length() + 1 + item.length() > width) {
        out.append(line).append('\n');
        line = new StringBuilder(next);
        lineHasItem = false;
      }
      if (lineHasItem) {
        line.append(' ');
      }
      line.append(item);
      lineHasItem = true;
    }
    out.append(line.toString().stripTrailing()).append('\n');
    return out.toString();
  }
}
