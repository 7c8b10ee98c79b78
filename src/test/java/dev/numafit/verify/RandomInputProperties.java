package dev.numafit.verify;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.numafit.cluster.SnapshotFile;
import dev.numafit.demand.Demand;
import dev.numafit.demand.PodArithmetic;
import dev.numafit.diag.InputException;
import dev.numafit.manifest.ManifestReader;
import dev.numafit.manifest.PodSpecConversion;
import dev.numafit.manifest.ReadOptions;
import dev.numafit.profile.HostProfileReader;
import io.fabric8.kubernetes.api.model.PodSpec;
import io.fabric8.kubernetes.api.model.PodSpecBuilder;
import io.fabric8.kubernetes.api.model.Quantity;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.TreeMap;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Assume;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * Random-input tests (jqwik, not coverage-guided) for the four readers of outside input: the
 * quantity path, the manifest reader, the host-profile reader and the snapshot reader. They run in
 * every build at no start-up cost; the coverage-guided fuzz targets for the same readers are in
 * dev.numafit.verify.fuzz (bench/fuzz.sh). Inputs are random text and random byte-level mutations of the
 * valid corpus files. The property: a reader answers with diagnostics or a refusal, never with
 * any other exception.
 */
class RandomInputProperties {
  static String corpus(String name) {
    try {
      return Files.readString(Path.of(
          RandomInputProperties.class.getResource("/bad-input/" + name).toURI()));
    } catch (IOException ex) {
      throw new UncheckedIOException(ex);
    } catch (URISyntaxException ex) {
      throw new IllegalStateException(ex);
    }
  }

  static final String MANIFEST = corpus("valid/storefront-web.yaml");
  static final String PROFILE = corpus("valid/host-profile.yaml");
  static final String SNAPSHOT = corpus("valid/snapshot.json");

  /** A valid text with one to four characters replaced, inserted or deleted at random. */
  static Arbitrary<String> mutated(String base) {
    Arbitrary<Integer> at = Arbitraries.integers().between(0, base.length() - 1);
    Arbitrary<Character> c = Arbitraries.oneOf(Arbitraries.of(':', '-', ' ', '\n', '\t', '[',
        ']', '{', '}', '"', '\'', '&', '*', '#', '0', '9', 'e', 'm', 'G', 'i', ','),
        Arbitraries.chars());
    Arbitrary<int[]> edit = Arbitraries.integers().between(0, 2).array(int[].class).ofSize(1);
    return net.jqwik.api.Combinators.combine(at.list().ofMinSize(1).ofMaxSize(4),
        c.list().ofSize(4), edit).as((pos, chars, kind) -> {
          StringBuilder b = new StringBuilder(base);
          for (int i = 0; i < pos.size(); i++) {
            int p = Math.min(pos.get(i), b.length() - 1);
            switch (kind[0]) {
              case 0 -> b.setCharAt(p, chars.get(i));
              case 1 -> b.insert(p, chars.get(i));
              default -> b.deleteCharAt(p);
            }
          }
          return b.toString();
        });
  }

  @Provide
  Arbitrary<String> manifests() {
    return Arbitraries.oneOf(mutated(MANIFEST), Arbitraries.strings().ofMaxLength(200));
  }

  @Provide
  Arbitrary<String> profiles() {
    return Arbitraries.oneOf(mutated(PROFILE), Arbitraries.strings().ofMaxLength(200));
  }

  @Provide
  Arbitrary<String> snapshots() {
    return Arbitraries.oneOf(mutated(SNAPSHOT), Arbitraries.strings().ofMaxLength(200));
  }

  @Provide
  Arbitrary<String> quantities() {
    return Arbitraries.oneOf(
        Arbitraries.strings().withChars("0123456789.+-eEkMGTPKimun ").ofMaxLength(12),
        Arbitraries.strings().ofMaxLength(8));
  }

  @Property(tries = 400)
  void manifestReader_randomText_diagnosticsNeverAnException(@ForAll("manifests") String text) {
    TreeMap<String, String> in = new TreeMap<>();
    in.put("random.yaml", text);
    in.put("random.json", text);
    Demand d = new ManifestReader().readTexts(in, ReadOptions.defaults()).demand();
    assertNotNull(d);
    // The reader's own safety net must not be what caught it.
    assertFalse(d.diagnostics().stream().anyMatch(x -> x.message().contains("cannot read this"
        + " document (")), d.diagnostics().toString());
  }

  @Property(tries = 300)
  void hostProfileReader_randomText_loadOrInputException(@ForAll("profiles") String text) {
    try {
      assertNotNull(new HostProfileReader().parse("random.yaml", text));
    } catch (InputException ex) {
      assertFalse(ex.diagnostics().isEmpty());
    }
  }

  @Property(tries = 300)
  void snapshotReader_randomText_modelOrInputException(@ForAll("snapshots") String text) {
    try {
      assertNotNull(SnapshotFile.parse(text, "random.json"));
    } catch (InputException ex) {
      assertTrue(ex.diagnostics().get(0).format().startsWith("random.json:"),
          ex.diagnostics().get(0).format());
    }
  }

  @Property(tries = 1000)
  void quantityPath_randomAmount_problemOrAnEffectivePod(@ForAll("quantities") String amount) {
    Quantity q;
    try {
      q = new Quantity(amount);
    } catch (IllegalArgumentException ex) {
      // fabric8 refuses this text itself (an empty amount): it never reaches numafit this way.
      Assume.that(false);
      return;
    }
    PodSpec spec = new PodSpecBuilder().addNewContainer().withName("c").withNewResources()
        .addToRequests("cpu", q).addToLimits("memory", q)
        .endResources().endContainer().build();
    PodSpecConversion.Result r = PodSpecConversion.toModel(spec, "random/Pod/p");
    if (r.problems().isEmpty()) {
      assertNotNull(PodArithmetic.effective(r.model()));
    } else {
      assertTrue(r.problems().stream().allMatch(p -> p.contains("random/Pod/p")),
          r.problems().toString());
    }
  }

  @Property(tries = 1)
  void corpusFiles_areValid(@ForAll("manifests") String ignored) throws InputException {
    // The mutation bases themselves are valid inputs.
    assertNotNull(new HostProfileReader().parse("valid.yaml", PROFILE));
    assertNotNull(SnapshotFile.parse(SNAPSHOT, "valid.json"));
    assertTrue(new ManifestReader().readTexts(new TreeMap<>(java.util.Map.of("v.yaml",
        MANIFEST)), ReadOptions.defaults()).demand().workloads().size() == 1);
    List.of().size();
  }
}
