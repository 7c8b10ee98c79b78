package dev.numafit.plan;

import dev.numafit.demand.PlacementRules;
import dev.numafit.demand.Workload;
import dev.numafit.pack.RulePacker;
import java.util.EnumMap;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Maps a workload's placement rules and the plan's placement options to the packer's domains:
 * {@code kubernetes.io/hostname} is one worker, {@link PlacementRules#HOST_KEY} one physical
 * host, {@code topology.kubernetes.io/zone} one zone. Rules on other keys, and ScheduleAnyway
 * spread, are noted and not enforced. Node rules (nodeSelector, node affinity, tolerations) are
 * checked before packing, against worker pools ({@link PoolPlanner}).
 */
public final class RuleMapping {
  private RuleMapping() {}

  /** The packer's domain of a topology key, if it models that key. */
  public static Optional<RulePacker.Domain> domainOf(String topologyKey) {
    return switch (topologyKey) {
      case PlacementRules.HOSTNAME_KEY -> Optional.of(RulePacker.Domain.WORKER);
      case PlacementRules.HOST_KEY -> Optional.of(RulePacker.Domain.HOST);
      case PlacementRules.ZONE_KEY, "failure-domain.beta.kubernetes.io/zone" ->
          Optional.of(RulePacker.Domain.ZONE);
      default -> Optional.empty();
    };
  }

  /**
   * The packer group of a workload's pods.
   *
   * @param row one pod's demand over the plan's dimensions
   * @param count pods to place
   * @param notes receives a remark per rule that is read but not enforced
   */
  public static RulePacker.Group group(
      Workload w, long[] row, int count, PlacementOptions options, List<String> notes) {
    PlacementRules rules = w.rules();
    Set<RulePacker.Domain> anti = EnumSet.noneOf(RulePacker.Domain.class);
    Map<RulePacker.Domain, Integer> skew = new EnumMap<>(RulePacker.Domain.class);
    for (String key : rules.antiAffinityKeys()) {
      Optional<RulePacker.Domain> d = domainOf(key);
      if (d.isPresent()) {
        anti.add(d.get());
      } else {
        notes.add(w.id() + ": anti-affinity on " + key + " is not modelled (not enforced)");
      }
    }
    for (PlacementRules.Spread s : rules.spread()) {
      Optional<RulePacker.Domain> d = domainOf(s.topologyKey());
      if (!s.hard()) {
        notes.add(w.id() + ": spread over " + s.topologyKey() + " is ScheduleAnyway (reported,"
            + " not enforced)");
      } else if (d.isEmpty()) {
        notes.add(w.id() + ": spread over " + s.topologyKey() + " is not modelled (not"
            + " enforced)");
      } else {
        skew.merge(d.get(), s.maxSkew(), Math::min);
      }
    }
    if (options.spreadReplicasAcross().isPresent() && count >= 2) {
      domainOf(options.spreadReplicasAcross().get())
          .ifPresent(d -> skew.merge(d, 1, Math::min));
    }
    rules.notModelled().forEach(n -> notes.add(w.id() + ": " + n));
    // Zone rules mean nothing with one zone: every pod is in it.
    if (options.zones() == 1) {
      skew.remove(RulePacker.Domain.ZONE);
    }
    return new RulePacker.Group(row, count, anti, skew);
  }
}
