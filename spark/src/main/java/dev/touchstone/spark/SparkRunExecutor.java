package dev.touchstone.spark;

import dev.touchstone.harness.WorkStoppedException;
import dev.touchstone.harness.execution.EstimateCodec;
import dev.touchstone.harness.execution.JournalCodec;
import dev.touchstone.harness.execution.PerformedRun;
import dev.touchstone.harness.execution.RunExecutor;
import dev.touchstone.harness.execution.RunRecipe;
import dev.touchstone.harness.study.RunDefinition;
import org.apache.spark.SparkConf;
import org.apache.spark.SparkContext;
import org.apache.spark.SparkException;
import org.apache.spark.TaskContext;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.broadcast.Broadcast;
import org.apache.spark.rdd.RDD;
import scala.Function2;
import scala.reflect.ClassTag;
import scala.reflect.ClassTag$;
import scala.runtime.BoxedUnit;

import java.io.Serializable;
import java.util.List;
import java.util.function.Consumer;

/**
 * Performs runs as Spark tasks. The runs are packed into {@link TaskGroup}s of whole
 * replicates; the recipe (study text, learners file) is broadcast once; each task returns
 * its journal lines, each with its run's estimate, and as each task finishes (not at the end of the job) the driver parses
 * them and hands the results to the sink, which journals them. A task that dies is retried
 * by Spark up to {@code spark.task.maxFailures} times; if it still fails the job stops, the
 * runs already journaled stay done and a resume does the rest.
 *
 * <p>Cost on the driver: one Spark context (a second or two to start), one result message
 * per task and one parse per run; on the executors: one plan expansion per JVM and study,
 * one draw per replicate, the runs themselves.
 */
final class SparkRunExecutor implements RunExecutor {

    private final String master;
    private final String studyName;
    private final RunRecipe recipe;

    SparkRunExecutor(String master, String studyName, RunRecipe recipe) {
        this.master = master;
        this.studyName = studyName;
        this.recipe = recipe;
    }

    @Override
    public void execute(List<RunDefinition> runs, int rows, Consumer<PerformedRun> sink) {
        if (runs.isEmpty()) {
            return;
        }
        SparkConf conf = SparkSettings.conf(master, studyName);
        SparkContext sc = SparkContext.getOrCreate(conf);
        sc.setLogLevel(conf.get(SparkSettings.LOG_LEVEL, "WARN"));
        try {
            JavaSparkContext jsc = JavaSparkContext.fromSparkContext(sc);
            int maxRuns = conf.contains(SparkSettings.RUNS_PER_TASK) ? conf.getInt(SparkSettings.RUNS_PER_TASK, 1)
                    : TaskGroups.defaultMaxRuns(runs.size(), sc.defaultParallelism());
            List<TaskGroup> tasks = TaskGroups.pack(runs, rows, maxRuns);
            Broadcast<RunRecipe> shared = jsc.broadcast(recipe);
            RDD<TaskGroup> rdd = jsc.parallelize(tasks, tasks.size()).rdd();
            ClassTag<String> tag = ClassTag$.MODULE$.apply(String.class);
            sc.runJob(rdd, work(shared), (Function2<Object, String, BoxedUnit>) (partition, lines) -> {
                for (String line : lines.split("\n")) {
                    sink.accept(record(line));
                }
                return BoxedUnit.UNIT;
            }, tag);
        } catch (RuntimeException e) {
            throw e;
        } catch (Exception e) {
            // Scala declares no checked exceptions: a job that failed arrives as a SparkException here.
            if (!(e instanceof SparkException)) {
                throw new IllegalStateException(e.toString(), e);
            }
            throw new WorkStoppedException("the Spark job stopped: " + firstLine(e)
                    + "; runs journaled so far are kept, run again to resume", e);
        } finally {
            sc.stop();
        }
    }

    /** One run's record from a task: its journal line and its estimate line, split at the separator. */
    static PerformedRun record(String line) {
        int tab = line.indexOf(TaskWork.SEPARATOR);
        if (tab < 0) {
            throw new IllegalStateException("a task's record has no estimate part: " + line);
        }
        var result = JournalCodec.read(line.substring(0, tab)).result();
        EstimateCodec.Kept kept = EstimateCodec.read(line.substring(tab + 1));
        if (!kept.key().equals(result.key())) {
            throw new IllegalStateException("a task's record pairs run " + result.key() + " with the estimate of "
                    + kept.key());
        }
        return new PerformedRun(result, kept.estimate());
    }

    /** The task function: a static factory, so the closure holds the broadcast handle and nothing of the driver. */
    private static Function2<TaskContext, scala.collection.Iterator<TaskGroup>, String> work(
            Broadcast<RunRecipe> shared) {
        return (Function2<TaskContext, scala.collection.Iterator<TaskGroup>, String> & Serializable) (ctx, it) -> {
            StringBuilder out = new StringBuilder();
            while (it.hasNext()) {
                String lines = TaskWork.perform(shared.value(), it.next());
                if (out.length() > 0 && !lines.isEmpty()) {
                    out.append('\n');
                }
                out.append(lines);
            }
            return out.toString();
        };
    }

    private static String firstLine(Throwable e) {
        String m = e.getMessage() == null ? e.toString() : e.getMessage();
        int nl = m.indexOf('\n');
        return nl < 0 ? m : m.substring(0, nl);
    }
}
