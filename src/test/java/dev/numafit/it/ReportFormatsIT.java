package dev.numafit.it;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * Golden files of the Markdown plan report from the built jar, on the example scenarios
 * (src/test/resources/golden; regenerate with {@code mvn verify -Dnumafit.golden.update=true} and
 * review the diff). The scenarios are invented demo data.
 */
class ReportFormatsIT {
  @Test
  void plan_markdown_oneProfile_matchesGolden() {
    JarRun r = JarRun.of("plan", "-f", ExamplesIT.PARCEL, "--host-profile", ExamplesIT.TWO_SOCKET,
        "-o", "markdown");
    assertEquals(0, r.code(), r.err());
    // Warnings go into the document, as with JSON.
    assertEquals("", r.err());
    r.matchesGolden("plan-parcel-two-socket-markdown");
  }

  @Test
  void plan_markdown_threeProfilesCompared_matchesGolden() {
    JarRun r = JarRun.of("plan", "-f", ExamplesIT.TICKETS, "--host-profile",
        ExamplesIT.TWO_SOCKET, "--host-profile", ExamplesIT.FOUR_NODE, "--host-profile",
        ExamplesIT.EMPTY_CHANNEL, "-o", "markdown");
    assertEquals(0, r.code(), r.err());
    r.matchesGolden("plan-tickets-compare-markdown");
  }

  /** A review of the invented example snapshot (examples/ticket-office-cluster.json). */
  private static final String[] REVIEW = {"review", "--snapshot",
      "examples/ticket-office-cluster.json", "--pool", "pool=general", "--nodes", "5",
      "--host-profile", ExamplesIT.TWO_SOCKET};

  @Test
  void review_text_exampleSnapshot_matchesGolden() {
    JarRun r = JarRun.of(REVIEW);
    assertEquals(0, r.code(), r.err());
    r.matchesGolden("review-tickets-text");
  }

  @Test
  void review_markdown_exampleSnapshot_matchesGolden() {
    String[] args = java.util.Arrays.copyOf(REVIEW, REVIEW.length + 2);
    args[REVIEW.length] = "-o";
    args[REVIEW.length + 1] = "markdown";
    JarRun r = JarRun.of(args);
    assertEquals(0, r.code(), r.err());
    r.matchesGolden("review-tickets-markdown");
  }
}
