#!/usr/bin/env bash
# How order-independent PC (Fisher z, alpha = 0.01, mean degree 2, 2 threads) scales with
# the number of variables p and the sample size n. Each line of the "[pc ...]" output gives
# the number of independence tests and edges of one run next to its first-run time; the
# JMH table gives the median single-shot time (covariance included) per setting.
#
# Usage: scripts/scaling/constraint.sh [iterations]    (run from the repository root)
set -euo pipefail
cd "$(dirname "$0")/../.."
iterations="${1:-3}"
jar=benchmarks/target/benchmarks.jar
if [[ ! -f "$jar" ]]; then
  mvn -B -q -Pbench package -DskipTests
fi
run() {
  java -jar "$jar" -f 1 -wi 1 -i "$iterations" -bm ss -tu ms "$@" 'constraint.PcBenchmark.orderIndependentPc' \
    | grep -E '^\[pc|^PcBenchmark|^Benchmark'
}
echo "== growth with p (n = 1000)"
run -p p=100,250,500,1000,2000 -p n=1000
echo "== growth with n (p = 1000)"
run -p p=1000 -p n=250,500,2000,4000
