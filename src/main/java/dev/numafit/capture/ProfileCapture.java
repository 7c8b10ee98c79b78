package dev.numafit.capture;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * Runs a capture from the sources the user named: sysfs under a root folder (the default, root
 * {@code /}), or an {@code lscpu -p} file for the CPUs, plus optionally the text of
 * {@code dmidecode -t 17} for the memory modules.
 */
public final class ProfileCapture {
  /** The name standard input goes by in messages. */
  public static final String STDIN = "<stdin>";

  private ProfileCapture() {}

  /**
   * What to read.
   *
   * @param sysfsRoot the root folder of a sysfs tree; empty means {@code /} unless {@code lscpu}
   *     is given, in which case sysfs is not read at all
   * @param dmidecode a file with {@code dmidecode -t 17} output, or {@code -} for standard input
   * @param lscpu a file with {@code lscpu -p} output, used for the CPUs instead of sysfs
   */
  public record Request(Optional<Path> sysfsRoot, Optional<String> dmidecode, Optional<Path> lscpu) {
    public Request {
      Objects.requireNonNull(sysfsRoot, "sysfsRoot");
      Objects.requireNonNull(dmidecode, "dmidecode");
      Objects.requireNonNull(lscpu, "lscpu");
    }
  }

  /**
   * Reads every source and derives the host.
   *
   * @throws InputException every problem of every source, each naming file and line
   */
  public static CapturedHost capture(Request request, InputStream stdin) throws InputException {
    List<Diagnostic> errors = new ArrayList<>();
    CapturedTopology topology = null;
    if (request.lscpu().isPresent()) {
      try {
        topology = LscpuParser.parse(TextFile.read(request.lscpu().get()));
      } catch (TextFile.ReadFailure f) {
        errors.add(f.diagnostic());
      } catch (InputException e) {
        errors.addAll(e.diagnostics());
      }
      if (request.sysfsRoot().isPresent()) {
        try {
          CapturedTopology sys = new SysfsReader(request.sysfsRoot().get()).read();
          if (topology != null) {
            topology =
                new CapturedTopology(
                    topology.cpuSource(), topology.cpus(), sys.offlineCpus(), sys.nodes());
          }
        } catch (InputException e) {
          errors.addAll(e.diagnostics());
        }
      }
    } else {
      try {
        topology = new SysfsReader(request.sysfsRoot().orElse(Path.of("/"))).read();
      } catch (InputException e) {
        errors.addAll(e.diagnostics());
      }
    }
    Optional<String> dimmSource = Optional.empty();
    List<MemoryDevice> dimms = List.of();
    if (request.dmidecode().isPresent()) {
      String name = request.dmidecode().get();
      try {
        TextFile text =
            name.equals("-")
                ? TextFile.of(STDIN, new String(stdin.readAllBytes(), StandardCharsets.UTF_8))
                : TextFile.read(Path.of(name));
        dimms = DmidecodeParser.parse(text);
        dimmSource = Optional.of(text.name());
      } catch (TextFile.ReadFailure f) {
        errors.add(f.diagnostic());
      } catch (InputException e) {
        errors.addAll(e.diagnostics());
      } catch (IOException e) {
        errors.add(Diagnostic.error(null, "cannot read standard input: " + e.getMessage()));
      }
    }
    if (!errors.isEmpty()) {
      throw new InputException(errors);
    }
    try {
      return HostCapture.derive(topology, dimmSource, dimms);
    } catch (IllegalArgumentException e) {
      throw new InputException(Diagnostic.error(null, e.getMessage()));
    }
  }
}
