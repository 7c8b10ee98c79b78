package dev.numafit.shape;

/** How a worker VM sits on its host. */
public enum ShapeKind {
  /** One worker per NUMA node, as large as the node allows. */
  ONE_NODE("1-node"),
  /** k workers sharing one NUMA node. */
  SPLIT_NODE("split-node"),
  /** Spanning two NUMA nodes of one socket. */
  TWO_NODES("2-nodes"),
  /** Spanning a whole socket. */
  SOCKET("socket"),
  /** Spanning the whole host. */
  HOST("host"),
  /** Given by the user with --worker. */
  EXPLICIT("explicit");

  private final String label;

  ShapeKind(String label) {
    this.label = label;
  }

  public String label() {
    return label;
  }
}
