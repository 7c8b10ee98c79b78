package dev.numafit.manifest;

import dev.numafit.demand.PodModel;
import dev.numafit.diag.Diagnostic;
import io.fabric8.kubernetes.api.model.PodSpec;
import java.util.List;
import java.util.Map;
import tools.jackson.databind.node.MissingNode;

/**
 * The manifest reader's pod-spec conversion for pod specs that come from elsewhere than a file
 * (the live-cluster reader): the same quantity validation and container roles, without line
 * numbers.
 */
public final class PodSpecConversion {
  /**
   * A converted pod spec.
   *
   * @param problems one sentence per invalid quantity or missing part, prefixed with the label;
   *     the model leaves those values out
   */
  public record Result(PodModel model, List<String> problems) {
    public Result {
      problems = List.copyOf(problems);
    }
  }

  private PodSpecConversion() {}

  /**
   * Converts one pod spec.
   *
   * @param label how the object is named in problems ({@code namespace/Pod/name})
   */
  public static Result toModel(PodSpec spec, String label) {
    LocatedDocument doc = new LocatedDocument(label, MissingNode.getInstance(), Map.of(), 0);
    ObjectContext ctx = new ObjectContext(doc, label);
    PodModel model = PodSpecs.toModel(spec, "/spec", ctx);
    return new Result(model, ctx.errors.stream().map(Diagnostic::message).toList());
  }
}
