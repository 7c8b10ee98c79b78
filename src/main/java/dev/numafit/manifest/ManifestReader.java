package dev.numafit.manifest;

import dev.numafit.demand.Admission;
import dev.numafit.demand.Demand;
import dev.numafit.demand.EffectivePod;
import dev.numafit.demand.LimitDefaults;
import dev.numafit.demand.PlacementRules;
import dev.numafit.demand.PodArithmetic;
import dev.numafit.demand.PodModel;
import dev.numafit.demand.ReplicaRules;
import dev.numafit.demand.ReplicaMode;
import dev.numafit.demand.Replicas;
import dev.numafit.demand.Workload;
import dev.numafit.demand.WorkloadId;
import dev.numafit.demand.WorkloadSource;
import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.SourceRef;
import io.fabric8.kubernetes.api.model.LimitRange;
import io.fabric8.kubernetes.api.model.LimitRangeItem;
import io.fabric8.kubernetes.api.model.Pod;
import io.fabric8.kubernetes.api.model.PodTemplateSpec;
import io.fabric8.kubernetes.api.model.ReplicationController;
import io.fabric8.kubernetes.api.model.apps.DaemonSet;
import io.fabric8.kubernetes.api.model.apps.Deployment;
import io.fabric8.kubernetes.api.model.apps.ReplicaSet;
import io.fabric8.kubernetes.api.model.apps.StatefulSet;
import io.fabric8.kubernetes.api.model.autoscaling.v2.HorizontalPodAutoscaler;
import io.fabric8.kubernetes.api.model.batch.v1.CronJob;
import io.fabric8.kubernetes.api.model.batch.v1.Job;
import io.fabric8.kubernetes.api.model.batch.v1.JobSpec;
import io.fabric8.kubernetes.api.model.node.v1.RuntimeClass;
import io.fabric8.kubernetes.client.utils.KubernetesSerialization;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.math.BigDecimal;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.SortedMap;
import java.util.TreeMap;
import java.util.function.Function;
import java.util.stream.Stream;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.DatabindException;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.exc.MismatchedInputException;

/**
 * Reads Kubernetes manifests (files, directories, standard input) into {@link Demand}: one {@link
 * Workload} per pod-bearing object with Kubernetes' own request arithmetic applied (limits-only
 * defaulting, LimitRange defaults, RuntimeClass overhead, sidecar ordering, pod-level resources)
 * and its replica count (HorizontalPodAutoscaler peaks, Job parallelism, DaemonSets per worker).
 *
 * <p>It never throws for bad input: each problem is a {@link Diagnostic} in {@link
 * Demand#diagnostics()}, an invalid object is left out with an error, and everything valid is still
 * read. Output order is fixed (workloads by id, diagnostics by place), so the same input gives the
 * same result.
 */
public final class ManifestReader {
  /** How standard input is shown in messages. */
  public static final String STDIN = "<stdin>";

  private static final String GUESS_FLAG = "sized from a custom resource: a guess";
  /**
   * fabric8's serialization, shared: its deserializer cache is costly to build and safe to use
   * from any thread. Built on first use, as plain workloads ({@link PlainWorkloads}) never need it.
   */
  private static final class K8s {
    static final KubernetesSerialization INSTANCE = new KubernetesSerialization();
  }
  private final DocumentReader documents;
  private final int maxChars;

  /**
   * Largest input read by default, in characters, for one file (or standard input) and for one
   * YAML document or JSON value in it (32 Mi): above the manifests people render, low enough that
   * a runaway input is refused before it is read, in bounded memory.
   */
  public static final int DEFAULT_MAX_DOCUMENT_CHARS = 32 << 20;

  /** A reader with the default limits. */
  public ManifestReader() {
    this(DEFAULT_MAX_DOCUMENT_CHARS);
  }

  /**
   * A reader that accepts YAML documents and JSON values up to {@code maxDocumentChars}
   * characters (nesting depth and YAML aliases keep their fixed limits).
   */
  public ManifestReader(int maxDocumentChars) {
    if (maxDocumentChars <= 0) {
      throw new IllegalArgumentException("maxDocumentChars must be positive");
    }
    this.documents = new DocumentReader(maxDocumentChars);
    this.maxChars = maxDocumentChars;
  }

  private String tooLarge(String what, long size) {
    return what
        + " "
        + size
        + " bytes, more than numafit reads from one input ("
        + maxChars
        + " characters); raise the limit with --max-document-size if the input is meant to be"
        + " this large";
  }

  /**
   * Reads every path in order.
   *
   * @param paths files ({@code .yaml}, {@code .yml}, {@code .json}), directories (read recursively
   *     in sorted path order, only those extensions) or {@code -} for {@code stdin}
   */
  public Demand read(List<String> paths, InputStream stdin, ReadOptions opts) {
    return readLocated(paths, stdin, opts).demand();
  }

  /**
   * Reads every path in order, as {@link #read}, and also returns where each workload's pod
   * template, replica count and containers are written, for messages that point at the line to
   * change.
   */
  public ManifestRead readLocated(List<String> paths, InputStream stdin, ReadOptions opts) {
    Reading s = new Reading(opts);
    boolean stdinRead = false;
    for (String path : paths) {
      if ("-".equals(path)) {
        if (stdinRead) {
          s.diags.add(
              Diagnostic.warning(new SourceRef(STDIN, 0), "standard input given twice; read once"));
          continue;
        }
        stdinRead = true;
        if (stdin == null) {
          s.diags.add(Diagnostic.error(new SourceRef(STDIN, 0), "no standard input to read"));
          continue;
        }
        s.readStdin(stdin);
        continue;
      }
      s.readPath(path);
    }
    return new ManifestRead(s.finish(), s.sources);
  }

  /**
   * Reads manifests given as text, each named as it should appear in messages (for example {@code
   * main:deploy/app.yaml} for a file read from a git revision), in name order. A name ending in
   * {@code .json} is read as JSON.
   */
  public ManifestRead readTexts(SortedMap<String, String> texts, ReadOptions opts) {
    Reading s = new Reading(opts);
    texts.forEach(
        (name, text) -> s.readText(name, text, name.toLowerCase(Locale.ROOT).endsWith(".json")));
    return new ManifestRead(s.finish(), s.sources);
  }

  /** A pod-bearing object waiting for namespace-wide rules (LimitRange, RuntimeClass, HPA). */
  private record Candidate(
      WorkloadId id,
      SourceRef source,
      PodModel pod,
      Replicas replicas,
      boolean perWorker,
      boolean custom,
      boolean scalable) {}

  /** Where a candidate's pod template, replica count and containers are written. */
  private record Lines(
      SourceRef template,
      Optional<SourceRef> replicas,
      SortedMap<String, SourceRef> containers,
      PlacementRules rules) {}

  /**
   * The lines of a pod spec at {@code specPtr}: the template, each container's {@code resources}
   * key (the container's own line when it has none) and the replica count at {@code replicasPtr}
   * when it is written.
   */
  private static Lines lines(LocatedDocument doc, String specPtr, String replicasPtr) {
    SortedMap<String, SourceRef> containers = new TreeMap<>();
    for (String list : List.of("/initContainers", "/containers")) {
      JsonNode arr = doc.at(specPtr + list);
      if (!arr.isArray()) {
        continue;
      }
      for (int i = 0; i < arr.size(); i++) {
        String cptr = specPtr + list + "/" + i;
        String name = text(arr.get(i).get("name"));
        String at = arr.get(i).has("resources") ? cptr + "/resources" : cptr;
        containers.putIfAbsent(
            name == null ? "#" + i : name, new SourceRef(doc.file(), doc.keyLine(at)));
      }
    }
    Optional<SourceRef> replicas =
        replicasPtr != null && doc.lines().containsKey(replicasPtr)
            ? Optional.of(new SourceRef(doc.file(), doc.line(replicasPtr)))
            : Optional.empty();
    String templatePtr =
        specPtr.endsWith("/spec") && !specPtr.equals("/spec")
            ? specPtr.substring(0, specPtr.length() - 5)
            : specPtr;
    return new Lines(
        new SourceRef(doc.file(), doc.keyLine(templatePtr)),
        replicas,
        containers,
        PlacementReader.read(
            doc.at(specPtr),
            doc.at(
                (specPtr.endsWith("/spec") ? specPtr.substring(0, specPtr.length() - 5) : specPtr)
                    + "/metadata/labels")));
  }

  private record Autoscaler(
      String label,
      String namespace,
      String targetKind,
      String targetName,
      int maxReplicas,
      SourceRef source,
      SourceRef maxReplicasAt) {}

  private record NamedLimits(String name, LimitDefaults defaults, SourceRef source) {}

  private record Overhead(SortedMap<String, BigDecimal> podFixed, SourceRef source) {}

  /** State of one {@link #read} call. */
  private final class Reading {
    final ReadOptions opts;
    final List<Diagnostic> diags = new ArrayList<>();
    final Map<String, SourceRef> seen = new LinkedHashMap<>();
    final Map<String, Candidate> workloads = new LinkedHashMap<>();
    final Map<String, List<Candidate>> customs = new LinkedHashMap<>();
    final Map<String, Autoscaler> autoscalers = new LinkedHashMap<>();
    final Map<String, Map<String, NamedLimits>> limitRanges = new TreeMap<>();
    final Map<String, Overhead> runtimeClasses = new TreeMap<>();
    final Map<String, String> skipped = new LinkedHashMap<>();
    final SortedMap<WorkloadId, WorkloadSource> sources = new TreeMap<>();
    final Map<Candidate, Lines> candidateLines = new java.util.IdentityHashMap<>();
    int unnamed;

    Reading(ReadOptions opts) {
      this.opts = opts;
    }

    void readStdin(InputStream in) {
      String text;
      try {
        byte[] bytes = in.readNBytes(maxChars + 1);
        if (bytes.length > maxChars) {
          diags.add(
              Diagnostic.error(
                  new SourceRef(STDIN, 1), tooLarge("standard input is over", maxChars)));
          return;
        }
        text = new String(bytes, StandardCharsets.UTF_8);
      } catch (IOException e) {
        diags.add(
            Diagnostic.error(
                new SourceRef(STDIN, 0), "cannot read standard input: " + e.getMessage()));
        return;
      }
      String t = text.stripLeading();
      boolean looksJson = t.startsWith("{") || t.startsWith("[");
      if (looksJson) {
        // A JSON stream may be two objects back to back, which is not YAML; try JSON first and
        // fall back to YAML (flow-style YAML also starts with a brace).
        List<Diagnostic> jsonDiags = new ArrayList<>();
        List<LocatedDocument> docs = new ArrayList<>();
        DocumentReader.Outcome o = documents.read(STDIN, text, true, docs::add, jsonDiags);
        if (jsonDiags.isEmpty()) {
          finishText(STDIN, text, docs, o, jsonDiags);
          return;
        }
      }
      readText(STDIN, text, false);
    }

    void readPath(String path) {
      Path p;
      try {
        p = Path.of(path);
      } catch (InvalidPathException e) {
        diags.add(Diagnostic.error(new SourceRef(path, 0), "not a valid path: " + e.getReason()));
        return;
      }
      if (!Files.exists(p)) {
        diags.add(
            Diagnostic.error(
                new SourceRef(path, 0),
                "no such file or directory (expected a .yaml, .yml or .json file, a directory,"
                    + " or - for standard input)"));
        return;
      }
      if (Files.isDirectory(p)) {
        List<String> files = new ArrayList<>();
        try (Stream<Path> walk = Files.walk(p)) {
          walk.filter(Files::isRegularFile)
              .filter(f -> isManifest(f) && !hidden(p, f))
              .map(f -> f.toString())
              .sorted()
              .forEach(files::add);
        } catch (IOException | UncheckedIOException e) {
          diags.add(
              Diagnostic.error(new SourceRef(path, 0), "cannot list directory: " + e.getMessage()));
          return;
        }
        if (files.isEmpty()) {
          diags.add(
              Diagnostic.warning(
                  new SourceRef(path, 0), "no .yaml, .yml or .json files in this directory"));
        }
        files.forEach(f -> readFile(Path.of(f), f));
        return;
      }
      readFile(p, path);
    }

    void readFile(Path p, String shown) {
      String text;
      byte[] bytes = null;
      try {
        long size = Files.size(p);
        if (size > maxChars) {
          // Refused before reading: a runaway file must not fill the heap.
          diags.add(Diagnostic.error(new SourceRef(shown, 1), tooLarge("this file is", size)));
          return;
        }
        bytes = Files.readAllBytes(p);
        text = decode(bytes);
      } catch (CharacterCodingException e) {
        diags.add(
            Diagnostic.error(
                new SourceRef(shown, firstBadLine(bytes)),
                "not UTF-8 text (expected a YAML or JSON manifest in UTF-8, or UTF-16 with a"
                    + " byte order mark)"));
        return;
      } catch (IOException e) {
        diags.add(Diagnostic.error(new SourceRef(shown, 0), "cannot read: " + e.getMessage()));
        return;
      }
      boolean json = shown.toLowerCase(Locale.ROOT).endsWith(".json");
      readText(shown, text, json);
    }

    /**
     * UTF-8 text, or UTF-16 when the bytes start with its byte order mark (YAML 1.2 allows both;
     * some editors on one desktop system save UTF-16).
     */
    private String decode(byte[] bytes) throws CharacterCodingException {
      boolean utf16 =
          bytes.length >= 2
              && ((bytes[0] == (byte) 0xFE && bytes[1] == (byte) 0xFF)
                  || (bytes[0] == (byte) 0xFF && bytes[1] == (byte) 0xFE));
      java.nio.charset.Charset cs = utf16 ? StandardCharsets.UTF_16 : StandardCharsets.UTF_8;
      return cs.newDecoder().decode(java.nio.ByteBuffer.wrap(bytes)).toString();
    }

    /** The 1-based line of the first byte that is not UTF-8. */
    private int firstBadLine(byte[] bytes) {
      java.nio.ByteBuffer in = java.nio.ByteBuffer.wrap(bytes);
      java.nio.CharBuffer out = java.nio.CharBuffer.allocate(bytes.length + 1);
      StandardCharsets.UTF_8.newDecoder().decode(in, out, true);
      int line = 1;
      for (int i = 0; i < in.position(); i++) {
        if (bytes[i] == '\n') {
          line++;
        }
      }
      return line;
    }

    void readText(String file, String text, boolean json) {
      if (text.startsWith("\uFEFF")) {
        text = text.substring(1);
      }
      if (text.isBlank()) {
        diags.add(Diagnostic.warning(new SourceRef(file, 0), "empty file"));
        return;
      }
      // Each document is read as soon as it is parsed, so its tree and line table become garbage
      // at once instead of all of them staying alive until the end of the file.
      DocumentReader.Outcome o =
          documents.read(
              file,
              text,
              json,
              new DocumentReader.Sink() {
                @Override
                public void document(LocatedDocument doc) {
                  readDocument(doc);
                }

                @Override
                public void listItem(LocatedDocument item, String listKind) {
                  readListItem(item, listKind);
                }
              },
              diags);
      finishText(file, text, List.of(), o, List.of());
    }

    void finishText(
        String file,
        String text,
        List<LocatedDocument> docs,
        DocumentReader.Outcome o,
        List<Diagnostic> fileDiags) {
      diags.addAll(fileDiags);
      if (o.emptyDocuments > 0) {
        diags.add(
            Diagnostic.note(
                new SourceRef(file, 0),
                "skipped "
                    + o.emptyDocuments
                    + (o.emptyDocuments == 1
                        ? " empty or comment-only document"
                        : " empty or comment-only documents")));
      }
      docs.forEach(this::readDocument);
    }

    void readDocument(LocatedDocument doc) {
      try {
        document(doc);
      } catch (RuntimeException e) {
        // A safety net: whatever an unexpected document does, the rest is still read.
        diags.add(
            Diagnostic.error(
                new SourceRef(doc.file(), doc.startLine()),
                "cannot read this document ("
                    + e.getClass().getSimpleName()
                    + ": "
                    + e.getMessage()
                    + ")"));
      }
    }

    /** One item of a list read on its own ({@link DocumentReader.Sink#listItem}). */
    void readListItem(LocatedDocument item, String listKind) {
      try {
        String itemKind = listKind.equals("List") ? null : listKind.substring(0, listKind.length() - 4);
        JsonNode node = item.root();
        String k = text(node.get("kind"));
        if (!node.isObject() || (k == null && itemKind == null)) {
          diags.add(
              Diagnostic.note(
                  new SourceRef(item.file(), item.startLine()),
                  "list item is not a Kubernetes object (no kind), skipped"));
          return;
        }
        object(item, "", node, k == null ? itemKind : k);
      } catch (RuntimeException e) {
        // The same safety net as for a whole document.
        diags.add(
            Diagnostic.error(
                new SourceRef(item.file(), item.startLine()),
                "cannot read this document ("
                    + e.getClass().getSimpleName()
                    + ": "
                    + e.getMessage()
                    + ")"));
      }
    }

    void document(LocatedDocument doc) {
      JsonNode root = doc.root();
      String kind = text(root.get("kind"));
      if (!root.isObject() || kind == null || kind.isBlank()) {
        diags.add(
            Diagnostic.note(
                new SourceRef(doc.file(), doc.startLine()),
                "not a Kubernetes object (no kind), skipped"));
        return;
      }
      JsonNode items = root.get("items");
      if (kind.endsWith("List") && items != null && (items.isArray() || items.isNull())) {
        String itemKind = kind.equals("List") ? null : kind.substring(0, kind.length() - 4);
        if (items.isArray()) {
          for (int i = 0; i < items.size(); i++) {
            String ptr = "/items/" + i;
            JsonNode item = items.get(i);
            String k = text(item.get("kind"));
            if (!item.isObject() || (k == null && itemKind == null)) {
              diags.add(
                  Diagnostic.note(
                      new SourceRef(doc.file(), doc.line(ptr)),
                      "list item is not a Kubernetes object (no kind), skipped"));
              continue;
            }
            object(doc, ptr, item, k == null ? itemKind : k);
          }
        }
        return;
      }
      object(doc, "", root, kind);
    }

    void object(LocatedDocument doc, String ptr, JsonNode node, String kind) {
      String apiVersion = text(node.get("apiVersion"));
      JsonNode meta = node.path("metadata");
      String namespace = scalar(meta.get("namespace"));
      if (namespace == null || namespace.isBlank()) {
        namespace = "default";
      }
      String name = scalar(meta.get("name"));
      boolean named = name != null && !name.isBlank();
      boolean generated = false;
      if (!named) {
        String generate = scalar(meta.get("generateName"));
        generated = generate != null && !generate.isBlank();
        name = generated ? generate + "*" : "(unnamed)";
      }
      WorkloadId id = new WorkloadId(namespace, kind, name);
      int kindLine = doc.lines().getOrDefault(ptr + "/kind", doc.line(ptr));
      SourceRef source = new SourceRef(doc.file(), kindLine);
      if (!named && !generated) {
        // The API server rejects an object without a name; size it all the same, but say so.
        diags.add(
            Diagnostic.warning(
                source,
                id
                    + ": no metadata.name (expected metadata.name or metadata.generateName);"
                    + " read as "
                    + name));
      }
      String key = named ? id.toString() : id + "@" + source + "#" + (unnamed++);
      ObjectContext ctx = new ObjectContext(doc, id.toString());

      Optional<KnownKind> known = KnownKind.of(kind);
      if (known.isPresent()) {
        KnownKind k = known.get();
        if (apiVersion == null || apiVersion.isBlank()) {
          diags.add(Diagnostic.warning(source, id + ": no apiVersion; read as " + k.current));
        } else if (k.older.contains(apiVersion)) {
          diags.add(
              Diagnostic.note(
                  source,
                  id
                      + ": old apiVersion "
                      + apiVersion
                      + " (now "
                      + k.current
                      + "); read with the current schema"));
        } else if (!k.isCurrent(apiVersion)) {
          diags.add(
              Diagnostic.warning(
                  source,
                  id
                      + ": unknown apiVersion "
                      + apiVersion
                      + " for "
                      + kind
                      + " (expected "
                      + k.current
                      + "); read as "
                      + k.current));
        }
        boolean ok = known(k, node, ptr, id, source, key, ctx);
        if (!ctx.errors.isEmpty()) {
          diags.addAll(ctx.errors);
          return;
        }
        if (ok) {
          duplicate(key, source, id);
        }
        return;
      }
      List<String> templates = new ArrayList<>();
      findTemplates(node.path("spec"), ptr + "/spec", templates);
      if (templates.isEmpty()) {
        if (seen.containsKey(key)) {
          duplicate(key, source, id);
        }
        seen.put(key, source);
        skipped.put(key, kind);
        return;
      }
      List<Candidate> found = new ArrayList<>();
      for (String tptr : templates) {
        PodTemplateSpec template = convert(doc.at(tptr), PodTemplateSpec.class, tptr, ctx);
        if (template == null) {
          continue;
        }
        PodModel pod = PodSpecs.toModel(template.getSpec(), tptr + "/spec", ctx);
        String parent = tptr.substring(0, tptr.lastIndexOf('/'));
        JsonNode replicasNode = doc.at(parent).get("replicas");
        Replicas replicas;
        if (replicasNode != null
            && replicasNode.isIntegralNumber()
            && replicasNode.asLong() >= 0
            && replicasNode.canConvertToInt()) {
          replicas =
              new Replicas(
                  replicasNode.asInt(),
                  replicasNode.asInt(),
                  "replicas beside the pod template (a guess)");
        } else {
          replicas = new Replicas(1, 1, "1 assumed: no replicas beside the pod template (a guess)");
        }
        WorkloadId cid =
            templates.size() == 1
                ? id
                : new WorkloadId(
                    namespace,
                    kind,
                    name + "[" + templateLabel(tptr.substring(ptr.length())) + "]");
        Candidate custom =
            new Candidate(
                cid, new SourceRef(doc.file(), doc.line(tptr)), pod, replicas, false, true, false);
        candidateLines.put(custom, lines(doc, tptr + "/spec", parent + "/replicas"));
        found.add(custom);
      }
      if (!ctx.errors.isEmpty()) {
        diags.addAll(ctx.errors);
        return;
      }
      duplicate(key, source, id);
      customs.put(key, found);
    }

    /** Reads a kind the tool knows; false when the object is left out. */
    boolean known(
        KnownKind k,
        JsonNode node,
        String ptr,
        WorkloadId id,
        SourceRef source,
        String key,
        ObjectContext ctx) {
      String spec = ptr + "/spec";
      String template = spec + "/template/spec";
      switch (k) {
        case POD -> {
          PlainWorkloads.Plain plain = PlainWorkloads.of(node, k);
          Pod o = plain != null ? null : convert(node, Pod.class, ptr, ctx);
          if (plain == null && o == null) {
            return false;
          }
          PodModel pod = PodSpecs.toModel(plain != null ? plain.podSpec() : o.getSpec(), spec, ctx);
          put(
              key,
              new Candidate(id, source, pod, ReplicaRules.pod(), false, false, false),
              ctx,
              lines(ctx.doc, spec, null));
        }
        case DEPLOYMENT -> {
          return scalableKind(
              k, node, ptr, id, source, key, ctx, template, spec, Deployment.class,
              o -> o.getSpec() == null ? null : o.getSpec().getReplicas(),
              o -> o.getSpec() == null ? null : o.getSpec().getTemplate());
        }
        case REPLICA_SET -> {
          return scalableKind(
              k, node, ptr, id, source, key, ctx, template, spec, ReplicaSet.class,
              o -> o.getSpec() == null ? null : o.getSpec().getReplicas(),
              o -> o.getSpec() == null ? null : o.getSpec().getTemplate());
        }
        case STATEFUL_SET -> {
          return scalableKind(
              k, node, ptr, id, source, key, ctx, template, spec, StatefulSet.class,
              o -> o.getSpec() == null ? null : o.getSpec().getReplicas(),
              o -> o.getSpec() == null ? null : o.getSpec().getTemplate());
        }
        case REPLICATION_CONTROLLER -> {
          return scalableKind(
              k, node, ptr, id, source, key, ctx, template, spec, ReplicationController.class,
              o -> o.getSpec() == null ? null : o.getSpec().getReplicas(),
              o -> o.getSpec() == null ? null : o.getSpec().getTemplate());
        }
        case DAEMON_SET -> {
          PlainWorkloads.Plain plain = PlainWorkloads.of(node, k);
          DaemonSet o = plain != null ? null : convert(node, DaemonSet.class, ptr, ctx);
          if (plain == null && o == null) {
            return false;
          }
          PodTemplateSpec t =
              plain != null
                  ? plain.template()
                  : o.getSpec() == null ? null : o.getSpec().getTemplate();
          PodModel pod = PodSpecs.toModel(t == null ? null : t.getSpec(), template, ctx);
          put(
              key,
              new Candidate(id, source, pod, ReplicaRules.daemonSet(), true, false, false),
              ctx,
              lines(ctx.doc, template, null));
        }
        case JOB -> {
          Job o = convert(node, Job.class, ptr, ctx);
          if (o == null) {
            return false;
          }
          job(key, id, source, o.getSpec(), spec, ctx);
        }
        case CRON_JOB -> {
          CronJob o = convert(node, CronJob.class, ptr, ctx);
          if (o == null) {
            return false;
          }
          var jt = o.getSpec() == null ? null : o.getSpec().getJobTemplate();
          job(key, id, source, jt == null ? null : jt.getSpec(), spec + "/jobTemplate/spec", ctx);
        }
        case HORIZONTAL_POD_AUTOSCALER -> {
          HorizontalPodAutoscaler o = convert(node, HorizontalPodAutoscaler.class, ptr, ctx);
          if (o == null) {
            return false;
          }
          var s = o.getSpec();
          if (s == null
              || s.getMaxReplicas() == null
              || s.getScaleTargetRef() == null
              || s.getScaleTargetRef().getKind() == null
              || s.getScaleTargetRef().getName() == null) {
            ctx.error(spec, "spec.maxReplicas and spec.scaleTargetRef (kind, name) are required");
            return false;
          }
          // minReplicas defaults to 1 and maxReplicas may not be below it (HPA API reference, K20).
          int min = s.getMinReplicas() == null ? 1 : s.getMinReplicas();
          if (s.getMaxReplicas() < min) {
            ctx.error(
                spec + "/maxReplicas",
                "spec.maxReplicas "
                    + s.getMaxReplicas()
                    + " is below minReplicas "
                    + min
                    + (s.getMinReplicas() == null ? " (the default)" : "")
                    + " (expected maxReplicas >= minReplicas)");
            return false;
          }
          autoscalers.put(
              key,
              new Autoscaler(
                  id.namespace() + "/" + id.name(),
                  id.namespace(),
                  s.getScaleTargetRef().getKind(),
                  s.getScaleTargetRef().getName(),
                  s.getMaxReplicas(),
                  source,
                  new SourceRef(ctx.doc.file(), ctx.doc.line(spec + "/maxReplicas"))));
        }
        case LIMIT_RANGE -> {
          LimitRange o = convert(node, LimitRange.class, ptr, ctx);
          if (o == null) {
            return false;
          }
          LimitDefaults d = LimitDefaults.NONE;
          List<LimitRangeItem> items =
              o.getSpec() == null || o.getSpec().getLimits() == null
                  ? List.of()
                  : o.getSpec().getLimits();
          for (int i = 0; i < items.size(); i++) {
            LimitRangeItem item = items.get(i);
            if (item == null || !"Container".equals(item.getType())) {
              continue;
            }
            String ip = spec + "/limits/" + i;
            d =
                d.then(
                    LimitDefaults.fromItem(
                        PodSpecs.quantities(
                            item.getMax(), ip + "/max", "spec.limits[" + i + "].max", ctx),
                        PodSpecs.quantities(
                            item.getMin(), ip + "/min", "spec.limits[" + i + "].min", ctx),
                        PodSpecs.quantities(
                            item.getDefault(),
                            ip + "/default",
                            "spec.limits[" + i + "].default",
                            ctx),
                        PodSpecs.quantities(
                            item.getDefaultRequest(),
                            ip + "/defaultRequest",
                            "spec.limits[" + i + "].defaultRequest",
                            ctx)));
          }
          if (ctx.errors.isEmpty()) {
            limitRanges
                .computeIfAbsent(id.namespace(), n -> new TreeMap<>())
                .put(key, new NamedLimits(id.name(), d, source));
          }
        }
        case RUNTIME_CLASS -> {
          RuntimeClass o = convert(node, RuntimeClass.class, ptr, ctx);
          if (o == null) {
            return false;
          }
          SortedMap<String, BigDecimal> fixed = new TreeMap<>();
          if (o.getOverhead() != null) {
            fixed =
                PodSpecs.quantities(
                    o.getOverhead().getPodFixed(),
                    ptr + "/overhead/podFixed",
                    "overhead.podFixed",
                    ctx);
          }
          if (ctx.errors.isEmpty()) {
            runtimeClasses.put(id.name(), new Overhead(fixed, source));
          }
        }
        default -> throw new IllegalStateException(k.toString());
      }
      return true;
    }

    /**
     * Reads a workload kind that carries {@code spec.replicas} and {@code spec.template}: plain
     * objects through the quick path, the rest through fabric8's full conversion.
     */
    <T> boolean scalableKind(
        KnownKind k,
        JsonNode node,
        String ptr,
        WorkloadId id,
        SourceRef source,
        String key,
        ObjectContext ctx,
        String template,
        String spec,
        Class<T> type,
        Function<T, Integer> replicas,
        Function<T, PodTemplateSpec> podTemplate) {
      PlainWorkloads.Plain plain = PlainWorkloads.of(node, k);
      if (plain != null) {
        scalable(key, id, source, plain.replicas(), plain.template(), template, spec, ctx);
        return true;
      }
      T o = convert(node, type, ptr, ctx);
      if (o == null) {
        return false;
      }
      scalable(key, id, source, replicas.apply(o), podTemplate.apply(o), template, spec, ctx);
      return true;
    }

    void scalable(
        String key,
        WorkloadId id,
        SourceRef source,
        Integer replicas,
        PodTemplateSpec t,
        String templatePtr,
        String specPtr,
        ObjectContext ctx) {
      if (replicas != null && replicas < 0) {
        ctx.error(
            specPtr + "/replicas",
            "spec.replicas " + replicas + " is negative (expected 0 or more)");
        return;
      }
      PodModel pod = PodSpecs.toModel(t == null ? null : t.getSpec(), templatePtr, ctx);
      put(
          key,
          new Candidate(id, source, pod, ReplicaRules.scalable(replicas), false, false, true),
          ctx,
          lines(ctx.doc, templatePtr, specPtr + "/replicas"));
    }

    void job(
        String key,
        WorkloadId id,
        SourceRef source,
        JobSpec s,
        String jobSpecPtr,
        ObjectContext ctx) {
      Integer parallelism = s == null ? null : s.getParallelism();
      Integer completions = s == null ? null : s.getCompletions();
      if (parallelism != null && parallelism < 0) {
        ctx.error(
            jobSpecPtr + "/parallelism",
            "parallelism " + parallelism + " is negative (expected 0 or more)");
        return;
      }
      if (completions != null && completions < 0) {
        ctx.error(
            jobSpecPtr + "/completions",
            "completions " + completions + " is negative (expected 0 or more)");
        return;
      }
      PodTemplateSpec t = s == null ? null : s.getTemplate();
      PodModel pod =
          PodSpecs.toModel(t == null ? null : t.getSpec(), jobSpecPtr + "/template/spec", ctx);
      put(
          key,
          new Candidate(
              id, source, pod, ReplicaRules.job(parallelism, completions), false, false, false),
          ctx,
          lines(ctx.doc, jobSpecPtr + "/template/spec", jobSpecPtr + "/parallelism"));
    }

    void put(String key, Candidate c, ObjectContext ctx, Lines at) {
      if (ctx.errors.isEmpty()) {
        workloads.put(key, c);
        candidateLines.put(c, at);
      }
    }

    /** Records an object's place; a second definition warns and the later one wins. */
    void duplicate(String key, SourceRef source, WorkloadId id) {
      SourceRef before = seen.get(key);
      if (before != null && !before.equals(source)) {
        diags.add(
            Diagnostic.warning(
                source,
                id
                    + " is defined twice, at "
                    + before
                    + " and at "
                    + source
                    + "; the later definition is used"));
      }
      seen.put(key, source);
    }

    <T> T convert(JsonNode node, Class<T> type, String ptr, ObjectContext ctx) {
      try {
        return K8s.INSTANCE.convertValue(node, type);
      } catch (RuntimeException e) {
        DatabindException de = null;
        for (Throwable c = e; c != null; c = c.getCause()) {
          if (c instanceof DatabindException d) {
            de = d;
            break;
          }
        }
        StringBuilder pointer = new StringBuilder(ptr);
        StringBuilder dotted = new StringBuilder();
        Class<?> target = null;
        if (de != null) {
          List<JacksonException.Reference> path = de.getPath();
          // When converting a nested node (a custom resource's template), the path starts there.
          for (JacksonException.Reference r : path) {
            if (r.getPropertyName() != null) {
              pointer.append('/').append(LocatedDocument.segment(r.getPropertyName()));
              dotted.append(dotted.length() == 0 ? "" : ".").append(r.getPropertyName());
            } else if (r.getIndex() >= 0) {
              pointer.append('/').append(r.getIndex());
              dotted.append('[').append(r.getIndex()).append(']');
            }
          }
          if (de instanceof MismatchedInputException m) {
            target = m.getTargetType();
          }
          Throwable root = de;
          while (root.getCause() != null) {
            root = root.getCause();
          }
          // fabric8's Quantity deserializer rejects some forms (1e3m, 1K) with a bare message.
          String rootMessage = String.valueOf(root.getMessage()).toLowerCase(Locale.ROOT);
          if (target == null && rootMessage.contains("quantity")) {
            target = io.fabric8.kubernetes.api.model.Quantity.class;
          }
        }
        String field = dotted.length() == 0 ? "object" : dotted.toString();
        JsonNode value = ctx.doc.at(pointer.toString());
        String got =
            value == null || value.isMissingNode()
                ? "an unreadable value"
                : value.isObject()
                    ? "a mapping"
                    : value.isArray()
                        ? "a list"
                        : value.isNull() ? "null" : "\"" + value.asString() + "\"";
        ctx.error(pointer.toString(), field + " expects " + describe(target) + ", got " + got);
        return null;
      }
    }

    Demand finish() {
      Map<String, LimitDefaults> defaults = new TreeMap<>();
      limitRanges.forEach(
          (ns, byKey) -> {
            List<NamedLimits> sorted = new ArrayList<>(byKey.values());
            sorted.sort((a, b) -> a.name().compareTo(b.name()));
            LimitDefaults d = LimitDefaults.NONE;
            List<NamedLimits> withDefaults = new ArrayList<>();
            for (NamedLimits n : sorted) {
              d = d.then(n.defaults());
              if (!n.defaults().isEmpty()) {
                withDefaults.add(n);
              }
            }
            if (withDefaults.size() > 1) {
              // "Limit Ranges": with two or more, which default applies is not deterministic.
              NamedLimits first = withDefaults.get(0);
              diags.add(
                  Diagnostic.warning(
                      first.source(),
                      "namespace "
                          + ns
                          + " has "
                          + withDefaults.size()
                          + " LimitRanges with container defaults; Kubernetes applies them in no"
                          + " fixed order, so the first by name ("
                          + first.name()
                          + ") wins here for each resource it sets"));
            }
            defaults.put(ns, d);
          });

      Map<String, List<Autoscaler>> byTarget = new TreeMap<>();
      for (Autoscaler a : autoscalers.values()) {
        String target = a.namespace() + "/" + a.targetKind() + "/" + a.targetName();
        Candidate hit = workloads.get(target);
        if (hit == null || !hit.scalable()) {
          String why =
              customs.containsKey(target)
                  ? ", a custom resource: its replica count stays a guess"
                  : ", which is not a Deployment, ReplicaSet, StatefulSet or"
                      + " ReplicationController in the input";
          diags.add(
              Diagnostic.note(
                  a.source(),
                  "HorizontalPodAutoscaler "
                      + a.label()
                      + " targets "
                      + a.targetKind()
                      + " "
                      + a.targetName()
                      + why
                      + "; ignored"));
          continue;
        }
        byTarget.computeIfAbsent(target, t -> new ArrayList<>()).add(a);
      }

      List<Workload> sized = new ArrayList<>();
      List<Workload> unsized = new ArrayList<>();
      for (Candidate c : workloads.values()) {
        Workload w = admit(c, defaults, byTarget.getOrDefault(c.id().toString(), List.of()));
        if (w != null) {
          sized.add(w);
        }
      }
      for (List<Candidate> list : customs.values()) {
        for (Candidate c : list) {
          Workload w = admit(c, defaults, List.of());
          if (w != null) {
            (opts.includeCustom() ? sized : unsized).add(w);
          }
        }
      }
      sized.sort((a, b) -> a.id().compareTo(b.id()));
      unsized.sort((a, b) -> a.id().compareTo(b.id()));
      SortedMap<String, Integer> skippedByKind = new TreeMap<>();
      skipped.values().forEach(k -> skippedByKind.merge(k, 1, Integer::sum));
      List<Diagnostic> sorted = new ArrayList<>(diags);
      sorted.sort(null);
      return new Demand(sized, unsized, skippedByKind, sorted);
    }

    Workload admit(Candidate c, Map<String, LimitDefaults> defaults, List<Autoscaler> hpas) {
      List<String> flags = new ArrayList<>();
      PodModel pod = Admission.limitsAsRequests(c.pod());
      LimitDefaults d = defaults.getOrDefault(c.id().namespace(), LimitDefaults.NONE);
      PodModel defaulted = Admission.applyLimitDefaults(pod, d);
      if (!defaulted.equals(pod)) {
        flags.add("LimitRange defaults of namespace " + c.id().namespace() + " applied");
      }
      pod = defaulted;
      if (pod.runtimeClassName().isPresent()) {
        String rc = pod.runtimeClassName().get();
        Overhead o = runtimeClasses.get(rc);
        if (o == null) {
          diags.add(
              Diagnostic.warning(
                  c.source(),
                  c.id()
                      + ": RuntimeClass \""
                      + rc
                      + "\" is not in the input, so its pod overhead is unknown"
                      + (pod.overhead().isEmpty()
                          ? " and counted as zero"
                          : "; spec.overhead is used")));
          flags.add("overhead unknown: RuntimeClass " + rc + " not in input");
        } else if (!o.podFixed().isEmpty()) {
          if (!pod.overhead().isEmpty() && !pod.overhead().equals(o.podFixed())) {
            diags.add(
                Diagnostic.warning(
                    c.source(),
                    c.id()
                        + ": spec.overhead differs from"
                        + " RuntimeClass \""
                        + rc
                        + "\" overhead.podFixed; the RuntimeClass's is used"));
          }
          pod = Admission.applyOverhead(pod, o.podFixed());
        }
      }
      List<String> problems = PodArithmetic.validate(pod);
      if (!problems.isEmpty()) {
        for (String p : problems) {
          diags.add(Diagnostic.error(c.source(), c.id() + ": " + p));
        }
        return null;
      }
      EffectivePod eff = PodArithmetic.effective(pod);
      Replicas replicas = c.replicas();
      if (!hpas.isEmpty()) {
        Autoscaler top = hpas.get(0);
        for (Autoscaler a : hpas) {
          if (a.maxReplicas() > top.maxReplicas()) {
            top = a;
          }
        }
        if (hpas.size() > 1) {
          diags.add(
              Diagnostic.warning(
                  c.source(),
                  c.id()
                      + " is the target of "
                      + hpas.size()
                      + " HorizontalPodAutoscalers; the largest maxReplicas ("
                      + top.label()
                      + ") is used"));
        }
        replicas =
            ReplicaRules.autoscaled(replicas, top.maxReplicas(), top.label(), opts.replicaMode());
      }
      if (c.custom()) {
        flags.add(GUESS_FLAG);
      }
      Lines at = candidateLines.get(c);
      if (at != null) {
        Optional<SourceRef> replicasAt = at.replicas();
        if (!hpas.isEmpty() && opts.replicaMode() == ReplicaMode.PEAK) {
          Autoscaler top = hpas.get(0);
          for (Autoscaler a : hpas) {
            if (a.maxReplicas() > top.maxReplicas()) {
              top = a;
            }
          }
          replicasAt = Optional.of(top.maxReplicasAt());
        }
        sources.put(c.id(), new WorkloadSource(at.template(), replicasAt, at.containers(), pod));
      }
      return new Workload(
          c.id(),
          c.source(),
          replicas,
          eff,
          c.perWorker(),
          c.custom(),
          flags,
          at == null ? PlacementRules.NONE : at.rules());
    }
  }

  private static boolean isManifest(Path f) {
    String n = f.getFileName().toString().toLowerCase(Locale.ROOT);
    return n.endsWith(".yaml") || n.endsWith(".yml") || n.endsWith(".json");
  }

  private static boolean hidden(Path root, Path f) {
    for (Path part : root.relativize(f)) {
      if (part.toString().startsWith(".")) {
        return true;
      }
    }
    return false;
  }

  private static String text(JsonNode n) {
    return n != null && n.isString() ? n.asString() : null;
  }

  /** A string or number as text ({@code name: 123} names an object "123"), else null. */
  private static String scalar(JsonNode n) {
    return n != null && (n.isString() || n.isNumber()) ? n.asString() : null;
  }

  /**
   * A template's place in its object: {@code /spec/workerGroupSpecs/0/template} → {@code
   * spec.workerGroupSpecs[0]}; a named template such as {@code workerTemplate} keeps its name.
   */
  private static String templateLabel(String pointer) {
    String p = pointer.endsWith("/template") ? pointer.substring(0, pointer.length() - 9) : pointer;
    return dotted(p);
  }

  /** {@code /spec/workerGroupSpecs/0} → {@code spec.workerGroupSpecs[0]}. */
  private static String dotted(String pointer) {
    StringBuilder b = new StringBuilder();
    for (String part : pointer.split("/")) {
      if (part.isEmpty()) {
        continue;
      }
      if (part.chars().allMatch(Character::isDigit)) {
        b.append('[').append(part).append(']');
      } else {
        b.append(b.length() == 0 ? "" : ".").append(part.replace("~1", "/").replace("~0", "~"));
      }
    }
    return b.toString();
  }

  /**
   * Every pod template under a node, in document order: a {@code template} (or {@code *Template},
   * as in {@code workerTemplate}) whose {@code spec.containers} is a list.
   */
  private static void findTemplates(JsonNode n, String ptr, List<String> out) {
    if (n.isObject()) {
      for (Map.Entry<String, JsonNode> e : n.properties()) {
        String child = ptr + "/" + LocatedDocument.segment(e.getKey());
        JsonNode v = e.getValue();
        boolean templateKey = e.getKey().equals("template") || e.getKey().endsWith("Template");
        if (templateKey && v.isObject() && v.path("spec").path("containers").isArray()) {
          out.add(child);
        } else {
          findTemplates(v, child, out);
        }
      }
    } else if (n.isArray()) {
      for (int i = 0; i < n.size(); i++) {
        findTemplates(n.get(i), ptr + "/" + i, out);
      }
    }
  }

  private static String describe(Class<?> t) {
    if (t == null) {
      return "a value of another type";
    }
    if (t == Integer.class || t == int.class || t == Long.class || t == long.class) {
      return "an integer";
    }
    if (t == String.class) {
      return "a string";
    }
    if (t == Boolean.class || t == boolean.class) {
      return "true or false";
    }
    if (t == Double.class || t == double.class || t == Float.class || t == float.class) {
      return "a number";
    }
    if (t == io.fabric8.kubernetes.api.model.Quantity.class) {
      return "a Kubernetes quantity " + PodSpecs.EXPECTED;
    }
    if (t == io.fabric8.kubernetes.api.model.IntOrString.class) {
      return "an integer or a string";
    }
    if (Collection.class.isAssignableFrom(t)) {
      return "a list";
    }
    return "a mapping";
  }
}
