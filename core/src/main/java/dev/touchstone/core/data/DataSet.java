package dev.touchstone.core.data;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.concurrent.ConcurrentHashMap;
import java.util.function.Function;

/**
 * A columnar data set: continuous columns as {@code double[]}, discrete columns as
 * {@code int[]} category codes; mixed sets allowed.
 *
 * <p>A missing cell is {@link Double#NaN} in a continuous column and {@link #MISSING_CODE}
 * in a discrete one; real NaN values are refused when data are read, so the two cannot be
 * confused. The column arrays are shared, never copied on access: callers must not write
 * to them. Sufficient statistics (covariance, counts) are computed once per data set and
 * shared by every learner through {@link #shared(Object, Function)}.
 */
public final class DataSet {

    /** The code of a missing cell in a discrete column. */
    public static final int MISSING_CODE = -1;

    private final List<Variable> variables;
    private final Map<String, Integer> indexByName;
    private final Object[] columns;
    private final int rows;
    private final Map<Object, Memo> sharedStatistics = new ConcurrentHashMap<>();

    private DataSet(List<Variable> variables, Object[] columns, int rows) {
        this.variables = List.copyOf(variables);
        this.columns = columns;
        this.rows = rows;
        Map<String, Integer> idx = new HashMap<>();
        for (int j = 0; j < this.variables.size(); j++) {
            if (idx.put(this.variables.get(j).name(), j) != null) {
                throw new IllegalArgumentException("variable name '" + this.variables.get(j).name() + "' appears twice");
            }
        }
        this.indexByName = idx;
    }

    /** A builder for a data set with this many rows. */
    public static Builder builder(int rows) {
        return new Builder(rows);
    }

    public int rows() {
        return rows;
    }

    public int columns() {
        return variables.size();
    }

    public List<Variable> variables() {
        return variables;
    }

    public Variable variable(int column) {
        return variables.get(column);
    }

    /** The variable names in column order. */
    public List<String> names() {
        List<String> out = new ArrayList<>(variables.size());
        for (Variable v : variables) {
            out.add(v.name());
        }
        return Collections.unmodifiableList(out);
    }

    /** The column of {@code name}, or −1. */
    public int indexOf(String name) {
        Integer i = indexByName.get(name);
        return i == null ? -1 : i;
    }

    public boolean isDiscrete(int column) {
        return variables.get(column).isDiscrete();
    }

    /** Continuous, discrete or mixed. */
    public DataKind kind() {
        boolean anyDiscrete = false;
        boolean anyContinuous = false;
        for (Variable v : variables) {
            if (v.isDiscrete()) {
                anyDiscrete = true;
            } else {
                anyContinuous = true;
            }
        }
        if (anyDiscrete && anyContinuous) {
            return DataKind.MIXED;
        }
        return anyDiscrete ? DataKind.DISCRETE : DataKind.CONTINUOUS;
    }

    /**
     * The values of a continuous column (shared, do not modify; NaN marks missing).
     *
     * @throws IllegalArgumentException if the column is discrete
     */
    public double[] continuous(int column) {
        Object c = columns[column];
        if (!(c instanceof double[])) {
            throw new IllegalArgumentException("column '" + variables.get(column).name() + "' is discrete, not continuous");
        }
        return (double[]) c;
    }

    /**
     * The category codes of a discrete column (shared, do not modify; {@link #MISSING_CODE} marks missing).
     *
     * @throws IllegalArgumentException if the column is continuous
     */
    public int[] discrete(int column) {
        Object c = columns[column];
        if (!(c instanceof int[])) {
            throw new IllegalArgumentException("column '" + variables.get(column).name() + "' is continuous, not discrete");
        }
        return (int[]) c;
    }

    /** The cell as a number: the value of a continuous cell, the code of a discrete one, NaN if missing. */
    public double value(int row, int column) {
        Object c = columns[column];
        if (c instanceof double[]) {
            return ((double[]) c)[row];
        }
        int code = ((int[]) c)[row];
        return code == MISSING_CODE ? Double.NaN : code;
    }

    public boolean isMissing(int row, int column) {
        Object c = columns[column];
        if (c instanceof double[]) {
            return Double.isNaN(((double[]) c)[row]);
        }
        return ((int[]) c)[row] == MISSING_CODE;
    }

    /** The number of missing cells in a column. */
    public int missingCount(int column) {
        return shared(new MissingCountKey(column), d -> {
            int n = 0;
            for (int r = 0; r < rows; r++) {
                if (isMissing(r, column)) {
                    n++;
                }
            }
            return n;
        });
    }

    /**
     * The indices of the rows with no missing cell in any of these columns (every row when
     * none is given): the rows a test-wise or family-wise deletion keeps. Cost O(n · columns).
     */
    public int[] rowsCompleteIn(int[] columnIndices) {
        int[] keep = new int[rows];
        int k = 0;
        for (int r = 0; r < rows; r++) {
            boolean ok = true;
            for (int i = 0; i < columnIndices.length && ok; i++) {
                ok = !isMissing(r, columnIndices[i]);
            }
            if (ok) {
                keep[k++] = r;
            }
        }
        return k == rows ? keep : Arrays.copyOf(keep, k);
    }

    /** The indices of the rows with no missing cell at all. */
    public int[] completeRows() {
        int[] all = new int[columns()];
        for (int j = 0; j < all.length; j++) {
            all[j] = j;
        }
        return rowsCompleteIn(all);
    }

    /** This data set without its rows that have a missing cell (list-wise deletion); itself when none has. */
    public DataSet completeCases() {
        return hasMissing() ? rows(completeRows()) : this;
    }

    /** Whether any cell is missing. */
    public boolean hasMissing() {
        for (int j = 0; j < columns(); j++) {
            if (missingCount(j) > 0) {
                return true;
            }
        }
        return false;
    }

    /**
     * The sample covariance (divisor n − 1) of all columns, computed once and shared.
     * Discrete columns enter with their codes. Rows with any missing cell are left out
     * (list-wise deletion); tests that want test-wise deletion compute their own.
     */
    public CovarianceMatrix covariance() {
        return shared(CovarianceKey.INSTANCE, Covariances::sample);
    }

    /**
     * A statistic computed once per data set and shared by every caller that uses the same
     * key (keys need value equality). Thread-safe; the computation must not call back into
     * {@code shared} with the same key.
     */
    @SuppressWarnings("unchecked")
    public <T> T shared(Object key, Function<DataSet, T> compute) {
        // One memo per key, filled under its own lock: concurrent callers wait for the first
        // computation instead of repeating it, and a computation may use other keys.
        return (T) sharedStatistics.computeIfAbsent(key, k -> new Memo()).get(this, compute);
    }

    /** The first {@code n} rows (the nested prefix used for smaller sample sizes). */
    public DataSet head(int n) {
        if (n < 0 || n > rows) {
            throw new IllegalArgumentException("cannot take " + n + " rows of a data set with " + rows);
        }
        if (n == rows) {
            return this;
        }
        Object[] cols = new Object[columns.length];
        for (int j = 0; j < columns.length; j++) {
            Object c = columns[j];
            cols[j] = c instanceof double[] ? Arrays.copyOf((double[]) c, n) : Arrays.copyOf((int[]) c, n);
        }
        return new DataSet(variables, cols, n);
    }

    /** The columns at these indices, in this order. */
    public DataSet select(int[] columnIndices) {
        List<Variable> vars = new ArrayList<>(columnIndices.length);
        Object[] cols = new Object[columnIndices.length];
        for (int k = 0; k < columnIndices.length; k++) {
            vars.add(variables.get(columnIndices[k]));
            cols[k] = columns[columnIndices[k]];
        }
        return new DataSet(vars, cols, rows);
    }

    /** The rows at these indices (with repeats allowed, as for a bootstrap resample). */
    public DataSet rows(int[] rowIndices) {
        Object[] cols = new Object[columns.length];
        for (int j = 0; j < columns.length; j++) {
            Object c = columns[j];
            if (c instanceof double[]) {
                double[] src = (double[]) c;
                double[] dst = new double[rowIndices.length];
                for (int r = 0; r < rowIndices.length; r++) {
                    dst[r] = src[rowIndices[r]];
                }
                cols[j] = dst;
            } else {
                int[] src = (int[]) c;
                int[] dst = new int[rowIndices.length];
                for (int r = 0; r < rowIndices.length; r++) {
                    dst[r] = src[rowIndices[r]];
                }
                cols[j] = dst;
            }
        }
        return new DataSet(variables, cols, rowIndices.length);
    }

    /** Bytes held by the column arrays (the raw size of the data). */
    public long rawBytes() {
        long b = 0;
        for (Object c : columns) {
            b += c instanceof double[] ? 8L * ((double[]) c).length : 4L * ((int[]) c).length;
        }
        return b;
    }

    private record MissingCountKey(int column) { }

    /** A value computed at most once (again only if an earlier computation threw). */
    private static final class Memo {
        private volatile Object value;

        Object get(DataSet data, Function<DataSet, ?> compute) {
            Object v = value;
            if (v == null) {
                synchronized (this) {
                    v = value;
                    if (v == null) {
                        v = Objects.requireNonNull(compute.apply(data), "a shared statistic cannot be null");
                        value = v;
                    }
                }
            }
            return v;
        }
    }

    private enum CovarianceKey { INSTANCE }

    /** Collects columns of one length; each column array is taken as is, not copied. */
    public static final class Builder {
        private final int rows;
        private final List<Variable> variables = new ArrayList<>();
        private final List<Object> columns = new ArrayList<>();

        private Builder(int rows) {
            if (rows < 0) {
                throw new IllegalArgumentException("a data set cannot have " + rows + " rows");
            }
            this.rows = rows;
        }

        /** Adds a continuous column (NaN marks missing); the array is kept, not copied. */
        public Builder continuous(String name, double[] values) {
            return add(Variable.continuous(name), values, values.length);
        }

        /** Adds a discrete column of codes 0 … categories−1 ({@link #MISSING_CODE} marks missing). */
        public Builder discrete(Variable variable, int[] codes) {
            if (!variable.isDiscrete()) {
                throw new IllegalArgumentException("variable '" + variable.name() + "' is not discrete");
            }
            int k = variable.cardinality();
            for (int r = 0; r < codes.length; r++) {
                if (codes[r] != MISSING_CODE && (codes[r] < 0 || codes[r] >= k)) {
                    throw new IllegalArgumentException("column '" + variable.name() + "', row " + (r + 1)
                            + ": code " + codes[r] + " outside 0.." + (k - 1));
                }
            }
            return add(variable, codes, codes.length);
        }

        private Builder add(Variable v, Object column, int length) {
            Objects.requireNonNull(column, "column");
            if (length != rows) {
                throw new IllegalArgumentException("column '" + v.name() + "' has " + length + " rows, expected " + rows);
            }
            variables.add(v);
            columns.add(column);
            return this;
        }

        public DataSet build() {
            return new DataSet(variables, columns.toArray(), rows);
        }
    }
}
