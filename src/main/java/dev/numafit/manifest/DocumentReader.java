package dev.numafit.manifest;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.SourceRef;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;
import org.snakeyaml.engine.v2.exceptions.MarkedYamlEngineException;
import org.snakeyaml.engine.v2.api.LoadSettings;
import tools.jackson.core.JacksonException;
import tools.jackson.core.JsonParser;
import tools.jackson.core.JsonToken;
import tools.jackson.core.StreamReadConstraints;
import tools.jackson.core.json.JsonFactory;
import tools.jackson.core.TokenStreamLocation;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.JsonNodeFactory;
import tools.jackson.databind.node.ObjectNode;
import tools.jackson.dataformat.yaml.YAMLFactory;
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

  /**
   * Deepest nesting of mappings and lists in one document. A Kubernetes manifest needs a few
   * dozen levels; the cap keeps a hostile document from exhausting the stack.
   */
  static final int MAX_DEPTH = 500;

  /**
   * Most values one document may copy through YAML aliases ({@code *name}). Aliases that repeat
   * aliases grow exponentially (the "billion laughs" document); real manifests copy a handful.
   */
  static final int MAX_ALIAS_VALUES = 100_000;

  private final int maxDocumentChars;
  private final YAMLMapper yaml;
  private final StreamReadConstraints limits;
  private JsonMapper json;

  /** A reader with the default document size limit ({@link ManifestReader#DEFAULT_MAX_DOCUMENT_CHARS}). */
  DocumentReader() {
    this(ManifestReader.DEFAULT_MAX_DOCUMENT_CHARS);
  }

  /** A reader refusing YAML documents and JSON values longer than {@code maxDocumentChars}. */
  DocumentReader(int maxDocumentChars) {
    this.maxDocumentChars = maxDocumentChars;
    StreamReadConstraints limits =
        StreamReadConstraints.builder()
            .maxNestingDepth(MAX_DEPTH)
            .maxDocumentLength(maxDocumentChars)
            .build();
    this.yaml =
        YAMLMapper.builder(
                YAMLFactory.builder()
                    .loadSettings(
                        LoadSettings.builder()
                            .setCodePointLimit(maxDocumentChars)
                            // Duplicates are reported by this reader, as a warning naming the key.
                            .setAllowDuplicateKeys(true)
                            .setMaxAliasesForCollections(MAX_ALIAS_VALUES)
                            .build())
                    .streamReadConstraints(limits)
                    .build())
            .disable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
            .build();
    this.limits = limits;
  }

  private JsonMapper json() {
    if (json == null) {
      // Built on first use: most inputs are YAML only.
      json =
          JsonMapper.builder(JsonFactory.builder().streamReadConstraints(limits).build())
              .disable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
              .build();
    }
    return json;
  }

  /** Thrown while building a tree whose aliases copy more than {@link #MAX_ALIAS_VALUES}. */
  private static final class AliasLimit extends RuntimeException {
    private static final long serialVersionUID = 1L;
    final int line;

    AliasLimit(int line) {
      super(null, null, false, false);
      this.line = line;
    }
  }

  /** Values copied through aliases in the document being built, and each anchor's size. */
  private static final class AliasBudget {
    long copied;
    final Map<String, Long> sizes = new HashMap<>();
  }

  /** A key given twice in one mapping, where the second one is. */
  private record DuplicateKey(int line, String name) {}

  /** What reading one file produced besides its documents. */
  static final class Outcome {
    int emptyDocuments;
  }

  /** Where documents go; list items may go one by one. */
  interface Sink {
    /** A whole document. */
    void document(LocatedDocument doc);

    /**
     * One item of a list document ({@code kind: List} or {@code PodList} and the like), as its
     * own document (pointers start at the item), passed on as soon as it is parsed so that a huge
     * list never has to be held whole. The list document itself follows with empty items.
     */
    void listItem(LocatedDocument item, String listKind);
  }

  /**
   * Reads {@code text}; documents go to {@code sink}, problems to {@code diagnostics}. List items
   * stay inside their list document.
   *
   * @param asJson parse as JSON (several values may follow each other) instead of YAML
   */
  Outcome read(
      String file,
      String text,
      boolean asJson,
      Consumer<LocatedDocument> sink,
      List<Diagnostic> diagnostics) {
    return read(file, text, asJson, sink, null, diagnostics);
  }

  /**
   * Reads {@code text} as {@link #read(String, String, boolean, Consumer, List)}, but passes the
   * items of a list document to {@code sink} one by one when the list's {@code kind} is written
   * before its {@code items} (as YAML lists usually are); otherwise the list stays whole.
   */
  Outcome read(
      String file, String text, boolean asJson, Sink sink, List<Diagnostic> diagnostics) {
    return read(file, text, asJson, sink::document, sink, diagnostics);
  }

  private Outcome read(
      String file,
      String text,
      boolean asJson,
      Consumer<LocatedDocument> sink,
      Sink items,
      List<Diagnostic> diagnostics) {
    Outcome outcome = new Outcome();
    int offset = 0; // lines skipped before the current parser's input
    String rest = text;
    while (rest != null) {
      String next = null;
      JsonParser parser = null;
      try (JsonParser p = asJson ? json().createParser(rest) : yaml.createParser(rest)) {
        parser = p;
        JsonToken t;
        while ((t = p.nextToken()) != null) {
          int start = offset + line(p.currentTokenLocation());
          if (t == JsonToken.VALUE_NULL) {
            outcome.emptyDocuments++;
            continue;
          }
          Map<String, Integer> positions = new HashMap<>();
          List<DuplicateKey> duplicates = new ArrayList<>();
          JsonNode root =
              items != null && t == JsonToken.START_OBJECT
                  ? buildTop(file, p, positions, offset, duplicates, items)
                  : build(p, t, "", positions, offset, new HashMap<>(), duplicates,
                      new AliasBudget());
          for (DuplicateKey d : duplicates) {
            diagnostics.add(
                Diagnostic.warning(
                    new SourceRef(file, d.line()),
                    "duplicate key \"" + d.name() + "\" in one mapping; the later value is used"));
          }
          sink.accept(new LocatedDocument(file, root, positions, start));
        }
      } catch (JacksonException | AliasLimit e) {
        int errorLine;
        String message;
        if (e instanceof AliasLimit a) {
          errorLine = a.line;
          message =
              "YAML aliases in this document copy more than "
                  + MAX_ALIAS_VALUES
                  + " values (an alias bomb?); numafit reads documents whose aliases repeat"
                  + " a few small blocks";
        } else {
          JacksonException je = (JacksonException) e;
          errorLine = offset + errorLine(je);
          if (errorLine <= offset && parser != null) {
            // Limit errors carry no location of their own: use where the parser stopped.
            errorLine = offset + line(parser.currentLocation());
          }
          message = limitMessage(je, asJson);
          if (message == null) {
            message = (asJson ? "malformed JSON: " : "malformed YAML: ") + problem(je, offset);
          }
        }
        diagnostics.add(Diagnostic.error(new SourceRef(file, Math.max(errorLine, 0)), message));
        if (!asJson) {
          // Resume at the next document separator after the error, if any. Scan the text
          // rather than splitting it into lines: a huge file must not be copied again.
          int from = lineStart(text, Math.max(errorLine - 1, offset + 1) + 1);
          int sep = from < 0 ? -1 : separatorAt(text, from);
          if (sep >= 0) {
            next = text.substring(sep);
            offset = lineOf(text, sep);
          }
        }
      }
      rest = next;
    }
    return outcome;
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
      List<DuplicateKey> duplicates,
      AliasBudget budget) {
    positions.put(pointer, offset + line(p.currentTokenLocation()));
    if (p instanceof YAMLParser y && t == JsonToken.VALUE_STRING && y.isCurrentAlias()) {
      // An alias (*name) repeats the node anchored as &name earlier in the document.
      JsonNode anchored = anchors.get(p.getString());
      if (anchored != null) {
        budget.copied += budget.sizes.getOrDefault(p.getString(), 1L);
        if (budget.copied > MAX_ALIAS_VALUES) {
          throw new AliasLimit(offset + line(p.currentTokenLocation()));
        }
        return anchored.deepCopy();
      }
    }
    Object anchor = p.getObjectId();
    JsonNode node = buildValue(p, t, pointer, positions, offset, anchors, duplicates, budget);
    if (anchor != null) {
      anchors.put(anchor.toString(), node);
      budget.sizes.put(anchor.toString(), size(node));
    }
    return node;
  }

  /**
   * Builds a document's top-level mapping as {@link #buildValue} does, except that the items of
   * a list whose {@code kind} (ending in {@code List}) came before {@code items} are built one at
   * a time and handed to {@code sink}; the returned mapping then holds an empty item list.
   */
  private JsonNode buildTop(
      String file,
      JsonParser p,
      Map<String, Integer> positions,
      int offset,
      List<DuplicateKey> duplicates,
      Sink sink) {
    positions.put("", offset + line(p.currentTokenLocation()));
    Map<String, JsonNode> anchors = new HashMap<>();
    AliasBudget budget = new AliasBudget();
    ObjectNode o = NODES.objectNode();
    String kind = null;
    JsonToken n;
    while ((n = p.nextToken()) == JsonToken.PROPERTY_NAME) {
      String name = p.currentName();
      String child = "/" + LocatedDocument.segment(name);
      int keyLine = offset + line(p.currentTokenLocation());
      JsonToken v = p.nextToken();
      if (o.has(name)) {
        duplicates.add(new DuplicateKey(keyLine, name));
      }
      if (name.equals("items") && v == JsonToken.START_ARRAY && kind != null
          && kind.endsWith("List") && !o.has("items")) {
        positions.put(child, offset + line(p.currentTokenLocation()));
        JsonToken item;
        while ((item = p.nextToken()) != JsonToken.END_ARRAY) {
          Map<String, Integer> itemPositions = new HashMap<>();
          int itemLine = offset + line(p.currentTokenLocation());
          JsonNode node =
              build(p, item, "", itemPositions, offset, anchors, duplicates, budget);
          sink.listItem(new LocatedDocument(file, node, itemPositions, itemLine), kind);
        }
        o.set(name, NODES.arrayNode());
        continue;
      }
      JsonNode value = build(p, v, child, positions, offset, anchors, duplicates, budget);
      if (name.equals("kind") && value.isString()) {
        kind = value.asString();
      }
      o.set(name, value);
      Integer valueLine = positions.get(child);
      if (valueLine != null && valueLine != keyLine) {
        positions.put(child + LocatedDocument.KEY_SUFFIX, keyLine);
      }
    }
    return o;
  }

  /** Values in a tree, counting containers and leaves; bounded by the alias budget. */
  private static long size(JsonNode node) {
    long n = 1;
    for (JsonNode child : node.values()) {
      n += size(child);
    }
    return n;
  }

  /** A message for a deliberate parser limit, or null when {@code e} is another error. */
  private String limitMessage(JacksonException e, boolean asJson) {
    String m = String.valueOf(e.getOriginalMessage());
    for (Throwable c = e.getCause(); c != null; c = c.getCause()) {
      m = m + " " + c.getMessage();
    }
    if (m.contains("nesting depth")) {
      return "nested deeper than "
          + MAX_DEPTH
          + " levels (numafit's limit for one document; a Kubernetes manifest needs a few"
          + " dozen)";
    }
    if (m.contains("exceeds the limit") || m.toLowerCase(java.util.Locale.ROOT).contains("document length")) {
      return (asJson ? "a JSON value" : "a YAML document")
          + " longer than "
          + maxDocumentChars
          + " characters (numafit's limit); raise it with --max-document-size if the input"
          + " is meant to be this large";
    }
    if (m.contains("Number of aliases")) {
      return "more than "
          + MAX_ALIAS_VALUES
          + " YAML aliases in this document (an alias bomb?)";
    }
    return null;
  }

  /** The character offset where 1-based line {@code line} starts, or -1 past the end. */
  private static int lineStart(String text, int line) {
    int at = 0;
    for (int i = 1; i < line; i++) {
      at = text.indexOf('\n', at);
      if (at < 0) {
        return -1;
      }
      at++;
    }
    return at;
  }

  /** The start of the first line at or after {@code from} that begins with {@code ---}. */
  private static int separatorAt(String text, int from) {
    int at = from;
    while (at >= 0 && at < text.length()) {
      if (text.startsWith("---", at)) {
        return at;
      }
      at = text.indexOf('\n', at);
      if (at >= 0) {
        at++;
      }
    }
    return -1;
  }

  /** How many lines come before character offset {@code at} (so a 0-based line number). */
  private static int lineOf(String text, int at) {
    int n = 0;
    for (int i = text.indexOf('\n'); i >= 0 && i < at; i = text.indexOf('\n', i + 1)) {
      n++;
    }
    return n;
  }

  private JsonNode buildValue(
      JsonParser p,
      JsonToken t,
      String pointer,
      Map<String, Integer> positions,
      int offset,
      Map<String, JsonNode> anchors,
      List<DuplicateKey> duplicates,
      AliasBudget budget) {
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
            o.set(name, build(p, v, child, positions, offset, anchors, duplicates, budget));
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
            a.add(build(p, n, pointer + "/" + i, positions, offset, anchors, duplicates, budget));
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
    String first = nl < 0 ? String.valueOf(msg) : msg.substring(0, nl);
    // Jackson appends where the open object began, as an internal source description; the line
    // of the error is already in front of the message.
    int marker = first.indexOf(" (start marker at");
    return marker < 0 ? first : first.substring(0, marker);
  }
}
