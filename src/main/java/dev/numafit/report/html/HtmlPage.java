package dev.numafit.report.html;

/**
 * The frame every HTML report shares, for writers outside this package: the page head with the
 * inline style sheet, and escaping of text from input. The page needs nothing outside itself.
 */
public final class HtmlPage {
  private HtmlPage() {}

  /** {@code text} safe in HTML text and attribute values (see {@link Html#esc}). */
  public static String esc(String text) {
    return Html.esc(text);
  }

  /** A whole page: {@code title} (escaped here) and {@code body}, HTML already escaped. */
  public static String page(String title, String body) {
    return "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n"
        + "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n<title>"
        + Html.esc(title)
        + "</title>\n<style>\n"
        + Style.CSS
        + "</style>\n</head>\n<body>\n<main>\n"
        + body
        + "</main>\n</body>\n</html>\n";
  }
}
