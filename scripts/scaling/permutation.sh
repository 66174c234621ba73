#!/usr/bin/env bash
# BOSS next to GES on the same linear Gaussian data (Erdős–Rényi DAGs of the given mean degree).
# Usage: [LEARNERS=boss,ges] [BACKWARD=true|false] [STARTS=1] [SCORE=bic|ebic] [PENALTY=c] [GAMMA=g] \
#        scripts/scaling/permutation.sh [threads] [rows] [mean_degree] [p ...]
# Builds the benchmarks jar if it is missing; prints CSV (see PermutationScaling for the columns).
set -euo pipefail
cd "$(dirname "$0")/../.."
threads=${1:-2}
rows=${2:-1000}
degree=${3:-4}
shift $(( $# > 3 ? 3 : $# )) || true
sizes=("$@")
if [ ${#sizes[@]} -eq 0 ]; then
  sizes=(100 1000)
fi
jar=${JAR:-benchmarks/target/benchmarks.jar}
if [ ! -f "$jar" ]; then
  mvn -B -q -o -Pbench package -DskipTests
fi
exec java -Xmx4g -Dbackward="${BACKWARD:-true}" -Dstarts="${STARTS:-1}" -Dlearners="${LEARNERS:-boss,ges}" -Dscore="${SCORE:-bic}" -Dpenalty="${PENALTY:-1}" \
  -Dgamma="${GAMMA:-0.5}" -cp "$jar" dev.touchstone.benchmarks.score.PermutationScaling "$threads" "$rows" "$degree" "${sizes[@]}"
