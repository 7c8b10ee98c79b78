package dev.numafit.bench;

import java.nio.file.Path;
import tools.jackson.core.JsonParser;
import tools.jackson.core.JsonToken;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.databind.JsonNode;
import tools.jackson.dataformat.yaml.YAMLMapper;

/**
 * The floor for the whole-process benchmark: reads a YAML file with the Jackson YAML mapper
 * configured as the manifest reader configures it, into one JsonNode tree per document, and does
 * nothing else. No planner can read manifests faster than this. Run with the launcher's JVM
 * options; bench/compare.sh runs it from jars only ({@code target/bench/floor.jar} and the
 * dependency jars), as the plan runs from its jar, so a class-data-sharing archive covers both.
 */
public final class YamlFloor {
  private YamlFloor() {}

  public static void main(String[] args) {
    YAMLMapper mapper =
        YAMLMapper.builder().disable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS).build();
    int documents = 0;
    try (JsonParser p = mapper.createParser(Path.of(args[0]).toFile())) {
      while (p.nextToken() != null) {
        if (p.currentToken() == JsonToken.VALUE_NULL) {
          continue;
        }
        JsonNode node = mapper.readTree(p);
        if (node != null) {
          documents++;
        }
      }
    }
    System.out.println(documents + " documents");
  }
}
