#!/usr/bin/env bash
# Packing quality against the published instances with known optima.
# Usage: bench/quality.sh [BENCH_DIR (default ../shared/bench)] [STEP_BUDGET]
source "$(dirname "$0")/common.sh"
build_bench
java -Xmx1g -cp "$CP" dev.numafit.bench.PackingQuality "$@"
