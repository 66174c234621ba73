package dev.touchstone.harness.io;

import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.data.VariableKind;
import dev.touchstone.core.random.Seeds;

import org.apache.commons.rng.UniformRandomProvider;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class DataCsvTest {

    @TempDir
    Path dir;

    private Path file(String name, String text) throws IOException {
        Path f = dir.resolve(name);
        Files.writeString(f, text, StandardCharsets.UTF_8);
        return f;
    }

    private String refused(String text) throws IOException {
        Path f = file("bad.csv", text);
        return assertThrows(FileFormatException.class, () -> DataCsv.read(f)).getMessage();
    }

    private String refused(String text, Map<String, VariableKind> declared) throws IOException {
        Path f = file("bad.csv", text);
        return assertThrows(FileFormatException.class, () -> DataCsv.read(f, declared)).getMessage();
    }

    @Test
    void readsMixedColumnsAndReportsTheKinds() throws IOException {
        Path f = file("orchard.csv", "rain,soil,yield,grade\n"
                + "1.5,clay,10,1\n"
                + ",loam,12.25,2\n"
                + "2.5e-1,,9,1\n"
                + "-3,clay,11,\n");
        DataCsv.Result r = DataCsv.read(f, Map.of("grade", VariableKind.DISCRETE));
        DataSet d = r.data();
        assertEquals(4, d.rows());
        assertEquals(List.of("rain", "soil", "yield", "grade"), d.names());
        assertArrayEquals(new double[] {1.5, Double.NaN, 0.25, -3}, d.continuous(0));
        assertEquals(List.of("clay", "loam"), d.variable(1).categories());
        assertArrayEquals(new int[] {0, 1, DataSet.MISSING_CODE, 0}, d.discrete(1));
        assertArrayEquals(new double[] {10, 12.25, 9, 11}, d.continuous(2));
        assertEquals(List.of("1", "2"), d.variable(3).categories());
        assertArrayEquals(new int[] {0, 1, 0, DataSet.MISSING_CODE}, d.discrete(3));
        assertEquals("rain: continuous (every value is a number)\n"
                + "soil: discrete (has text values, such as 'clay' on line 2)\n"
                + "yield: continuous (every value is a number)\n"
                + "grade: discrete (declared)\n", r.describeKinds());
        assertEquals(DataCsv.Choice.INFERRED_NOT_A_NUMBER, r.columns().get(1).choice());
    }

    @Test
    void aColumnThatTurnsOutDiscreteKeepsItsEarlierTextExactly() throws IOException {
        Path f = file("late.csv", "dose,size\n1.50,1\n2,2\nnone,3\n1.50,4\n");
        DataCsv.Result r = DataCsv.read(f);
        Variable dose = r.data().variable(0);
        assertEquals(List.of("1.50", "2", "none"), dose.categories(), "labels as written, numbers first");
        assertArrayEquals(new int[] {0, 1, 2, 0}, r.data().discrete(0));
        assertEquals("dose: discrete (has text values, such as 'none' on line 4)", r.columns().get(0).describe());
    }

    @Test
    void numericCategoriesAreOrderedByValueOthersAlphabetically() throws IOException {
        Path f = file("codes.csv", "k,w\n10,b\n9,a\n10,c\n-1,a\n");
        DataSet d = DataCsv.read(f, Map.of("k", VariableKind.DISCRETE)).data();
        assertEquals(List.of("-1", "9", "10"), d.variable(0).categories());
        assertEquals(List.of("a", "b", "c"), d.variable(1).categories());
    }

    @Test
    void quotingSpacesBlankLinesAndByteOrderMark() throws IOException {
        Path f = file("q.csv", "\uFEFFname, value\n\"Smith, J\", 1.0\n\n\"O\"\"Neil\",2\n");
        DataSet d = DataCsv.read(f).data();
        assertEquals(List.of("name", "value"), d.names());
        assertEquals(List.of("O\"Neil", "Smith, J"), d.variable(0).categories());
        assertArrayEquals(new double[] {1, 2}, d.continuous(1));
    }

    @Test
    void nonNumberInDeclaredContinuousColumnNamesFileLineColumn() throws IOException {
        String m = refused("a,b\n1,2\n3,4\n5,x\n", Map.of("b", VariableKind.CONTINUOUS));
        assertTrue(m.endsWith("bad.csv, line 4, column 'b': 'x' is not a number, but the column is continuous"), m);
    }

    @Test
    void raggedRowsAreRefused() throws IOException {
        assertTrue(refused("a,b,c\n1,2,3\n4,5\n").endsWith("bad.csv, line 3: the row has 2 cells but the header has 3"));
        assertTrue(refused("a,b\n1,2\n4,5,6\n").endsWith("bad.csv, line 3: the row has 3 cells but the header has 2"));
    }

    @Test
    void lineNumbersCountQuotedLineBreaksAndBlankLines() throws IOException {
        String m = refused("note,v\n\"two\nlines\",1\n\nok,NaN\n");
        assertTrue(m.endsWith("bad.csv, line 5, column 'v': 'NaN' is not a finite number "
                + "(leave the cell empty for a missing value)"), m);
    }

    @Test
    void badNamesAreRefused() throws IOException {
        assertTrue(refused("a,,c\n1,2,3\n").endsWith("bad.csv, line 1, column 2: empty variable name"));
        assertTrue(refused("a,b,a\n1,2,3\n")
                .endsWith("bad.csv, line 1, column 3: variable name 'a' appears twice (also column 1)"));
    }

    @Test
    void constantAndEmptyColumnsAreRefused() throws IOException {
        assertTrue(refused("a,b\n1,2\n1,3\n1,\n").endsWith(
                "bad.csv, column 'a': every value is 1.0 (a constant column carries no information)"));
        assertTrue(refused("a,b\n,2\n,3\n").endsWith("bad.csv, column 'a': every cell is empty"));
        assertTrue(refused("a,b\nx,2\nx,3\n").endsWith(
                "bad.csv, column 'a': every value is 'x' (a constant column carries no information)"));
    }

    @Test
    void nanAndInfinityAreRefusedEvenInUndeclaredColumns() throws IOException {
        assertTrue(refused("a,b\n1,2\ninf,3\n").endsWith(
                "bad.csv, line 3, column 'a': 'inf' is not a finite number (leave the cell empty for a missing value)"));
        assertTrue(refused("a,b\n1,2\n-Infinity,3\n").contains("line 3, column 'a': '-Infinity' is not a finite number"));
        assertTrue(refused("a,b\n1,2\n1e400,3\n").endsWith(
                "bad.csv, line 3, column 'a': '1e400' is too large for a double (not a finite number)"));
    }

    @Test
    void emptyFilesAndMissingDeclaredColumns() throws IOException {
        assertTrue(refused("").endsWith("bad.csv: the file is empty (expected a header row of variable names)"));
        assertTrue(refused("a,b\n").endsWith("bad.csv: no data rows after the header"));
        assertTrue(refused("a,b\n1,2\n2,1\n", Map.of("c", VariableKind.DISCRETE))
                .endsWith("bad.csv: column 'c' is declared discrete but the header has no such column"));
    }

    @Test
    void javaOnlyNumberFormsAreNotNumbers() throws IOException {
        // Double.parseDouble accepts "1d" and hex floats; a data file should not.
        Path f = file("suffix.csv", "a,b\n1d,1\n2,2\n");
        assertEquals(VariableKind.DISCRETE, DataCsv.read(f).data().variable(0).kind());
        assertTrue(refused("a,b\n0x1p3,1\n2,2\n", Map.of("a", VariableKind.CONTINUOUS)).contains("'0x1p3' is not a number"));
    }

    @Test
    void writeThenReadGivesTheSameDataBitForBit() throws IOException {
        UniformRandomProvider rng = Seeds.random(99);
        int n = 300;
        double[] x = new double[n];
        double[] y = new double[n];
        int[] k = new int[n];
        for (int r = 0; r < n; r++) {
            x[r] = rng.nextDouble() * Math.pow(10, rng.nextInt(40) - 20) * (rng.nextBoolean() ? 1 : -1);
            y[r] = r % 17 == 0 ? Double.NaN : Double.longBitsToDouble(rng.nextLong() >>> 2);
            k[r] = r % 13 == 0 ? DataSet.MISSING_CODE : rng.nextInt(3);
        }
        x[0] = Double.MIN_VALUE;
        x[1] = Double.MAX_VALUE;
        x[2] = -0.0;
        x[3] = 0.1 + 0.2;
        DataSet data = DataSet.builder(n)
                .continuous("x", x)
                .continuous("y", y)
                .discrete(Variable.discrete("kind", List.of("bare, \"quoted\"", "plain", "2")), k)
                .build();
        Path f = dir.resolve("out/round.csv");
        DataCsv.write(f, data);
        DataSet back = DataCsv.read(f).data();
        assertEquals(data.names(), back.names());
        for (int r = 0; r < n; r++) {
            assertEquals(Double.doubleToRawLongBits(x[r]), Double.doubleToRawLongBits(back.continuous(0)[r]), "x row " + r);
            assertEquals(Double.doubleToRawLongBits(y[r]), Double.doubleToRawLongBits(back.continuous(1)[r]), "y row " + r);
        }
        Variable kind = back.variable(2);
        for (int r = 0; r < n; r++) {
            String expected = k[r] < 0 ? null : data.variable(2).categories().get(k[r]);
            String got = back.discrete(2)[r] < 0 ? null : kind.categories().get(back.discrete(2)[r]);
            assertEquals(expected, got, "kind row " + r);
        }
    }

    @Test
    void oneColumnRoundTripKeepsMissingCells() throws IOException {
        DataSet data = DataSet.builder(4).continuous("only", new double[] {1, Double.NaN, 2, 3}).build();
        Path f = dir.resolve("one.csv");
        DataCsv.write(f, data);
        assertArrayEquals(data.continuous(0), DataCsv.read(f).data().continuous(0));
    }

    @Test
    void writerRefusesEmptyCategoryLabels() {
        DataSet data = DataSet.builder(2).discrete(Variable.discrete("k", List.of("", "a")), new int[] {0, 1}).build();
        assertThrows(IllegalArgumentException.class, () -> DataCsv.write(dir.resolve("x.csv"), data));
    }
}
