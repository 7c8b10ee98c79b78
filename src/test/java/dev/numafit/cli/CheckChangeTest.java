package dev.numafit.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The change scenario (src/test/resources/check/change/base → head) has a known set of new,
 * existing and resolved findings and a known capacity change; and --baseline-git reads the base
 * from a git revision to the same verdict.
 *
 * <p>Why the values hold. The worker is 16 vCPU / 64Gi with {@code --kubelet-reserve none}, so
 * allocatable is exactly 16 CPU, 64Gi, 110 pods. The test host has two nodes of 32 cores and 128Gi
 * with nothing reserved, so each node holds 2 such workers: 4 per host.
 *
 * <ul>
 *   <li>Base: order-api 4 × 4 CPU fill one worker (16 CPU); oven-scheduler 2 × 2 CPU and
 *       legacy-batch 1 CPU share a second; recipe-db (18 CPU) is oversize and not packed. 2 workers,
 *       ceil(2/4) = 1 host.
 *   <li>Head: an autoscaler raises order-api to maxReplicas 20 (sized at peak): 20 × 4 CPU = 80 CPU
 *       fill 5 workers exactly; oven-scheduler 2 × 2 CPU and nightly-report (no requests) a sixth.
 *       image-resizer (20 CPU) and recipe-db are oversize. 6 workers, ceil(6/4) = 2 hosts. Delta
 *       +4 workers, +1 host; with --fleet-hosts 1 the head is over the fleet, the base was not.
 *   <li>New: image-resizer pod-exceeds-worker (20 − 16 = 4 CPU over), nightly-report
 *       missing-request, fleet-capacity. Already present (same workload and rule, lines moved by
 *       the head's longer header): recipe-db pod-exceeds-worker, oven-scheduler limit-request-ratio
 *       (limit 10 ÷ request 2 = 5, above 4). Resolved: legacy-batch missing-request (removed).
 * </ul>
 */
class CheckChangeTest {
  private static final JsonMapper JSON = new JsonMapper();

  private static Set<String> keys(JsonNode list, Boolean isNew) {
    Set<String> out = new TreeSet<>();
    for (JsonNode f : list) {
      if (isNew == null || f.get("new").asBoolean() == isNew) {
        String w = f.get("workload").isNull() ? "(fleet)" : f.get("workload").asString();
        out.add(w + " " + f.get("rule").asString());
      }
    }
    return out;
  }

  private static void assertChangeVerdict(CliRun r) {
    assertEquals(1, r.code(), r.err());
    JsonNode root = JSON.readTree(r.out());
    assertEquals(Set.of(
            "(fleet) fleet-capacity",
            "bakery/Deployment/image-resizer pod-exceeds-worker",
            "bakery/Job/nightly-report missing-request"),
        keys(root.get("findings"), true));
    assertEquals(Set.of(
            "bakery/StatefulSet/recipe-db pod-exceeds-worker",
            "bakery/Deployment/oven-scheduler limit-request-ratio"),
        keys(root.get("findings"), false));
    assertEquals(Set.of("bakery/Deployment/legacy-batch missing-request"),
        keys(root.get("resolved"), null));
    JsonNode cap = root.get("capacity");
    assertEquals(2, cap.get("baseWorkers").asInt());
    assertEquals(6, cap.get("workers").asInt());
    assertEquals(4, cap.get("workersDelta").asInt());
    assertEquals(1, cap.get("hostsDelta").asInt());
    // Only the two new error findings fail; the new warning and existing errors do not.
    assertEquals(2, root.get("failing").asInt());
  }

  @Test
  void check_changeScenario_knownNewFindingsAndDelta() {
    List<String> args = new ArrayList<>(CheckGoldenTest.changeArgs());
    args.addAll(List.of("-o", "json"));
    assertChangeVerdict(CliRun.of(args.toArray(String[]::new)));
  }

  @Test
  void check_failOnExisting_failsOnOldErrorsToo() {
    List<String> args = new ArrayList<>(CheckGoldenTest.changeArgs());
    args.addAll(List.of("-o", "json", "--fail-on-existing"));
    CliRun r = CliRun.of(args.toArray(String[]::new));
    // Adds recipe-db's existing pod-exceeds-worker; the warning rules are not in --fail-on.
    assertEquals(3, JSON.readTree(r.out()).get("failing").asInt());
  }

  @Test
  void check_onlyWarningsNew_exitsZero() {
    // Base against itself: nothing is new, so nothing fails.
    String dir = CheckGoldenTest.CHECK + "change/base";
    CliRun r = CliRun.of("check", "-f", dir, "--baseline", dir, "--worker",
        "cpu=16,memory=64Gi", "--kubelet-reserve", "none");
    assertEquals(0, r.code(), r.out() + r.err());
    assertTrue(r.out().contains("+0 workers"), r.out());
  }

  private static void git(Path dir, String... args) throws IOException, InterruptedException {
    List<String> cmd = new ArrayList<>(List.of("git", "-c", "user.name=test",
        "-c", "user.email=test@example.com", "-c", "commit.gpgsign=false"));
    cmd.addAll(List.of(args));
    Process p = new ProcessBuilder(cmd).directory(dir.toFile()).redirectErrorStream(true).start();
    String out = new String(p.getInputStream().readAllBytes());
    assertEquals(0, p.waitFor(), String.join(" ", cmd) + ": " + out);
  }

  @Test
  void check_baselineGit_readsBaseFromRevision(@TempDir Path repo)
      throws IOException, InterruptedException {
    Path src = Path.of(CheckGoldenTest.CHECK).toAbsolutePath();
    Files.createDirectories(repo.resolve("deploy"));
    Files.copy(src.resolve("change/base/bakery.yaml"), repo.resolve("deploy/bakery.yaml"));
    git(repo, "init", "-q");
    git(repo, "add", ".");
    git(repo, "commit", "-q", "-m", "base");
    Files.copy(src.resolve("change/head/bakery.yaml"), repo.resolve("deploy/bakery.yaml"),
        java.nio.file.StandardCopyOption.REPLACE_EXISTING);
    CliRun r = CliRun.in(repo, "", "check", "-f", repo.resolve("deploy").toString(),
        "--baseline-git", "HEAD", "--host-profile", src.resolve("host-two-nodes.yaml").toString(),
        "--worker", "cpu=16,memory=64Gi", "--kubelet-reserve", "none", "--fleet-hosts", "1",
        "-o", "json");
    assertChangeVerdict(r);
  }

  @Test
  void check_baselineGitUnknownRevision_exitsTwo(@TempDir Path repo)
      throws IOException, InterruptedException {
    Files.writeString(repo.resolve("a.yaml"), "kind: ConfigMap\nmetadata: {name: a}\n");
    git(repo, "init", "-q");
    git(repo, "add", ".");
    git(repo, "commit", "-q", "-m", "one");
    CliRun r = CliRun.in(repo, "", "check", "-f", repo.resolve("a.yaml").toString(),
        "--baseline-git", "no-such-branch", "--worker", "cpu=16,memory=64Gi");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("error: --baseline-git no-such-branch: no such revision"),
        r.err());
  }

  @Test
  void check_baselineGitOutsideRepository_exitsTwo(@TempDir Path dir) throws IOException {
    Files.writeString(dir.resolve("a.yaml"), "kind: ConfigMap\nmetadata: {name: a}\n");
    CliRun r = CliRun.in(dir, "", "check", "-f", dir.resolve("a.yaml").toString(),
        "--baseline-git", "HEAD", "--worker", "cpu=16,memory=64Gi");
    assertEquals(2, r.code());
    assertTrue(r.err().contains("is not inside a git repository"), r.err());
  }
}
