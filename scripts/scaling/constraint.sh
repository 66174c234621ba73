#!/usr/bin/env bash
# How order-independent PC (Fisher z, alpha = 0.01, mean degree 2, 2 threads) scales with
# the number of variables p and the sample size n. For every setting it prints two lines:
# the number of independence tests and edges of a run, and the median single-shot time of
# the measured runs, for the whole run (covariance included) and for the covariance alone. The machine's load is printed before and after,
# since a shared machine makes absolute times noisy; compare within one run of the script.
#
# Usage: scripts/scaling/constraint.sh [iterations]    (run from the repository root)
#        scripts/scaling/constraint.sh hidden [threads] [rows] [hidden_every] [p] [learners]
#   The second form runs the PAG learners once each on the same data with every k-th variable
#   hidden (default: 2 threads, n = 1000, every 10th of p = 500 hidden, fci,rfci); one CSV line per
#   run (see HiddenScaling); MINUTES (default 30) stops a run that takes longer; DEGREE (default 2) is the mean degree. The figures in docs/dev/constraint.md and hybrid.md:
#     scripts/scaling/constraint.sh hidden 2 1000 10 500 rfci,fci
#     scripts/scaling/constraint.sh hidden 2 1000 10 100 gfci,fci,rfci
# JMH_JAVA_OPTS is passed to java (e.g. -Djmh.ignoreLock=true while another JMH run holds the lock).
set -euo pipefail
cd "$(dirname "$0")/../.."
jar=${JAR:-benchmarks/target/benchmarks.jar}
if [[ ! -f "$jar" ]]; then
  mvn -B -q -Pbench package -DskipTests
fi
if [[ "${1:-}" == hidden ]]; then
  echo "load before: $(cut -d' ' -f1-3 /proc/loadavg) (2 cores)"
  java -Xmx4g -Dminutes="${MINUTES:-30}" -Ddegree="${DEGREE:-2}" -cp "$jar" dev.touchstone.benchmarks.constraint.HiddenScaling "${2:-2}" "${3:-1000}" "${4:-10}" \
      "${5:-500}" "${6:-fci,rfci}"
  echo "load after: $(cut -d' ' -f1-3 /proc/loadavg)"
  exit 0
fi
iterations="${1:-5}"
run() {
  # shellcheck disable=SC2086
  java ${JMH_JAVA_OPTS:-} -jar "$jar" -f 1 -wi 1 -i "$iterations" -bm ss -tu ms "$@" \
      'constraint.PcBenchmark' \
    | awk '/^# Benchmark:/ { n = split($3, part, "."); what = part[n] }
           /^\[pc / { run = $0 }
           /p\(50\.0000\) =/ { printf "%-44s %-18s median %8.1f ms\n", run, what, $3 }'
}
echo "load before: $(cut -d' ' -f1-3 /proc/loadavg) (2 cores)"
echo "== growth with p (n = 1000)"
run -p p=100,250,500,1000,2000 -p n=1000
echo "== growth with n (p = 1000)"
run -p p=1000 -p n=250,500,1000,2000,4000
echo "load after: $(cut -d' ' -f1-3 /proc/loadavg)"
