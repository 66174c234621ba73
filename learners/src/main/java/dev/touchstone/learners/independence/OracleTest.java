package dev.touchstone.learners.independence;

import dev.touchstone.core.learner.Oracle;

/**
 * The perfect test of an infinite sample: independence is d-separation in the true DAG
 * (m-separation over the observed variables when some are hidden), answered by
 * {@link Oracle#independent}. The p-value is 1 for separated pairs and 0 otherwise, so
 * every α in (0, 1) gives the same decisions. Cost: one reachability search,
 * O(|V| + |E|) at worst. Thread-safe.
 */
public final class OracleTest implements IndependenceTest {

    private final Oracle oracle;

    public OracleTest(Oracle oracle) {
        this.oracle = oracle;
    }

    @Override
    public int variables() {
        return oracle.variableNames().size();
    }

    @Override
    public double alpha() {
        return 0.5;
    }

    @Override
    public double pValue(int x, int y, int[] z) {
        return oracle.independent(x, y, z) ? 1.0 : 0.0;
    }

    @Override
    public boolean independent(int x, int y, int[] z) {
        return oracle.independent(x, y, z);
    }

    @Override
    public String name() {
        return "oracle";
    }
}
