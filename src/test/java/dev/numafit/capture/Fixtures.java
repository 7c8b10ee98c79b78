package dev.numafit.capture;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;

/** Locates the capture fixtures on the test class path and copies trees for damaging. */
final class Fixtures {
  private Fixtures() {}

  static Path path(String resource) {
    try {
      return Path.of(Fixtures.class.getResource("/" + resource).toURI());
    } catch (URISyntaxException | NullPointerException e) {
      throw new IllegalStateException("missing test resource " + resource, e);
    }
  }

  static Path sysfs(String name) {
    return path("sysfs/" + name);
  }

  static TextFile text(String resource) throws TextFile.ReadFailure {
    return TextFile.read(path(resource));
  }

  /** Copies a fixture sysfs tree into {@code target} so a test can damage one file. */
  static Path copyTree(String name, Path target) {
    Path from = sysfs(name);
    try (Stream<Path> all = Files.walk(from)) {
      for (Path p : all.sorted().toList()) {
        Path to = target.resolve(from.relativize(p).toString());
        if (Files.isDirectory(p)) {
          Files.createDirectories(to);
        } else {
          Files.copy(p, to);
        }
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return target;
  }
}
