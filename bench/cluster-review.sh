#!/usr/bin/env bash
# Benchmark (not a test): numafit reads 150,000 pods from a mock API server running in another
# process, writes a snapshot, and reviews a pool resize live and from the snapshot. Prints wall
# time and the numafit process's peak memory; docs/performance.md records the numbers.
#
#   bench/cluster-review.sh            # heap limit 1g (the issue's target)
#   HEAP=512m bench/cluster-review.sh  # try a smaller heap
set -euo pipefail
cd "$(dirname "$0")/.."
HEAP="${HEAP:-1g}"
out="target/bench-cluster"
mkdir -p "$out"

mvn -B -o -q -DskipTests package
mvn -B -o -q test-compile
mvn -B -o -q dependency:build-classpath -Dmdep.outputFile="$out/test-classpath.txt" \
  -Dmdep.includeScope=test >/dev/null
cp="target/test-classes:target/classes:$(cat "$out/test-classpath.txt")"

java -Xmx3g -cp "$cp" -Djava.util.logging.config.file=src/test/resources/logging.properties \
  dev.numafit.cluster.BenchClusterServer "$out/kubeconfig" >"$out/server.log" 2>&1 &
server=$!
trap 'kill "$server" 2>/dev/null || true' EXIT
for _ in $(seq 1 300); do
  grep -q '^ready' "$out/server.log" 2>/dev/null && break
  kill -0 "$server" 2>/dev/null || { cat "$out/server.log"; exit 1; }
  sleep 1
done
grep '^ready' "$out/server.log"

run() {
  local label="$1"; shift
  /usr/bin/time -f "%e s wall, %U s user CPU, %M KiB max RSS" -o "$out/$label.time" \
    java -Xmx"$HEAP" -XX:+UseSerialGC -Xlog:gc:file="$out/$label.gc" -jar target/numafit.jar "$@" \
    >"$out/$label.out" 2>"$out/$label.err" || true
  # Largest heap in use before a collection, from the GC log ("12M->3M(20M)": 12M).
  peak=$(grep -o '[0-9]*M->[0-9]*M' "$out/$label.gc" | sed 's/M->.*//' | sort -n | tail -1)
  echo "$label: $(cat "$out/$label.time"), heap peak ${peak:-?} MiB before a GC (-Xmx$HEAP)"
}

run snapshot snapshot --kubeconfig "$out/kubeconfig" --out "$out/cluster.json"
run review-live review --kubeconfig "$out/kubeconfig" --pool pool=general --nodes 1400 -o json
run review-snapshot review --snapshot "$out/cluster.json" --pool pool=general --nodes 1400 -o json
ls -l "$out/cluster.json" | awk '{print "snapshot size: " $5 " bytes"}'
head -c 300 "$out/review-live.out"; echo
