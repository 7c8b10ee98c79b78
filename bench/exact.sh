#!/usr/bin/env bash
# Exact mode (plan --exact) on the small published vector instances: share proved optimal, nodes, time.
# Usage: bench/exact.sh [BENCH_DIR (default ../shared/bench)] [NODE_LIMIT] [MAX_ITEMS (default 60)]
source "$(dirname "$0")/common.sh"
build_bench
java -Xmx1g -cp "$CP" dev.numafit.bench.ExactQuality "$@"
