package dev.numafit.it;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * Headless Chromium as a subprocess: loads a file:// page with a fresh profile folder and no
 * network chatter, and returns the DOM after the page ran plus every console message Chromium
 * logged for it (read from its log on standard error, where each console message is one {@code
 * CONSOLE} line).
 */
final class Chromium {
  private static final Pattern CONSOLE = Pattern.compile(":CONSOLE[:(]");

  private final Path binary;

  private Chromium(Path binary) {
    this.binary = binary;
  }

  /** Debian's chromium on the PATH, when installed. */
  static Optional<Chromium> find() {
    String path = System.getenv().getOrDefault("PATH", "/usr/bin:/bin");
    for (String dir : path.split(":")) {
      for (String name : List.of("chromium", "chromium-browser")) {
        Path p = Path.of(dir, name);
        if (Files.isExecutable(p)) {
          return Optional.of(new Chromium(p));
        }
      }
    }
    return Optional.empty();
  }

  /**
   * What one load of a page gave.
   *
   * @param dom the serialised DOM after load
   * @param console the console messages, one line each
   */
  record Load(String dom, List<String> console) {}

  /** Loads {@code page} and dumps its DOM. */
  Load dumpDom(Path page) throws IOException, InterruptedException {
    Result r = run(page, "--dump-dom");
    return new Load(r.out, consoleLines(r.err));
  }

  /** Loads {@code page} and writes a PNG screenshot of {@code width × height} to {@code png}. */
  Load screenshot(Path page, Path png, int width, int height)
      throws IOException, InterruptedException {
    Result r = run(page, "--screenshot=" + png, "--window-size=" + width + "," + height,
        "--hide-scrollbars");
    return new Load("", consoleLines(r.err));
  }

  private record Result(String out, String err) {}

  private Result run(Path page, String... extra) throws IOException, InterruptedException {
    Path profile = Files.createTempDirectory("numafit-chromium");
    Path out = Files.createTempFile("numafit-chromium", ".out");
    Path err = Files.createTempFile("numafit-chromium", ".err");
    try {
      List<String> cmd = new ArrayList<>(List.of(
          binary.toString(),
          "--headless",
          "--no-sandbox",
          "--disable-gpu",
          "--disable-quic",
          "--no-first-run",
          "--disable-background-networking",
          "--disable-component-update",
          "--disable-sync",
          "--user-data-dir=" + profile,
          "--enable-logging=stderr",
          "--v=0"));
      cmd.addAll(List.of(extra));
      cmd.add(page.toUri().toString());
      Process p = new ProcessBuilder(cmd)
          .redirectOutput(out.toFile())
          .redirectError(err.toFile())
          .redirectInput(ProcessBuilder.Redirect.from(Path.of("/dev/null").toFile()))
          .start();
      if (!p.waitFor(120, TimeUnit.SECONDS)) {
        p.destroyForcibly();
        throw new AssertionError("chromium did not finish in 120 s: " + page);
      }
      if (p.exitValue() != 0) {
        throw new AssertionError("chromium exited " + p.exitValue() + ":\n"
            + Files.readString(err, StandardCharsets.UTF_8));
      }
      return new Result(Files.readString(out, StandardCharsets.UTF_8),
          Files.readString(err, StandardCharsets.UTF_8));
    } finally {
      Files.deleteIfExists(out);
      Files.deleteIfExists(err);
      deleteTree(profile);
    }
  }

  static List<String> consoleLines(String log) {
    return log.lines().filter(l -> CONSOLE.matcher(l).find()).toList();
  }

  private static void deleteTree(Path root) throws IOException {
    try (Stream<Path> all = Files.walk(root)) {
      for (Path p : all.sorted(java.util.Comparator.reverseOrder()).toList()) {
        Files.deleteIfExists(p);
      }
    }
  }
}
