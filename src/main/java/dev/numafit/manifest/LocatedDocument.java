package dev.numafit.manifest;

import java.util.Map;
import tools.jackson.databind.JsonNode;

/**
 * One parsed YAML or JSON document with the line of every value, keyed by JSON Pointer ({@code
 * /spec/template/spec/containers/0/resources/requests/cpu}). fabric8 keeps no positions, so every
 * message about a field looks its line up here.
 */
record LocatedDocument(String file, JsonNode root, Map<String, Integer> lines, int startLine) {

  /** The line of the value at {@code pointer}, else of its nearest parent, else the document's. */
  int line(String pointer) {
    String p = pointer;
    while (true) {
      Integer l = lines.get(p);
      if (l != null) {
        return l;
      }
      int slash = p.lastIndexOf('/');
      if (slash < 0) {
        return startLine;
      }
      p = p.substring(0, slash);
    }
  }

  /**
   * Suffix of the entries that hold the line of a property's key where it differs from its
   * value's line; {@code ~} followed by a letter never occurs in an escaped pointer.
   */
  static final String KEY_SUFFIX = "~k";

  /** The line of the key of the property at {@code pointer} (for a list item, its own line). */
  int keyLine(String pointer) {
    Integer l = lines.get(pointer + KEY_SUFFIX);
    return l != null ? l : line(pointer);
  }

  /** A JSON Pointer segment for a property name (RFC 6901 escaping). */
  static String segment(String name) {
    if (name.indexOf('~') < 0 && name.indexOf('/') < 0) {
      return name;
    }
    return name.replace("~", "~0").replace("/", "~1");
  }

  /** The value at a pointer, or a missing node. */
  JsonNode at(String pointer) {
    return pointer.isEmpty() ? root : root.at(pointer);
  }
}
