package dev.numafit.cli;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.diag.SourceRef;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;
import tools.jackson.core.JacksonException;
import tools.jackson.core.JsonParser;
import tools.jackson.core.JsonToken;
import tools.jackson.databind.JsonNode;
import tools.jackson.dataformat.yaml.YAMLMapper;

/**
 * A project config file ({@code --config FILE}, or {@code numafit.yaml} in the current folder): a
 * YAML map from long option names without dashes to values, for example {@code host-profile:
 * [hosts/a.yaml]} or {@code max-utilization: 80}. Turned into command-line arguments for the
 * options the user did not give, so flags always win. Paths are relative to the file's folder.
 */
final class ConfigFile {
  /** The file looked for in the current folder when --config is not given. */
  static final String DEFAULT_NAME = "numafit.yaml";

  private static final Set<String> PATH_OPTIONS =
      Set.of("filename", "host-profile", "kubelet-config", "out", "baseline", "snapshot",
          "kubeconfig", "pools");
  private static final Set<String> NOT_ALLOWED = Set.of("config", "help", "version");

  private ConfigFile() {}

  /** One config entry: the option, its values as arguments, and where it was written. */
  record Entry(OptionSpec option, List<String> values, SourceRef source) {}

  /**
   * Reads {@code file} (named {@code shown} in messages) and checks every key against {@code spec}'s options.
   *
   * @throws InputException listing every problem with file:line
   */
  static List<Entry> read(Path file, String shown, CommandSpec spec) throws InputException {
    return read(file, shown, spec, List.of(), Set.of());
  }

  /**
   * {@link #read(Path, String, CommandSpec)} for a file that several commands share: a key that
   * is no option of {@code spec} but one of {@code others} belongs to those commands and is
   * passed over, and a key the command line gives ({@code given}: long option names with
   * dashes) is passed over unchecked, since the command line's value replaces it.
   */
  static List<Entry> read(Path file, String shown, CommandSpec spec, List<CommandSpec> others,
      Set<String> given) throws InputException {
    String text;
    try {
      text = Files.readString(file, StandardCharsets.UTF_8);
    } catch (IOException ex) {
      throw new InputException(
          Diagnostic.error(new SourceRef(shown, 0), "cannot read config file: " + ex.getMessage()));
    }
    List<Entry> entries = new ArrayList<>();
    List<Diagnostic> errors = new ArrayList<>();
    Path base = file.toAbsolutePath().getParent();
    // Read value by value from one parser: trailing tokens are the next keys, not an error.
    YAMLMapper mapper =
        YAMLMapper.builder()
            .disable(tools.jackson.databind.DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
            .build();
    try (JsonParser p = mapper.createParser(text)) {
      JsonToken t = p.nextToken();
      if (t == null) {
        return entries;
      }
      if (t != JsonToken.START_OBJECT) {
        throw new InputException(
            Diagnostic.error(
                new SourceRef(shown, p.currentTokenLocation().getLineNr()),
                "expected a map of option names to values, e.g. \"max-utilization: 80\""));
      }
      while ((t = p.nextToken()) == JsonToken.PROPERTY_NAME) {
        String key = p.currentName();
        SourceRef at = new SourceRef(shown, p.currentTokenLocation().getLineNr());
        p.nextToken();
        JsonNode value = mapper.readTree(p);
        OptionSpec opt = NOT_ALLOWED.contains(key) ? null : spec.findOption("--" + key);
        if (!NOT_ALLOWED.contains(key) && key.length() > 1 && (opt == null
            ? others.stream().anyMatch(o -> o.findOption("--" + key) != null)
            : given.contains(opt.longestName()))) {
          continue;
        }
        if (opt == null || key.length() == 1) {
          errors.add(
              Diagnostic.error(
                  at,
                  "unknown option \"" + key + "\" for " + spec.qualifiedName()
                      + " (expected a long option name without dashes, such as host-profile)"));
          continue;
        }
        List<String> values = new ArrayList<>();
        boolean flag = opt.arity().max() == 0;
        List<JsonNode> items = new ArrayList<>();
        if (value.isArray()) {
          value.forEach(items::add);
        } else {
          items.add(value);
        }
        boolean bad = false;
        for (JsonNode item : items) {
          if (flag) {
            if (!item.isBoolean()) {
              errors.add(Diagnostic.error(at, key + ": expected true or false"));
              bad = true;
            } else if (item.booleanValue()) {
              values.add("true");
            }
          } else if (item.isValueNode() && !item.isNull()) {
            String v = item.asString();
            if (PATH_OPTIONS.contains(key) && !v.equals("-")) {
              v = base.resolve(v).normalize().toString();
            }
            values.add(v);
          } else {
            errors.add(
                Diagnostic.error(at, key + ": expected a value or a list of values, not a map"));
            bad = true;
          }
        }
        if (value.isArray() && !opt.isMultiValue()) {
          errors.add(Diagnostic.error(at, key + ": takes one value, not a list"));
          bad = true;
        }
        if (!bad) {
          entries.add(new Entry(opt, values, at));
        }
      }
    } catch (JacksonException ex) {
      int line = ex.getLocation() == null ? 0 : ex.getLocation().getLineNr();
      throw new InputException(
          Diagnostic.error(
              new SourceRef(shown, Math.max(line, 0)),
              "not valid YAML: " + ex.getOriginalMessage()));
    }
    if (!errors.isEmpty()) {
      throw new InputException(errors);
    }
    return entries;
  }

  /** The entries as arguments: a flag for true booleans, {@code --name value} per value. */
  static List<String> toArgs(List<Entry> entries) {
    List<String> args = new ArrayList<>();
    for (Entry e : entries) {
      String name = e.option().longestName();
      for (String v : e.values()) {
        if (e.option().arity().max() == 0) {
          args.add(name);
        } else {
          args.add(name);
          args.add(v);
        }
      }
    }
    return args;
  }
}
