package dev.numafit.manifest;

import io.fabric8.kubernetes.api.model.Container;
import io.fabric8.kubernetes.api.model.PodSpec;
import io.fabric8.kubernetes.api.model.PodTemplateSpec;
import io.fabric8.kubernetes.api.model.Quantity;
import io.fabric8.kubernetes.api.model.ResourceRequirements;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import tools.jackson.databind.JsonNode;

/**
 * A shortcut past fabric8's full conversion for workloads written in a plain, common shape.
 *
 * <p>Converting a whole Deployment with fabric8 builds Jackson deserializers for every type a pod
 * spec can hold (volumes, probes, affinity, ...), which costs more than reading thousands of plain
 * documents. When every field of an object is one of a short list of fields with simple values of
 * exactly the type fabric8 declares for them, no conversion of that object can fail, and the few
 * parts the reader uses (replica count, containers, resources) are built directly as the fabric8
 * model types, each quantity through fabric8's {@link Quantity} as its deserializer would. Any
 * other field, any other value type (even one Jackson would coerce), or any quantity fabric8
 * rejects makes {@link #of} return null, and the caller converts the object in full, so messages
 * and results stay those of the full conversion.
 */
final class PlainWorkloads {
  private PlainWorkloads() {}

  /** What the reader needs from a plain object. */
  record Plain(Integer replicas, PodTemplateSpec template, PodSpec podSpec) {}

  /** Accepts a node, or rejects it (the object then takes the full conversion). */
  private interface Shape {
    boolean accepts(JsonNode n);
  }

  private static final Shape STRING = JsonNode::isString;
  // fabric8's Integer fields; the document reader keeps values that fit in 32 bits as int nodes.
  private static final Shape INT = JsonNode::isInt;
  private static final Shape LONG = n -> n.isInt() || n.isLong();
  private static final Shape BOOLEAN = JsonNode::isBoolean;
  private static final Shape STRINGS = listOf(STRING);
  private static final Shape STRING_MAP = mapOf(STRING);
  // What fabric8's Quantity deserializer turns into new Quantity(text); a float stays text.
  private static final Shape QUANTITY = n -> n.isString() || n.isIntegralNumber();
  private static final Shape RESOURCES =
      object(Map.of("requests", mapOf(QUANTITY), "limits", mapOf(QUANTITY)));
  private static final Shape META =
      object(
          Map.of(
              "name", STRING,
              "namespace", STRING,
              "generateName", STRING,
              "labels", STRING_MAP,
              "annotations", STRING_MAP));
  private static final Shape CONTAINER =
      object(
          Map.ofEntries(
              Map.entry("name", STRING),
              Map.entry("image", STRING),
              Map.entry("imagePullPolicy", STRING),
              Map.entry("restartPolicy", STRING),
              Map.entry("workingDir", STRING),
              Map.entry("terminationMessagePath", STRING),
              Map.entry("terminationMessagePolicy", STRING),
              Map.entry("stdin", BOOLEAN),
              Map.entry("tty", BOOLEAN),
              Map.entry("command", STRINGS),
              Map.entry("args", STRINGS),
              Map.entry(
                  "ports",
                  listOf(
                      object(
                          Map.of(
                              "name", STRING,
                              "containerPort", INT,
                              "hostPort", INT,
                              "hostIP", STRING,
                              "protocol", STRING)))),
              Map.entry("env", listOf(object(Map.of("name", STRING, "value", STRING)))),
              Map.entry("resources", RESOURCES)));
  private static final Shape POD_SPEC =
      object(
          Map.ofEntries(
              Map.entry("containers", listOf(CONTAINER)),
              Map.entry("initContainers", listOf(CONTAINER)),
              Map.entry("runtimeClassName", STRING),
              Map.entry("overhead", mapOf(QUANTITY)),
              Map.entry("resources", RESOURCES),
              Map.entry("restartPolicy", STRING),
              Map.entry("serviceAccountName", STRING),
              Map.entry("priorityClassName", STRING),
              Map.entry("schedulerName", STRING),
              Map.entry("dnsPolicy", STRING),
              Map.entry("nodeSelector", STRING_MAP),
              Map.entry("terminationGracePeriodSeconds", LONG)));
  private static final Shape TEMPLATE = object(Map.of("metadata", META, "spec", POD_SPEC));
  private static final Shape SELECTOR = object(Map.of("matchLabels", STRING_MAP));

  private static final Map<KnownKind, Shape> ROOTS = new HashMap<>();

  static {
    Map<String, Shape> deployment = new HashMap<>();
    deployment.put("replicas", INT);
    deployment.put("selector", SELECTOR);
    deployment.put("template", TEMPLATE);
    deployment.put("minReadySeconds", INT);
    deployment.put("revisionHistoryLimit", INT);
    deployment.put("progressDeadlineSeconds", INT);
    deployment.put("paused", BOOLEAN);
    Map<String, Shape> statefulSet = new HashMap<>();
    statefulSet.put("replicas", INT);
    statefulSet.put("selector", SELECTOR);
    statefulSet.put("template", TEMPLATE);
    statefulSet.put("minReadySeconds", INT);
    statefulSet.put("revisionHistoryLimit", INT);
    statefulSet.put("serviceName", STRING);
    statefulSet.put("podManagementPolicy", STRING);
    ROOTS.put(KnownKind.DEPLOYMENT, root(object(deployment)));
    ROOTS.put(KnownKind.STATEFUL_SET, root(object(statefulSet)));
    ROOTS.put(
        KnownKind.REPLICA_SET,
        root(
            object(
                Map.of(
                    "replicas", INT,
                    "selector", SELECTOR,
                    "template", TEMPLATE,
                    "minReadySeconds", INT))));
    ROOTS.put(
        KnownKind.REPLICATION_CONTROLLER,
        root(
            object(
                Map.of(
                    "replicas", INT,
                    "selector", STRING_MAP,
                    "template", TEMPLATE,
                    "minReadySeconds", INT))));
    ROOTS.put(
        KnownKind.DAEMON_SET,
        root(
            object(
                Map.of(
                    "selector", SELECTOR,
                    "template", TEMPLATE,
                    "minReadySeconds", INT,
                    "revisionHistoryLimit", INT))));
    ROOTS.put(KnownKind.POD, root(POD_SPEC));
  }

  private static Shape root(Shape spec) {
    return object(Map.of("apiVersion", STRING, "kind", STRING, "metadata", META, "spec", spec));
  }

  private static Shape object(Map<String, Shape> fields) {
    return n -> {
      if (!n.isObject()) {
        return false;
      }
      for (Map.Entry<String, JsonNode> e : n.properties()) {
        Shape s = fields.get(e.getKey());
        if (s == null || !s.accepts(e.getValue())) {
          return false;
        }
      }
      return true;
    };
  }

  private static Shape listOf(Shape item) {
    return n -> {
      if (!n.isArray()) {
        return false;
      }
      for (JsonNode i : n) {
        if (!item.accepts(i)) {
          return false;
        }
      }
      return true;
    };
  }

  private static Shape mapOf(Shape value) {
    return n -> {
      if (!n.isObject()) {
        return false;
      }
      for (Map.Entry<String, JsonNode> e : n.properties()) {
        if (!value.accepts(e.getValue())) {
          return false;
        }
      }
      return true;
    };
  }

  /**
   * The parts of a plain object of kind {@code k}, or null when it is not plain (or its kind has
   * no shortcut) and must be converted in full.
   */
  static Plain of(JsonNode node, KnownKind k) {
    Shape shape = ROOTS.get(k);
    if (shape == null || !shape.accepts(node)) {
      return null;
    }
    try {
      JsonNode spec = node.get("spec");
      if (k == KnownKind.POD) {
        return new Plain(null, null, spec == null ? null : podSpec(spec));
      }
      if (spec == null) {
        return new Plain(null, null, null);
      }
      JsonNode r = spec.get("replicas");
      Integer replicas = r == null ? null : r.intValue();
      JsonNode t = spec.get("template");
      PodTemplateSpec template = null;
      if (t != null) {
        template = new PodTemplateSpec();
        JsonNode ps = t.get("spec");
        template.setSpec(ps == null ? null : podSpec(ps));
      }
      return new Plain(replicas, template, null);
    } catch (RuntimeException e) {
      // A quantity fabric8 will not take: the full conversion reports it in its own words.
      return null;
    }
  }

  private static PodSpec podSpec(JsonNode n) {
    PodSpec s = new PodSpec();
    JsonNode init = n.get("initContainers");
    if (init != null) {
      s.setInitContainers(containers(init));
    }
    JsonNode app = n.get("containers");
    if (app != null) {
      s.setContainers(containers(app));
    }
    JsonNode overhead = n.get("overhead");
    if (overhead != null) {
      s.setOverhead(quantities(overhead));
    }
    JsonNode resources = n.get("resources");
    if (resources != null) {
      s.setResources(resources(resources));
    }
    JsonNode runtimeClass = n.get("runtimeClassName");
    if (runtimeClass != null) {
      s.setRuntimeClassName(runtimeClass.asString());
    }
    return s;
  }

  private static List<Container> containers(JsonNode list) {
    List<Container> out = new ArrayList<>(list.size());
    for (JsonNode c : list) {
      Container container = new Container();
      JsonNode name = c.get("name");
      if (name != null) {
        container.setName(name.asString());
      }
      JsonNode restart = c.get("restartPolicy");
      if (restart != null) {
        container.setRestartPolicy(restart.asString());
      }
      JsonNode resources = c.get("resources");
      if (resources != null) {
        container.setResources(resources(resources));
      }
      out.add(container);
    }
    return out;
  }

  private static ResourceRequirements resources(JsonNode n) {
    ResourceRequirements r = new ResourceRequirements();
    JsonNode requests = n.get("requests");
    if (requests != null) {
      r.setRequests(quantities(requests));
    }
    JsonNode limits = n.get("limits");
    if (limits != null) {
      r.setLimits(quantities(limits));
    }
    return r;
  }

  private static Map<String, Quantity> quantities(JsonNode map) {
    Map<String, Quantity> out = new LinkedHashMap<>();
    for (Map.Entry<String, JsonNode> e : map.properties()) {
      // As fabric8's Quantity deserializer does for a scalar: new Quantity(text).
      out.put(e.getKey(), new Quantity(e.getValue().asString()));
    }
    return out;
  }
}
