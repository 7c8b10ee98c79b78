package dev.numafit.cli;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * A published three-dimensional instance from the test resources (bench/SOURCE.md) written as a
 * manifest: each item type becomes a Deployment with one replica per copy, its three sizes become
 * cpu (whole vCPUs), memory (Gi) and the extended resource {@code example.com/slots}. Run with
 * {@code --worker cpu=C,memory=CGi,example.com/slots=C --kubelet-reserve none} and a pods limit
 * that never binds, the plan packs onto exactly the instance's capacity C.
 */
final class PublishedAsPods {
  private PublishedAsPods() {}

  /** Writes the instance {@code file} (a .vbp of 3 dimensions) as a manifest in {@code dir}. */
  static Path write(Path dir, String file) throws IOException {
    String[] tok;
    try (InputStream in = PublishedAsPods.class.getResourceAsStream("/bench/" + file)) {
      if (in == null) {
        throw new IOException("missing test resource bench/" + file);
      }
      tok = new String(in.readAllBytes(), StandardCharsets.US_ASCII).trim().split("\\s+");
    }
    int d = Integer.parseInt(tok[0]);
    if (d != 3) {
      throw new IllegalArgumentException(file + " has " + d + " dimensions, not 3");
    }
    int m = Integer.parseInt(tok[1 + d]);
    StringBuilder yaml = new StringBuilder();
    int p = 2 + d;
    for (int i = 0; i < m; i++) {
      long cpu = Long.parseLong(tok[p]);
      long mem = Long.parseLong(tok[p + 1]);
      long slots = Long.parseLong(tok[p + 2]);
      int copies = Integer.parseInt(tok[p + 3]);
      p += 4;
      yaml.append("---\napiVersion: apps/v1\nkind: Deployment\nmetadata:\n  name: item-")
          .append(i).append("\n  namespace: bench\nspec:\n  replicas: ").append(copies)
          .append("\n  selector:\n    matchLabels:\n      app: item-").append(i)
          .append("\n  template:\n    metadata:\n      labels:\n        app: item-").append(i)
          .append("\n    spec:\n      containers:\n        - name: main\n          image: app:1\n")
          .append("          resources:\n            requests:\n              cpu: \"")
          .append(cpu).append("\"\n              memory: ").append(mem)
          .append("Gi\n              example.com/slots: \"").append(slots)
          .append("\"\n            limits:\n              example.com/slots: \"").append(slots)
          .append("\"\n");
    }
    Path out = dir.resolve(file.replace(".vbp", ".yaml"));
    Files.writeString(out, yaml.toString());
    return out;
  }
}
