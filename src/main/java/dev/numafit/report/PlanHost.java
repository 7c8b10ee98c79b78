package dev.numafit.report;

import dev.numafit.host.HostProfile;
import dev.numafit.shape.HostLayout;
import java.util.Objects;

/**
 * The host a plan was made for, kept for the reports that draw it: its topology and where the
 * plan's workers sit on it.
 *
 * @param profile the host profile as read
 * @param layout the plan's workers on one host, node by node
 */
public record PlanHost(HostProfile profile, HostLayout layout) {
  public PlanHost {
    Objects.requireNonNull(profile, "profile");
    Objects.requireNonNull(layout, "layout");
  }
}
