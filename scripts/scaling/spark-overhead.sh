#!/usr/bin/env bash
# Overhead per run of the Spark engine on local[2] against the local engine (2 threads), on
# the 10,000-run empty-learner study of the harness benchmark (p = 10, n = 100, Erdős–Rényi
# mean degree 2, linear Gaussian, one run per replicate: the worst case, nothing shared).
# Each engine also runs the same study with 1 replicate, so fixed costs (JVM start, Spark
# context start and stop, report) cancel: overhead per run =
#   ((spark 10k − spark 1) − (local 10k − local 1)) / 9,999.
# Prints each wall time and the medians over the repetitions.
#
# The jars are built once (if missing) and copied aside, so a rebuild in the work tree during
# the measurement cannot disturb it.
#
# Usage: scripts/scaling/spark-overhead.sh [repetitions]    (run from anywhere)
set -euo pipefail
root="$(cd "$(dirname "$0")/../.." && pwd)"
reps="${1:-3}"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
if [ ! -f "$root/spark/target/touchstone-spark-0.1.0-SNAPSHOT.jar" ] || [ ! -f "$root/harness/target/touchstone.jar" ]; then
  (cd "$root" && mvn -B -q -DskipTests package -pl spark -am)
fi
mkdir -p "$work/lib"
cp "$root/harness/target/touchstone.jar" "$root/spark/target/touchstone-spark-0.1.0-SNAPSHOT.jar" "$work/"
cp "$root"/spark/target/lib/*.jar "$work/lib/"
# The same JVM options as ./touchstone --engine spark.
opens="-Dlog4j2.configurationFile=touchstone-spark-log4j2.properties -XX:+IgnoreUnrecognizedVMOptions"
opens="$opens -Djdk.reflect.useDirectMethodHandle=false -Dio.netty.tryReflectionSetAccessible=true"
for p in java.lang java.lang.invoke java.lang.reflect java.io java.net java.nio java.util java.util.concurrent \
    java.util.concurrent.atomic jdk.internal.ref sun.nio.ch sun.nio.cs sun.security.action sun.util.calendar; do
  opens="$opens --add-opens=java.base/$p=ALL-UNNAMED"
done
touchstone() { # engine, then the arguments of `touchstone`
  local engine="$1"
  shift
  if [ "$engine" = spark ]; then
    # shellcheck disable=SC2086
    java -Djava.awt.headless=true $opens -cp "$work/touchstone.jar:$work/touchstone-spark-0.1.0-SNAPSHOT.jar:$work/lib/*" \
      dev.touchstone.harness.cli.Main "$@" --engine spark --master 'local[2]'
  else
    java -Djava.awt.headless=true -jar "$work/touchstone.jar" "$@" --threads 2
  fi
}

study() {
  cat >"$work/study-$1.yaml" <<YAML
name: spark-overhead-$1
seed: 1
replicates: $1
truth:
  graph: {family: erdos-renyi, nodes: 10, mean_degree: 2}
  model: {kind: linear-gaussian}
samples: [100]
learners:
  - {id: e, use: empty}
metrics: [shd, adjacency_f1, orientation_f1, seconds]
limits: {max_runs: 20000}
YAML
}
study 1
study 10000
touchstone spark run "$work/study-1.yaml" --out "$work/warm" --quiet >/dev/null

seconds() { # engine replicates → wall seconds of one whole `touchstone run`
  local out="$work/out-$1-$2-$RANDOM"
  local t0 t1
  t0=$(date +%s.%N)
  touchstone "$1" run "$work/study-$2.yaml" --out "$out" --quiet >/dev/null 2>&1
  t1=$(date +%s.%N)
  rm -rf "$out"
  echo "$t1 - $t0" | bc -l
}

median() { sort -g | awk '{a[NR]=$1} END {print (NR % 2) ? a[(NR+1)/2] : (a[NR/2] + a[NR/2+1]) / 2}'; }

declare -A times
for engine in local spark; do
  for n in 1 10000; do
    list=""
    for _ in $(seq "$reps"); do
      s=$(seconds "$engine" "$n")
      list="$list $s"
      printf '%s %5d replicates: %.2f s\n' "$engine" "$n" "$s"
    done
    times[$engine-$n]=$(echo $list | tr ' ' '\n' | median)
  done
done
echo "load average: $(cut -d' ' -f1-3 /proc/loadavg)"
for k in local-1 local-10000 spark-1 spark-10000; do
  printf 'median %-12s %.2f s\n' "$k" "${times[$k]}"
done
echo "${times[spark-10000]} ${times[spark-1]} ${times[local-10000]} ${times[local-1]}" | awk '{
  spark = ($1 - $2) / 9999 * 1000; local = ($3 - $4) / 9999 * 1000
  printf "per run: local %.3f ms, spark local[2] %.3f ms, overhead %.3f ms (ratio %.2f)\n", local, spark, spark - local, spark / local }'
