package dev.numafit.profile;

import dev.numafit.diag.Diagnostic;
import dev.numafit.host.HostProfile;
import java.util.List;
import java.util.Objects;

/**
 * A host profile read from a file and the warnings raised while reading it (empty or unequal
 * memory channels, unconfirmed channel population, speeds outside the JEDEC range, more NUMA nodes
 * than the Topology Manager handles by default), sorted by line.
 */
public record ProfileLoad(HostProfile profile, List<Diagnostic> warnings) {
  public ProfileLoad {
    Objects.requireNonNull(profile, "profile");
    warnings = warnings.stream().sorted().toList();
  }
}
