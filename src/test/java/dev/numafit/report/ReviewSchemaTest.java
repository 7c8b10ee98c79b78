package dev.numafit.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import com.networknt.schema.Error;
import dev.numafit.review.Pools;
import dev.numafit.review.ResizeRequest;
import dev.numafit.review.Review;
import dev.numafit.review.Reviewer;
import dev.numafit.review.ReviewerTest;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/** docs/schema/review.schema.json accepts what the writer prints and is not vacuous. */
class ReviewSchemaTest {
  static String render() {
    ResizeRequest base = Pools.resize(7);
    ResizeRequest req = new ResizeRequest("pool", "general", OptionalInt.of(7), Optional.empty(),
        Optional.of(dev.numafit.resource.Resources.of("cpu", 3000L, "memory", 12 * Pools.GI)),
        Optional.of("lab"), 1, Optional.empty(), 2, base.from(), base.replicas());
    Review r = new Reviewer().review(ReviewerTest.tenWorkers().model(), req);
    return new ReviewJsonWriter().render(r);
  }

  @Test
  void reviewSchema_acceptsWriterOutputWithEverySection() throws Exception {
    assertEquals(List.<Error>of(), SchemaTest.validate("review.schema.json", render()));
  }

  @Test
  void reviewSchema_rejectsMissingPendingReason() throws Exception {
    JsonNode root = new JsonMapper().readTree(render());
    ((ObjectNode) root.get("pending").get(0)).remove("reason");
    assertFalse(SchemaTest.schema("review.schema.json").validate(root).isEmpty());
  }
}
