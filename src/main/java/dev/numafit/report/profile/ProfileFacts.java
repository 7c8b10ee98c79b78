package dev.numafit.report.profile;

import dev.numafit.diag.Diagnostic;
import dev.numafit.host.HostFacts;
import dev.numafit.host.HostProfile;
import dev.numafit.host.NodeFacts;
import dev.numafit.host.NumaNode;
import dev.numafit.profile.ProfileLoad;
import dev.numafit.resource.Resources;
import dev.numafit.shape.Allocatable;
import dev.numafit.shape.AllocatableResult;
import dev.numafit.shape.KubeletReserve;
import dev.numafit.shape.ShapeDeriver;
import dev.numafit.shape.ShapeOptions;
import dev.numafit.shape.WorkerShape;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * What {@code numafit profile show} prints about one host profile: the derived facts per node and
 * the one-node worker with the kubelet's default reservations. Amounts: memory in bytes, bandwidth
 * in bytes per second, CPU in whole vCPUs for the worker and millicores in allocatable.
 *
 * @param file the profile file as the user named it
 * @param profile the loaded profile
 * @param facts per-node and total facts
 * @param worker the one-node worker (pool shape) with one vCPU per core, no overcommit
 * @param allocatable that worker's allocatable under {@link KubeletReserve#defaults()}
 * @param warnings the profile's warnings, sorted
 */
public record ProfileFacts(
    String file,
    HostProfile profile,
    HostFacts facts,
    WorkerShape worker,
    AllocatableResult allocatable,
    List<Diagnostic> warnings) {
  public ProfileFacts {
    Objects.requireNonNull(file, "file");
    Objects.requireNonNull(profile, "profile");
    Objects.requireNonNull(facts, "facts");
    Objects.requireNonNull(worker, "worker");
    Objects.requireNonNull(allocatable, "allocatable");
    warnings = warnings.stream().sorted().toList();
  }

  /** Derives the facts of a loaded profile. */
  public static ProfileFacts of(String file, ProfileLoad load) {
    HostProfile p = load.profile();
    WorkerShape worker = new ShapeDeriver(ShapeOptions.defaults()).oneNode(p);
    return new ProfileFacts(
        file,
        p,
        HostFacts.of(p),
        worker,
        Allocatable.computeDetailed(worker, KubeletReserve.defaults()),
        load.warnings());
  }

  /** The SLIT row of node {@code i}, when the profile gives distances. */
  public Optional<List<Integer>> distances(int i) {
    return profile.distances().map(d -> d.get(i));
  }

  /** The node's extra capacity: hugepages in bytes, devices in counts. */
  public Resources extraCapacity(int i) {
    return profile.nodes().get(i).extraCapacity();
  }

  /** Whether the node's channel population was confirmed in the profile. */
  public boolean channelsConfirmed(int i) {
    return profile.nodes().get(i).channelsConfirmed();
  }

  /** The node facts in node order. */
  public List<NodeFacts> nodes() {
    return facts.nodes();
  }

  /** The profile's node, for fields the facts do not repeat. */
  public NumaNode node(int i) {
    return profile.nodes().get(i);
  }
}
