package dev.numafit.profile;

import dev.numafit.demand.Taint;
import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.diag.SourceRef;
import dev.numafit.profile.YamlTree.Entry;
import dev.numafit.profile.YamlTree.ListNode;
import dev.numafit.profile.YamlTree.MapNode;
import dev.numafit.profile.YamlTree.Node;
import dev.numafit.profile.YamlTree.Scalar;
import dev.numafit.resource.Resources;
import io.fabric8.kubernetes.api.model.Quantity;
import java.math.BigDecimal;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.regex.Pattern;
import tools.jackson.core.JsonToken;

/**
 * Reads a WorkerPools file ({@code --pools}, format in docs/pools.md). Every wrong field is one
 * {@code file:line: error: ...} naming what was expected; all of them are reported together.
 */
public final class PoolsFileReader {
  /** The apiVersion a pools file must declare. */
  public static final String API_VERSION = "numafit.dev/v1alpha1";

  /** The kind a pools file must declare. */
  public static final String KIND = "WorkerPools";

  /** Shape name of one worker per NUMA node (the default). */
  public static final String ONE_NODE = "one-node";

  private static final List<String> ROOT_KEYS = List.of("apiVersion", "kind", "metadata", "spec");
  private static final List<String> METADATA_KEYS = List.of("name", "description");
  private static final List<String> SPEC_KEYS = List.of("pools");
  private static final List<String> POOL_KEYS =
      List.of("name", "labels", "taints", "hostProfile", "worker", "workersPerNode");
  private static final List<String> TAINT_KEYS = List.of("key", "value", "effect");
  private static final List<String> WORKER_KEYS = List.of("cpu", "memory");

  /** A pool name: a DNS label (lower case letters, digits and '-', at most 63). */
  private static final Pattern POOL_NAME = Pattern.compile("[a-z0-9]([-a-z0-9]{0,61}[a-z0-9])?");

  /** The name part of a label key or a label value ("Labels and Selectors", syntax). */
  private static final Pattern LABEL_NAME =
      Pattern.compile("[A-Za-z0-9]([-A-Za-z0-9_.]{0,61}[A-Za-z0-9])?");

  /** The prefix of a label key: a DNS subdomain. */
  private static final Pattern DNS_SUBDOMAIN =
      Pattern.compile("[a-z0-9]([-a-z0-9]*[a-z0-9])?(\\.[a-z0-9]([-a-z0-9]*[a-z0-9])?)*");

  /** Reads and checks the file. */
  public List<PoolSpec> read(Path file) throws InputException {
    String name = file.toString();
    String text = HostProfileReader.readText(file, name);
    Path base = file.toAbsolutePath().getParent();
    return parse(name, text, base == null ? Path.of("") : base);
  }

  /**
   * Parses pools file text.
   *
   * @param file the name used in messages
   * @param base the folder host-profile paths are relative to
   */
  public List<PoolSpec> parse(String file, String text, Path base) throws InputException {
    Node root = YamlTree.parse(file, text, KIND);
    Run run = new Run(file, base);
    List<PoolSpec> pools = run.root(root);
    if (!run.errors.isEmpty()) {
      throw new InputException(run.errors.stream().sorted().toList());
    }
    return pools;
  }

  private static final class Run {
    private final String file;
    private final Path base;
    private final List<Diagnostic> errors = new ArrayList<>();

    Run(String file, Path base) {
      this.file = file;
      this.base = base;
    }

    private void error(int line, String path, String message) {
      errors.add(Diagnostic.error(new SourceRef(file, line), path + ": " + message));
    }

    private void checkKeys(MapNode m, String path, List<String> allowed) {
      for (Entry e : m.entries().values()) {
        if (!allowed.contains(e.key())) {
          error(e.keyLine(), join(path, e.key()),
              "unknown field; expected one of " + String.join(", ", allowed));
        }
      }
    }

    private static String join(String path, String key) {
      return path.isEmpty() ? key : path + "." + key;
    }

    List<PoolSpec> root(Node root) {
      if (!(root instanceof MapNode m)) {
        errors.add(Diagnostic.error(new SourceRef(file, root.line()),
            "expected a " + KIND + " mapping (apiVersion, kind, spec), got " + root.shown()));
        return List.of();
      }
      checkKeys(m, "", ROOT_KEYS);
      expectText(m, "apiVersion", API_VERSION, m.line());
      expectText(m, "kind", KIND, m.line());
      Entry meta = m.entries().get("metadata");
      if (meta != null) {
        if (meta.value() instanceof MapNode mm) {
          checkKeys(mm, "metadata", METADATA_KEYS);
          for (Entry e : mm.entries().values()) {
            if (METADATA_KEYS.contains(e.key()) && !isText(e.value())) {
              error(e.keyLine(), "metadata." + e.key(), "expected text, got " + e.value().shown());
            }
          }
        } else {
          error(meta.keyLine(), "metadata", "expected a mapping, got " + meta.value().shown());
        }
      }
      Entry spec = m.entries().get("spec");
      if (spec == null) {
        error(m.line(), "spec", "missing; expected a mapping with pools");
        return List.of();
      }
      if (!(spec.value() instanceof MapNode sm)) {
        error(spec.keyLine(), "spec", "expected a mapping with pools, got " + spec.value().shown());
        return List.of();
      }
      checkKeys(sm, "spec", SPEC_KEYS);
      Entry poolsEntry = sm.entries().get("pools");
      if (poolsEntry == null) {
        error(spec.keyLine(), "spec.pools", "missing; expected a list of pools");
        return List.of();
      }
      if (!(poolsEntry.value() instanceof ListNode list) || list.items().isEmpty()) {
        error(poolsEntry.keyLine(), "spec.pools",
            "expected a list of one or more pools, got " + poolsEntry.value().shown());
        return List.of();
      }
      List<PoolSpec> pools = new ArrayList<>();
      Map<String, Integer> seen = new HashMap<>();
      for (int i = 0; i < list.items().size(); i++) {
        Node item = list.items().get(i);
        String path = "spec.pools[" + i + "]";
        if (!(item instanceof MapNode pm)) {
          error(item.line(), path, "expected a pool mapping (name, labels, taints, ...), got "
              + item.shown());
          continue;
        }
        PoolSpec p = pool(pm, path);
        // Duplicates are checked on every pool with a name, even one with other errors.
        Entry n = pm.entries().get("name");
        if (n != null && n.value() instanceof Scalar s && !s.isNull()) {
          Integer first = seen.putIfAbsent(s.text(), n.keyLine());
          if (first != null) {
            error(n.keyLine(), path + ".name",
                "pool " + s.text() + " is already defined on line " + first);
            continue;
          }
        }
        if (p != null) {
          pools.add(p);
        }
      }
      return pools;
    }

    private void expectText(MapNode m, String key, String expected, int line) {
      Entry e = m.entries().get(key);
      if (e == null) {
        error(line, key, "missing; expected " + expected);
      } else if (!(e.value() instanceof Scalar s) || !s.text().equals(expected)) {
        error(e.keyLine(), key, "expected " + expected + ", got " + e.value().shown());
      }
    }

    private static boolean isText(Node n) {
      return n instanceof Scalar s && !s.isNull() && s.token() == JsonToken.VALUE_STRING;
    }

    /** A pool, or null when a field is wrong (the errors are recorded). */
    private PoolSpec pool(MapNode m, String path) {
      int before = errors.size();
      checkKeys(m, path, POOL_KEYS);
      String name = null;
      int nameLine = m.line();
      Entry n = m.entries().get("name");
      if (n == null) {
        error(m.line(), path + ".name", "missing; expected a pool name such as general");
      } else {
        nameLine = n.keyLine();
        if (n.value() instanceof Scalar s && !s.isNull() && POOL_NAME.matcher(s.text()).matches()) {
          name = s.text();
        } else {
          error(n.keyLine(), path + ".name", "expected a name of lower-case letters, digits and"
              + " '-' (at most 63, starting and ending with a letter or digit), got "
              + n.value().shown());
        }
      }
      TreeMap<String, String> labels = labels(m, path);
      List<Taint> taints = taints(m, path);
      Optional<Path> host = Optional.empty();
      Entry h = m.entries().get("hostProfile");
      if (h != null) {
        if (isText(h.value()) && !((Scalar) h.value()).text().isBlank()) {
          Path p = base.resolve(((Scalar) h.value()).text()).normalize();
          if (!Files.isRegularFile(p)) {
            error(h.keyLine(), path + ".hostProfile",
                "no such file " + ((Scalar) h.value()).text() + " (relative to this file's folder)");
          } else {
            host = Optional.of(p);
          }
        } else {
          error(h.keyLine(), path + ".hostProfile",
              "expected the path of a host profile file, got " + h.value().shown());
        }
      }
      Optional<Resources> worker = Optional.empty();
      Entry w = m.entries().get("worker");
      if (w != null) {
        if (w.value() instanceof Scalar s && ONE_NODE.equals(s.text())) {
          // the default shape, written out
        } else if (w.value() instanceof MapNode wm) {
          worker = worker(wm, path + ".worker", w.keyLine());
        } else {
          error(w.keyLine(), path + ".worker",
              "expected one-node or a mapping with cpu and memory, got " + w.value().shown());
        }
      }
      int perNode = 1;
      Entry k = m.entries().get("workersPerNode");
      if (k != null) {
        if (k.value() instanceof Scalar s && s.token() == JsonToken.VALUE_NUMBER_INT
            && parseInt(s.text()) >= 1 && parseInt(s.text()) <= 64) {
          perNode = parseInt(s.text());
          if (perNode > 1 && worker.isPresent()) {
            error(k.keyLine(), path + ".workersPerNode",
                "applies to the one-node shape only, not to a worker with cpu and memory");
          }
        } else {
          error(k.keyLine(), path + ".workersPerNode",
              "expected a whole number from 1 to 64, got " + k.value().shown());
        }
      }
      if (errors.size() > before || name == null) {
        return null;
      }
      return new PoolSpec(name, labels, taints, host, worker, perNode, new SourceRef(file, nameLine));
    }

    private static int parseInt(String s) {
      try {
        return Integer.parseInt(s);
      } catch (NumberFormatException e) {
        return -1;
      }
    }

    private TreeMap<String, String> labels(MapNode m, String path) {
      TreeMap<String, String> out = new TreeMap<>();
      Entry e = m.entries().get("labels");
      if (e == null) {
        return out;
      }
      if (!(e.value() instanceof MapNode lm)) {
        error(e.keyLine(), path + ".labels", "expected a mapping of label keys to values, got "
            + e.value().shown());
        return out;
      }
      for (Entry l : lm.entries().values()) {
        String where = path + ".labels." + l.key();
        if (!validKey(l.key())) {
          error(l.keyLine(), where, "expected a label key such as example.com/tier (an optional"
              + " DNS prefix and '/', then a name of at most 63 letters, digits, '-', '_', '.')");
          continue;
        }
        if (!(l.value() instanceof Scalar s) || s.isNull()
            || !(s.text().isEmpty() || LABEL_NAME.matcher(s.text()).matches())) {
          error(l.keyLine(), where, "expected a label value (at most 63 letters, digits, '-',"
              + " '_', '.'), got " + l.value().shown());
          continue;
        }
        out.put(l.key(), s.text());
      }
      return out;
    }

    private List<Taint> taints(MapNode m, String path) {
      List<Taint> out = new ArrayList<>();
      Entry e = m.entries().get("taints");
      if (e == null) {
        return out;
      }
      if (!(e.value() instanceof ListNode list)) {
        error(e.keyLine(), path + ".taints", "expected a list of taints (key, value, effect), got "
            + e.value().shown());
        return out;
      }
      Set<String> seen = new TreeSet<>();
      for (int i = 0; i < list.items().size(); i++) {
        Node item = list.items().get(i);
        String where = path + ".taints[" + i + "]";
        if (!(item instanceof MapNode tm)) {
          error(item.line(), where, "expected a taint mapping (key, value, effect), got "
              + item.shown());
          continue;
        }
        int before = errors.size();
        checkKeys(tm, where, TAINT_KEYS);
        Entry key = tm.entries().get("key");
        Entry value = tm.entries().get("value");
        Entry effect = tm.entries().get("effect");
        if (key == null) {
          error(tm.line(), where + ".key", "missing; expected a taint key such as dedicated");
        } else if (!(key.value() instanceof Scalar ks) || !validKey(ks.text())) {
          error(key.keyLine(), where + ".key", "expected a taint key such as dedicated, got "
              + key.value().shown());
        }
        if (value != null && (!(value.value() instanceof Scalar vs) || vs.isNull()
            || !(vs.text().isEmpty() || LABEL_NAME.matcher(vs.text()).matches()))) {
          error(value.keyLine(), where + ".value", "expected a taint value (at most 63 letters,"
              + " digits, '-', '_', '.'), got " + value.value().shown());
        }
        Optional<Taint.Effect> eff = Optional.empty();
        if (effect == null) {
          error(tm.line(), where + ".effect",
              "missing; expected NoSchedule, PreferNoSchedule or NoExecute");
        } else {
          eff = effect.value() instanceof Scalar es ? Taint.Effect.of(es.text()) : Optional.empty();
          if (eff.isEmpty()) {
            error(effect.keyLine(), where + ".effect",
                "expected NoSchedule, PreferNoSchedule or NoExecute, got "
                    + effect.value().shown());
          }
        }
        if (errors.size() > before) {
          continue;
        }
        Taint t =
            new Taint(((Scalar) key.value()).text(),
                value == null ? "" : ((Scalar) value.value()).text(), eff.get());
        if (!seen.add(t.key() + ":" + t.effect().apiName())) {
          error(tm.line(), where, "a taint with key " + t.key() + " and effect "
              + t.effect().apiName() + " is already given for this pool");
          continue;
        }
        out.add(t);
      }
      return out;
    }

    private Optional<Resources> worker(MapNode wm, String path, int line) {
      checkKeys(wm, path, WORKER_KEYS);
      Long cpu = null;
      Entry c = wm.entries().get("cpu");
      if (c == null) {
        error(line, path + ".cpu", "missing; expected whole vCPUs such as 16");
      } else if (c.value() instanceof Scalar s && s.token() == JsonToken.VALUE_NUMBER_INT
          && parseInt(s.text()) >= 1) {
        cpu = parseInt(s.text()) * 1000L;
      } else {
        error(c.keyLine(), path + ".cpu", "expected whole vCPUs (1 or more) such as 16, got "
            + c.value().shown());
      }
      Long memory = null;
      Entry mem = wm.entries().get("memory");
      if (mem == null) {
        error(line, path + ".memory", "missing; expected a size such as 64Gi");
      } else {
        memory = size(mem.value());
        if (memory == null || memory <= 0) {
          error(mem.keyLine(), path + ".memory", "expected a size above zero such as 64Gi, got "
              + mem.value().shown());
          memory = null;
        }
      }
      if (cpu == null || memory == null) {
        return Optional.empty();
      }
      return Optional.of(Resources.of(Resources.CPU, cpu, Resources.MEMORY, memory));
    }

    /** Bytes from a Kubernetes quantity or a plain number; null when not one. */
    private static Long size(Node n) {
      if (!(n instanceof Scalar s) || s.isNull()
          || (s.token() != JsonToken.VALUE_STRING && s.token() != JsonToken.VALUE_NUMBER_INT)) {
        return null;
      }
      try {
        BigDecimal b = Quantity.getAmountInBytes(Quantity.parse(s.text()));
        return b.longValueExact();
      } catch (RuntimeException e) {
        // Quantity parses leniently and fails only when the amount is read (LIBRARIES.md).
        return null;
      }
    }

    private static boolean validKey(String key) {
      if (key == null || key.isEmpty()) {
        return false;
      }
      int slash = key.indexOf('/');
      String name = slash < 0 ? key : key.substring(slash + 1);
      if (slash >= 0) {
        String prefix = key.substring(0, slash);
        if (prefix.isEmpty() || prefix.length() > 253 || !DNS_SUBDOMAIN.matcher(prefix).matches()) {
          return false;
        }
      }
      return LABEL_NAME.matcher(name).matches();
    }
  }
}
