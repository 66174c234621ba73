#!/usr/bin/env bash
# Times the jobs of the performance table in issue 22 through the command line, one process
# each, and prints one CSV line per job: job, seconds (wall clock), peak resident memory in MB,
# and a note. Peak memory comes from /usr/bin/time -v when it is installed, otherwise from
# polling VmHWM in /proc/PID/status every 0.1 s (a lower bound).
#
# Usage: [JAR=path/to/touchstone.jar] [ROWS="1 2 3 ..."] [WORK=dir] [PC_SECONDS=s] \
#        scripts/scaling/issue-table.sh
#   JAR        the jar to time (default: the one ./touchstone builds from this tree), so an
#              older build can be timed on the same files for a before/after comparison
#   ROWS       which rows to run (default: all that the tool can do)
#   WORK       where the data files go (default: a temporary folder, removed at the end;
#              a given WORK is kept and its data files are reused)
#   PC_SECONDS the time limit handed to the learners (default 900)
#   PC_ALPHA   the Fisher z level for PC's rows 6 and 9 (default: the learner's, 0.01; at
#              p = 100,000 that keeps about 5·10^7 pairs after level 0, see docs/dev/constraint.md)
# Rows:
#   1 simulate 200,000 x 50 linear Gaussian to CSV   (its data.csv is then the file of row 3)
#   2 the same with a numpy script, when python3 has numpy (the issue's comparison)
#   3 read the 200,000 x 50 CSV and do nothing (learn --learner empty)
#   4 simulate 10,000 variables, mean degree 2, n = 1,000 (its data.csv is the file of row 5)
#   5 read the 10,000 x 1,000 CSV (learn --learner empty)
#   6 PC, p = 10,000, mean degree 2, n = 1,000, total with loading (the data of row 4)
#   7 GES, p = 1,000, mean degree 2, n = 1,000
#   8 resume a finished study (nothing to do), three times each: a 10,000-run study (the empty
#     learner on 10,000 replicates of Erdős–Rényi p = 10, mean degree 2, n = 100) and the bundled
#     demo; each is first run to the end with the same jar (not timed)
#   9 PC, p = 100,000, mean degree 2, n = 500, total with loading (only when ROWS names it:
#     the simulation alone writes a CSV of about 1 GB)
set -euo pipefail
root="$(cd "$(dirname "$0")/../.." && pwd)"
if [ -z "${JAR:-}" ]; then
  "$root/touchstone" --version >/dev/null
  JAR="$root/harness/target/touchstone.jar"
fi
rows=" ${ROWS:-1 2 3 4 5 6 7 8} "
pc_seconds=${PC_SECONDS:-900}
if [ -n "${WORK:-}" ]; then
  work="$WORK"
  mkdir -p "$work"
else
  work="$(mktemp -d)"
  trap 'rm -rf "$work"' EXIT
fi

# measure NAME NOTE COMMAND...: runs the command, prints "NAME,seconds,peak MB,NOTE".
measure() {
  local name="$1" note="$2"
  shift 2
  local start end status=0 kb
  start=$(date +%s.%N)
  if [ -x /usr/bin/time ]; then
    /usr/bin/time -f "%M" -o "$work/.time" "$@" >"$work/.out" 2>"$work/.err" || status=$?
    kb=$(tail -n 1 "$work/.time")
  else
    "$@" >"$work/.out" 2>"$work/.err" &
    local pid=$! hwm
    kb=0
    while kill -0 "$pid" 2>/dev/null; do
      hwm=$(awk '/VmHWM/ {print $2}' "/proc/$pid/status" 2>/dev/null || true)
      [ -n "$hwm" ] && [ "$hwm" -gt "$kb" ] && kb=$hwm
      sleep 0.1
    done
    wait "$pid" || status=$?
  fi
  end=$(date +%s.%N)
  if [ "$status" -ne 0 ]; then
    note="$note; exit $status: $(tail -n 1 "$work/.err" | tr ',' ';')"
  fi
  printf '%s,%.2f,%d,%s\n' "$name" "$(echo "$end - $start" | bc)" $((kb / 1024)) "$note"
}

want() {
  [[ "$rows" == *" $1 "* ]]
}

tool=(java -Djava.awt.headless=true ${TOUCHSTONE_JAVA_OPTS:-} -jar "$JAR")
# PC's rows run as the launcher runs them, with the Vector API module for level 0's tile kernel.
pc_tool=(java -Djava.awt.headless=true --add-modules jdk.incubator.vector ${TOUCHSTONE_JAVA_OPTS:-} -jar "$JAR")
pc_alpha=()
[ -n "${PC_ALPHA:-}" ] && pc_alpha=(--set "pc.alpha=$PC_ALPHA")
echo "job,seconds,peak_mb,note"
# The simulate command line for DIR NODES SAMPLES (an array, so /usr/bin/time can run it).
sim() {
  simcmd=("${tool[@]}" simulate --graph erdos-renyi --set nodes="$2" --set mean_degree=2 --model linear-gaussian
      --samples "$3" --seed 1 --out "$1")
}
if want 1 || { want 3 && [ ! -f "$work/wide/data.csv" ]; }; then
  rm -rf "$work/wide"
  sim "$work/wide" 50 200000
  measure "simulate 200000 x 50 linear Gaussian to CSV" "$(date -u +%FT%TZ)" "${simcmd[@]}"
fi
if want 2; then
  if python3 -c 'import numpy' 2>/dev/null; then
    cat >"$work/numpy_sim.py" <<'EOF'
# Linear Gaussian data on a random DAG of 50 variables (edge probability 2/49, weights
# uniform in +-[0.5, 2]), 200,000 rows, written as CSV with 17 significant digits.
import sys
import numpy as np
n, p, out = 200_000, 50, sys.argv[1]
rng = np.random.default_rng(1)
w = np.triu(rng.uniform(0.5, 2, (p, p)) * rng.choice([-1, 1], (p, p)) * (rng.random((p, p)) < 2 / (p - 1)), 1)
x = rng.standard_normal((n, p))
for j in range(p):
    x[:, j] += x[:, :j] @ w[:j, j]
with open(out, "w") as f:
    f.write(",".join(f"x{j}" for j in range(p)) + "\n")
    np.savetxt(f, x, fmt="%.17g", delimiter=",")
EOF
    measure "numpy script: 200000 x 50 linear Gaussian to CSV" "for comparison with row 1" \
        python3 "$work/numpy_sim.py" "$work/numpy.csv"
    rm -f "$work/numpy.csv"
  else
    echo "numpy script: 200000 x 50 linear Gaussian to CSV,,,skipped: python3 with numpy not found"
  fi
fi
if want 3; then
  measure "read 200000 x 50 CSV (learn empty)" "$(du -m "$work/wide/data.csv" | cut -f1) MB" \
      "${tool[@]}" learn --data "$work/wide/data.csv" --learner empty --out "$work/empty-wide.json"
fi
if want 4 || { { want 5 || want 6; } && [ ! -f "$work/deep/data.csv" ]; }; then
  rm -rf "$work/deep"
  sim "$work/deep" 10000 1000
  measure "simulate 10000 variables mean degree 2 n=1000" "$(date -u +%FT%TZ)" "${simcmd[@]}"
fi
if want 5; then
  measure "read 10000 x 1000 CSV (learn empty)" "$(du -m "$work/deep/data.csv" | cut -f1) MB" \
      "${tool[@]}" learn --data "$work/deep/data.csv" --learner empty --out "$work/empty-deep.json"
fi
if want 6; then
  measure "PC p=10000 mean degree 2 n=1000 with loading" "limit ${pc_seconds} s; alpha ${PC_ALPHA:-default}" \
      "${pc_tool[@]}" learn --data "$work/deep/data.csv" --learner pc "${pc_alpha[@]}" --seconds "$pc_seconds" --out "$work/pc.json"
fi
if want 7; then
  rm -rf "$work/ges"
  sim "$work/ges" 1000 1000
  "${simcmd[@]}" >/dev/null 2>&1
  measure "GES p=1000 mean degree 2 n=1000 with loading" "limit ${pc_seconds} s" \
      "${tool[@]}" learn --data "$work/ges/data.csv" --learner ges --seconds "$pc_seconds" --out "$work/ges.json"
fi
if want 8; then
  cat >"$work/resume-10000.yaml" <<'YAML'
name: resume-10000
seed: 1
replicates: 10000
truth:
  graph: {family: erdos-renyi, nodes: 10, mean_degree: 2}
  model: {kind: linear-gaussian}
samples: [100]
learners:
  - {id: e, use: empty}
metrics: [shd, adjacency_f1, orientation_f1, seconds]
limits: {max_runs: 20000}
YAML
  cp "$root/scenarios/demo.yaml" "$work/demo.yaml"
  for study in resume-10000 demo; do
    rm -rf "$work/$study-out"
    "${tool[@]}" run "$work/$study.yaml" --out "$work/$study-out" --quiet >/dev/null 2>&1
    for i in 1 2 3; do
      measure "resume finished $study ($i of 3)" "$(wc -l <"$work/$study-out/journal.jsonl") runs" \
          "${tool[@]}" run "$work/$study.yaml" --out "$work/$study-out" --quiet
    done
  done
fi
if [[ " ${ROWS:-} " == *" 9 "* ]]; then
  if [ ! -f "$work/huge/data.csv" ]; then
    rm -rf "$work/huge"
    sim "$work/huge" 100000 500
    "${simcmd[@]}" >/dev/null 2>&1
  fi
  measure "PC p=100000 mean degree 2 n=500 with loading" "limit ${pc_seconds} s; alpha ${PC_ALPHA:-default}" \
      "${pc_tool[@]}" learn --data "$work/huge/data.csv" --learner pc "${pc_alpha[@]}" --seconds "$pc_seconds" --out "$work/pc-huge.json"
else
  echo "PC p=100000 mean degree 2 n=500,,,not run: ask for it with ROWS=9"
fi
