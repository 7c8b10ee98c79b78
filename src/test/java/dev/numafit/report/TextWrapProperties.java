package dev.numafit.report;

import java.util.ArrayList;
import java.util.List;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.AlphaChars;
import net.jqwik.api.constraints.Size;
import net.jqwik.api.constraints.StringLength;

/** The text reports' wrapping keeps every word and stays within 80 columns. */
class TextWrapProperties {
  @Property
  boolean wrap_anyWords_fitWidthAndKeepEveryWord(
      @ForAll @Size(max = 60) List<@AlphaChars @StringLength(min = 1, max = 30) String> words) {
    String text = String.join(" ", words);
    String wrapped = TextSupport.wrap("  Note: ", "    ", text);
    for (String line : wrapped.split("\n")) {
      if (line.length() > TextSupport.WIDTH) {
        return false;
      }
    }
    List<String> back = new ArrayList<>(List.of(wrapped.strip().split("\\s+")));
    back.remove(0); // "Note:"
    return back.equals(words.isEmpty() ? List.of() : words);
  }

  @Property
  boolean wrapItems_neverSplitsAnItem(
      @ForAll @Size(min = 1, max = 30) List<@AlphaChars @StringLength(min = 1, max = 20) String>
          items) {
    String wrapped = TextSupport.wrapItems("  Allocatable       ", " ".repeat(20), items);
    String joined = wrapped.replaceAll("\\s+", " ").strip();
    return joined.equals("Allocatable " + String.join(", ", items))
        && wrapped.lines().allMatch(l -> l.length() <= TextSupport.WIDTH);
  }
}
