package dev.numafit.capture;

/**
 * One online logical CPU (hardware thread) as the kernel or lscpu reports it.
 *
 * @param cpu logical CPU number
 * @param socket physical package id (the socket), -1 when the platform does not say
 * @param die die id within the package, -1 when unknown
 * @param core a key naming the CPU's physical core, unique on the host: two CPUs with the same key
 *     are hardware threads of one core
 * @param node NUMA node id, -1 when the source gives none
 */
public record CpuEntry(int cpu, int socket, int die, int core, int node) {
  public CpuEntry {
    if (cpu < 0) {
      throw new IllegalArgumentException("cpu must be >= 0, was " + cpu);
    }
  }
}
