package dev.numafit.cli;

import dev.numafit.cluster.SnapshotFile;
import dev.numafit.cluster.model.ClusterModel;
import dev.numafit.diag.InputException;
import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;

/** {@code numafit snapshot}: reads a live cluster once and writes it to a snapshot file. */
@Command(
    name = "snapshot",
    sortOptions = false,
    usageHelpAutoWidth = false,
    mixinStandardHelpOptions = true,
    versionProvider = VersionProvider.class,
    description = {
      "Reads a running cluster (list requests only: nodes, pods, workloads, autoscalers,"
          + " LimitRanges, RuntimeClasses, PodDisruptionBudgets) and writes what it read to one"
          + " JSON file, so a review can be rerun offline or shared (format: docs/snapshot.md).",
      "Access needed: docs/rbac.md."
    },
    footerHeading = "%nExamples:%n",
    footer = {
      "  numafit snapshot --out cluster.json",
      "  numafit snapshot --context staging --namespace shop --out shop.json",
      "  numafit review --snapshot cluster.json --pool pool=general --nodes 7 \\",
      "      --host-profile host-profiles/two-socket-one-node-per-socket.yaml",
      "",
      "Exit codes: 0 written, 2 usage, input or connection error, 3 internal error."
    })
public final class SnapshotCommand implements Callable<Integer> {
  @ParentCommand NumafitCommand root;

  @Mixin ClusterOptions cluster = new ClusterOptions();

  @Option(
      names = "--out",
      required = true,
      paramLabel = "FILE",
      description = "Snapshot file to write (via a temporary file in the same folder, then"
          + " renamed).")
  Path out;

  @Option(names = "--verbose", description = "List every request made (never a credential).")
  boolean verbose;

  @Override
  public Integer call() throws InputException {
    Console console = root.console();
    if (cluster.snapshot != null) {
      throw new UsageException("snapshot reads a live cluster: --snapshot is for review");
    }
    ClusterModel m = cluster.load(console, verbose);
    ClusterOptions.reportNotes(m, console);
    write(out.toAbsolutePath(), m);
    console.err().println("numafit: wrote " + out + ": " + m.nodes().size() + " nodes, "
        + m.pods().size() + " pods, " + m.workloads().size() + " workloads, "
        + m.budgets().size() + " disruption budgets");
    return ExitCode.OK.code();
  }

  private static void write(Path target, ClusterModel m) {
    Path tmp = null;
    try {
      tmp = Files.createTempFile(target.getParent(), "." + target.getFileName(), ".tmp");
      try (Writer w = Files.newBufferedWriter(tmp, StandardCharsets.UTF_8)) {
        SnapshotFile.write(m, w);
      }
      try {
        Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE,
            StandardCopyOption.REPLACE_EXISTING);
      } catch (AtomicMoveNotSupportedException ex) {
        Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
      }
    } catch (IOException ex) {
      try {
        if (tmp != null) {
          Files.deleteIfExists(tmp);
        }
      } catch (IOException ignored) {
        // the first error is the one worth reporting
      }
      throw new OutputException("cannot write " + target + ": " + ex.getMessage(), ex);
    }
  }
}
