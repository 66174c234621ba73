#!/usr/bin/env bash
# Runs the Spark engine on a real Spark standalone cluster on this machine (loopback only):
# one master and two workers of one core each, started from spark/target/lib, then
#   1. the same small study with the local engine (2 threads), with
#      `./touchstone --engine spark --master spark://…` and with Spark's SparkSubmit main class
#      (the spark-submit recipe of docs/spark.md) and with a driver class path of touchstone.jar
#      ahead of the cluster's jars/, comparing runs.csv apart from the timing columns (first of
#      all, touchstone.jar must hold no unrelocated Jackson or SnakeYAML class);
#   2. resume across engines: a third of the local journal finished on the cluster, half of the
#      cluster's journal finished locally;
#   3. a killed executor: kill -9 of one executor JVM mid-study; the study must finish with
#      runs.csv equal to the local one and one journal line per run.
# By default the cluster's class path is Spark's own order, with Spark 4.0.1's Jackson 2.18.2
# (from ~/.m2, where Maven put it while resolving Spark) instead of the 2.23 of spark/target/lib,
# as in a Spark distribution's jars/ folder; TOUCHSTONE_SPARK_JACKSON=lib keeps spark/target/lib as is.
# Every process is bounded by `timeout` and stopped on exit. Prints each wall time.
#
# Usage: scripts/spark-standalone-check.sh    (run from anywhere; needs java 17, mvn, python3)
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
work="$(mktemp -d)"
pids=()
cleanup() {
  for p in "${pids[@]}"; do kill "$p" 2>/dev/null || true; done
  for p in "${pids[@]}"; do wait "$p" 2>/dev/null || true; done
  rm -rf "$work"
}
trap cleanup EXIT
cd "$root"
if [ ! -f spark/target/touchstone-spark-0.1.0-SNAPSHOT.jar ] || [ ! -f harness/target/touchstone.jar ] \
    || [ ! -d spark/target/lib ]; then
  mvn -B -q -DskipTests package -pl spark -am
fi
jar="$root/harness/target/touchstone.jar"
engine_jar="$root/spark/target/touchstone-spark-0.1.0-SNAPSHOT.jar"
# touchstone.jar must carry Jackson and SnakeYAML relocated (harness/pom.xml), never under their
# own names, or they would meet the cluster's Jackson.
unrelocated=$(jar tf "$jar" | grep -cE '^(com/fasterxml|org/yaml)/' || true)
if [ "$unrelocated" -ne 0 ]; then
  echo "FAILED: $jar holds $unrelocated com/fasterxml/ or org/yaml/ entries (not relocated)" >&2
  exit 1
fi

# A Spark "home" whose jars/ folder is the cluster's class path (workers launch executors from it).
export SPARK_HOME="$work/spark-home" SPARK_SCALA_VERSION=2.13 SPARK_LOCAL_IP=127.0.0.1 SPARK_LOCAL_HOSTNAME=localhost
mkdir -p "$SPARK_HOME/jars"
m2="$HOME/.m2/repository/com/fasterxml/jackson"
old_jackson=("$m2/core/jackson-core/2.18.2/jackson-core-2.18.2.jar"
  "$m2/core/jackson-databind/2.18.2/jackson-databind-2.18.2.jar"
  "$m2/core/jackson-annotations/2.18.2/jackson-annotations-2.18.2.jar"
  "$m2/module/jackson-module-scala_2.13/2.18.2/jackson-module-scala_2.13-2.18.2.jar")
jackson="lib (2.23)"
if [ "${TOUCHSTONE_SPARK_JACKSON:-spark}" = spark ] && ls "${old_jackson[@]}" >/dev/null 2>&1; then
  jackson="Spark's 2.18.2"
  for j in spark/target/lib/*.jar; do
    case "$(basename "$j")" in
      jackson-annotations-*|jackson-core-*|jackson-databind-*|jackson-module-scala*|jackson-dataformat-yaml-*) ;;
      *) ln -s "$root/$j" "$SPARK_HOME/jars/" ;;
    esac
  done
  ln -s "${old_jackson[@]}" "$SPARK_HOME/jars/"
else
  ln -s "$root"/spark/target/lib/*.jar "$SPARK_HOME/jars/"
fi
echo "cluster class path: $SPARK_HOME/jars (Jackson: $jackson)"

opens="-XX:+IgnoreUnrecognizedVMOptions -Djdk.reflect.useDirectMethodHandle=false -Dio.netty.tryReflectionSetAccessible=true"
for p in java.lang java.lang.invoke java.lang.reflect java.io java.net java.nio java.util java.util.concurrent \
    java.util.concurrent.atomic jdk.internal.ref sun.nio.ch sun.nio.cs sun.security.action sun.util.calendar; do
  opens="$opens --add-opens=java.base/$p=ALL-UNNAMED"
done
quiet_log="-Dlog4j2.configurationFile=$root/spark/src/main/resources/touchstone-spark-log4j2.properties"
free_port() { python3 -c 'import socket; s=socket.socket(); s.bind(("127.0.0.1", 0)); print(s.getsockname()[1])'; }
port=$(free_port)
master="spark://127.0.0.1:$port"

daemon() { # log name, then the main class and its arguments; lives at most 10 minutes
  local name="$1"
  shift
  # shellcheck disable=SC2086
  timeout 600 java -Xmx512m $opens $quiet_log -cp "$SPARK_HOME/jars/*" "$@" >"$work/$name.log" 2>&1 &
  pids+=($!)
}
daemon master org.apache.spark.deploy.master.Master --host 127.0.0.1 --port "$port" --webui-port "$(free_port)"
for _ in $(seq 1 120); do
  (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null && break
  sleep 0.5
done
for w in 1 2; do
  mkdir -p "$work/worker$w"
  daemon "worker$w" org.apache.spark.deploy.worker.Worker "$master" --host 127.0.0.1 --cores 1 --memory 1g \
    --work-dir "$work/worker$w" --webui-port "$(free_port)"
done
sleep 5

seconds() { date +%s.%N; }
elapsed() { python3 -c "print(f'{$(seconds) - $1:.1f} s')"; }
same() { # two runs.csv files, equal apart from the timing columns?
  python3 - "$1" "$2" <<'PY'
import csv, sys
timing = {"seconds", "cpu_seconds", "allocated_mb"}
def rows(p):
    with open(p, newline="") as f:
        return [{k: v for k, v in r.items() if k not in timing} for r in csv.DictReader(f)]
a, b = rows(sys.argv[1]), rows(sys.argv[2])
if not a or a != b:
    sys.exit(f"FAILED: {sys.argv[2]} differs from {sys.argv[1]} ({len(a)} and {len(b)} rows)")
PY
}
lines() { wc -l <"$1" | tr -d ' '; }
local_run() { timeout 300 java -jar "$jar" run "$@" --threads 2 --quiet; }
cluster_run() { # the launcher, as a user types it (its driver class path: touchstone.jar, then spark/target/lib)
  timeout 300 "$root/touchstone" run "$@" --engine spark --master "$master" --quiet
}
submit_run() { # the spark-submit recipe of docs/spark.md, through Spark's own launcher class
  # shellcheck disable=SC2086
  timeout 300 java $opens $quiet_log -cp "$SPARK_HOME/jars/*" org.apache.spark.deploy.SparkSubmit \
    --master "$master" --deploy-mode client --class dev.touchstone.harness.cli.Main --jars "$engine_jar" \
    --conf spark.task.maxFailures=4 "$jar" run "$@" --engine spark --quiet
}
jar_first_run() { # a driver class path of one's own with touchstone.jar ahead of the cluster's jars/
  # (Spark's Jackson there): this stopped at the first job until Jackson was relocated
  # shellcheck disable=SC2086
  timeout 300 java $opens $quiet_log -cp "$jar:$engine_jar:$SPARK_HOME/jars/*" dev.touchstone.harness.cli.Main \
    run "$@" --engine spark --master "$master" --quiet
}

study() { # name, replicates, nodes, samples
  cat >"$work/$1.yaml" <<YAML
name: standalone-$1
seed: 11
replicates: $2
truth:
  graph: {family: erdos-renyi, nodes: $3, mean_degree: 3}
  model: {kind: linear-gaussian}
samples: $4
learners:
  - {id: pc, use: pc, with: {alpha: [0.001, 0.01, 0.05]}}
  - {id: empty, use: empty}
metrics: [shd, adjacency_f1, orientation_f1, seconds]
limits: {seconds: 60}
compare_to: empty
YAML
}
study small 4 '[5, 8]' '[100, 400, oracle]'
study large 40 '[30, 40]' '[2000, 5000]'

# ./touchstone rebuilds its jars when the sources changed: let it do so now, outside the timings
# (the arguments are only there to make it take its Spark route; Main's answer does not matter).
"$root/touchstone" --engine spark >/dev/null 2>&1 || true
t=$(seconds); local_run "$work/small.yaml" --out "$work/local"; echo "local engine, 2 threads: $(elapsed "$t")"
t=$(seconds); cluster_run "$work/small.yaml" --out "$work/launcher"; echo "standalone, launcher route: $(elapsed "$t")"
same "$work/local/runs.csv" "$work/launcher/runs.csv"
t=$(seconds); submit_run "$work/small.yaml" --out "$work/submit"; echo "standalone, SparkSubmit: $(elapsed "$t")"
same "$work/local/runs.csv" "$work/submit/runs.csv"
t=$(seconds); jar_first_run "$work/small.yaml" --out "$work/first"; echo "standalone, touchstone.jar first: $(elapsed "$t")"
same "$work/local/runs.csv" "$work/first/runs.csv"
t=$(seconds)
timeout 300 "$root/touchstone" run "$work/small.yaml" --out "$work/local2" --engine spark --master 'local[2]' --quiet
echo "same study on local[2]: $(elapsed "$t")"
total=$(lines "$work/local/journal.jsonl")
echo "runs.csv equal to the local engine's (timing columns aside): launcher, SparkSubmit, touchstone.jar first ($total runs)"

mkdir -p "$work/resume1" "$work/resume2"
head -n $((total / 3)) "$work/local/journal.jsonl" >"$work/resume1/journal.jsonl"
cluster_run "$work/small.yaml" --out "$work/resume1"
same "$work/local/runs.csv" "$work/resume1/runs.csv"
head -n $((total / 3)) "$work/local/journal.jsonl" | cmp -s - <(head -n $((total / 3)) "$work/resume1/journal.jsonl") \
  || { echo "FAILED: the local lines of the resumed journal changed"; exit 1; }
head -n $((total / 2)) "$work/launcher/journal.jsonl" >"$work/resume2/journal.jsonl"
local_run "$work/small.yaml" --out "$work/resume2"
same "$work/local/runs.csv" "$work/resume2/runs.csv"
[ "$(lines "$work/resume1/journal.jsonl")" = "$total" ] && [ "$(lines "$work/resume2/journal.jsonl")" = "$total" ] \
  || { echo "FAILED: a resumed journal does not hold one line per run"; exit 1; }
echo "resume local -> standalone and standalone -> local: equal, one line per run"

t=$(seconds); local_run "$work/large.yaml" --out "$work/large-local"; echo "640-run study, local engine: $(elapsed "$t")"
t=$(seconds)
# small tasks (8 runs), so that the study is still running when an executor dies
TOUCHSTONE_JAVA_OPTS=-Dspark.touchstone.runsPerTask=8 timeout 300 "$root/touchstone" \
  run "$work/large.yaml" --out "$work/large" --engine spark --master "$master" --quiet &
driver=$!
pids+=("$driver")
killed=""
for _ in $(seq 1 600); do
  n=$(lines "$work/large/journal.jsonl" 2>/dev/null || echo 0)
  if [ "$n" -gt 40 ]; then
    # an executor of this cluster: its working folder is in one of our workers' folders
    for e in $(pgrep -f CoarseGrainedExecutorBackend || true); do
      case "$(readlink "/proc/$e/cwd" || true)" in "$work"/*) killed="$e" ;; esac
    done
    [ -n "$killed" ] && kill -9 "$killed"
    break
  fi
  sleep 0.1
done
wait "$driver"
echo "640-run study, standalone, one executor killed: $(elapsed "$t")"
[ -n "$killed" ] || { echo "FAILED: no executor found to kill (study finished first?)"; exit 1; }
same "$work/large-local/runs.csv" "$work/large/runs.csv"
[ "$(lines "$work/large/journal.jsonl")" = "$(lines "$work/large-local/journal.jsonl")" ] \
  || { echo "FAILED: the journal after the killed executor does not hold one line per run"; exit 1; }
echo "executor $killed killed (kill -9) after $n journal lines: study finished, runs.csv equal, one line per run"
echo "all standalone checks passed"
