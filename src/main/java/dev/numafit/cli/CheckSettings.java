package dev.numafit.cli;

import dev.numafit.check.CheckOptions;
import dev.numafit.check.Rule;
import dev.numafit.report.check.CheckFormat;
import java.math.BigDecimal;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.SortedSet;
import java.util.TreeSet;

/**
 * The options of {@code numafit check} after every cross-option rule was checked. The sizing
 * options are {@code plan}'s, checked by {@link PlanOptions#check} so both commands size alike.
 *
 * @param plan the sizing options, shared with {@code plan}
 * @param check what the gate checks and what fails it
 * @param baseline {@code --baseline} paths, empty when not given
 * @param baselineGit {@code --baseline-git} revision, when given
 */
record CheckSettings(
    PlanOptions plan,
    CheckOptions check,
    List<String> baseline,
    Optional<String> baselineGit,
    CheckFormat format,
    Optional<Path> out) {
  CheckSettings {
    Objects.requireNonNull(plan, "plan");
    Objects.requireNonNull(check, "check");
    baseline = List.copyOf(baseline);
    Objects.requireNonNull(baselineGit, "baselineGit");
    Objects.requireNonNull(format, "format");
    Objects.requireNonNull(out, "out");
  }

  /** Whether a baseline was asked for. */
  boolean hasBaseline() {
    return !baseline.isEmpty() || baselineGit.isPresent();
  }

  /**
   * Checks every rule between options and builds the settings; all broken rules are reported
   * together.
   *
   * @throws UsageException naming each broken rule in one sentence
   */
  static CheckSettings check(CheckCommand c) {
    List<String> problems = new ArrayList<>();
    PlanCommand p = new PlanCommand();
    p.manifests = c.manifests;
    p.kubelet = c.kubelet;
    p.hostProfiles = c.hostProfiles;
    p.worker = c.worker;
    p.hostFailures = c.hostFailures;
    p.maxUtilization = c.maxUtilization;
    p.cpuOvercommit = c.cpuOvercommit;
    p.vcpuPerThread = c.vcpuPerThread;
    p.includeCustom = c.includeCustom;
    PlanOptions plan = null;
    try {
      plan = PlanOptions.check(p);
    } catch (UsageException ex) {
      for (String s : ex.problems()) {
        problems.add(s.startsWith("plan ") ? "check " + s.substring(5) : s);
      }
    }
    if (c.hostProfiles.size() > 1) {
      problems.add("check takes one --host-profile (it checks against one worker shape), got "
          + c.hostProfiles.size());
    }
    CheckFormat format = CheckFormat.TEXT;
    try {
      format = CheckFormat.fromLabel(c.output);
    } catch (IllegalArgumentException ex) {
      problems.add("-o " + ex.getMessage());
    }
    OptionalInt fleet = OptionalInt.empty();
    if (c.fleetHosts != null) {
      if (c.fleetHosts < 1) {
        problems.add("--fleet-hosts must be at least 1, got " + c.fleetHosts);
      } else if (c.hostProfiles.isEmpty()) {
        problems.add("--fleet-hosts needs --host-profile (without one, check counts workers,"
            + " not hosts)");
      } else {
        fleet = OptionalInt.of(c.fleetHosts);
      }
    }
    SortedSet<Rule> failOn = CheckOptions.defaultFailOn(c.fleetHosts != null);
    if (c.failOn != null) {
      failOn = new TreeSet<>();
      for (String id : c.failOn) {
        if (id.strip().equalsIgnoreCase("none") && c.failOn.size() == 1) {
          break;
        }
        Optional<Rule> rule = Rule.byId(id);
        if (rule.isEmpty()) {
          problems.add("--fail-on: unknown rule \"" + id.strip() + "\" (expected none or one of: "
              + Rule.ids() + ")");
        } else {
          failOn.add(rule.get());
        }
      }
    }
    BigDecimal ratio = CheckOptions.DEFAULT_LIMIT_RATIO;
    if (c.limitRatio != null) {
      if (c.limitRatio.compareTo(BigDecimal.ONE) <= 0) {
        problems.add("--limit-ratio must be above 1 (limit ÷ request), got "
            + c.limitRatio.toPlainString());
      } else {
        ratio = c.limitRatio;
      }
    }
    if (!c.baseline.isEmpty() && c.baselineGit != null) {
      problems.add("--baseline and --baseline-git cannot be combined: give one baseline");
    }
    if (c.baselineGit != null && c.manifests.files.contains("-")) {
      problems.add("--baseline-git reads the -f paths at a revision; standard input (-f -) has"
          + " none");
    }
    if (c.baselineGit != null && c.baselineGit.isBlank()) {
      problems.add("--baseline-git needs a revision, e.g. origin/main");
    }
    if (c.baseline.contains("-") && c.manifests.files.contains("-")) {
      problems.add("standard input can feed either -f or --baseline, not both");
    }
    if (c.failOnExisting && c.baseline.isEmpty() && c.baselineGit == null) {
      problems.add("--fail-on-existing needs --baseline or --baseline-git (without a baseline"
          + " every finding is new)");
    }
    if (!problems.isEmpty()) {
      throw new UsageException(problems);
    }
    return new CheckSettings(
        plan,
        new CheckOptions(ratio, fleet, failOn, c.failOnExisting),
        c.baseline,
        Optional.ofNullable(c.baselineGit),
        format,
        Optional.ofNullable(c.out));
  }
}
