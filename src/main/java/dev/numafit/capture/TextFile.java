package dev.numafit.capture;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.SourceRef;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Objects;

/**
 * A small input text split into lines, with its name as messages print it. Line endings CRLF and
 * LF read alike.
 *
 * @param name the file name as the user gave it, or {@code <stdin>}
 * @param lines the lines without their endings
 */
public record TextFile(String name, List<String> lines) {
  public TextFile {
    Objects.requireNonNull(name, "name");
    lines = List.copyOf(lines);
  }

  /** Splits text into lines; a final line ending does not make an extra empty line. */
  public static TextFile of(String name, String text) {
    return new TextFile(name, text.isEmpty() ? List.of() : List.of(text.split("\r?\n", -1)))
        .dropFinalEmpty(text);
  }

  private TextFile dropFinalEmpty(String text) {
    if (!lines.isEmpty() && (text.endsWith("\n"))) {
      return new TextFile(name, lines.subList(0, lines.size() - 1));
    }
    return this;
  }

  /**
   * Reads a file as UTF-8.
   *
   * @throws ReadFailure with a diagnostic naming the file when it is missing or unreadable
   */
  public static TextFile read(Path path) throws ReadFailure {
    try {
      return of(path.toString(), Files.readString(path, StandardCharsets.UTF_8));
    } catch (java.nio.file.NoSuchFileException e) {
      throw new ReadFailure(Diagnostic.error(new SourceRef(path.toString(), 0), "file not found"));
    } catch (IOException | java.io.UncheckedIOException e) {
      throw new ReadFailure(
          Diagnostic.error(new SourceRef(path.toString(), 0), "cannot read: " + e.getMessage()));
    }
  }

  /** Where line {@code n} (1-based) of this file is. */
  public SourceRef at(int n) {
    return new SourceRef(name, n);
  }

  public boolean isEmpty() {
    return lines.isEmpty() || lines.stream().allMatch(String::isBlank);
  }

  /** A file that could not be read; carries the one diagnostic to show. */
  public static final class ReadFailure extends Exception {
    private static final long serialVersionUID = 1L;
    private final transient Diagnostic diagnostic;

    public ReadFailure(Diagnostic diagnostic) {
      super(diagnostic.format());
      this.diagnostic = diagnostic;
    }

    public Diagnostic diagnostic() {
      return diagnostic;
    }
  }
}
