#!/usr/bin/env bash
# The whole-process floor: time to parse the workload file into JsonNode trees and nothing else,
# in a fresh JVM each run (cold), median of 5. Usage: bench/floor.sh [FILE]
source "$(dirname "$0")/common.sh"
build_bench
FILE="${1:-target/bench/workload-150k.yaml}"
[ -f "$FILE" ] || java -cp "$CP" dev.numafit.bench.WorkloadGenerator "$FILE"
# The launcher's JVM options (see ./numafit); NUMAFIT_JAVA_OPTS replaces them, as there.
JAVA_OPTS="${NUMAFIT_JAVA_OPTS:--XX:+UseSerialGC -XX:TieredStopAtLevel=1}"
times=()
for i in 1 2 3 4 5; do
  start=$(date +%s%N)
  java $JAVA_OPTS -cp "$CP" dev.numafit.bench.YamlFloor "$FILE" >/dev/null
  end=$(date +%s%N)
  times+=($(( (end - start) / 1000000 )))
done
printf '%s\n' "${times[@]}" | sort -n | awk '{a[NR]=$1} END {print "floor runs (ms): " a[1] " " a[2] " " a[3] " " a[4] " " a[5] "; median " a[3]}'
