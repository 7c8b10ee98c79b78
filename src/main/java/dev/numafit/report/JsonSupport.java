package dev.numafit.report;

import dev.numafit.diag.Diagnostic;
import dev.numafit.resource.Resources;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import tools.jackson.core.util.DefaultIndenter;
import tools.jackson.core.util.DefaultPrettyPrinter;
import tools.jackson.core.util.Separators;
import tools.jackson.databind.ObjectWriter;
import tools.jackson.databind.SerializationFeature;
import tools.jackson.databind.json.JsonMapper;

/**
 * Shared pieces of the JSON writers: objects are {@link TreeMap}s so keys come out sorted, and the
 * printer indents by two spaces with {@code \n} line ends on every platform, so the same report is
 * the same bytes everywhere.
 */
final class JsonSupport {
  /** The version of the JSON output schema, at the root of every document. */
  static final int SCHEMA_VERSION = 1;

  private static final ObjectWriter WRITER;

  static {
    JsonMapper mapper =
        JsonMapper.builder().enable(SerializationFeature.ORDER_MAP_ENTRIES_BY_KEYS).build();
    DefaultIndenter lf = new DefaultIndenter("  ", "\n");
    WRITER =
        mapper
            .writer()
            .with(
                new DefaultPrettyPrinter(
                        Separators.createDefaultInstance()
                            .withObjectNameValueSpacing(Separators.Spacing.AFTER)
                            .withObjectEmptySeparator("")
                            .withArrayEmptySeparator(""))
                    .withObjectIndenter(lf)
                    .withArrayIndenter(lf));
  }

  private JsonSupport() {}

  static Map<String, Object> object() {
    return new TreeMap<>();
  }

  static String write(Object tree) {
    return WRITER.writeValueAsString(tree) + "\n";
  }

  /** A resource vector as {name: integer}: cpu in millicores, the rest in bytes or counts. */
  static Map<String, Object> resources(Resources r) {
    Map<String, Object> m = object();
    r.asMap().forEach(m::put);
    return m;
  }

  static List<Object> diagnostics(List<Diagnostic> ds) {
    List<Object> out = new ArrayList<>();
    for (Diagnostic d : ds) {
      Map<String, Object> m = object();
      m.put("severity", d.severity().label());
      m.put("file", d.source().map(s -> s.file()).orElse(null));
      m.put("line", d.source().map(s -> s.line() > 0 ? (Object) s.line() : null).orElse(null));
      m.put("message", d.message());
      out.add(m);
    }
    return out;
  }
}
