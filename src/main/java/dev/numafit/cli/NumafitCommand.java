package dev.numafit.cli;

import dev.numafit.manifest.ManifestReader;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ScopeType;
import picocli.CommandLine.Spec;

/** The root command: {@code --help}, {@code --version} and the subcommands. */
@Command(
    name = "numafit",
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    usageHelpAutoWidth = false,
    description = {
      "Sizes Kubernetes worker VMs so each fits one NUMA node of its host, from the workload's"
          + " manifests and a host profile."
    },
    subcommands = {
      DemandCommand.class,
      PlanCommand.class,
      CheckCommand.class,
      SnapshotCommand.class,
      ReviewCommand.class,
      CompletionCommand.class,
      ProfileCommand.class,
      CommandLine.HelpCommand.class
    },
    footerHeading = "%nExamples:%n",
    footer = {
      "  numafit plan -f manifests-examples/parcel-delivery/ \\",
      "      --host-profile host-profiles/two-socket-one-node-per-socket.yaml",
      "  numafit demand -f manifests-examples/ticket-office/ -o json",
      "  numafit help plan",
      "",
      "Exit codes: 0 done, 2 usage or input error, 3 internal error (see docs/exit-codes.md).",
      "Sizing comes from declared requests: verify a plan against your hardware's documentation"
          + " and a load test."
    })
public final class NumafitCommand implements Callable<Integer> {
  private final Console console;

  @Spec CommandSpec spec;

  NumafitCommand(Console console) {
    this.console = console;
  }

  @Option(
      names = "--max-document-size",
      scope = ScopeType.INHERIT,
      paramLabel = "SIZE",
      converter = DocumentSizeConverter.class,
      description =
          "Largest manifest file, standard input, YAML document or JSON value read, in"
              + " characters (Ki, Mi suffixes allowed; default 32Mi). Raise it for very large"
              + " inputs.")
  int maxDocumentChars = ManifestReader.DEFAULT_MAX_DOCUMENT_CHARS;

  Console console() {
    return console.withMaxDocumentChars(maxDocumentChars);
  }

  /** Reads {@code --max-document-size}: a whole number with an optional Ki or Mi suffix. */
  static final class DocumentSizeConverter implements CommandLine.ITypeConverter<Integer> {
    @Override
    public Integer convert(String value) {
      java.util.regex.Matcher m =
          java.util.regex.Pattern.compile("([0-9]{1,10})(Ki|Mi)?").matcher(value.trim());
      long n = -1;
      if (m.matches()) {
        n = Long.parseLong(m.group(1));
        if ("Ki".equals(m.group(2))) {
          n <<= 10;
        } else if ("Mi".equals(m.group(2))) {
          n <<= 20;
        }
      }
      if (n <= 0 || n > Integer.MAX_VALUE - 8) {
        throw new CommandLine.TypeConversionException(
            "'" + value + "' is not a size (expected a whole number of characters from 1 to"
                + " 2047Mi, e.g. 64Mi)");
      }
      return (int) n;
    }
  }

  @Override
  public Integer call() {
    throw new CommandLine.ParameterException(
        spec.commandLine(),
        "missing command (expected one of: "
            + String.join(", ", spec.subcommands().keySet())
            + ")");
  }
}
