package dev.numafit.report.check;

import java.util.Map;
import java.util.TreeMap;
import tools.jackson.core.util.DefaultIndenter;
import tools.jackson.core.util.DefaultPrettyPrinter;
import tools.jackson.databind.ObjectWriter;
import tools.jackson.databind.SerializationFeature;
import tools.jackson.databind.json.JsonMapper;

/**
 * JSON printing for the check writers: map keys sorted, two-space indent and {@code \n} line ends
 * on every platform, so equal reports give equal bytes.
 */
final class Json {
  private static final ObjectWriter WRITER;

  static {
    JsonMapper mapper =
        JsonMapper.builder().enable(SerializationFeature.ORDER_MAP_ENTRIES_BY_KEYS).build();
    DefaultIndenter lf = new DefaultIndenter("  ", "\n");
    WRITER =
        mapper.writer().with(new DefaultPrettyPrinter().withObjectIndenter(lf).withArrayIndenter(lf));
  }

  private Json() {}

  /** A JSON object whose keys print sorted. */
  static Map<String, Object> object() {
    return new TreeMap<>();
  }

  /** The tree as text, ending with a newline. */
  static String write(Object tree) {
    return WRITER.writeValueAsString(tree) + "\n";
  }
}
