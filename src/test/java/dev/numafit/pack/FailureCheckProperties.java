package dev.numafit.pack;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.numafit.pack.RulePacker.Group;
import java.util.ArrayList;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * The incremental failure check ({@link RulePacker#hostsToSurvive}: one layout, lost pods taken
 * off and put back with an undo log, failure sets that survived not checked again at larger host
 * counts) gives exactly what a plain rebuild of the survivors for every host count and failure
 * set gives ({@link FailureReference}), on random small layouts under random rules.
 */
class FailureCheckProperties {
  record Check(RulePackerProperties.Case c, int hostFailures, boolean zoneFailure) {}

  @Provide
  Arbitrary<Check> checks() {
    return Combinators.combine(
            new RulePackerProperties().cases(),
            Arbitraries.integers().between(0, 2),
            Arbitraries.of(false, true))
        .as(Check::new)
        .filter(k -> k.hostFailures() > 0 || (k.zoneFailure() && k.c().topo().zones() > 1));
  }

  @Property(tries = 300)
  void hostsToSurvive_rulePackedLayout_agreesWithRebuildPerFailureSet(
      @ForAll("checks") Check k) {
    RulePackerProperties.Case c = k.c();
    RulePacker.Result layout = RulePacker.pack(c.groups(), c.capacity(), c.topo());
    assertEquals(
        FailureReference.hostsToSurvive(
            c.groups(), c.capacity(), c.topo(), layout, k.hostFailures(), k.zoneFailure(), 6),
        RulePacker.hostsToSurvive(
            c.groups(), c.capacity(), c.topo(), layout, k.hostFailures(), k.zoneFailure(), 6));
  }

  @Property(tries = 200)
  void hostsToSurvive_vectorPackedLayout_agreesWithRebuildPerFailureSet(
      @ForAll("checks") Check k) {
    // The plan's path without rules: the vector packer's workers laid out host by host.
    RulePackerProperties.Case c = k.c();
    List<Group> plain = new ArrayList<>();
    List<long[]> items = new ArrayList<>();
    for (Group g : c.groups()) {
      plain.add(Group.plain(g.demand(), g.count()));
      for (int j = 0; j < g.count(); j++) {
        items.add(g.demand());
      }
    }
    Packing p = new VectorPacker().pack(items.toArray(new long[0][]), c.capacity());
    RulePacker.Result layout = RulePacker.fromPacking(p.binOfItem(), p.bins(), c.topo());
    assertEquals(
        FailureReference.hostsToSurvive(
            plain, c.capacity(), c.topo(), layout, k.hostFailures(), k.zoneFailure(), 6),
        RulePacker.hostsToSurvive(
            plain, c.capacity(), c.topo(), layout, k.hostFailures(), k.zoneFailure(), 6));
  }
}
