#!/usr/bin/env bash
# Packing quality against the published instances with known optima.
# Usage: bench/quality.sh [BENCH_DIR (default ../shared/bench)] [STEP_BUDGET] [--sets a,b]
#          [--every-large N] [--plan-every N]
# Per set and half (even / odd position in the index CSV), the packer beside plain
# first-fit-decreasing; --plan-every N also runs every N-th instance through `numafit plan`.
source "$(dirname "$0")/common.sh"
build_bench
java -Xmx1g -cp "$CP" dev.numafit.bench.PackingQuality "$@"
