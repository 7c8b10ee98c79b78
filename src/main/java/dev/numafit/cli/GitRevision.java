package dev.numafit.cli;

import dev.numafit.diag.Diagnostic;
import dev.numafit.diag.InputException;
import dev.numafit.diag.SourceRef;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * Reads manifests as they were at a git revision, through the {@code git} command line: {@code git
 * ls-tree} lists the files under each path, {@code git show REV:./path} prints each. A path that
 * did not exist at the revision yields nothing (the change adds it); no git, no repository or no
 * such revision is an input error.
 */
final class GitRevision {
  private GitRevision() {}

  /**
   * The manifest texts under {@code paths} at {@code rev}, keyed {@code REV:path} in path order,
   * read with {@code workingDir} as the current folder.
   */
  static SortedMap<String, String> read(Path workingDir, String rev, List<String> paths)
      throws InputException {
    Result version = run(workingDir, List.of("git", "--version"));
    if (version.code != 0) {
      throw error("--baseline-git needs the git command, which did not run: " + version.err);
    }
    Result verify =
        run(workingDir, List.of("git", "rev-parse", "--verify", "--quiet", rev + "^{commit}"));
    if (verify.code != 0) {
      Result inside = run(workingDir, List.of("git", "rev-parse", "--is-inside-work-tree"));
      if (inside.code != 0) {
        throw error("--baseline-git " + rev + ": " + workingDir
            + " is not inside a git repository");
      }
      throw error("--baseline-git " + rev + ": no such revision in this repository");
    }
    SortedMap<String, String> texts = new TreeMap<>();
    for (String path : paths) {
      Result list =
          run(workingDir, List.of("git", "ls-tree", "-r", "-z", "--name-only", rev, "--", path));
      if (list.code != 0) {
        throw error("--baseline-git " + rev + ": cannot list " + path + ": " + list.err.strip());
      }
      for (String file : list.out.split("\0")) {
        if (file.isEmpty() || !isManifest(file) || hidden(path, file)) {
          continue;
        }
        Result show = run(workingDir, List.of("git", "show", rev + ":./" + file));
        if (show.code != 0) {
          throw error("--baseline-git " + rev + ": cannot read " + file + ": " + show.err.strip());
        }
        texts.put(rev + ":" + file, show.out);
      }
    }
    return texts;
  }

  private static boolean isManifest(String f) {
    String n = f.toLowerCase(Locale.ROOT);
    return n.endsWith(".yaml") || n.endsWith(".yml") || n.endsWith(".json");
  }

  /** A file under a dot folder (below the path given) is skipped, as the manifest reader does. */
  private static boolean hidden(String root, String file) {
    String rel = file;
    String r = root.endsWith("/") ? root : root + "/";
    if (file.startsWith(r)) {
      rel = file.substring(r.length());
    }
    for (String part : rel.split("/")) {
      if (part.startsWith(".") && !part.equals(".") && !part.equals("..")) {
        return true;
      }
    }
    return false;
  }

  private static InputException error(String message) {
    return new InputException(Diagnostic.error((SourceRef) null, message));
  }

  private record Result(int code, String out, String err) {}

  private static Result run(Path dir, List<String> command) throws InputException {
    ProcessBuilder pb = new ProcessBuilder(new ArrayList<>(command)).directory(dir.toFile());
    pb.environment().put("GIT_TERMINAL_PROMPT", "0");
    pb.environment().put("LC_ALL", "C");
    Process p;
    try {
      p = pb.start();
    } catch (IOException ex) {
      throw error("--baseline-git needs the git command line, but \"git\" could not be started"
          + " (is it installed and on PATH?)");
    }
    try {
      p.getOutputStream().close();
      ByteArrayOutputStream err = new ByteArrayOutputStream();
      Thread drain = new Thread(() -> copy(p.getErrorStream(), err));
      drain.start();
      byte[] out = p.getInputStream().readAllBytes();
      int code = p.waitFor();
      drain.join();
      return new Result(code, new String(out, StandardCharsets.UTF_8),
          err.toString(StandardCharsets.UTF_8));
    } catch (IOException ex) {
      throw error("--baseline-git: reading from git failed: " + ex.getMessage());
    } catch (InterruptedException ex) {
      Thread.currentThread().interrupt();
      throw error("--baseline-git: interrupted while waiting for git");
    }
  }

  private static void copy(InputStream in, ByteArrayOutputStream out) {
    try {
      in.transferTo(out);
    } catch (IOException ignored) {
      // the exit code tells whether git failed; its error text is a courtesy
    }
  }
}
