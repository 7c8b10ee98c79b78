package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** The placement and failure options of {@code numafit plan}: checks and their effect. */
class PlacementOptionsTest {
  static final String PARCEL = "manifests-examples/parcel-delivery";
  static final String PROFILE = "host-profiles/two-socket-one-node-per-socket.yaml";

  @Test
  void plan_zoneFailuresWithoutZones_usageError() {
    CliRun r =
        CliRun.of("plan", "-f", PARCEL, "--host-profile", PROFILE, "--zone-failures", "1");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("--zone-failures 1 needs --zones 2 or more"), r.err());
  }

  @Test
  void plan_unknownSpreadTarget_usageError() {
    CliRun r =
        CliRun.of(
            "plan", "-f", PARCEL, "--host-profile", PROFILE, "--spread-replicas-across", "racks");
    assertEquals(2, r.code());
    assertTrue(
        r.err().contains("--spread-replicas-across takes hosts, workers or zones, not \"racks\""),
        r.err());
  }

  @Test
  void plan_hostFailures_jsonCarriesCountWithoutFailures() {
    CliRun r =
        CliRun.of(
            "plan", "-f", PARCEL, "--host-profile", PROFILE, "--host-failures", "1", "-o",
            "json");
    assertEquals(0, r.code(), r.err());
    // The parcel plan needs 1 host (golden plan-parcel-two-socket.txt); losing that one host
    // leaves nothing, so one more host is the least that survives.
    assertTrue(r.out().contains("\"hostsNeeded\": 2"), r.out());
    assertTrue(r.out().contains("\"hostsNeededWithoutFailures\": 1"), r.out());
  }

  @Test
  void plan_spreadAcrossHostsTwoZonesZoneFailure_runs() {
    CliRun r =
        CliRun.of(
            "plan", "-f", PARCEL, "--host-profile", PROFILE, "--spread-replicas-across", "hosts",
            "--zones", "2", "--zone-failures", "1");
    assertEquals(0, r.code(), r.err());
    assertTrue(r.out().contains("without failures)"), r.out());
  }

  @Test
  void plan_effortOutOfRange_usageError() {
    CliRun r = CliRun.of("plan", "-f", PARCEL, "--host-profile", PROFILE, "--effort", "-1");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("--effort must be from 0 to 1000"), r.err());
  }

  @Test
  void plan_effortZeroAndHigh_sameWorkersOnSmallExample() {
    // The parcel example packs to its lower bound of 2 workers (golden plan-parcel-two-socket.txt:
    // "Workers needed 2 (no packing can use fewer than 2)"), so neither effort can change it.
    for (String effort : new String[] {"0", "5"}) {
      CliRun r =
          CliRun.of("plan", "-f", PARCEL, "--host-profile", PROFILE, "--effort", effort);
      assertEquals(0, r.code(), r.err());
      assertTrue(r.out().contains("Workers needed    2 (no packing can use fewer than 2)"),
          r.out());
    }
  }
}
