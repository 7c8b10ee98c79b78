package dev.numafit.bench;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Writes the 150,000-pod benchmark workload ({@link SyntheticFleet}) as one multi-document YAML
 * file of Deployments. Run: {@code bench/gen-workload.sh [OUT]} (default
 * target/bench/workload-150k.yaml).
 */
public final class WorkloadGenerator {
  private WorkloadGenerator() {}

  public static void main(String[] args) throws IOException {
    Path out = Path.of(args.length > 0 ? args[0] : "target/bench/workload-150k.yaml");
    if (out.getParent() != null) {
      Files.createDirectories(out.getParent());
    }
    int pods = 0;
    try (BufferedWriter w = Files.newBufferedWriter(out, StandardCharsets.UTF_8)) {
      for (SyntheticFleet.Deployment d : SyntheticFleet.deployments()) {
        pods += d.replicas();
        w.write("---\n");
        w.write("apiVersion: apps/v1\nkind: Deployment\n");
        w.write("metadata:\n  name: " + d.name() + "\n  namespace: " + d.namespace() + "\n");
        w.write("spec:\n  replicas: " + d.replicas() + "\n");
        w.write("  selector:\n    matchLabels:\n      app: " + d.name() + "\n");
        w.write("  template:\n    metadata:\n      labels:\n        app: " + d.name() + "\n");
        w.write("    spec:\n      initContainers:\n");
        container(w, "migrate", d.initCpu(), d.initMemory());
        w.write("      containers:\n");
        container(w, "app", d.appCpu()[0], d.appMemory()[0]);
        container(w, "proxy", d.appCpu()[1], d.appMemory()[1]);
      }
    }
    System.out.println(
        "wrote " + out + ": " + SyntheticFleet.DEPLOYMENTS + " Deployments, " + pods + " pods");
  }

  private static void container(BufferedWriter w, String name, long cpuMillis, long memBytes)
      throws IOException {
    // Every generated amount is a whole MiB, so the text is exact.
    w.write("      - name: " + name + "\n");
    w.write("        image: registry.example.com/" + name + ":1.0\n");
    w.write("        resources:\n          requests:\n");
    w.write("            cpu: " + cpuMillis + "m\n");
    w.write("            memory: " + (memBytes >> 20) + "Mi\n");
  }
}
