package dev.numafit.verify;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.TimeUnit;

/** Runs an outside program for a test, with a deadline, and keeps what it printed. */
final class Processes {
  private Processes() {}

  /** What a finished program left: exit code, standard output and standard error. */
  record Result(int exitCode, String stdout, String stderr) {}

  /** The first executable of this name on PATH, if any. */
  static Optional<Path> onPath(String name) {
    String path = System.getenv("PATH");
    if (path == null) {
      return Optional.empty();
    }
    for (String dir : path.split(File.pathSeparator)) {
      if (dir.isEmpty()) {
        continue;
      }
      Path p = Path.of(dir, name);
      if (Files.isRegularFile(p) && Files.isExecutable(p)) {
        return Optional.of(p);
      }
    }
    return Optional.empty();
  }

  /** Runs {@code command} in {@code dir} with extra environment; kills it after the deadline. */
  static Result run(List<String> command, Path dir, Map<String, String> env, Duration deadline)
      throws IOException, InterruptedException {
    Path out = Files.createTempFile(dir, "out", ".txt");
    Path err = Files.createTempFile(dir, "err", ".txt");
    ProcessBuilder pb = new ProcessBuilder(command).directory(dir.toFile())
        .redirectInput(ProcessBuilder.Redirect.from(new File("/dev/null")))
        .redirectOutput(out.toFile()).redirectError(err.toFile());
    pb.environment().putAll(env);
    Process p = pb.start();
    if (!p.waitFor(deadline.toMillis(), TimeUnit.MILLISECONDS)) {
      p.destroyForcibly();
      p.waitFor();
      throw new IllegalStateException(command.get(0) + " did not finish within " + deadline
          + "; stderr: " + Files.readString(err, StandardCharsets.UTF_8));
    }
    return new Result(p.exitValue(), Files.readString(out, StandardCharsets.UTF_8),
        Files.readString(err, StandardCharsets.UTF_8));
  }
}
