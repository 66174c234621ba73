#!/usr/bin/env bash
# How well `check`'s time estimate (its pilot) predicts a study's wall time: for each study
# file given (default: the demo and every bundled reproduction at its quick scale), runs
# `check` (timing it: that is the pilot's cost), then `run` into a fresh folder, and prints one
# CSV line: study, estimated seconds, check's wall seconds, run's wall seconds, and
# actual / estimated. Both with the same --threads (default 2). The run's wall time includes
# JVM start and the report, as a user sees it.
#
# Usage: [JAR=path/to/touchstone.jar] [THREADS=2] scripts/scaling/estimate.sh [STUDY.yaml ...]
set -euo pipefail
root="$(cd "$(dirname "$0")/../.." && pwd)"
if [ -z "${JAR:-}" ]; then
  "$root/touchstone" --version >/dev/null
  JAR="$root/harness/target/touchstone.jar"
fi
threads=${THREADS:-2}
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
if [ $# -eq 0 ]; then
  set -- "$root/scenarios/demo.yaml" "$root"/scenarios/reproductions/*-quick.yaml
fi
tool=(java -Djava.awt.headless=true ${TOUCHSTONE_JAVA_OPTS:-} -jar "$JAR")
now() { date +%s.%N; }
echo "study,estimated_s,check_s,actual_s,actual_over_estimated"
for study in "$@"; do
  name=$(basename "$study" .yaml)
  t0=$(now)
  "${tool[@]}" check "$study" --threads "$threads" >"$work/check.txt" 2>&1 || { echo "$name,,,,check failed: $(tail -n 1 "$work/check.txt")"; continue; }
  t1=$(now)
  est=$(sed -n 's/.*time estimate: [a-z ]*\([0-9][0-9]*\) s of wall time.*/\1/p' "$work/check.txt")
  rm -rf "$work/out"
  t2=$(now)
  "${tool[@]}" run "$study" --threads "$threads" --out "$work/out" --quiet >"$work/run.txt" 2>&1 || { echo "$name,$est,,,run failed: $(tail -n 1 "$work/run.txt")"; continue; }
  t3=$(now)
  printf '%s,%s,%.1f,%.1f,%.2f\n' "$name" "$est" "$(echo "$t1 - $t0" | bc)" "$(echo "$t3 - $t2" | bc)" \
      "$(echo "($t3 - $t2) / $est" | bc -l)"
done
