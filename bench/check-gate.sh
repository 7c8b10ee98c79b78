#!/usr/bin/env bash
# Wall time of the pre-merge gate, JVM start included: `numafit check` on the example scenarios and
# on the change scenario of the tests, each as 5 separate cold processes, median reported.
# Also measured with a class-data-sharing archive (AppCDS, -XX:SharedArchiveFile) made by one
# training run of the same command, to show what start-up costs.
#
# Usage: bench/check-gate.sh            (from the project root; builds target/numafit.jar if absent)
# Output: one line per scenario and mode: median and all five runs in milliseconds.
set -euo pipefail
cd "$(dirname "$0")/.."
JAR=target/numafit.jar
RUNS=5
if [ ! -f "$JAR" ]; then
  mvn -B -q -DskipTests package
fi
JAVA=${JAVA:-java}
CDS=target/numafit-check.jsa

declare -A SCENARIO
SCENARIO[parcel-delivery]="check -f manifests-examples/parcel-delivery/ --host-profile host-profiles/two-socket-one-node-per-socket.yaml"
SCENARIO[ticket-office]="check -f manifests-examples/ticket-office/ --host-profile host-profiles/two-socket-one-node-per-socket.yaml"
SCENARIO[change]="check -f src/test/resources/check/change/head --baseline src/test/resources/check/change/base --host-profile src/test/resources/check/host-two-nodes.yaml --worker cpu=16,memory=64Gi --kubelet-reserve none --fleet-hosts 1"

median() { sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }

run_ms() {
  local start end
  start=$(date +%s%N)
  # Exit code 1 (failing findings) is the expected verdict on these scenarios.
  "$@" >/dev/null 2>&1 || true
  end=$(date +%s%N)
  echo $(( (end - start) / 1000000 ))
}

echo "load average before: $(cut -d' ' -f1-3 /proc/loadavg); cores: $(nproc)"
# One training run makes the archive of the classes the gate loads (JDK 13+ dynamic archive).
# shellcheck disable=SC2086
"$JAVA" -XX:ArchiveClassesAtExit="$CDS" -jar "$JAR" ${SCENARIO[parcel-delivery]} >/dev/null 2>&1 || true
for name in parcel-delivery ticket-office change; do
  for mode in plain appcds; do
    opts=()
    [ "$mode" = appcds ] && opts=(-XX:SharedArchiveFile="$CDS")
    times=()
    for _ in $(seq "$RUNS"); do
      # shellcheck disable=SC2086
      times+=("$(run_ms "$JAVA" "${opts[@]}" -jar "$JAR" ${SCENARIO[$name]})")
    done
    med=$(printf '%s\n' "${times[@]}" | median)
    printf '%-16s %-7s median %5d ms   runs: %s\n' "$name" "$mode" "$med" "${times[*]}"
  done
done
echo "load average after: $(cut -d' ' -f1-3 /proc/loadavg)"
