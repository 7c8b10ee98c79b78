package dev.numafit.pack;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

/** A bin-packing instance read from src/test/resources/bench (formats in SOURCE.md there). */
record BenchInstance(String name, long[][] items, long[] capacity) {
  static BenchInstance load(String file) throws IOException {
    try (InputStream in = BenchInstance.class.getResourceAsStream("/bench/" + file)) {
      if (in == null) {
        throw new IOException("missing test resource bench/" + file);
      }
      String[] tok = new String(in.readAllBytes(), StandardCharsets.US_ASCII).trim().split("\\s+");
      int p = 0;
      if (file.endsWith(".vbp")) {
        int d = Integer.parseInt(tok[p++]);
        long[] cap = new long[d];
        for (int k = 0; k < d; k++) {
          cap[k] = Long.parseLong(tok[p++]);
        }
        int m = Integer.parseInt(tok[p++]);
        List<long[]> items = new ArrayList<>();
        for (int i = 0; i < m; i++) {
          long[] v = new long[d];
          for (int k = 0; k < d; k++) {
            v[k] = Long.parseLong(tok[p++]);
          }
          int copies = Integer.parseInt(tok[p++]);
          for (int c = 0; c < copies; c++) {
            items.add(v.clone());
          }
        }
        return new BenchInstance(file, items.toArray(new long[0][]), cap);
      }
      int n = Integer.parseInt(tok[p++]);
      long[] cap = {Long.parseLong(tok[p++])};
      long[][] items = new long[n][1];
      for (int i = 0; i < n; i++) {
        items[i][0] = Long.parseLong(tok[p++]);
      }
      return new BenchInstance(file, items, cap);
    }
  }

  /** Asserts-free feasibility check: true when no bin is over capacity in any dimension. */
  static boolean feasible(Packing p, long[][] items, long[] capacity) {
    for (long[] load : p.loads(items)) {
      for (int k = 0; k < capacity.length; k++) {
        if (load[k] > capacity[k]) {
          return false;
        }
      }
    }
    return true;
  }

  /** The sizes of a one-dimensional instance. */
  long[] sizes() {
    long[] s = new long[items.length];
    for (int i = 0; i < s.length; i++) {
      s[i] = items[i][0];
    }
    return s;
  }
}
