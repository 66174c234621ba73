package dev.touchstone.core.data;

import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class DataSetTest {

    private static final Variable COLOUR = Variable.discrete("colour", List.of("red", "green", "blue"));

    private static DataSet mixed() {
        return DataSet.builder(4)
                .continuous("height", new double[] {1.5, Double.NaN, 1.7, 1.9})
                .discrete(COLOUR, new int[] {0, 2, DataSet.MISSING_CODE, 1})
                .continuous("weight", new double[] {60, 70, 80, 90})
                .build();
    }

    @Test
    void completeRowsForListWiseAndTestWiseDeletion() {
        // By hand: row 1 lacks height, row 2 lacks colour; weight is never missing.
        DataSet d = mixed();
        assertArrayEquals(new int[] {0, 3}, d.completeRows());
        assertArrayEquals(new int[] {0, 2, 3}, d.rowsCompleteIn(new int[] {0, 2}));
        assertArrayEquals(new int[] {0, 1, 3}, d.rowsCompleteIn(new int[] {1}));
        assertArrayEquals(new int[] {0, 1, 2, 3}, d.rowsCompleteIn(new int[0]));
        DataSet cases = d.completeCases();
        assertEquals(2, cases.rows());
        assertFalse(cases.hasMissing());
        assertArrayEquals(new double[] {1.5, 1.9}, cases.continuous(0));
        assertSame(cases, cases.completeCases(), "nothing missing: the data set itself");
    }

    @Test
    void columnsKindsAndCells() {
        DataSet d = mixed();
        assertEquals(4, d.rows());
        assertEquals(3, d.columns());
        assertEquals(List.of("height", "colour", "weight"), d.names());
        assertEquals(DataKind.MIXED, d.kind());
        assertEquals(1, d.indexOf("colour"));
        assertEquals(-1, d.indexOf("age"));
        assertTrue(d.isDiscrete(1));
        assertEquals(2.0, d.value(1, 1));
        assertTrue(Double.isNaN(d.value(2, 1)));
        assertTrue(d.isMissing(1, 0));
        assertFalse(d.isMissing(0, 0));
        assertEquals(1, d.missingCount(0));
        assertEquals(1, d.missingCount(1));
        assertEquals(0, d.missingCount(2));
        assertTrue(d.hasMissing());
        assertEquals(4 * 8 + 4 * 4 + 4 * 8, d.rawBytes());
        assertEquals("column 'colour' is discrete, not continuous",
                assertThrows(IllegalArgumentException.class, () -> d.continuous(1)).getMessage());
        assertEquals("column 'height' is continuous, not discrete",
                assertThrows(IllegalArgumentException.class, () -> d.discrete(0)).getMessage());
        DataSet onlyDiscrete = d.select(new int[] {1});
        assertEquals(DataKind.DISCRETE, onlyDiscrete.kind());
        assertEquals(DataKind.CONTINUOUS, d.select(new int[] {2, 0}).kind());
    }

    @Test
    void builderErrorsNameTheColumn() {
        assertEquals("a data set cannot have -1 rows",
                assertThrows(IllegalArgumentException.class, () -> DataSet.builder(-1)).getMessage());
        assertEquals("column 'x' has 2 rows, expected 3", assertThrows(IllegalArgumentException.class,
                () -> DataSet.builder(3).continuous("x", new double[2])).getMessage());
        assertEquals("column 'colour', row 2: code 3 outside 0..2", assertThrows(IllegalArgumentException.class,
                () -> DataSet.builder(2).discrete(COLOUR, new int[] {0, 3})).getMessage());
        assertEquals("column 'colour', row 1: code -2 outside 0..2", assertThrows(IllegalArgumentException.class,
                () -> DataSet.builder(1).discrete(COLOUR, new int[] {-2})).getMessage());
        assertEquals("variable 'x' is not discrete", assertThrows(IllegalArgumentException.class,
                () -> DataSet.builder(1).discrete(Variable.continuous("x"), new int[] {0})).getMessage());
        assertEquals("variable name 'x' appears twice", assertThrows(IllegalArgumentException.class,
                () -> DataSet.builder(1).continuous("x", new double[1]).continuous("x", new double[1]).build())
                .getMessage());
        assertThrows(IllegalArgumentException.class, () -> Variable.discrete("z", List.of()));
        assertThrows(IllegalArgumentException.class, () -> Variable.continuous(" "));
        assertEquals(List.of("0", "1", "2"), Variable.discrete("k", 3).categories());
    }

    @Test
    void headIsTheNestedPrefix() {
        DataSet d = mixed();
        DataSet h = d.head(2);
        assertEquals(2, h.rows());
        assertEquals(d.variables(), h.variables());
        assertArrayEquals(new double[] {1.5, Double.NaN}, h.continuous(0));
        assertArrayEquals(new int[] {0, 2}, h.discrete(1));
        assertEquals(h.names(), d.head(3).head(2).names());
        assertArrayEquals(h.continuous(2), d.head(3).head(2).continuous(2));
        assertSame(d, d.head(4));
        assertEquals(0, d.head(0).rows());
        assertEquals("cannot take 5 rows of a data set with 4",
                assertThrows(IllegalArgumentException.class, () -> d.head(5)).getMessage());
        assertThrows(IllegalArgumentException.class, () -> d.head(-1));
    }

    @Test
    void selectAndRows() {
        DataSet d = mixed();
        DataSet s = d.select(new int[] {2, 0});
        assertEquals(List.of("weight", "height"), s.names());
        assertSame(d.continuous(2), s.continuous(0), "select shares the column arrays");
        DataSet r = d.rows(new int[] {3, 3, 0});
        assertEquals(3, r.rows());
        assertArrayEquals(new double[] {90, 90, 60}, r.continuous(2));
        assertArrayEquals(new int[] {1, 1, 0}, r.discrete(1));
        assertEquals(0, r.missingCount(0));
    }

    @Test
    void sharedStatisticsAreComputedOnce() {
        DataSet d = mixed();
        AtomicInteger calls = new AtomicInteger();
        record Key(String what) { }
        Object first = d.shared(new Key("sum"), x -> {
            calls.incrementAndGet();
            return new Object();
        });
        Object second = d.shared(new Key("sum"), x -> {
            calls.incrementAndGet();
            return new Object();
        });
        assertSame(first, second);
        assertEquals(1, calls.get());
        assertSame(d.covariance(), d.covariance());
        // a statistic may use another one while it is computed
        int nested = d.shared(new Key("outer"), x -> x.missingCount(0) + 10);
        assertEquals(11, nested);
        // a different data set (even a prefix) has its own statistics
        assertFalse(d.covariance() == d.head(3).covariance());
    }

    @Test
    void concurrentCallersShareOneComputation() throws Exception {
        DataSet d = mixed();
        AtomicInteger calls = new AtomicInteger();
        CountDownLatch start = new CountDownLatch(1);
        ExecutorService pool = Executors.newFixedThreadPool(4);
        try {
            List<Future<Object>> results = new java.util.ArrayList<>();
            for (int t = 0; t < 4; t++) {
                results.add(pool.submit(() -> {
                    start.await();
                    return d.shared("slow", x -> {
                        calls.incrementAndGet();
                        try {
                            Thread.sleep(50);
                        } catch (InterruptedException e) {
                            Thread.currentThread().interrupt();
                        }
                        return new Object();
                    });
                }));
            }
            start.countDown();
            Object first = results.get(0).get(10, TimeUnit.SECONDS);
            for (Future<Object> f : results) {
                assertSame(first, f.get(10, TimeUnit.SECONDS));
            }
            assertEquals(1, calls.get());
        } finally {
            pool.shutdownNow();
        }
    }

    @Test
    void failedComputationIsRetried() {
        DataSet d = mixed();
        assertThrows(IllegalStateException.class, () -> d.shared("fails", x -> {
            throw new IllegalStateException("boom");
        }));
        assertEquals("ok", d.shared("fails", x -> "ok"));
    }
}
