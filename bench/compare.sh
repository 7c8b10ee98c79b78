#!/usr/bin/env bash
# Whole-process comparison: `numafit plan` on the 150,000-pod workload against the floor (a JVM
# that only parses the same file into JsonNode trees), both cold, with the launcher's JVM options.
# Runs are interleaved (floor, plan, floor, plan, ...) so both see the same machine load.
# Usage: bench/compare.sh [RUNS (default 5)]
source "$(dirname "$0")/common.sh"
RUNS="${1:-5}"
mvn -B -o -q -DskipTests package
build_bench
FILE=target/bench/workload-150k.yaml
[ -f "$FILE" ] || java -cp "$CP" dev.numafit.bench.WorkloadGenerator "$FILE"
JAVA_OPTS="${NUMAFIT_JAVA_OPTS:--XX:+UseSerialGC -XX:TieredStopAtLevel=1}"
ms() { local s e; s=$(date +%s%N); "$@" >/dev/null; e=$(date +%s%N); echo $(( (e - s) / 1000000 )); }
floor=(); plan=()
for i in $(seq "$RUNS"); do
  floor+=("$(ms java $JAVA_OPTS -cp "$CP" dev.numafit.bench.YamlFloor "$FILE")")
  plan+=("$(ms java $JAVA_OPTS -jar target/numafit.jar plan -f "$FILE" --worker cpu=16,memory=64Gi)")
done
median() { printf '%s\n' "$@" | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }
fm=$(median "${floor[@]}"); pm=$(median "${plan[@]}")
echo "floor (ms): ${floor[*]}; median $fm"
echo "plan  (ms): ${plan[*]}; median $pm"
awk -v p="$pm" -v f="$fm" 'BEGIN {printf "plan / floor = %.2f (target 1.5 or less)\n", p / f}'
