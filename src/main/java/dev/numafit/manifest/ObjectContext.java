package dev.numafit.manifest;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.SourceRef;
import java.util.ArrayList;
import java.util.List;

/**
 * The object being read: its document (for field lines), its printed name {@code
 * namespace/Kind/name} and the errors found in it so far. An object with errors is left out.
 */
final class ObjectContext {
  final LocatedDocument doc;
  final String label;
  final List<Diagnostic> errors = new ArrayList<>();

  ObjectContext(LocatedDocument doc, String label) {
    this.doc = doc;
    this.label = label;
  }

  SourceRef at(String pointer) {
    return new SourceRef(doc.file(), doc.line(pointer));
  }

  void error(String pointer, String message) {
    errors.add(Diagnostic.error(at(pointer), label + ": " + message));
  }

  /** The value as written at a pointer, for messages. */
  String written(String pointer, Object fallback) {
    var node = doc.at(pointer);
    if (node == null || node.isMissingNode() || node.isNull()) {
      return String.valueOf(fallback);
    }
    return node.isValueNode() ? node.asString() : node.toString();
  }
}
