#!/usr/bin/env bash
# Wall time of `touchstone calibrate` at the size the issue names: 15 variables, 400 rows,
# 2 learners (pc, ges), 4 sample sizes (200, 400, 800, 1600), 50 replicates, 4 variants,
# 50 bootstrap resamples, 2 threads — on continuous data with 10% MCAR missing cells and on
# mixed (conditional Gaussian) data. Prints each repetition and the median per data kind.
#
# Usage: scripts/scaling/calibrate.sh [repetitions]    (run from the repository root)
set -euo pipefail
cd "$(dirname "$0")/../.."
reps="${1:-3}"
./touchstone --version >/dev/null
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
for kind in linear-gaussian conditional-gaussian; do
  cat >"$work/$kind.yaml" <<YAML
name: calibrate-scaling
seed: 17
replicates: 1
truth:
  graph: {family: erdos-renyi, nodes: 15, mean_degree: 2}
  model: {kind: $kind}
  missing: {mechanism: mcar, rate: 0.1}
samples: [400]
learners:
  - {use: empty}
metrics: [shd]
YAML
  ./touchstone simulate "$work/$kind.yaml" --out "$work/$kind" >/dev/null
  times=()
  for ((i = 1; i <= reps; i++)); do
    start=$(date +%s.%N)
    ./touchstone calibrate --data "$work/$kind/t0-r0/data.csv" --learner pc,ges --replicates 50 \
      --variants 4 --bootstrap 50 --threads 2 --out "$work/out-$kind" --quiet >/dev/null 2>"$work/err"
    end=$(date +%s.%N)
    t=$(echo "$end - $start" | bc)
    times+=("$t")
    echo "$kind repetition $i: ${t} s"
  done
  median=$(printf '%s\n' "${times[@]}" | sort -g | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}')
  echo "$kind median of $reps: ${median} s (load average: $(cut -d' ' -f1-3 /proc/loadavg))"
done
