package dev.numafit.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.cli.Main;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.TestFactory;

/**
 * The bad-input corpus under src/test/resources/bad-input: every file in manifest/, profile/ and
 * snapshot/ is a broken input with its expected message beside it ({@code NAME.expected}, one
 * {@code file:line: severity: message} per line). Each runs through the whole CLI together with a
 * valid input of the same kind; the test checks the expected message, that the valid input is
 * still read, and that no stack trace or internal error reaches the user.
 *
 * <p>The inputs are written for this corpus (made-up services); the expected messages were read
 * and judged one by one when the corpus was made: each names the file, the line and what was
 * expected.
 */
class BadInputCorpusTest {
  static final Path ROOT = root();
  static int answered;

  static Path root() {
    try {
      return Path.of(BadInputCorpusTest.class.getResource("/bad-input").toURI());
    } catch (URISyntaxException ex) {
      throw new IllegalStateException(ex);
    }
  }

  /** One CLI run: exit code, standard output, standard error (absolute corpus paths shortened). */
  record Run(int code, String out, String err) {}

  static Run cli(String... args) {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    int code = Main.run(args, new ByteArrayInputStream(new byte[0]),
        new PrintStream(out, true, StandardCharsets.UTF_8),
        new PrintStream(err, true, StandardCharsets.UTF_8));
    String prefix = ROOT + "/";
    return new Run(code, out.toString(StandardCharsets.UTF_8).replace(prefix, ""),
        err.toString(StandardCharsets.UTF_8).replace(prefix, ""));
  }

  static List<Path> inputs(String dir) throws IOException {
    try (Stream<Path> s = Files.list(ROOT.resolve(dir))) {
      return s.filter(p -> !p.toString().endsWith(".expected")).sorted().toList();
    }
  }

  static void check(Path input, Run r) throws IOException {
    String name = ROOT.relativize(input).toString();
    List<String> expected = Files.readAllLines(Path.of(input + ".expected"));
    assertFalse(expected.isEmpty(), name + ": an expected message");
    for (String line : expected) {
      assertTrue(line.startsWith(name + ":"), name + ": expected line names the file: " + line);
      assertTrue(r.err().lines().anyMatch(line::equals),
          name + ": expected\n" + line + "\nin\n" + r.err());
    }
    String all = r.out() + r.err();
    assertFalse(all.contains("Exception") || all.contains("\tat ")
        || all.contains("internal error"), name + ": no stack trace or internal error:\n" + all);
    answered++;
  }

  @TestFactory
  Stream<DynamicTest> manifests_eachBadInput_messageAndTheValidRestKept() throws IOException {
    Path good = ROOT.resolve("valid/storefront-web.yaml");
    return inputs("manifest").stream().map(p -> DynamicTest.dynamicTest(
        p.getFileName().toString(), () -> {
          Run r = cli("demand", "-f", p.toString(), "-f", good.toString(), "--skip-invalid");
          check(p, r);
          assertEquals(0, r.code(), r.err());
          // The valid manifest given in the same run is still sized.
          assertTrue(r.out().contains("storefront/Deployment/web"), r.out());
        }));
  }

  @TestFactory
  Stream<DynamicTest> profiles_eachBadInput_messageAndTheValidProfileStillValid()
      throws IOException {
    Path good = ROOT.resolve("valid/host-profile.yaml");
    return inputs("profile").stream().map(p -> DynamicTest.dynamicTest(
        p.getFileName().toString(), () -> {
          Run r = cli("profile", "validate", p.toString(), good.toString());
          check(p, r);
          assertEquals(2, r.code(), r.err());
          assertTrue(r.out().contains("valid/host-profile.yaml: valid"), r.out());
        }));
  }

  @TestFactory
  Stream<DynamicTest> snapshots_eachBadInput_refusedWithMessage() throws IOException {
    return inputs("snapshot").stream().map(p -> DynamicTest.dynamicTest(
        p.getFileName().toString(), () -> {
          Run r = cli("review", "--snapshot", p.toString(), "--pool", "pool=general",
              "--worker", "cpu=16,memory=64Gi", "--nodes", "2");
          check(p, r);
          // Refused whole: a snapshot is never used in part.
          assertEquals(2, r.code(), r.err());
          assertEquals("", r.out());
        }));
  }

  @AfterAll
  static void corpusSize() throws IOException {
    List<Path> all = new ArrayList<>();
    for (String d : List.of("manifest", "profile", "snapshot")) {
      all.addAll(inputs(d));
    }
    System.out.println("bad-input corpus: " + all.size() + " inputs, " + answered
        + " answered with their expected message");
    assertTrue(all.size() >= 40, "at least 40 bad inputs");
  }
}
