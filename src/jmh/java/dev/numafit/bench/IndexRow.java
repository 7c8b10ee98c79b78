package dev.numafit.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * One row of a benchmark index CSV in ../shared/bench (columns found by their header names, so
 * the one-dimensional and vector indexes read alike).
 *
 * @param set the set the instance belongs to
 * @param name the instance's name
 * @param file its path, relative to the benchmark root
 * @param items its number of items
 * @param known the known value: a proven optimum or the best known
 * @param proven whether {@code known} is a proven optimum
 */
record IndexRow(String set, String name, String file, int items, int known, boolean proven) {
  /** The rows of an index CSV, in file order. */
  static List<IndexRow> read(Path index) throws IOException {
    List<String> lines = Files.readAllLines(index);
    List<String> header = List.of(lines.get(0).split(","));
    int setCol = header.indexOf("set");
    int nameCol = header.indexOf("name");
    int fileCol = header.indexOf("file");
    int nCol = header.indexOf("n_items");
    int knownCol = header.indexOf("known_value");
    int provenCol = header.indexOf("proven_optimal");
    List<IndexRow> rows = new ArrayList<>();
    for (String line : lines.subList(1, lines.size())) {
      String[] c = line.split(",", -1);
      rows.add(new IndexRow(c[setCol], c[nameCol], c[fileCol], Integer.parseInt(c[nCol]),
          Integer.parseInt(c[knownCol]), Boolean.parseBoolean(c[provenCol])));
    }
    return rows;
  }
}
