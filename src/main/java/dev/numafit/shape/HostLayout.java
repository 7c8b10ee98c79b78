package dev.numafit.shape;

import java.util.List;
import java.util.Objects;

/**
 * Where the workers of one host sit: for a shape that fits a NUMA node, one group per node with
 * the workers wholly inside it; for a spanning shape, one group per run of neighbouring nodes the
 * hypervisor splits each worker over. The workers of all groups add up to {@link
 * HostFit#workersPerHost()}.
 *
 * @param groups in node order; every node of the host is in exactly one group
 * @param spanning whether each worker covers every node of its group
 */
public record HostLayout(List<Group> groups, boolean spanning) {
  public HostLayout {
    groups = List.copyOf(groups);
  }

  /**
   * Nodes that share workers and how many workers they carry.
   *
   * @param nodes node ids, ascending
   * @param workers workers placed on these nodes (0 when the nodes are too small)
   */
  public record Group(List<Integer> nodes, int workers) {
    public Group {
      nodes = List.copyOf(nodes);
      Objects.requireNonNull(nodes, "nodes");
      if (workers < 0) {
        throw new IllegalArgumentException("workers must be >= 0, was " + workers);
      }
    }
  }

  /** Total workers one host carries. */
  public int workers() {
    return groups.stream().mapToInt(Group::workers).sum();
  }

  /** The group holding node {@code id}. */
  public Group groupOf(int id) {
    for (Group g : groups) {
      if (g.nodes().contains(id)) {
        return g;
      }
    }
    throw new IllegalArgumentException("no node " + id + " in this layout");
  }
}
