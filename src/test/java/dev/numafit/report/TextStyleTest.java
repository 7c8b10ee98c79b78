package dev.numafit.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * Colour and width of the text reports. The NO_COLOR rule is the convention published at
 * no-color.org: colour is off when the variable is present and not empty.
 */
class TextStyleTest {
  @Test
  void of_notATerminal_plainWhateverTheEnvironment() {
    assertEquals(TextStyle.PLAIN, TextStyle.of(false, null, "200"));
    assertEquals(TextStyle.PLAIN, TextStyle.of(false, "1", null));
  }

  @Test
  void of_terminal_colourUnlessNoColorIsSetAndNotEmpty() {
    assertTrue(TextStyle.of(true, null, null).colour());
    assertTrue(TextStyle.of(true, "", null).colour());
    assertFalse(TextStyle.of(true, "1", null).colour());
  }

  @Test
  void of_terminal_widthFromColumnsClamped() {
    assertEquals(100, TextStyle.of(true, null, "100").width());
    assertEquals(TextStyle.MIN_WIDTH, TextStyle.of(true, null, "20").width());
    assertEquals(TextStyle.MAX_WIDTH, TextStyle.of(true, null, "300").width());
    // Unset or not a number: 80, the width the plain reports aim at.
    assertEquals(80, TextStyle.of(true, null, null).width());
    assertEquals(80, TextStyle.of(true, null, "wide").width());
  }

  @Test
  void paint_onlyWithColour() {
    assertEquals("\u001b[1mx\u001b[0m", new TextStyle(true, 80).paint("1", "x"));
    assertEquals("x", TextStyle.PLAIN.paint("1", "x"));
  }
}
