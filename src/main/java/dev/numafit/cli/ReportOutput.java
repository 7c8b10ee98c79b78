package dev.numafit.cli;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.Optional;

/**
 * Writes a finished report to standard output or to {@code --out FILE}. A file is written to a
 * temporary file in the same folder and then renamed over the target, so a reader never sees half
 * a report and a failed run leaves the old file in place.
 */
final class ReportOutput {
  private ReportOutput() {}

  static void write(String report, Optional<Path> file, Console console) {
    if (file.isEmpty()) {
      console.out().print(report);
      console.out().flush();
      return;
    }
    writeFile(file.get(), report);
  }

  /** Writes {@code content} to {@code target} through a temporary file and a rename. */
  static void writeFile(Path target, String content) {
    Path abs = target.toAbsolutePath();
    Path dir = abs.getParent();
    Path tmp = null;
    try {
      tmp = Files.createTempFile(dir, "." + abs.getFileName(), ".tmp");
      Files.writeString(tmp, content, StandardCharsets.UTF_8);
      try {
        Files.move(tmp, abs, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
      } catch (AtomicMoveNotSupportedException ex) {
        Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING);
      }
    } catch (IOException ex) {
      if (tmp != null) {
        try {
          Files.deleteIfExists(tmp);
        } catch (IOException ignored) {
          // the original error is the one worth reporting
        }
      }
      throw new OutputException(
          "cannot write " + target + ": " + describe(ex), ex);
    }
  }

  private static String describe(IOException ex) {
    String kind = ex.getClass().getSimpleName();
    return switch (kind) {
      case "NoSuchFileException" -> "no such folder";
      case "AccessDeniedException" -> "permission denied";
      case "FileSystemException" -> ex.getMessage();
      default -> ex.getMessage() == null ? kind : ex.getMessage();
    };
  }
}
