package dev.numafit.cli;

import dev.numafit.diag.InputException;
import dev.numafit.report.TextStyle;
import java.io.InputStream;
import java.io.PrintStream;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import picocli.CommandLine;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.ParseResult;

/**
 * The command-line entry point. {@link #main} is the only place numafit calls {@link System#exit};
 * everything else goes through {@link #run} so tests can drive the whole CLI with byte streams.
 */
public final class Main {
  /** The commands that read the project config file. */
  private static final java.util.Set<String> CONFIGURABLE =
      java.util.Set.of("plan", "check", "review");

  private Main() {}

  public static void main(String... args) {
    boolean colour =
        "1".equals(System.getProperty("numafit.stderrTty")) && System.getenv("NO_COLOR") == null;
    // The launcher passes what [ -t 1 ] says and the terminal's width.
    TextStyle stdout =
        TextStyle.of(
            "1".equals(System.getProperty("numafit.stdoutTty")),
            System.getenv("NO_COLOR"),
            System.getProperty("numafit.columns", System.getenv("COLUMNS")));
    PrintStream out = new PrintStream(System.out, false, StandardCharsets.UTF_8);
    PrintStream err = new PrintStream(System.err, true, StandardCharsets.UTF_8);
    int code = run(args, System.in, out, err, Path.of("").toAbsolutePath(), colour, stdout);
    out.flush();
    err.flush();
    System.exit(code);
  }

  /**
   * Runs numafit with {@code args} and returns its exit code (see {@link ExitCode}). The config
   * file {@code numafit.yaml} is looked for in the process's current folder.
   */
  public static int run(String[] args, InputStream in, PrintStream out, PrintStream err) {
    return run(args, in, out, err, Path.of("").toAbsolutePath(), false);
  }

  static int run(
      String[] args,
      InputStream in,
      PrintStream out,
      PrintStream err,
      Path workingDir,
      boolean colour) {
    return run(args, in, out, err, workingDir, colour, TextStyle.PLAIN);
  }

  static int run(
      String[] args,
      InputStream in,
      PrintStream out,
      PrintStream err,
      Path workingDir,
      boolean colour,
      TextStyle stdout) {
    Console console = new Console(in, out, err, workingDir, colour, stdout);
    boolean verbose = Arrays.asList(args).contains("--verbose");
    Errors errors = new Errors(console, verbose);
    Optional<String> overInput = outputOverInput(args, workingDir);
    if (overInput.isPresent()) {
      console.error(overInput.get());
      return ExitCode.USAGE_OR_INPUT.code();
    }
    String[] effective;
    try {
      effective = withConfig(args, console);
    } catch (InputException ex) {
      ex.diagnostics().forEach(console::report);
      return ExitCode.USAGE_OR_INPUT.code();
    }
    CommandLine cl = commandLine(console, errors);
    int code = cl.execute(effective);
    cl.getOut().flush();
    cl.getErr().flush();
    out.flush();
    return code;
  }

  /**
   * A sentence when {@code --out FILE} names one of the run's inputs (the same file, or a
   * manifest file inside an input folder): writing there would destroy an input or feed the
   * report back in as one on the next run. Checked before anything is read.
   */
  static Optional<String> outputOverInput(String[] args, Path workingDir) {
    Optional<String> outArg = Optional.empty();
    int outIndex = -1;
    for (int i = 0; i < args.length; i++) {
      if (args[i].equals("--out") && i + 1 < args.length) {
        outArg = Optional.of(args[i + 1]);
        outIndex = i + 1;
      } else if (args[i].startsWith("--out=")) {
        outArg = Optional.of(args[i].substring("--out=".length()));
        outIndex = i;
      }
    }
    if (outArg.isEmpty()) {
      return Optional.empty();
    }
    Path out = workingDir.resolve(outArg.get()).toAbsolutePath().normalize();
    for (int i = 0; i < args.length; i++) {
      String a = args[i];
      if (i == outIndex || a.startsWith("-") && !a.contains("=")) {
        continue;
      }
      String value = a.startsWith("-") ? a.substring(a.indexOf('=') + 1) : a;
      Path in;
      try {
        in = workingDir.resolve(value).toAbsolutePath().normalize();
      } catch (java.nio.file.InvalidPathException ex) {
        continue;
      }
      boolean same;
      try {
        same = Files.exists(out) && Files.exists(in) && Files.isSameFile(out, in);
      } catch (java.io.IOException ex) {
        same = false;
      }
      String name = out.getFileName() == null ? "" : out.getFileName().toString();
      boolean manifestInFolder = Files.isDirectory(in) && out.startsWith(in)
          && (name.endsWith(".yaml") || name.endsWith(".yml") || name.endsWith(".json"));
      if (same || in.equals(out) && Files.exists(in) || manifestInFolder) {
        return Optional.of("--out " + outArg.get() + (same || in.equals(out)
            ? " is also an input of this run"
            : " lies in the input folder " + value + " and would be read as input next time")
            + "; numafit never writes its output over its inputs (choose another file)");
      }
    }
    return Optional.empty();
  }

  private static CommandLine commandLine(Console console, Errors errors) {
    CommandLine cl = new CommandLine(new NumafitCommand(console));
    cl.setOut(new PrintWriter(console.out(), true));
    cl.setErr(new PrintWriter(console.err(), true));
    cl.setCaseInsensitiveEnumValuesAllowed(true);
    cl.setExitCodeExceptionMapper(errors);
    cl.setExecutionExceptionHandler(errors);
    cl.setParameterExceptionHandler(errors);
    return cl;
  }

  /**
   * The arguments with the config file's options inserted right after {@code plan}, for every
   * option the command line does not give itself. Other commands, and command lines picocli
   * rejects, pass through unchanged (execute reports the problem).
   */
  static String[] withConfig(String[] args, Console console) throws InputException {
    CommandLine probe = commandLine(console, new Errors(console, false));
    ParseResult root;
    try {
      root = probe.parseArgs(args);
    } catch (CommandLine.ParameterException ex) {
      return args;
    }
    ParseResult sub = root.subcommand();
    if (sub == null || !CONFIGURABLE.contains(sub.commandSpec().name())
        || sub.isUsageHelpRequested()
        || sub.isVersionHelpRequested()) {
      return args;
    }
    Path config;
    if (sub.hasMatchedOption("--config")) {
      config = console.workingDir().resolve(sub.<Path>matchedOptionValue("--config", null));
      if (!Files.isRegularFile(config)) {
        throw new InputException(
            dev.numafit.diag.Diagnostic.error(
                null, "--config " + sub.<Path>matchedOptionValue("--config", null)
                    + ": no such file"));
      }
    } else {
      config = console.workingDir().resolve(ConfigFile.DEFAULT_NAME);
      if (!Files.isRegularFile(config)) {
        return args;
      }
    }
    CommandSpec plan = sub.commandSpec();
    // One file serves every command that reads it: keys of the others are theirs.
    List<CommandSpec> others = new ArrayList<>();
    for (String name : new java.util.TreeSet<>(CONFIGURABLE)) {
      if (!name.equals(plan.name())) {
        others.add(probe.getSubcommands().get(name).getCommandSpec());
      }
    }
    java.util.Set<String> given = new java.util.HashSet<>();
    sub.matchedOptions().forEach(o -> given.add(o.longestName()));
    List<ConfigFile.Entry> entries = new ArrayList<>();
    for (ConfigFile.Entry e : ConfigFile.read(config, displayPath(config, console).toString(), plan,
        others, given)) {
      if (!sub.hasMatchedOption(e.option())) {
        entries.add(e);
      }
    }
    int at = Arrays.asList(args).indexOf(sub.commandSpec().name());
    List<String> merged = new ArrayList<>(Arrays.asList(args).subList(0, at + 1));
    merged.addAll(ConfigFile.toArgs(entries));
    merged.addAll(Arrays.asList(args).subList(at + 1, args.length));
    return merged.toArray(String[]::new);
  }

  /** The config path relative to the working folder where it lies inside it, for messages. */
  private static Path displayPath(Path config, Console console) {
    Path abs = config.toAbsolutePath().normalize();
    Path wd = console.workingDir().toAbsolutePath().normalize();
    return abs.startsWith(wd) ? wd.relativize(abs) : abs;
  }
}
