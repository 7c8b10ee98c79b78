#!/usr/bin/env bash
# Wall time of the pre-merge gate, JVM start included: `numafit check` on the example scenarios and
# on the change scenario of the tests, each as 5 separate cold processes, median reported.
# Three JVM setups (see the loop below); the last adds a class-data-sharing archive (AppCDS,
# -XX:SharedArchiveFile) made by one training run of the gate, to show what start-up costs.
#
# Usage: bench/check-gate.sh            (from the project root; builds target/numafit.jar if absent)
# Output: one line per scenario and mode: median wall time and all five runs in milliseconds, and
# the median CPU time (user + system) of the process, which a busy machine disturbs less.
set -euo pipefail
cd "$(dirname "$0")/.."
JAR=target/numafit.jar
RUNS=5
if [ ! -f "$JAR" ]; then
  mvn -B -q -DskipTests package
fi
JAVA=${JAVA:-java}
CDS=target/numafit-check.jsa
TIMES=$(mktemp)
trap 'rm -f "$TIMES"' EXIT

declare -A SCENARIO
SCENARIO[parcel-delivery]="check -f manifests-examples/parcel-delivery/ --host-profile host-profiles/two-socket-one-node-per-socket.yaml"
SCENARIO[ticket-office]="check -f manifests-examples/ticket-office/ --host-profile host-profiles/two-socket-one-node-per-socket.yaml"
SCENARIO[change]="check -f src/test/resources/check/change/head --baseline src/test/resources/check/change/base --host-profile src/test/resources/check/host-two-nodes.yaml --worker cpu=16,memory=64Gi --kubelet-reserve none --fleet-hosts 1"

median() { sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }

# Prints "wall_ms cpu_ms" for one cold run.
run_ms() {
  local start end cpu
  start=$(date +%s%N)
  # Exit code 1 (failing findings) is the expected verdict on these scenarios.
  /usr/bin/time -f "%U %S" -o "$TIMES" "$@" >/dev/null 2>&1 || true
  cpu=$(tail -1 "$TIMES")
  end=$(date +%s%N)
  echo "$(( (end - start) / 1000000 )) $(echo "$cpu" | awk '{printf "%d", ($1 + $2) * 1000}')"
}

echo "load average before: $(cut -d' ' -f1-3 /proc/loadavg); cores: $(nproc)"
# One training run makes the archive of the classes the gate loads (JDK 13+ dynamic archive).
# shellcheck disable=SC2086
"$JAVA" -XX:TieredStopAtLevel=1 -XX:+UseSerialGC -XX:ArchiveClassesAtExit="$CDS" -jar "$JAR" ${SCENARIO[parcel-delivery]} >/dev/null 2>&1 || true
for name in parcel-delivery ticket-office change; do
  for mode in default c1-serial c1-serial-cds; do
    # default: the JVM's defaults; c1-serial: only the quick JIT tier and the serial collector,
    # which suit a short single-shot process; c1-serial-cds: the same with the AppCDS archive.
    opts=()
    case "$mode" in
      c1-serial) opts=(-XX:TieredStopAtLevel=1 -XX:+UseSerialGC) ;;
      c1-serial-cds) opts=(-XX:TieredStopAtLevel=1 -XX:+UseSerialGC -XX:SharedArchiveFile="$CDS") ;;
    esac
    times=()
    cpus=()
    for _ in $(seq "$RUNS"); do
      # shellcheck disable=SC2086
      read -r wall cpu < <(run_ms "$JAVA" "${opts[@]}" -jar "$JAR" ${SCENARIO[$name]})
      times+=("$wall")
      cpus+=("$cpu")
    done
    med=$(printf '%s\n' "${times[@]}" | median)
    cmed=$(printf '%s\n' "${cpus[@]}" | median)
    printf '%-16s %-14s wall median %5d ms (runs: %s)  cpu median %5d ms\n' \
      "$name" "$mode" "$med" "${times[*]}" "$cmed"
  done
done
echo "load average after: $(cut -d' ' -f1-3 /proc/loadavg)"
