#!/usr/bin/env bash
# Writes the 150,000-pod benchmark workload (5,000 Deployments, one YAML file).
# Usage: bench/gen-workload.sh [OUT]   (default target/bench/workload-150k.yaml)
source "$(dirname "$0")/common.sh"
build_bench
java -cp "$CP" dev.numafit.bench.WorkloadGenerator "$@"
