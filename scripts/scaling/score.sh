#!/usr/bin/env bash
# Scaling of GES with p (linear Gaussian data, Erdős–Rényi DAGs of mean degree 2).
# Usage: [SCORE=bic|ebic] [PENALTY=c] [GAMMA=g] [HEAP=4g] scripts/scaling/score.sh [threads] [rows] [p ...]
# SCORE is the local score (default bic); PENALTY the BIC penalty multiplier (default 1, the
# classical BIC); GAMMA the extended BIC's gamma in [0, 1] (default 0.5; used with SCORE=ebic);
# HEAP the JVM's maximum heap (p = 10,000 holds an 800 MB covariance matrix: use 6g or more).
# The last column is the process's peak resident memory so far, in MB.
# Builds the benchmarks jar if it is missing; prints CSV (see GesScaling for the columns).
set -euo pipefail
cd "$(dirname "$0")/../.."
threads=${1:-2}
rows=${2:-1000}
shift $(( $# > 2 ? 2 : $# )) || true
sizes=("$@")
if [ ${#sizes[@]} -eq 0 ]; then
  sizes=(50 100 200 500 1000)
fi
jar=benchmarks/target/benchmarks.jar
if [ ! -f "$jar" ]; then
  mvn -B -q -Pbench package -DskipTests
fi
exec java -Xmx"${HEAP:-4g}" -Dscore="${SCORE:-bic}" -Dpenalty="${PENALTY:-1}" -Dgamma="${GAMMA:-0.5}" -cp "$jar" dev.touchstone.benchmarks.score.GesScaling "$threads" "$rows" "${sizes[@]}"
