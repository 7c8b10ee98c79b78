package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;

import com.networknt.schema.Error;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import javax.xml.XMLConstants;
import javax.xml.transform.stream.StreamSource;
import javax.xml.validation.SchemaFactory;
import javax.xml.validation.Validator;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.api.Test;
import org.xml.sax.SAXException;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/**
 * SARIF output validates against the published SARIF 2.1.0 schema (JSON Schema draft-04) and JUnit
 * output against the Ant JUnit XML schema; both copied into src/test/resources/schemas with their
 * sources in SOURCE.md. Each schema also rejects a broken document, so the checks can fail.
 */
class CheckSchemaTest {
  private static final Path SCHEMAS = Path.of("src/test/resources/schemas");
  private static final JsonMapper JSON = new JsonMapper();

  static List<CheckGoldenTest.Scenario> scenarios() {
    return CheckGoldenTest.scenarios();
  }

  private static Schema sarifSchema() throws IOException {
    SchemaRegistry registry = SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_4);
    return registry.getSchema(Files.readString(SCHEMAS.resolve("sarif-schema-2.1.0.json")));
  }

  private static Validator junitValidator() throws SAXException {
    SchemaFactory f = SchemaFactory.newInstance(XMLConstants.W3C_XML_SCHEMA_NS_URI);
    return f.newSchema(SCHEMAS.resolve("junit.xsd").toFile()).newValidator();
  }

  private static String output(CheckGoldenTest.Scenario s, String format) {
    return CheckGoldenTest.run(s, format).out();
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("scenarios")
  void sarif_scenario_validatesAgainstSarif210Schema(CheckGoldenTest.Scenario s)
      throws IOException {
    List<Error> errors = sarifSchema().validate(JSON.readTree(output(s, "sarif")));
    assertEquals(List.of(), errors);
  }

  @Test
  void sarifSchema_resultWithoutMessage_rejected() throws IOException {
    // SARIF 2.1.0 §3.27.11: a result's message is required.
    JsonNode root = JSON.readTree(output(CheckGoldenTest.scenarios().get(2), "sarif"));
    ((ObjectNode) root.get("runs").get(0).get("results").get(0)).remove("message");
    assertFalse(sarifSchema().validate(root).isEmpty());
  }

  @Test
  void sarifSchema_unknownLevel_rejected() throws IOException {
    // The schema's level enum is none, note, warning, error.
    JsonNode root = JSON.readTree(output(CheckGoldenTest.scenarios().get(2), "sarif"));
    ((ObjectNode) root.get("runs").get(0).get("results").get(0)).put("level", "fatal");
    assertFalse(sarifSchema().validate(root).isEmpty());
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("scenarios")
  void junit_scenario_validatesAgainstJunitXsd(CheckGoldenTest.Scenario s)
      throws SAXException, IOException {
    junitValidator().validate(new StreamSource(new StringReader(output(s, "junit"))));
  }

  @Test
  void junitXsd_missingHostname_rejected() throws SAXException {
    // hostname is a required attribute of testsuite in the Ant schema.
    String xml = output(CheckGoldenTest.scenarios().get(2), "junit")
        .replace(" hostname=\"localhost\"", "");
    assertThrows(SAXException.class,
        () -> junitValidator().validate(new StreamSource(new StringReader(xml))));
  }
}
