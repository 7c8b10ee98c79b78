package dev.numafit.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class TextTableTest {
  @Test
  void render_alignsColumns_rightAlignsMarked() {
    String t =
        new TextTable("NAME", ">CPU")
            .row("web", "500m")
            .row("database-primary", "4")
            .render("  ");
    assertEquals(
        "  NAME               CPU\n"
            + "  web               500m\n"
            + "  database-primary     4\n",
        t);
  }

  @Test
  void wrap_breaksAtWords_within80Columns() {
    String text = "word ".repeat(40).strip();
    String wrapped = TextSupport.wrap("  ", "    ", text);
    for (String line : wrapped.split("\n")) {
      assertEquals(true, line.length() <= 80, line);
    }
    assertEquals(text, wrapped.replaceAll("\\s+", " ").strip());
  }
}
