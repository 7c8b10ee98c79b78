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
import dev.numafit.demand.Admission;
import dev.numafit.demand.Demand;
import dev.numafit.demand.PodArithmetic;
import dev.numafit.demand.ReplicaMode;
import dev.numafit.demand.Workload;
import dev.numafit.demand.WorkloadId;
import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.manifest.ManifestReader;
import dev.numafit.manifest.PodSpecConversion;
import dev.numafit.manifest.ReadOptions;
import dev.numafit.resource.Resources;
import io.fabric8.kubernetes.api.model.HasMetadata;
import io.fabric8.kubernetes.api.model.IntOrString;
import io.fabric8.kubernetes.api.model.KubernetesListBuilder;
import io.fabric8.kubernetes.api.model.KubernetesResourceList;
import io.fabric8.kubernetes.api.model.LabelSelectorRequirement;
import io.fabric8.kubernetes.api.model.ListOptions;
import io.fabric8.kubernetes.api.model.ListOptionsBuilder;
import io.fabric8.kubernetes.api.model.Node;
import io.fabric8.kubernetes.api.model.NodeSelectorRequirement;
import io.fabric8.kubernetes.api.model.NodeSelectorTerm;
import io.fabric8.kubernetes.api.model.ObjectMeta;
import io.fabric8.kubernetes.api.model.OwnerReference;
import io.fabric8.kubernetes.api.model.Pod;
import io.fabric8.kubernetes.api.model.PodSpec;
import io.fabric8.kubernetes.api.model.PodTemplateSpec;
import io.fabric8.kubernetes.api.model.apps.DaemonSet;
import io.fabric8.kubernetes.api.model.apps.Deployment;
import io.fabric8.kubernetes.api.model.apps.ReplicaSet;
import io.fabric8.kubernetes.api.model.apps.StatefulSet;
import io.fabric8.kubernetes.api.model.batch.v1.CronJob;
import io.fabric8.kubernetes.api.model.batch.v1.Job;
import io.fabric8.kubernetes.api.model.policy.v1.PodDisruptionBudget;
import io.fabric8.kubernetes.client.KubernetesClient;
import io.fabric8.kubernetes.client.KubernetesClientException;
import io.fabric8.kubernetes.client.dsl.MixedOperation;
import io.fabric8.kubernetes.client.dsl.Resource;
import io.fabric8.kubernetes.client.utils.KubernetesSerialization;
import java.io.ByteArrayInputStream;
import java.net.ConnectException;
import java.net.NoRouteToHostException;
import java.net.SocketTimeoutException;
import java.net.UnknownHostException;
import java.net.http.HttpConnectTimeoutException;
import java.net.http.HttpTimeoutException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import java.util.function.Consumer;
import java.util.function.Function;

/**
 * Reads a running cluster into a {@link ClusterModel}, with {@code list} calls only.
 *
 * <p>Every list is paged ({@value #PAGE_SIZE} objects and a continue token) and each page is
 * turned into compact records at once, so 150,000 pods fit a small heap. An expired continue
 * token (410 Gone) restarts that list once from the top, with a warning; the client retries
 * refused connections, 429 and 5xx a bounded number of times (set on its configuration); 401/403
 * stop the read with a message naming the verb and the resource refused. A type that cannot be
 * read is never silently empty: the read stops, or under {@code --allow-partial} the type is listed
 * in {@link ClusterModel#missing()}.
 */
public final class ClusterReader {
  /** Objects per list page. */
  public static final int PAGE_SIZE = 500;

  private static final String RBAC_DOC = "docs/rbac.md";

  private final KubernetesClient client;
  private final ConnectionSettings settings;
  private final ReadProgress progress;
  private final Consumer<String> log;

  /**
   * @param progress told after every page (for a terminal)
   * @param log receives one line per request made ({@code --verbose}); never a credential
   */
  public ClusterReader(
      KubernetesClient client, ConnectionSettings settings, ReadProgress progress,
      Consumer<String> log) {
    this.client = client;
    this.settings = settings;
    this.progress = progress;
    this.log = log;
  }

  /** Reads every type in {@link ResourceType} order and returns the model. */
  public ClusterModel read() throws InputException {
    return new Session().run();
  }

  private record BudgetSelector(String namespace, String id, LabelSelector selector) {}

  /** State of one read. */
  private final class Session {
    final String server = trimSlash(String.valueOf(client.getMasterUrl()));
    final Optional<String> namespace = settings.namespace();
    final List<String> missing = new ArrayList<>();
    final List<String> warnings = new ArrayList<>();
    final Map<Object, Object> interned = new HashMap<>();

    final List<NodeRecord> nodes = new ArrayList<>();
    final List<HasMetadata> declared = new ArrayList<>();
    final Map<String, Placement> templatePlacement = new HashMap<>();
    final List<BudgetRecord> budgets = new ArrayList<>();
    final Map<String, List<BudgetSelector>> budgetSelectors = new HashMap<>();
    final Map<String, String> replicaSetOwner = new HashMap<>();
    final Map<String, String> jobOwner = new HashMap<>();
    final List<PodRecord> pods = new ArrayList<>();
    int podProblems;

    ClusterModel run() throws InputException {
      list(ResourceType.NODES, o -> client.nodes().list(o), this::node, nodes::clear);
      List<HasMetadata> runtimeClasses = new ArrayList<>();
      list(ResourceType.RUNTIME_CLASSES, o -> client.runtimeClasses().list(o),
          runtimeClasses::add, runtimeClasses::clear);
      List<HasMetadata> limitRanges = new ArrayList<>();
      list(ResourceType.LIMIT_RANGES, scoped(client.limitRanges()), limitRanges::add,
          limitRanges::clear);
      list(ResourceType.POD_DISRUPTION_BUDGETS, scoped(client.policy().v1().podDisruptionBudget()),
          this::budget, () -> {
            budgets.clear();
            budgetSelectors.clear();
          });
      List<HasMetadata> workloads = new ArrayList<>();
      list(ResourceType.REPLICA_SETS, scoped(client.apps().replicaSets()),
          rs -> replicaSet(rs, workloads), replicaSetOwner::clear);
      list(ResourceType.JOBS, scoped(client.batch().v1().jobs()), j -> job(j, workloads),
          jobOwner::clear);
      list(ResourceType.DEPLOYMENTS, scoped(client.apps().deployments()),
          d -> template(d, d.getSpec() == null ? null : d.getSpec().getTemplate(), workloads),
          () -> { });
      list(ResourceType.STATEFUL_SETS, scoped(client.apps().statefulSets()),
          s -> template(s, s.getSpec() == null ? null : s.getSpec().getTemplate(), workloads),
          () -> { });
      list(ResourceType.DAEMON_SETS, scoped(client.apps().daemonSets()),
          d -> template(d, d.getSpec() == null ? null : d.getSpec().getTemplate(), workloads),
          () -> { });
      list(ResourceType.CRON_JOBS, scoped(client.batch().v1().cronjobs()),
          c -> template(c, cronTemplate(c), workloads), () -> { });
      List<HasMetadata> autoscalers = new ArrayList<>();
      list(ResourceType.HORIZONTAL_POD_AUTOSCALERS,
          scoped(client.autoscaling().v2().horizontalPodAutoscalers()), autoscalers::add,
          autoscalers::clear);
      list(ResourceType.PODS, scoped(client.pods()), this::pod, pods::clear);
      if (podProblems > 0) {
        warnings.add(podProblems + " pods had unreadable quantities; those amounts were left out");
      }

      declared.addAll(runtimeClasses);
      declared.addAll(limitRanges);
      declared.addAll(workloads);
      declared.addAll(autoscalers);
      List<WorkloadRecord> records = declaredWorkloads();
      return new ClusterModel(server, namespace, nodes, pods, budgets, records, missing,
          warnings);
    }

    <T extends HasMetadata, L extends KubernetesResourceList<T>>
        Function<ListOptions, L> scoped(MixedOperation<T, L, ? extends Resource<T>> op) {
      if (namespace.isPresent()) {
        String ns = namespace.get();
        return o -> op.inNamespace(ns).list(o);
      }
      return o -> op.inAnyNamespace().list(o);
    }

    /**
     * Lists one type page by page into {@code sink}. {@code reset} empties what the sink built,
     * for the one restart after an expired continue token.
     */
    <T extends HasMetadata> void list(
        ResourceType type,
        Function<ListOptions, ? extends KubernetesResourceList<T>> lister,
        Consumer<T> sink,
        Runnable reset) throws InputException {
      boolean restarted = false;
      String cont = null;
      long items = 0;
      int pages = 0;
      while (true) {
        ListOptions opts = new ListOptionsBuilder()
            .withLimit((long) PAGE_SIZE).withContinue(cont).build();
        log.accept("GET " + server + type.path(namespace) + "?limit=" + PAGE_SIZE
            + (cont == null ? "" : "&continue=…"));
        KubernetesResourceList<T> page;
        try {
          page = lister.apply(opts);
        } catch (KubernetesClientException ex) {
          if (ex.getCode() == 410 && cont != null && !restarted) {
            warnings.add(type.display() + ": the continue token expired (410 Gone) after "
                + items + " objects; the list was restarted from the top");
            restarted = true;
            reset.run();
            cont = null;
            items = 0;
            pages = 0;
            continue;
          }
          fail(type, ex, restarted);
          reset.run();
          return;
        }
        List<T> got = page.getItems() == null ? List.of() : page.getItems();
        for (T item : got) {
          sink.accept(item);
        }
        items += got.size();
        pages++;
        cont = page.getMetadata() == null ? null : page.getMetadata().getContinue();
        boolean done = cont == null || cont.isEmpty();
        progress.update(type, items, pages, done);
        if (done) {
          return;
        }
      }
    }

    /** Stops the read, or under --allow-partial records the type as missing. */
    void fail(ResourceType type, KubernetesClientException ex, boolean restarted)
        throws InputException {
      int code = ex.getCode();
      String what = "list " + type.display();
      String message;
      boolean connection = false;
      if (code == 401 || code == 403) {
        message = "the API server " + server + " refused to " + what + " (" + code + " "
            + (code == 401 ? "Unauthorized" : "Forbidden") + statusText(ex) + "); numafit needs"
            + " the verb list on " + type.display() + ": " + RBAC_DOC
            + " has a minimal read-only ClusterRole";
      } else if (code == 410) {
        message = "the API server " + server + " expired the continue token of " + what
            + " twice (410 Gone); the list was restarted once and expired again";
      } else if (code == 404) {
        message = "the API server " + server + " does not serve " + type.display()
            + " (404 Not Found)";
      } else if (code == 429 || code >= 500) {
        message = "the API server " + server + " answered " + what + " with " + code
            + statusText(ex) + " after " + settings.retries() + " retries";
      } else if (code > 0) {
        message = "the API server " + server + " answered " + what + " with " + code
            + statusText(ex);
      } else {
        connection = true;
        message = transport(ex, what);
      }
      if (settings.allowPartial() && !connection) {
        missing.add(type.display() + ": " + shortReason(code) + " (" + type.leavesOut() + ")");
        return;
      }
      throw new InputException(Diagnostic.error(null, message
          + (connection || code == 401 || code == 403 ? ""
              : "; --allow-partial goes on without it")));
    }

    String transport(KubernetesClientException ex, String what) {
      Throwable t = ex;
      while (t != null) {
        if (t instanceof ConnectException || t instanceof NoRouteToHostException) {
          return "cannot reach the API server " + server + ": connection refused (after "
              + settings.retries() + " retries)";
        }
        if (t instanceof UnknownHostException) {
          return "cannot reach the API server " + server + ": unknown host";
        }
        if (t instanceof HttpConnectTimeoutException) {
          return "cannot reach the API server " + server + ": no connection within "
              + Math.min(settings.requestTimeout().toSeconds(),
                  ConnectionSettings.CONNECT_TIMEOUT.toSeconds()) + " s";
        }
        if (t instanceof ResponseDeadline.BodyTimeoutException) {
          return "the API server " + server + " did not answer " + what + " within "
              + seconds() + " (--request-timeout); nothing of its answer was used";
        }
        if (t instanceof HttpTimeoutException || t instanceof SocketTimeoutException) {
          return "the API server " + server + " did not answer " + what + " within "
              + seconds() + " (--request-timeout)";
        }
        if (t instanceof javax.net.ssl.SSLException) {
          return "cannot reach the API server " + server + ": TLS failed: " + t.getMessage();
        }
        if (t instanceof tools.jackson.core.JacksonException
            || t instanceof java.io.EOFException) {
          return "the answer of the API server " + server + " to " + what
              + " was cut off or is not valid JSON; nothing of it was used";
        }
        if (t.getCause() == t) {
          break;
        }
        t = t.getCause();
      }
      return "cannot " + what + " at the API server " + server + ": " + ex.getMessage();
    }

    String seconds() {
      long ms = settings.requestTimeout().toMillis();
      return ms % 1000 == 0 ? (ms / 1000) + " s" : ms + " ms";
    }

    void node(Node n) {
      ObjectMeta m = n.getMetadata();
      List<String> problems = new ArrayList<>();
      Resources capacity = Resources.EMPTY;
      Resources allocatable = Resources.EMPTY;
      if (n.getStatus() != null) {
        capacity = Quantities.of(n.getStatus().getCapacity(), "node " + m.getName()
            + " capacity", problems);
        allocatable = Quantities.of(n.getStatus().getAllocatable(), "node " + m.getName()
            + " allocatable", problems);
      }
      warnings.addAll(problems);
      List<Taint> taints = new ArrayList<>();
      boolean unschedulable = false;
      if (n.getSpec() != null) {
        if (n.getSpec().getTaints() != null) {
          n.getSpec().getTaints().forEach(
              t -> taints.add(new Taint(t.getKey(), t.getValue(), t.getEffect())));
        }
        unschedulable = Boolean.TRUE.equals(n.getSpec().getUnschedulable());
      }
      nodes.add(new NodeRecord(m.getName(), capacity, allocatable, labels(m.getLabels()),
          taints, unschedulable));
    }

    void budget(PodDisruptionBudget p) {
      ObjectMeta m = p.getMetadata();
      Optional<IntOrPercent> min = Optional.empty();
      Optional<IntOrPercent> max = Optional.empty();
      String id = m.getNamespace() + "/" + m.getName();
      if (p.getSpec() == null) {
        return;
      }
      try {
        min = intOrPercent(p.getSpec().getMinAvailable());
        max = intOrPercent(p.getSpec().getMaxUnavailable());
      } catch (IllegalArgumentException ex) {
        warnings.add("PodDisruptionBudget " + id + ": " + ex.getMessage() + "; budget ignored");
        return;
      }
      budgets.add(new BudgetRecord(m.getNamespace(), m.getName(), min, max));
      if (p.getSpec().getSelector() != null) {
        // policy/v1: an empty selector selects every pod of the namespace; a null one none.
        budgetSelectors.computeIfAbsent(m.getNamespace(), k -> new ArrayList<>())
            .add(new BudgetSelector(m.getNamespace(), id, selector(p.getSpec().getSelector())));
      }
    }

    void replicaSet(ReplicaSet rs, List<HasMetadata> workloads) {
      Optional<OwnerReference> owner = controller(rs.getMetadata());
      String key = rs.getMetadata().getNamespace() + "/" + rs.getMetadata().getName();
      if (owner.isPresent() && "Deployment".equals(owner.get().getKind())) {
        replicaSetOwner.put(key, owner.get().getName());
      } else if (owner.isEmpty()) {
        template(rs, rs.getSpec() == null ? null : rs.getSpec().getTemplate(), workloads);
      }
    }

    void job(Job j, List<HasMetadata> workloads) {
      Optional<OwnerReference> owner = controller(j.getMetadata());
      String key = j.getMetadata().getNamespace() + "/" + j.getMetadata().getName();
      if (owner.isPresent() && "CronJob".equals(owner.get().getKind())) {
        jobOwner.put(key, owner.get().getName());
      } else if (owner.isEmpty()) {
        template(j, j.getSpec() == null ? null : j.getSpec().getTemplate(), workloads);
      }
    }

    PodTemplateSpec cronTemplate(CronJob c) {
      if (c.getSpec() == null || c.getSpec().getJobTemplate() == null
          || c.getSpec().getJobTemplate().getSpec() == null) {
        return null;
      }
      return c.getSpec().getJobTemplate().getSpec().getTemplate();
    }

    /** Keeps a top-level workload for --from declared, with its template's placement. */
    void template(HasMetadata w, PodTemplateSpec t, List<HasMetadata> workloads) {
      ObjectMeta m = w.getMetadata();
      if (m.getOwnerReferences() != null && !m.getOwnerReferences().isEmpty()
          && !(w instanceof ReplicaSet) && !(w instanceof Job)) {
        // Owned by something else (an operator): its pods still count under --from running.
        return;
      }
      m.setManagedFields(null);
      workloads.add(w);
      String id = m.getNamespace() + "/" + w.getKind() + "/" + m.getName();
      templatePlacement.put(id, t == null ? Placement.NONE : placement(t.getSpec()));
    }

    void pod(Pod p) {
      ObjectMeta m = p.getMetadata();
      String phase = p.getStatus() == null || p.getStatus().getPhase() == null ? "Unknown"
          : p.getStatus().getPhase();
      if ("Succeeded".equals(phase) || "Failed".equals(phase)) {
        return;
      }
      String ns = intern(m.getNamespace() == null ? "default" : m.getNamespace());
      PodSpec spec = p.getSpec();
      PodSpecConversion.Result r = PodSpecConversion.toModel(spec, ns + "/Pod/" + m.getName());
      if (!r.problems().isEmpty()) {
        podProblems++;
      }
      // A pod from the API server is already admitted; limits-as-requests is a no-op then and
      // only matters for pods written by hand into a test server.
      Resources requests = intern(
          PodArithmetic.effective(Admission.limitsAsRequests(r.model())).requests());
      Optional<OwnerReference> owner = controller(m);
      WorkloadId workload;
      boolean daemon = false;
      if (owner.isEmpty()) {
        workload = new WorkloadId(ns, "Pod", m.getName());
      } else {
        String kind = owner.get().getKind();
        String name = owner.get().getName();
        if ("ReplicaSet".equals(kind) && replicaSetOwner.containsKey(ns + "/" + name)) {
          kind = "Deployment";
          name = replicaSetOwner.get(ns + "/" + name);
        } else if ("Job".equals(kind) && jobOwner.containsKey(ns + "/" + name)) {
          kind = "CronJob";
          name = jobOwner.get(ns + "/" + name);
        }
        daemon = "DaemonSet".equals(kind);
        workload = intern(new WorkloadId(ns, intern(kind), intern(name)));
      }
      List<String> covering = new ArrayList<>();
      Map<String, String> labels = m.getLabels() == null ? Map.of() : m.getLabels();
      for (BudgetSelector b : budgetSelectors.getOrDefault(ns, List.of())) {
        if (b.selector().matches(labels)) {
          covering.add(b.id());
        }
      }
      covering.sort(null);
      pods.add(new PodRecord(ns, m.getName(), workload,
          spec == null || spec.getNodeName() == null ? "" : intern(spec.getNodeName()),
          intern(phase), requests, intern(placement(spec)), daemon, intern(List.copyOf(covering))));
    }

    List<WorkloadRecord> declaredWorkloads() {
      if (declared.isEmpty()) {
        return List.of();
      }
      KubernetesSerialization json = client.getKubernetesSerialization();
      String text = json.asJson(new KubernetesListBuilder().withItems(declared).build());
      Demand demand = new ManifestReader().read(List.of("-"),
          new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)),
          new ReadOptions(ReplicaMode.PEAK, false));
      for (Diagnostic d : demand.diagnostics()) {
        if (d.severity() != dev.numafit.diag.Severity.NOTE) {
          warnings.add("declared workloads: " + d.message());
        }
      }
      List<WorkloadRecord> out = new ArrayList<>();
      for (Workload w : demand.workloads()) {
        Placement pl = templatePlacement.getOrDefault(w.id().toString(), Placement.NONE);
        out.add(new WorkloadRecord(w.id(), w.replicas(), w.perWorker(), w.pod().requests(), pl));
      }
      declared.clear();
      return out;
    }

    @SuppressWarnings("unchecked")
    <T> T intern(T value) {
      return (T) interned.computeIfAbsent(value, k -> k);
    }
  }

  /** The scheduling constraints of a pod spec in numafit's simple form. */
  static Placement placement(PodSpec spec) {
    if (spec == null) {
      return Placement.NONE;
    }
    TreeMap<String, String> selector = new TreeMap<>();
    if (spec.getNodeSelector() != null) {
      selector.putAll(spec.getNodeSelector());
    }
    List<LabelSelector> terms = new ArrayList<>();
    if (spec.getAffinity() != null && spec.getAffinity().getNodeAffinity() != null
        && spec.getAffinity().getNodeAffinity()
            .getRequiredDuringSchedulingIgnoredDuringExecution() != null) {
      List<NodeSelectorTerm> ts = spec.getAffinity().getNodeAffinity()
          .getRequiredDuringSchedulingIgnoredDuringExecution().getNodeSelectorTerms();
      if (ts != null) {
        for (NodeSelectorTerm t : ts) {
          List<LabelRequirement> reqs = new ArrayList<>();
          if (t.getMatchExpressions() != null) {
            for (NodeSelectorRequirement r : t.getMatchExpressions()) {
              reqs.add(new LabelRequirement(r.getKey(), r.getOperator(),
                  r.getValues() == null ? List.of() : r.getValues()));
            }
          }
          if (t.getMatchFields() != null) {
            for (NodeSelectorRequirement r : t.getMatchFields()) {
              // The only field the API allows is metadata.name; the review offers it as a label.
              reqs.add(new LabelRequirement(r.getKey(), r.getOperator(),
                  r.getValues() == null ? List.of() : r.getValues()));
            }
          }
          terms.add(new LabelSelector(reqs));
        }
      }
    }
    List<Toleration> tolerations = new ArrayList<>();
    if (spec.getTolerations() != null) {
      spec.getTolerations().forEach(t -> tolerations.add(
          new Toleration(t.getKey(), t.getOperator(), t.getValue(), t.getEffect())));
    }
    if (selector.isEmpty() && terms.isEmpty() && tolerations.isEmpty()) {
      return Placement.NONE;
    }
    return new Placement(selector, terms, tolerations);
  }

  static LabelSelector selector(io.fabric8.kubernetes.api.model.LabelSelector s) {
    List<LabelRequirement> reqs = new ArrayList<>();
    if (s.getMatchLabels() != null) {
      new TreeMap<>(s.getMatchLabels()).forEach((k, v) -> reqs.add(LabelRequirement.equal(k, v)));
    }
    if (s.getMatchExpressions() != null) {
      for (LabelSelectorRequirement r : s.getMatchExpressions()) {
        reqs.add(new LabelRequirement(r.getKey(), r.getOperator(),
            r.getValues() == null ? List.of() : r.getValues()));
      }
    }
    return new LabelSelector(reqs);
  }

  static Optional<IntOrPercent> intOrPercent(IntOrString v) {
    if (v == null) {
      return Optional.empty();
    }
    if (v.getIntVal() != null) {
      return Optional.of(new IntOrPercent(v.getIntVal(), false));
    }
    if (v.getStrVal() != null) {
      return Optional.of(IntOrPercent.parse(v.getStrVal()));
    }
    return Optional.empty();
  }

  private static Optional<OwnerReference> controller(ObjectMeta m) {
    if (m.getOwnerReferences() == null || m.getOwnerReferences().isEmpty()) {
      return Optional.empty();
    }
    for (OwnerReference r : m.getOwnerReferences()) {
      if (Boolean.TRUE.equals(r.getController())) {
        return Optional.of(r);
      }
    }
    return Optional.of(m.getOwnerReferences().get(0));
  }

  private static TreeMap<String, String> labels(Map<String, String> m) {
    return m == null ? new TreeMap<>() : new TreeMap<>(m);
  }

  private static String statusText(KubernetesClientException ex) {
    if (ex.getStatus() != null && ex.getStatus().getMessage() != null
        && !ex.getStatus().getMessage().isBlank()) {
      return ": " + ex.getStatus().getMessage();
    }
    return "";
  }

  private static String shortReason(int code) {
    return switch (code) {
      case 401 -> "401 Unauthorized";
      case 403 -> "403 Forbidden";
      case 404 -> "404 Not Found";
      case 410 -> "410 Gone twice";
      default -> code > 0 ? "HTTP " + code : "not readable";
    };
  }

  private static String trimSlash(String url) {
    return url.endsWith("/") ? url.substring(0, url.length() - 1) : url;
  }
}
