package dev.numafit.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.review.Pools;
import dev.numafit.review.Review;
import dev.numafit.review.Reviewer;
import dev.numafit.review.ReviewerTest;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The node-fill sections of {@code review -o markdown}: one row per node for small pools, nodes
 * counted by fill above 40. Scenarios: {@link ReviewerTest}'s invented web shop.
 */
class ReviewMarkdownTest {
  @Test
  void render_tenWorkersToSeven_fillRowPerNodeBeforeAndAfter() {
    Review r = new Reviewer().review(ReviewerTest.tenWorkers().model(), Pools.resize(7));
    String md = new ReviewTextWriter(true).render(r);
    // w01 runs two storefront pods of 1950m and the 100m log shipper on 4000m allocatable:
    // (100 + 3900) / 4000 = 100% (ReviewerTest's arithmetic).
    assertTrue(md.contains("| w01 | 100m + 3900m / 4 (100.0%) |"), md);
    String after = md.substring(md.indexOf("## Node fill after the resize"));
    after = after.substring(0, after.indexOf("\n\n## "));
    assertEquals(7, after.lines().filter(l -> l.startsWith("| w")).count(), after);
  }

  @Test
  void render_fortyFiveNodes_nodesCountedByFill() {
    Pools p = new Pools();
    for (int i = 1; i <= 45; i++) {
      String n = String.format("w%02d", i);
      p.node(n, 4000, 16 * Pools.GI);
      p.pods("web", i % 4, 1000, Pools.GI, n);
    }
    Review r = new Reviewer().review(p.model(), Pools.resize(45));
    String md = new ReviewTextWriter(true).render(r);
    assertTrue(md.contains("45 nodes counted by fill:"), md);
    // Node i runs i % 4 pods of 1000m on 4000m: 12 nodes at 25% cpu (w01, w05, …, w45), 11 at
    // each of 0, 50 and 75%.
    for (String row : List.of("| 0–10% | 11 |", "| 20–30% | 12 |", "| 50–60% | 11 |",
        "| 70–80% | 11 |")) {
      assertTrue(md.contains(row), row + "\n" + md);
    }
  }
}
