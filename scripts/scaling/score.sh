#!/usr/bin/env bash
# Scaling of GES with p (linear Gaussian data, Erdős–Rényi DAGs of mean degree 2).
# Usage: [PENALTY=c] scripts/scaling/score.sh [threads] [rows] [p ...]
# PENALTY is the BIC penalty multiplier (default 1, the classical BIC).
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
exec java -Xmx4g -Dpenalty="${PENALTY:-1}" -cp "$jar" dev.touchstone.benchmarks.score.GesScaling "$threads" "$rows" "${sizes[@]}"
