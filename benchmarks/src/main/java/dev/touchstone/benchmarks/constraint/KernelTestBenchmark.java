package dev.touchstone.benchmarks.constraint;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.random.Seeds;
import dev.touchstone.learners.independence.FisherZTest;
import dev.touchstone.learners.independence.IndependenceTest;
import dev.touchstone.learners.independence.KciTest;
import dev.touchstone.learners.independence.RcitTest;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

import java.util.concurrent.TimeUnit;

/**
 * One kernel conditional independence test, by conditioning set size, on nonlinear data
 * (a chain of five variables, each sin or square of the previous plus Gaussian noise): KCI
 * with its default settings (rank ≤ 100, so its bounded mode) at n = 1,000 and RCIT with its
 * defaults (5 + 100 random features) at n = 10,000. As the irreducible part of RCIT's work,
 * {@code features} evaluates the n × 100 cosines of the conditioning set's features alone;
 * Fisher z on the same data (covariance cached) shows the cost of a linear test.
 * {@code kernelTest} reuses the same test object, so what it keeps between tests is warm, as
 * during a PC run that asks about the same conditioning set for many pairs: the kernel widths
 * and standardised columns (shared by the data set) and RCIT's Cholesky factor of the
 * conditioning set's features. {@code kernelTestNewObject} builds a new test object per
 * invocation, so RCIT factorises its conditioning set again (the first test with that set);
 * widths and standardised columns stay shared by the data set, as in a run.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
public class KernelTestBenchmark {

    @Param({"kci-1000", "rcit-10000"})
    public String test;

    @Param({"0", "1", "2"})
    public int size;

    private IndependenceTest kernel;
    private DataSet data;
    private IndependenceTest fisher;
    private int[] z;
    private double[] column;
    private double[] weights;

    @Setup
    public void setUp() {
        int n = Integer.parseInt(test.substring(test.indexOf('-') + 1));
        data = chain(n, 5, 31);
        kernel = newKernelTest();
        fisher = FisherZTest.of(data, 0.01);
        z = new int[size];
        for (int k = 0; k < size; k++) {
            z[k] = 2 + k;
        }
        column = data.continuous(1);
        weights = new double[100];
        UniformRandomProvider rng = Seeds.random(3);
        for (int k = 0; k < weights.length; k++) {
            weights[k] = rng.nextDouble();
        }
    }

    private IndependenceTest newKernelTest() {
        return test.startsWith("kci") ? KciTest.of(data, 0.01, KciTest.Settings.defaults(1))
                : RcitTest.of(data, 0.01, RcitTest.Settings.defaults(1));
    }

    static DataSet chain(int n, int p, long seed) {
        UniformRandomProvider rng = Seeds.random(seed);
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        DataSet.Builder b = DataSet.builder(n);
        double[] previous = null;
        for (int j = 0; j < p; j++) {
            double[] x = new double[n];
            for (int i = 0; i < n; i++) {
                double parent = previous == null ? 0 : (j % 2 == 0 ? Math.sin(2 * previous[i]) : previous[i] * previous[i]);
                x[i] = parent + g.sample();
            }
            b.continuous("X" + j, x);
            previous = x;
        }
        return b.build();
    }

    @Benchmark
    public double kernelTest() {
        return kernel.pValue(0, 1, z);
    }

    @Benchmark
    public double kernelTestNewObject() {
        return newKernelTest().pValue(0, 1, z);
    }

    @Benchmark
    public double fisherZ() {
        return fisher.pValue(0, 1, z);
    }

    /** The n × 100 cosines RCIT's conditioning features need at the least (irreducible for RCIT with S ≠ ∅). */
    @Benchmark
    public double features() {
        double s = 0;
        for (double w : weights) {
            for (double v : column) {
                s += Math.cos(w * v + 0.5);
            }
        }
        return s;
    }
}
