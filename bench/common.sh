# Shared by the bench scripts: build with the bench profile and compute the class path once.
set -euo pipefail
cd "$(dirname "$0")/.."
build_bench() {
  mvn -B -q -Pbench compile
  mvn -B -q -Pbench dependency:build-classpath -Dmdep.outputFile=target/bench-classpath.txt \
    -Dmdep.includeScope=runtime >/dev/null
  CP="target/classes:$(cat target/bench-classpath.txt)"
}
