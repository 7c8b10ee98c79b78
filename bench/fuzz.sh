#!/usr/bin/env bash
# Coverage-guided fuzzing (Jazzer) of numafit's four readers of outside input, one target per
# JVM: the quantity path, the manifest reader, the host-profile reader, the snapshot reader.
#
# Usage: bench/fuzz.sh [SECONDS_PER_TARGET]   (from the project root; default 15, as in CI)
#        FUZZ_TARGETS="ManifestFuzzTest" bench/fuzz.sh 600   (one target, ten minutes)
#
# Needs the test classes compiled (mvn -B test-compile, or any earlier mvn verify). Each target
# runs in its own JVM (-DreuseForks=false) with JAZZER_FUZZ=1, a 512 MB heap, a time limit
# (libFuzzer's -max_total_time) and a per-input limit of 10 s (the target's @Timeout, which
# Jazzer passes on as -timeout; JUnit's own timeouts are switched off here so they do not end
# the whole run). New coverage goes to .cifuzz-corpus/ (not committed); a crashing input is
# written into the target's seed directory under src/test/resources/dev/numafit/verify/fuzz/,
# where the next plain `mvn verify` runs it as a regression test: commit it with its fix.
# Prints one line per target (executions, seconds, crashes, wall time, load average at its end)
# and exits 1 when a target failed, or 0 with FUZZ_REPORT_ONLY=1 (as CI runs it: a finding of a
# time-limited, randomised run is reported for a developer to fix and commit as a seed, rather
# than failing a build whose tests all passed).
set -euo pipefail
cd "$(dirname "$0")/.."
seconds=${1:-15}
targets=${FUZZ_TARGETS:-QuantityFuzzTest ManifestFuzzTest HostProfileFuzzTest SnapshotFuzzTest}
log=${FUZZ_LOG:-target/fuzz.log}
mkdir -p target
: >"$log"
status=0
for t in $targets; do
  start=$(date +%s)
  rc=0
  JAZZER_FUZZ=1 mvn -B -q surefire:test -Dtest="$t" -DreuseForks=false \
    -Dsurefire.failIfNoSpecifiedTests=false \
    -DargLine="-Xmx512m -Djunit.jupiter.execution.timeout.mode=disabled \
-Djazzer.internal.arg.0=fuzz -Djazzer.internal.arg.1=-max_total_time=${seconds}" \
    >"target/fuzz-$t.log" 2>&1 || rc=$?
  took=$(( $(date +%s) - start ))
  load=$(cut -d' ' -f1 /proc/loadavg 2>/dev/null || echo unknown)
  cat "target/fuzz-$t.log" >>"$log"
  runs=$(grep -oE 'Done [0-9]+ runs in [0-9]+ second' "target/fuzz-$t.log" | tail -1 || true)
  # libFuzzer names each crashing input it saves ("Test unit written to ...").
  crashes=$(grep -c 'Test unit written to' "target/fuzz-$t.log" || true)
  if [ "$rc" -ne 0 ]; then
    status=1
    echo "fuzz $t: FAILED (${runs:-no libFuzzer summary}; crashes: $crashes; see target/fuzz-$t.log)"
  else
    echo "fuzz $t: ${runs:-no libFuzzer summary}(s), crashes: $crashes, wall ${took} s, load average $load"
  fi
done
if [ "$status" -ne 0 ] && [ "${FUZZ_REPORT_ONLY:-0}" = "1" ]; then
  echo "fuzz: FINDINGS above (FUZZ_REPORT_ONLY=1: reported, not failing the run); each crashing input"
  echo "fuzz: was written into its target's seed directory under src/test/resources/dev/numafit/verify/fuzz/"
  exit 0
fi
exit $status
