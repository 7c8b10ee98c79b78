package dev.numafit.report.html;

/**
 * Fill patterns shared by the pictures, so each kind of segment differs by texture as well as
 * colour (the report must read in greyscale print and for colour-blind readers). Ids are
 * prefixed per picture because every id on the page must be unique.
 */
final class Patterns {
  private Patterns() {}

  static void defs(StringBuilder sb, String id) {
    sb.append("<defs>")
        // Hypervisor share: grey diagonal hatch.
        .append("<pattern id=\"").append(id).append("-hv\" width=\"6\" height=\"6\"")
        .append(" patternUnits=\"userSpaceOnUse\" patternTransform=\"rotate(45)\">")
        .append("<rect width=\"6\" height=\"6\" fill=\"#d9d9d9\"/>")
        .append("<line x1=\"0\" y1=\"0\" x2=\"0\" y2=\"6\" stroke=\"#4d4d4d\" stroke-width=\"2\"/>")
        .append("</pattern>")
        // Empty channel: cross-hatch.
        .append("<pattern id=\"").append(id).append("-empty\" width=\"8\" height=\"8\"")
        .append(" patternUnits=\"userSpaceOnUse\">")
        .append("<rect width=\"8\" height=\"8\" fill=\"#fbe3e3\"/>")
        .append("<path d=\"M0,0 L8,8 M8,0 L0,8\" stroke=\"#a11d1d\" stroke-width=\"1\"/>")
        .append("</pattern>")
        // DaemonSets and per-worker demand: horizontal stripes.
        .append("<pattern id=\"").append(id).append("-ds\" width=\"6\" height=\"6\"")
        .append(" patternUnits=\"userSpaceOnUse\">")
        .append("<rect width=\"6\" height=\"6\" fill=\"#f6d7a7\"/>")
        .append("<line x1=\"0\" y1=\"3\" x2=\"6\" y2=\"3\" stroke=\"#8a4b00\" stroke-width=\"2\"/>")
        .append("</pattern>")
        // Over the line: red hatch the other way.
        .append("<pattern id=\"").append(id).append("-over\" width=\"6\" height=\"6\"")
        .append(" patternUnits=\"userSpaceOnUse\" patternTransform=\"rotate(-45)\">")
        .append("<rect width=\"6\" height=\"6\" fill=\"#f4c7c7\"/>")
        .append("<line x1=\"0\" y1=\"0\" x2=\"0\" y2=\"6\" stroke=\"#a11d1d\" stroke-width=\"2\"/>")
        .append("</pattern>")
        // Second series in histograms: dots.
        .append("<pattern id=\"").append(id).append("-dots\" width=\"5\" height=\"5\"")
        .append(" patternUnits=\"userSpaceOnUse\">")
        .append("<rect width=\"5\" height=\"5\" fill=\"#ffffff\"/>")
        .append("<circle cx=\"2.5\" cy=\"2.5\" r=\"1.3\" fill=\"#1f1f1f\"/>")
        .append("</pattern>")
        .append("</defs>\n");
  }
}
