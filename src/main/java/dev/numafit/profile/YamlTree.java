package dev.numafit.profile;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.diag.SourceRef;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import tools.jackson.core.JacksonException;
import tools.jackson.core.JsonParser;
import tools.jackson.core.JsonToken;
import tools.jackson.core.TokenStreamLocation;
import tools.jackson.dataformat.yaml.YAMLMapper;

/**
 * A YAML document as a tree that remembers the line of every value and key, built from Jackson's
 * token stream (Jackson's own trees keep no locations, and every message must name its line).
 */
final class YamlTree {
  private YamlTree() {}

  /** A value in the tree with its 1-based line. */
  sealed interface Node permits MapNode, ListNode, Scalar {
    int line();

    /** How the value looks in a message: the scalar's text, or "a mapping", "a list". */
    String shown();
  }

  /** One key of a mapping: the key's line and its value. */
  record Entry(String key, int keyLine, Node value) {}

  /** A mapping in document order. */
  record MapNode(int line, Map<String, Entry> entries) implements Node {
    @Override
    public String shown() {
      return "a mapping";
    }
  }

  /** A sequence. */
  record ListNode(int line, List<Node> items) implements Node {
    @Override
    public String shown() {
      return "a list";
    }
  }

  /**
   * A scalar: {@code token} tells how YAML typed it (number, string, boolean, null); {@code text}
   * is its text, empty for null.
   */
  record Scalar(int line, JsonToken token, String text) implements Node {
    boolean isNull() {
      return token == JsonToken.VALUE_NULL;
    }

    @Override
    public String shown() {
      return isNull() ? "nothing" : text;
    }
  }

  /**
   * Parses one YAML document. Malformed YAML, an empty file, more than one document and duplicate
   * keys are errors naming the file and line.
   */
  static Node parse(String file, String text) throws InputException {
    return parse(file, text, "HostProfile");
  }

  /** As {@link #parse(String, String)}, naming {@code kind} as the document expected. */
  static Node parse(String file, String text, String kind) throws InputException {
    YAMLMapper mapper = new YAMLMapper();
    List<Diagnostic> errors = new ArrayList<>();
    try (JsonParser p = mapper.createParser(text)) {
      JsonToken first = p.nextToken();
      if (first == null) {
        throw new InputException(
            Diagnostic.error(
                new SourceRef(file, 1), "expected a " + kind + " document, the file is empty"));
      }
      Node root = read(p, file, errors);
      JsonToken next = p.nextToken();
      if (next != null) {
        errors.add(
            Diagnostic.error(
                new SourceRef(file, line(p.currentTokenLocation())),
                "expected one " + kind + " document per file, found a second one"));
      }
      if (!errors.isEmpty()) {
        throw new InputException(errors);
      }
      return root;
    } catch (JacksonException e) {
      TokenStreamLocation loc = e.getLocation();
      String msg = e.getOriginalMessage();
      if (msg == null) {
        msg = e.getClass().getSimpleName();
      }
      // SnakeYAML's text interleaves its own locations and a caret drawing (indented lines) with
      // the problem; keep the problem, the line goes in front as for every other message.
      msg =
          String.join(
              "; ",
              msg.lines().filter(l -> !l.isBlank() && !Character.isWhitespace(l.charAt(0)))
                  .map(String::trim).toList());
      throw new InputException(
          Diagnostic.error(
              new SourceRef(file, loc == null ? 0 : line(loc)), "malformed YAML: " + msg));
    }
  }

  private static int line(TokenStreamLocation loc) {
    return Math.max(0, loc.getLineNr());
  }

  private static Node read(JsonParser p, String file, List<Diagnostic> errors) {
    JsonToken t = p.currentToken();
    int line = line(p.currentTokenLocation());
    switch (t) {
      case START_OBJECT -> {
        Map<String, Entry> entries = new LinkedHashMap<>();
        while (p.nextToken() == JsonToken.PROPERTY_NAME) {
          String key = p.currentName();
          int keyLine = line(p.currentTokenLocation());
          p.nextToken();
          Node value = read(p, file, errors);
          if (entries.containsKey(key)) {
            errors.add(
                Diagnostic.error(
                    new SourceRef(file, keyLine),
                    key + ": duplicate key; first given on line " + entries.get(key).keyLine()));
          } else {
            entries.put(key, new Entry(key, keyLine, value));
          }
        }
        return new MapNode(line, entries);
      }
      case START_ARRAY -> {
        List<Node> items = new ArrayList<>();
        while (p.nextToken() != JsonToken.END_ARRAY) {
          items.add(read(p, file, errors));
        }
        return new ListNode(line, items);
      }
      case VALUE_NULL -> {
        return new Scalar(line, t, "");
      }
      default -> {
        return new Scalar(line, t, p.getString());
      }
    }
  }
}
