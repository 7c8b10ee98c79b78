#!/usr/bin/env bash
# Runs the JMH benchmarks (all, or those matching the given pattern), e.g.
#   bench/run-jmh.sh PackerBenchmark
source "$(dirname "$0")/common.sh"
build_bench
java -Xmx1g -cp "$CP" org.openjdk.jmh.Main "$@"
