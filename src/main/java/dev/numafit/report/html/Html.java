package dev.numafit.report.html;

import java.math.BigDecimal;
import java.math.RoundingMode;

/**
 * Escaping and number formatting for the HTML report. Every string that comes from input
 * (workload and profile names, resource names, file paths, notes) passes through {@link #esc}
 * before it reaches the page, in text and in attributes alike.
 */
final class Html {
  private Html() {}

  /**
   * {@code s} with the five characters that could end text or an attribute replaced by entities,
   * so {@code <script>} in a name renders as text. Control characters other than tab and newline
   * become U+FFFD: they are not allowed in HTML text.
   */
  static String esc(String s) {
    StringBuilder sb = new StringBuilder(s.length() + 16);
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      switch (c) {
        case '&' -> sb.append("&amp;");
        case '<' -> sb.append("&lt;");
        case '>' -> sb.append("&gt;");
        case '"' -> sb.append("&quot;");
        case '\'' -> sb.append("&#39;");
        default -> {
          if (c < 0x20 && c != '\t' && c != '\n') {
            sb.append('\uFFFD');
          } else {
            sb.append(c);
          }
        }
      }
    }
    return sb.toString();
  }

  /** A coordinate or length for SVG: at most one decimal, no exponent, {@code .0} dropped. */
  static String n(double v) {
    BigDecimal d = BigDecimal.valueOf(v).setScale(1, RoundingMode.HALF_UP).stripTrailingZeros();
    if (d.signum() == 0) {
      return "0";
    }
    return d.toPlainString();
  }

  /** A table cell holding a figure that the JSON report also has, at JSON pointer {@code key}. */
  static String figure(String key, Object jsonValue, String shown) {
    return "<td class=\"num\" data-json=\""
        + esc(key)
        + "\" data-value=\""
        + esc(String.valueOf(jsonValue))
        + "\">"
        + esc(shown)
        + "</td>";
  }

  /** A JSON pointer segment: {@code ~} and {@code /} escaped as RFC 6901 says. */
  static String pointer(String segment) {
    return segment.replace("~", "~0").replace("/", "~1");
  }
}
