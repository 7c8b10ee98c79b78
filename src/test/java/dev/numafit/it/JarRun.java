package dev.numafit.it;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;

/**
 * One run of the built jar {@code target/numafit.jar} as a subprocess: exit code, standard output,
 * standard error. Golden files hold all three; {@code -Dnumafit.golden.update=true} rewrites them
 * instead of comparing.
 */
record JarRun(List<String> args, int code, String out, String err) {
  static final Path PROJECT = Path.of("").toAbsolutePath();
  static final Path JAR = PROJECT.resolve("target/numafit.jar");
  static final Path GOLDEN = PROJECT.resolve("src/test/resources/golden");
  static final boolean UPDATE = Boolean.getBoolean("numafit.golden.update");

  static JarRun of(String... args) {
    return in(PROJECT, null, args);
  }

  /** Runs in {@code dir}, feeding {@code stdin} (a file) when not null. */
  static JarRun in(Path dir, Path stdin, String... args) {
    assertTrue(Files.isRegularFile(JAR), "build the jar first (mvn package): " + JAR);
    List<String> cmd = new ArrayList<>();
    cmd.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
    cmd.add("-XX:+UseSerialGC");
    cmd.add("-XX:TieredStopAtLevel=1");
    cmd.add("-jar");
    cmd.add(JAR.toString());
    cmd.addAll(List.of(args));
    ProcessBuilder pb = new ProcessBuilder(cmd).directory(dir.toFile());
    pb.environment().remove("NO_COLOR");
    try {
      Path out = Files.createTempFile("numafit-it", ".out");
      Path err = Files.createTempFile("numafit-it", ".err");
      pb.redirectOutput(out.toFile()).redirectError(err.toFile());
      pb.redirectInput(
          stdin == null
              ? ProcessBuilder.Redirect.from(Path.of("/dev/null").toFile())
              : ProcessBuilder.Redirect.from(stdin.toFile()));
      Process p = pb.start();
      if (!p.waitFor(120, TimeUnit.SECONDS)) {
        p.destroyForcibly();
        throw new AssertionError("numafit did not finish in 120 s: " + args);
      }
      JarRun r =
          new JarRun(
              List.of(args),
              p.exitValue(),
              Files.readString(out, StandardCharsets.UTF_8),
              Files.readString(err, StandardCharsets.UTF_8));
      Files.delete(out);
      Files.delete(err);
      return r;
    } catch (IOException ex) {
      throw new AssertionError(ex);
    } catch (InterruptedException ex) {
      Thread.currentThread().interrupt();
      throw new AssertionError(ex);
    }
  }

  /** The run as a golden file: the command, the exit code, stdout and stderr. */
  String transcript() {
    return "$ numafit "
        + String.join(" ", args)
        + "\nexit: "
        + code
        + "\n--- stdout\n"
        + out
        + "--- stderr\n"
        + err;
  }

  /** Compares the transcript with {@code golden/<name>.txt}, or rewrites it when updating. */
  JarRun matchesGolden(String name) {
    Path file = GOLDEN.resolve(name + ".txt");
    try {
      if (UPDATE) {
        Files.createDirectories(GOLDEN);
        Files.writeString(file, transcript(), StandardCharsets.UTF_8);
        return this;
      }
      assertTrue(
          Files.isRegularFile(file),
          "no golden file " + file + "; run mvn verify -Dnumafit.golden.update=true");
      assertEquals(Files.readString(file, StandardCharsets.UTF_8), transcript(), name);
    } catch (IOException ex) {
      throw new AssertionError(ex);
    }
    return this;
  }
}
