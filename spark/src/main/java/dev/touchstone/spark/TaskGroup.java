package dev.touchstone.spark;

import java.io.Serializable;
import java.util.Arrays;

/**
 * One Spark task: the positions (in the plan) and keys of the runs of one or more whole
 * replicates. Each replicate's data set is drawn once, on the executor, from its seeds; no
 * data travel. The keys let the executor detect a plan that differs from the driver's.
 *
 * @param runs positions of the runs in the plan, replicate by replicate
 * @param keys the runs' keys, in the same order
 * @param rows rows of each replicate's draw (the study's largest finite sample size), 0 for oracle only
 */
record TaskGroup(int[] runs, String[] keys, int rows) implements Serializable {

    private static final long serialVersionUID = 1L;

    TaskGroup {
        if (runs.length != keys.length || runs.length == 0) {
            throw new IllegalArgumentException("a task needs as many keys as runs, and at least one run");
        }
        runs = runs.clone();
        keys = keys.clone();
    }

    int size() {
        return runs.length;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof TaskGroup g && rows == g.rows && Arrays.equals(runs, g.runs) && Arrays.equals(keys, g.keys);
    }

    @Override
    public int hashCode() {
        return 31 * Arrays.hashCode(runs) + Arrays.hashCode(keys) + rows;
    }

    @Override
    public String toString() {
        return "TaskGroup" + Arrays.toString(runs);
    }
}
