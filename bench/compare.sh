#!/usr/bin/env bash
# Whole-process comparison: `numafit plan` on the 150,000-pod workload against the floor (a JVM
# that only parses the same file into JsonNode trees), both cold, with the launcher's JVM options.
# Runs are interleaved (floor, plan, floor, plan, ...) so both see the same machine load.
#
# Two rounds: without class-data sharing (the launcher with NUMAFIT_CDS=0, the floor without an
# archive), then with it (the launcher with its own archive, target/numafit.jsa, which it builds
# on first use; the floor with an archive made the same way, by one training run on a small
# file). Both sides of each round run with the same JVM options.
#
# Usage: bench/compare.sh [RUNS (default 5)] [ROUNDS (default "plain cds")]
source "$(dirname "$0")/common.sh"
RUNS="${1:-5}"
ROUNDS="${2:-plain cds}"
mvn -B -o -q -DskipTests package
build_bench
FILE=target/bench/workload-150k.yaml
[ -f "$FILE" ] || java -cp "$CP" dev.numafit.bench.WorkloadGenerator "$FILE"
# The launcher's JVM options (see ./numafit); NUMAFIT_JAVA_OPTS replaces them, as there.
JAVA_OPTS="${NUMAFIT_JAVA_OPTS:--XX:+UseSerialGC -XX:TieredStopAtLevel=1}"
ms() { local s e; s=$(date +%s%N); "$@" >/dev/null; e=$(date +%s%N); echo $(( (e - s) / 1000000 )); }
median() { printf '%s\n' "$@" | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }

# The floor runs from jars only, as the plan does (class-data sharing archives no class read from
# a directory): its own class in a small jar, then the dependency jars.
mkdir -p target/bench
jar cf target/bench/floor.jar -C target/classes dev/numafit/bench/YamlFloor.class
FLOOR_CP="target/bench/floor.jar:$(cat target/bench-classpath.txt)"

# The floor's archive: one training run on the first documents of the workload, as the launcher
# trains on the shipped examples rather than on the file it is measured with.
FLOOR_JSA=target/bench/floor.jsa
SMALL=target/bench/workload-small.yaml
head -n 360 "$FILE" >"$SMALL"
rm -f "$FLOOR_JSA"
java -XX:ArchiveClassesAtExit="$FLOOR_JSA" -Xlog:disable $JAVA_OPTS -cp "$FLOOR_CP" \
  dev.numafit.bench.YamlFloor "$SMALL" >/dev/null 2>&1 || true
# The launcher builds its archive on its first run after a build; do that run before timing.
./numafit --version >/dev/null 2>&1 || true

echo "load average before: $(cut -d' ' -f1-3 /proc/loadavg); cores: $(nproc)"
for round in $ROUNDS; do
  floor=(); plan=()
  for i in $(seq "$RUNS"); do
    if [ "$round" = cds ]; then
      floor+=("$(ms java -XX:SharedArchiveFile="$FLOOR_JSA" -Xlog:disable $JAVA_OPTS -cp "$FLOOR_CP" \
        dev.numafit.bench.YamlFloor "$FILE")")
      plan+=("$(ms ./numafit plan -f "$FILE" --worker cpu=16,memory=64Gi)")
    else
      floor+=("$(ms java $JAVA_OPTS -cp "$FLOOR_CP" dev.numafit.bench.YamlFloor "$FILE")")
      plan+=("$(ms env NUMAFIT_CDS=0 ./numafit plan -f "$FILE" --worker cpu=16,memory=64Gi)")
    fi
  done
  fm=$(median "${floor[@]}"); pm=$(median "${plan[@]}")
  echo "[$round] floor (ms): ${floor[*]}; median $fm"
  echo "[$round] plan  (ms): ${plan[*]}; median $pm"
  awk -v r="$round" -v p="$pm" -v f="$fm" \
    'BEGIN {printf "[%s] plan / floor = %.2f (target 1.5 or less)\n", r, p / f}'
done
echo "load average after: $(cut -d' ' -f1-3 /proc/loadavg)"
