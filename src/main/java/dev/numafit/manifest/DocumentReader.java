package dev.numafit.manifest;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.SourceRef;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;
import org.snakeyaml.engine.v2.exceptions.MarkedYamlEngineException;
import tools.jackson.core.JacksonException;
import tools.jackson.core.JsonParser;
import tools.jackson.core.JsonToken;
import tools.jackson.core.TokenStreamLocation;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.JsonNodeFactory;
import tools.jackson.databind.node.ObjectNode;
import tools.jackson.dataformat.yaml.YAMLMapper;
import tools.jackson.dataformat.yaml.YAMLParser;

/**
 * Splits one file's text into documents (multi-document YAML, or JSON values back to back) and
 * builds each as a Jackson tree while recording the line of every value. A malformed document
 * becomes an error and reading resumes at the next {@code ---} line, so one bad document does not
 * hide the rest of the file.
 */
final class DocumentReader {
  private static final JsonNodeFactory NODES = JsonNodeFactory.instance;

  private final YAMLMapper yaml =
      YAMLMapper.builder().disable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS).build();
  private JsonMapper json; // built on first use: most inputs are YAML only

  /** A key given twice in one mapping, where the second one is. */
  private record DuplicateKey(int line, String name) {}

  /** What reading one file produced besides its documents. */
  static final class Outcome {
    int emptyDocuments;
  }

  /**
   * Reads {@code text}; documents go to {@code sink}, problems to {@code diagnostics}.
   *
   * @param asJson parse as JSON (several values may follow each other) instead of YAML
   */
  Outcome read(
      String file,
      String text,
      boolean asJson,
      Consumer<LocatedDocument> sink,
      List<Diagnostic> diagnostics) {
    Outcome outcome = new Outcome();
    String[] lines = null; // split only when an error needs the next document separator
    int offset = 0; // lines skipped before the current parser's input
    String rest = text;
    while (rest != null) {
      String next = null;
      try (JsonParser p = asJson ? json().createParser(rest) : yaml.createParser(rest)) {
        JsonToken t;
        while ((t = p.nextToken()) != null) {
          int start = offset + line(p.currentTokenLocation());
          if (t == JsonToken.VALUE_NULL) {
            outcome.emptyDocuments++;
            continue;
          }
          Map<String, Integer> positions = new HashMap<>();
          List<DuplicateKey> duplicates = new ArrayList<>();
          JsonNode root = build(p, t, "", positions, offset, new HashMap<>(), duplicates);
          for (DuplicateKey d : duplicates) {
            diagnostics.add(
                Diagnostic.warning(
                    new SourceRef(file, d.line()),
                    "duplicate key \"" + d.name() + "\" in one mapping; the later value is used"));
          }
          sink.accept(new LocatedDocument(file, root, positions, start));
        }
      } catch (JacksonException e) {
        int errorLine = offset + errorLine(e);
        diagnostics.add(
            Diagnostic.error(
                new SourceRef(file, Math.max(errorLine, 0)),
                (asJson ? "malformed JSON: " : "malformed YAML: ") + problem(e, offset)));
        if (!asJson) {
          if (lines == null) {
            lines = text.split("\n", -1);
          }
          // Resume at the next document separator after the error, if any.
          for (int i = Math.max(errorLine - 1, offset + 1); i < lines.length; i++) {
            if (lines[i].startsWith("---")) {
              next = String.join("\n", java.util.Arrays.copyOfRange(lines, i, lines.length));
              offset = i;
              break;
            }
          }
        }
      }
      rest = next;
    }
    return outcome;
  }

  private JsonMapper json() {
    if (json == null) {
      json = JsonMapper.builder().disable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS).build();
    }
    return json;
  }

  private static int line(TokenStreamLocation loc) {
    return loc == null ? 0 : Math.max(loc.getLineNr(), 0);
  }

  private JsonNode build(
      JsonParser p,
      JsonToken t,
      String pointer,
      Map<String, Integer> positions,
      int offset,
      Map<String, JsonNode> anchors,
      List<DuplicateKey> duplicates) {
    positions.put(pointer, offset + line(p.currentTokenLocation()));
    if (p instanceof YAMLParser y && t == JsonToken.VALUE_STRING && y.isCurrentAlias()) {
      // An alias (*name) repeats the node anchored as &name earlier in the document.
      JsonNode anchored = anchors.get(p.getString());
      if (anchored != null) {
        return anchored.deepCopy();
      }
    }
    Object anchor = p.getObjectId();
    JsonNode node = buildValue(p, t, pointer, positions, offset, anchors, duplicates);
    if (anchor != null) {
      anchors.put(anchor.toString(), node);
    }
    return node;
  }

  private JsonNode buildValue(
      JsonParser p,
      JsonToken t,
      String pointer,
      Map<String, Integer> positions,
      int offset,
      Map<String, JsonNode> anchors,
      List<DuplicateKey> duplicates) {
    switch (t) {
      case START_OBJECT:
        {
          ObjectNode o = NODES.objectNode();
          JsonToken n;
          while ((n = p.nextToken()) == JsonToken.PROPERTY_NAME) {
            String name = p.currentName();
            String child = pointer + "/" + LocatedDocument.segment(name);
            int keyLine = offset + line(p.currentTokenLocation());
            JsonToken v = p.nextToken();
            if (o.has(name)) {
              duplicates.add(new DuplicateKey(keyLine, name));
            }
            o.set(name, build(p, v, child, positions, offset, anchors, duplicates));
            Integer valueLine = positions.get(child);
            if (valueLine != null && valueLine != keyLine) {
              // A block mapping or list starts on the line after its key; keep the key's line
              // so a message can point at "resources:" itself.
              positions.put(child + LocatedDocument.KEY_SUFFIX, keyLine);
            }
          }
          return o;
        }
      case START_ARRAY:
        {
          ArrayNode a = NODES.arrayNode();
          JsonToken n;
          int i = 0;
          while ((n = p.nextToken()) != JsonToken.END_ARRAY) {
            a.add(build(p, n, pointer + "/" + i, positions, offset, anchors, duplicates));
            i++;
          }
          return a;
        }
      case VALUE_STRING:
        return NODES.stringNode(p.getString());
      case VALUE_NUMBER_INT:
        return intNode(p);
      case VALUE_NUMBER_FLOAT:
        // Keep the text as written: "0.5" or "129e6" must reach the Quantity parser unchanged.
        return NODES.stringNode(p.getString());
      case VALUE_TRUE:
        return NODES.booleanNode(true);
      case VALUE_FALSE:
        return NODES.booleanNode(false);
      case VALUE_NULL:
        return NODES.nullNode();
      default:
        return NODES.stringNode(p.getString());
    }
  }

  private static JsonNode intNode(JsonParser p) {
    java.math.BigInteger v = p.getBigIntegerValue();
    if (v.bitLength() < 32) {
      return NODES.numberNode(v.intValue());
    }
    if (v.bitLength() < 64) {
      return NODES.numberNode(v.longValue());
    }
    return NODES.numberNode(v);
  }

  private static int errorLine(JacksonException e) {
    for (Throwable c = e; c != null; c = c.getCause()) {
      if (c instanceof MarkedYamlEngineException m && m.getProblemMark().isPresent()) {
        return m.getProblemMark().get().getLine() + 1;
      }
    }
    return line(e.getLocation());
  }

  private static String problem(JacksonException e, int lineOffset) {
    for (Throwable c = e; c != null; c = c.getCause()) {
      if (c instanceof MarkedYamlEngineException m) {
        String problem = m.getProblem() == null ? "" : m.getProblem();
        problem = problem.replace("'\\t(TAB)'", "a tab").replace("\\t(TAB)", "tabs");
        if (problem.contains("tab")) {
          return problem + " (YAML indents with spaces only)";
        }
        String context = m.getContext();
        if (context == null || context.isBlank()) {
          return problem;
        }
        String started =
            m.getContextMark()
                .map(mark -> " started on line " + (mark.getLine() + 1 + lineOffset))
                .orElse("");
        return problem + " (" + context.trim() + started + ")";
      }
    }
    String msg = e.getOriginalMessage();
    int nl = msg == null ? -1 : msg.indexOf('\n');
    return nl < 0 ? String.valueOf(msg) : msg.substring(0, nl);
  }
}
