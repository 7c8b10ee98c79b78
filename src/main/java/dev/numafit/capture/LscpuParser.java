package dev.numafit.capture;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

/**
 * Reads the parsable CPU table {@code lscpu -p} prints (FACTS B5, util-linux {@code lscpu.1}):
 * {@code #} comment lines, the last of which names the columns ({@code # CPU,Core,Socket,Node,,
 * L1d,L1i,L2,L3}), then one comma-separated row per online CPU. The columns CPU, Core and Socket
 * are required; Node may be absent or empty on a host without NUMA (then every CPU is node 0).
 *
 * <p>lscpu's Core and Socket ids are its own logical numbering; they name cores and sockets
 * uniquely, which is all the derivation needs.
 */
public final class LscpuParser {
  private LscpuParser() {}

  /**
   * Parses the text of one {@code lscpu -p} output.
   *
   * @throws InputException every malformed row, each as {@code file:line: error: ...}
   */
  public static CapturedTopology parse(TextFile file) throws InputException {
    List<Diagnostic> errors = new ArrayList<>();
    if (file.isEmpty()) {
      throw new InputException(
          Diagnostic.error(
              file.at(1),
              "empty file: expected the output of lscpu -p (a \"# CPU,Core,Socket,Node,...\""
                  + " header and one row per CPU)"));
    }
    Map<String, Integer> columns = null;
    int headerLine = 0;
    List<CpuEntry> cpus = new ArrayList<>();
    Map<String, Integer> coreKeys = new TreeMap<>();
    boolean nodeMissing = false;
    for (int i = 0; i < file.lines().size(); i++) {
      String line = file.lines().get(i).strip();
      if (line.isEmpty()) {
        continue;
      }
      if (line.startsWith("#")) {
        String body = line.substring(1).strip();
        if (body.toUpperCase(Locale.ROOT).startsWith("CPU,") || body.equalsIgnoreCase("CPU")) {
          columns = new TreeMap<>();
          String[] names = body.split(",", -1);
          for (int c = 0; c < names.length; c++) {
            if (!names[c].isBlank()) {
              columns.putIfAbsent(names[c].strip().toUpperCase(Locale.ROOT), c);
            }
          }
          headerLine = i + 1;
          for (String need : List.of("CPU", "CORE", "SOCKET")) {
            if (!columns.containsKey(need)) {
              throw new InputException(
                  Diagnostic.error(
                      file.at(i + 1),
                      "expected the lscpu -p header to name the columns CPU, Core and Socket, got"
                          + " \"" + line + "\""));
            }
          }
        }
        continue;
      }
      if (columns == null) {
        throw new InputException(
            Diagnostic.error(
                file.at(i + 1),
                "expected a \"# CPU,Core,Socket,Node,...\" header line (lscpu -p) before the"
                    + " first row, got \"" + line + "\""));
      }
      String[] f = line.split(",", -1);
      int need = columns.values().stream().mapToInt(Integer::intValue).max().orElse(0) + 1;
      if (f.length < need) {
        errors.add(
            Diagnostic.error(
                file.at(i + 1),
                "expected " + need + " comma-separated fields as in the header at line "
                    + headerLine + ", got " + f.length + ": \"" + line + "\""));
        continue;
      }
      Integer cpu = field(file, i, f, columns, "CPU", errors);
      Integer core = field(file, i, f, columns, "CORE", errors);
      Integer socket = field(file, i, f, columns, "SOCKET", errors);
      Integer node = 0;
      if (columns.containsKey("NODE") && !f[columns.get("NODE")].isBlank()) {
        node = field(file, i, f, columns, "NODE", errors);
      } else {
        nodeMissing = true;
      }
      if (cpu == null || core == null || socket == null || node == null) {
        continue;
      }
      final int c = cpu;
      int key = coreKeys.computeIfAbsent(socket + "/" + core, k -> c);
      cpus.add(new CpuEntry(cpu, socket, -1, key, node));
    }
    if (columns == null) {
      throw new InputException(
          Diagnostic.error(
              file.at(file.lines().size()),
              "expected a \"# CPU,Core,Socket,Node,...\" header line and CPU rows (lscpu -p),"
                  + " found only comments"));
    }
    if (errors.isEmpty() && cpus.isEmpty()) {
      errors.add(
          Diagnostic.error(
              file.at(file.lines().size()), "expected at least one CPU row after the header"));
    }
    if (!errors.isEmpty()) {
      throw new InputException(errors);
    }
    cpus.sort(java.util.Comparator.comparingInt(CpuEntry::cpu));
    return new CapturedTopology(
        "lscpu -p file " + file.name() + (nodeMissing ? " (no Node column: one node)" : ""),
        cpus,
        List.of(),
        List.of());
  }

  private static Integer field(
      TextFile file,
      int i,
      String[] f,
      Map<String, Integer> columns,
      String name,
      List<Diagnostic> errors) {
    String v = f[columns.get(name)].strip();
    if (v.isEmpty() || v.length() > 9 || !v.chars().allMatch(Character::isDigit)) {
      errors.add(
          Diagnostic.error(
              file.at(i + 1),
              "expected a whole number in column " + name + ", got \"" + v + "\""));
      return null;
    }
    return Integer.parseInt(v);
  }
}
