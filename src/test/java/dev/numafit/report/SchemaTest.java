package dev.numafit.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import com.networknt.schema.Error;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The published JSON Schemas (docs/schema, draft 2020-12) accept what the writers print and reject
 * a document that breaks them, so the schema is not vacuous.
 */
class SchemaTest {
  private static final JsonMapper JSON = new JsonMapper();

  static Schema schema(String name) throws IOException {
    SchemaRegistry registry = SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12);
    return registry.getSchema(Files.readString(Path.of("docs/schema", name)));
  }

  static List<Error> validate(String schemaName, String json) throws IOException {
    return schema(schemaName).validate(JSON.readTree(json));
  }

  @Test
  void planSchema_acceptsWriterOutput() throws IOException {
    String json = new PlanJsonWriter().render(ReportFixtures.planReport());
    assertEquals(List.of(), validate("plan.schema.json", json));
  }

  @Test
  void demandSchema_acceptsWriterOutput() throws IOException {
    String json =
        new DemandJsonWriter()
            .render(
                new DemandReport(ReportFixtures.demand(), ReportFixtures.demand().diagnostics()));
    assertEquals(List.of(), validate("demand.schema.json", json));
  }

  @Test
  void planSchema_rejectsMissingWorkersNeeded() throws IOException {
    JsonNode root = JSON.readTree(new PlanJsonWriter().render(ReportFixtures.planReport()));
    ((tools.jackson.databind.node.ObjectNode) root.get("plans").get(0)).remove("workersNeeded");
    List<Error> errors = schema("plan.schema.json").validate(root);
    assertFalse(errors.isEmpty());
  }

  @Test
  void demandSchema_rejectsFractionalCpu() throws IOException {
    JsonNode root =
        JSON.readTree(
            new DemandJsonWriter()
                .render(new DemandReport(ReportFixtures.demand(), List.of())));
    ((tools.jackson.databind.node.ObjectNode) root.get("workloads").get(0).get("requests"))
        .put("cpu", 2.25);
    assertFalse(schema("demand.schema.json").validate(root).isEmpty());
  }
}
