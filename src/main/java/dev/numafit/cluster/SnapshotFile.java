package dev.numafit.cluster;

import dev.numafit.cluster.model.BudgetRecord;
import dev.numafit.cluster.model.ClusterModel;
import dev.numafit.cluster.model.IntOrPercent;
import dev.numafit.cluster.model.LabelRequirement;
import dev.numafit.cluster.model.LabelSelector;
import dev.numafit.cluster.model.NodeRecord;
import dev.numafit.cluster.model.Placement;
import dev.numafit.cluster.model.PodRecord;
import dev.numafit.cluster.model.Taint;
import dev.numafit.cluster.model.Toleration;
import dev.numafit.cluster.model.WorkloadRecord;
import dev.numafit.demand.Replicas;
import dev.numafit.demand.WorkloadId;
import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.diag.SourceRef;
import dev.numafit.resource.Resources;
import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import tools.jackson.core.JacksonException;
import tools.jackson.core.JsonParser;
import tools.jackson.core.JsonToken;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.JsonNodeFactory;
import tools.jackson.databind.node.ObjectNode;

/**
 * numafit's own snapshot format (docs/snapshot.md): one JSON document holding a {@link
 * ClusterModel}, so a review can be rerun offline, shared and used in tests. Records are written
 * one per line in a fixed key order, so the same model gives the same bytes; reading streams the
 * arrays element by element, so a snapshot of 150,000 pods never sits in memory as a tree.
 */
public final class SnapshotFile {
  /** The format version at the root; a reader refuses any other. */
  public static final int SCHEMA_VERSION = 1;
  /** The {@code kind} at the root. */
  public static final String KIND = "ClusterSnapshot";

  private static final JsonMapper JSON = JsonMapper.builder()
      .disable(tools.jackson.databind.DeserializationFeature.FAIL_ON_TRAILING_TOKENS).build();
  private static final JsonNodeFactory F = JsonNodeFactory.instance;

  private SnapshotFile() {}

  /** Writes the model to {@code out}. */
  public static void write(ClusterModel m, Writer out) throws IOException {
    out.write("{\"schemaVersion\":" + SCHEMA_VERSION + ",\"kind\":\"" + KIND + "\",\n");
    out.write("\"server\":" + str(m.server()) + ",\n");
    out.write("\"namespace\":" + (m.namespace().isPresent() ? str(m.namespace().get()) : "null")
        + ",\n");
    out.write("\"missing\":" + JSON.writeValueAsString(m.missing()) + ",\n");
    out.write("\"warnings\":" + JSON.writeValueAsString(m.warnings()) + ",\n");
    array(out, "nodes", m.nodes(), SnapshotFile::node, false);
    array(out, "budgets", m.budgets(), SnapshotFile::budget, false);
    array(out, "workloads", m.workloads(), SnapshotFile::workload, false);
    array(out, "pods", m.pods(), SnapshotFile::pod, true);
    out.write("}\n");
  }

  /** The model as snapshot text. */
  public static String toText(ClusterModel m) {
    java.io.StringWriter w = new java.io.StringWriter();
    try {
      write(m, w);
    } catch (IOException ex) {
      throw new java.io.UncheckedIOException(ex);
    }
    return w.toString();
  }

  /** Reads a snapshot file; every problem is a {@code file:line: error:} diagnostic. */
  public static ClusterModel read(Path file) throws InputException {
    try (Reader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
      return read(r, file.toString());
    } catch (java.nio.file.NoSuchFileException ex) {
      throw new InputException(Diagnostic.error(new SourceRef(file.toString(), 0),
          "no such file (expected a snapshot written by numafit snapshot --out FILE)"));
    } catch (IOException ex) {
      throw new InputException(Diagnostic.error(new SourceRef(file.toString(), 0),
          "cannot read: " + ex.getMessage()));
    }
  }

  /** Reads snapshot text, for tests. */
  public static ClusterModel parse(String text, String name) throws InputException {
    return read(new StringReader(text), name);
  }

  private interface ToJson<T> {
    ObjectNode apply(T t);
  }

  private static <T> void array(Writer out, String key, List<T> items, ToJson<T> f, boolean last)
      throws IOException {
    out.write("\"" + key + "\":[");
    for (int i = 0; i < items.size(); i++) {
      out.write(i == 0 ? "\n" : ",\n");
      out.write(JSON.writeValueAsString(f.apply(items.get(i))));
    }
    out.write(items.isEmpty() ? "]" : "\n]");
    out.write(last ? "\n" : ",\n");
  }

  private static String str(String s) {
    return JSON.writeValueAsString(s);
  }

  private static ObjectNode node(NodeRecord n) {
    ObjectNode o = F.objectNode();
    o.put("name", n.name());
    o.set("capacity", resources(n.capacity()));
    o.set("allocatable", resources(n.allocatable()));
    o.set("labels", strings(n.labels()));
    ArrayNode taints = o.putArray("taints");
    for (Taint t : n.taints()) {
      ObjectNode x = taints.addObject();
      x.put("key", t.key());
      x.put("value", t.value());
      x.put("effect", t.effect());
    }
    o.put("unschedulable", n.unschedulable());
    return o;
  }

  private static ObjectNode budget(BudgetRecord b) {
    ObjectNode o = F.objectNode();
    o.put("namespace", b.namespace());
    o.put("name", b.name());
    o.set("minAvailable", intOrPercent(b.minAvailable()));
    o.set("maxUnavailable", intOrPercent(b.maxUnavailable()));
    return o;
  }

  private static JsonNode intOrPercent(Optional<IntOrPercent> v) {
    if (v.isEmpty()) {
      return F.nullNode();
    }
    return v.get().percent() ? F.stringNode(v.get().toString()) : F.numberNode(v.get().value());
  }

  private static ObjectNode workload(WorkloadRecord w) {
    ObjectNode o = F.objectNode();
    o.put("workload", w.id().toString());
    ObjectNode r = o.putObject("replicas");
    r.put("declared", w.replicas().declared());
    r.put("peak", w.replicas().peak());
    r.put("peakSource", w.replicas().peakSource());
    o.put("perWorker", w.perWorker());
    o.set("requests", resources(w.requests()));
    placement(o, w.placement());
    return o;
  }

  private static ObjectNode pod(PodRecord p) {
    ObjectNode o = F.objectNode();
    o.put("namespace", p.namespace());
    o.put("name", p.name());
    o.put("workload", p.workload().toString());
    o.put("node", p.node());
    o.put("phase", p.phase());
    o.set("requests", resources(p.requests()));
    if (p.daemon()) {
      o.put("daemon", true);
    }
    if (!p.budgets().isEmpty()) {
      ArrayNode b = o.putArray("budgets");
      p.budgets().forEach(b::add);
    }
    placement(o, p.placement());
    return o;
  }

  private static void placement(ObjectNode o, Placement p) {
    if (p.equals(Placement.NONE)) {
      return;
    }
    ObjectNode x = o.putObject("placement");
    x.set("nodeSelector", strings(p.nodeSelector()));
    ArrayNode terms = x.putArray("required");
    for (LabelSelector t : p.requiredTerms()) {
      ArrayNode term = terms.addArray();
      for (LabelRequirement r : t.requirements()) {
        ObjectNode y = term.addObject();
        y.put("key", r.key());
        y.put("operator", r.operator());
        ArrayNode vs = y.putArray("values");
        r.values().forEach(vs::add);
      }
    }
    ArrayNode tols = x.putArray("tolerations");
    for (Toleration t : p.tolerations()) {
      ObjectNode y = tols.addObject();
      y.put("key", t.key());
      y.put("operator", t.operator());
      y.put("value", t.value());
      y.put("effect", t.effect());
    }
  }

  private static ObjectNode resources(Resources r) {
    ObjectNode o = F.objectNode();
    r.asMap().forEach(o::put);
    return o;
  }

  private static ObjectNode strings(Map<String, String> m) {
    ObjectNode o = F.objectNode();
    new TreeMap<>(m).forEach(o::put);
    return o;
  }

  // ---- reading ----

  /** Reads one element tree at a time; problems carry the element's line. */
  private static final class In {
    final String file;
    final Map<Object, Object> interned = new HashMap<>();
    int line;

    In(String file) {
      this.file = file;
    }

    InputException error(String message) {
      return new InputException(Diagnostic.error(new SourceRef(file, line), message));
    }

    JsonNode need(JsonNode o, String field, String expected) throws InputException {
      JsonNode v = o.get(field);
      if (v == null || v.isNull()) {
        throw error("missing field \"" + field + "\" (expected " + expected + ")");
      }
      return v;
    }

    String text(JsonNode o, String field) throws InputException {
      JsonNode v = need(o, field, "a string");
      if (!v.isString()) {
        throw error("field \"" + field + "\" is " + v.getNodeType().toString().toLowerCase()
            + " (expected a string)");
      }
      return intern(v.asString());
    }

    String optText(JsonNode o, String field) throws InputException {
      JsonNode v = o.get(field);
      return v == null || v.isNull() ? "" : text(o, field);
    }

    Resources resources(JsonNode o, String field) throws InputException {
      JsonNode v = need(o, field, "an object of resource amounts");
      if (!v.isObject()) {
        throw error("field \"" + field + "\" must be an object of integer amounts");
      }
      TreeMap<String, Long> m = new TreeMap<>();
      for (Map.Entry<String, JsonNode> e : v.properties()) {
        if (!e.getValue().isIntegralNumber()) {
          throw error(field + "." + e.getKey() + " is " + e.getValue()
              + " (expected an integer: cpu in millicores, others in bytes or counts)");
        }
        if (e.getValue().asLong() < 0 || !e.getValue().canConvertToLong()) {
          throw error(field + "." + e.getKey() + " is " + e.getValue()
              + " (expected an integer from 0 to 2^63-1)");
        }
        m.put(intern(e.getKey()), e.getValue().asLong());
      }
      return intern(Resources.of(m));
    }

    TreeMap<String, String> strings(JsonNode o, String field) throws InputException {
      TreeMap<String, String> m = new TreeMap<>();
      JsonNode v = o.get(field);
      if (v == null || v.isNull()) {
        return m;
      }
      if (!v.isObject()) {
        throw error("field \"" + field + "\" must be an object of strings");
      }
      for (Map.Entry<String, JsonNode> e : v.properties()) {
        m.put(intern(e.getKey()), intern(e.getValue().asString()));
      }
      return m;
    }

    WorkloadId workloadId(String text) throws InputException {
      String[] parts = text.split("/", 3);
      if (parts.length != 3 || parts[0].isEmpty() || parts[1].isEmpty() || parts[2].isEmpty()) {
        throw error("workload \"" + text + "\" is not namespace/Kind/name");
      }
      return intern(new WorkloadId(intern(parts[0]), intern(parts[1]), intern(parts[2])));
    }

    Placement placement(JsonNode o) throws InputException {
      JsonNode p = o.get("placement");
      if (p == null || p.isNull()) {
        return Placement.NONE;
      }
      List<LabelSelector> terms = new ArrayList<>();
      JsonNode req = p.get("required");
      if (req != null && req.isArray()) {
        for (JsonNode term : req) {
          List<LabelRequirement> rs = new ArrayList<>();
          for (JsonNode r : term) {
            List<String> values = new ArrayList<>();
            JsonNode vs = r.get("values");
            if (vs != null) {
              vs.forEach(v -> values.add(v.asString()));
            }
            rs.add(new LabelRequirement(text(r, "key"), text(r, "operator"), values));
          }
          terms.add(new LabelSelector(rs));
        }
      }
      List<Toleration> tols = new ArrayList<>();
      JsonNode ts = p.get("tolerations");
      if (ts != null && ts.isArray()) {
        for (JsonNode t : ts) {
          tols.add(new Toleration(optText(t, "key"), optText(t, "operator"), optText(t, "value"),
              optText(t, "effect")));
        }
      }
      return intern(new Placement(strings(p, "nodeSelector"), terms, tols));
    }

    Optional<IntOrPercent> intOrPercent(JsonNode o, String field) throws InputException {
      JsonNode v = o.get(field);
      if (v == null || v.isNull()) {
        return Optional.empty();
      }
      try {
        if (v.isIntegralNumber()) {
          return Optional.of(new IntOrPercent(v.asInt(), false));
        }
        return Optional.of(IntOrPercent.parse(v.asString()));
      } catch (IllegalArgumentException ex) {
        throw error(field + ": " + ex.getMessage());
      }
    }

    @SuppressWarnings("unchecked")
    <T> T intern(T v) {
      return (T) interned.computeIfAbsent(v, k -> k);
    }
  }

  private static ClusterModel read(Reader reader, String file) throws InputException {
    In in = new In(file);
    Integer version = null;
    String server = null;
    Optional<String> namespace = Optional.empty();
    List<String> missing = new ArrayList<>();
    List<String> warnings = new ArrayList<>();
    List<NodeRecord> nodes = new ArrayList<>();
    List<BudgetRecord> budgets = new ArrayList<>();
    List<WorkloadRecord> workloads = new ArrayList<>();
    List<PodRecord> pods = new ArrayList<>();
    try (JsonParser p = JSON.createParser(reader)) {
      if (p.nextToken() != JsonToken.START_OBJECT) {
        in.line = line(p);
        throw in.error("not a numafit snapshot (expected a JSON object with schemaVersion "
            + SCHEMA_VERSION + ")");
      }
      while (p.nextToken() == JsonToken.PROPERTY_NAME) {
        String key = p.currentName();
        JsonToken t = p.nextToken();
        in.line = line(p);
        switch (key) {
          case "schemaVersion" -> {
            if (!t.isNumeric()) {
              throw in.error("schemaVersion is " + JSON.writeValueAsString(JSON.readTree(p))
                  + " (expected the integer " + SCHEMA_VERSION + ")");
            }
            if (p.getIntValue() != SCHEMA_VERSION) {
              throw in.error("schemaVersion " + p.getString() + " is not supported (expected "
                  + SCHEMA_VERSION + "; write the snapshot again with this numafit)");
            }
            version = SCHEMA_VERSION;
          }
          case "kind" -> {
            if (!KIND.equals(p.getString())) {
              throw in.error("kind \"" + p.getString() + "\" is not " + KIND);
            }
          }
          case "server" -> server = p.getString();
          case "namespace" -> namespace = t == JsonToken.VALUE_NULL ? Optional.empty()
              : Optional.of(p.getString());
          case "missing" -> readStrings(p, in, missing);
          case "warnings" -> readStrings(p, in, warnings);
          case "nodes" -> elements(p, in, "nodes", n -> nodes.add(new NodeRecord(
              in.text(n, "name"), in.resources(n, "capacity"), in.resources(n, "allocatable"),
              in.strings(n, "labels"), taints(n, in),
              n.has("unschedulable") && n.get("unschedulable").asBoolean())));
          case "budgets" -> elements(p, in, "budgets", b -> budgets.add(new BudgetRecord(
              in.text(b, "namespace"), in.text(b, "name"), in.intOrPercent(b, "minAvailable"),
              in.intOrPercent(b, "maxUnavailable"))));
          case "workloads" -> elements(p, in, "workloads", w -> {
            JsonNode r = in.need(w, "replicas", "{declared, peak, peakSource}");
            int declared = r.path("declared").asInt(0);
            int peak = r.path("peak").asInt(declared);
            if (declared < 0 || peak < 0) {
              throw in.error("replicas must be >= 0");
            }
            workloads.add(new WorkloadRecord(in.workloadId(in.text(w, "workload")),
                new Replicas(declared, peak, r.path("peakSource").asString("spec.replicas")),
                w.path("perWorker").asBoolean(false), in.resources(w, "requests"),
                in.placement(w)));
          });
          case "pods" -> elements(p, in, "pods", x -> {
            List<String> bs = new ArrayList<>();
            JsonNode b = x.get("budgets");
            if (b != null) {
              b.forEach(v -> bs.add(v.asString()));
            }
            pods.add(new PodRecord(in.text(x, "namespace"), x.path("name").asString(),
                in.workloadId(in.text(x, "workload")), in.optText(x, "node"),
                in.text(x, "phase"), in.resources(x, "requests"), in.placement(x),
                x.path("daemon").asBoolean(false), in.intern(List.copyOf(bs))));
          });
          default -> p.skipChildren();
        }
      }
      if (p.currentToken() == JsonToken.END_OBJECT && p.nextToken() != null) {
        // A snapshot is one object; anything after it means the file was damaged or joined.
        in.line = line(p);
        throw in.error("unexpected content after the snapshot object (expected the end of the"
            + " file)");
      }
    } catch (JacksonException ex) {
      // The location's line is -1 when unknown (e.g. bytes that are not text at all).
      in.line = ex.getLocation() == null ? 1 : Math.max(1, ex.getLocation().getLineNr());
      for (Throwable c = ex; c != null; c = c.getCause()) {
        if (c instanceof java.nio.charset.CharacterCodingException) {
          throw in.error("not UTF-8 text (expected a JSON snapshot written by numafit snapshot"
              + " --out FILE)");
        }
      }
      throw in.error("not valid JSON: " + ex.getOriginalMessage());
    } catch (IllegalArgumentException | NullPointerException ex) {
      throw in.error("invalid record: " + ex.getMessage());
    }
    in.line = 1;
    if (version == null) {
      throw in.error("missing schemaVersion (expected " + SCHEMA_VERSION
          + "; is this a numafit snapshot?)");
    }
    if (server == null) {
      throw in.error("missing field \"server\"");
    }
    return new ClusterModel(server, namespace, nodes, pods, budgets, workloads, missing,
        warnings);
  }

  private interface ElementReader {
    void read(JsonNode element) throws InputException;
  }

  private static void elements(JsonParser p, In in, String key, ElementReader f)
      throws InputException {
    if (p.currentToken() != JsonToken.START_ARRAY) {
      throw in.error("\"" + key + "\" must be an array");
    }
    while (p.nextToken() != JsonToken.END_ARRAY) {
      in.line = line(p);
      JsonNode n = JSON.readTree(p);
      if (n == null || !n.isObject()) {
        throw in.error("an element of \"" + key + "\" is not an object");
      }
      f.read(n);
    }
  }

  private static void readStrings(JsonParser p, In in, List<String> into) throws InputException {
    JsonNode n = JSON.readTree(p);
    if (!n.isArray()) {
      throw in.error("expected an array of strings");
    }
    Iterator<JsonNode> it = n.iterator();
    while (it.hasNext()) {
      into.add(it.next().asString());
    }
  }

  private static List<Taint> taints(JsonNode n, In in) throws InputException {
    List<Taint> out = new ArrayList<>();
    JsonNode ts = n.get("taints");
    if (ts != null) {
      for (JsonNode t : ts) {
        out.add(new Taint(in.text(t, "key"), in.optText(t, "value"), in.text(t, "effect")));
      }
    }
    return out;
  }

  private static int line(JsonParser p) {
    return p.currentTokenLocation() == null ? 0 : p.currentTokenLocation().getLineNr();
  }
}
