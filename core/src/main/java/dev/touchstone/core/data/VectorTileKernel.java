package dev.touchstone.core.data;

import jdk.incubator.vector.DoubleVector;
import jdk.incubator.vector.VectorSpecies;

/**
 * The register-blocked tile kernel on the Vector API (Java 17 incubator module
 * {@code jdk.incubator.vector}), after the micro-kernel of Goto and van de Geijn (2008,
 * "Anatomy of high-performance matrix multiplication", ACM TOMS 34(3)): a block of 4 output
 * rows × 2 vectors of columns (4 × 16 pairs with 512-bit vectors) is held in eight vector
 * registers for a whole panel of rows, so each multiply-add costs no load or store of the
 * sums; only the packed panel and four scalars per row are read.
 *
 * <p>The tile's columns are packed panel by panel into strips of two vectors' width, row
 * after row, so that the micro-kernel reads each strip contiguously. For every pair the sum
 * is formed in {@link CrossProduct}'s order: per quadruple of rows the four products are
 * added left to right in a vector (lanewise multiply and add, no fused multiply-add), then
 * added to the accumulator; the rows after the last quadruple one by one. Panels hold
 * {@value TileKernel#ROW_PANEL} rows, a multiple of four, so quadruples never straddle two
 * panels. The columns that do not fill a strip go through the same order in scalar code.
 */
final class VectorTileKernel implements TileKernel {

    private static final VectorSpecies<Double> S = DoubleVector.SPECIES_PREFERRED;
    private static final int L = S.length();
    /** Columns per strip: two vectors, so that a 4-row block holds 8 accumulators. */
    private static final int STRIP = 2 * L;

    private double[] panel = new double[0];

    /** The width of the vectors in bits, for reports of which kernel ran. */
    static int vectorBits() {
        return S.vectorBitSize();
    }

    @Override
    public void crossProducts(double[][] columns, int rows, int i0, int i1, int j0, int j1, double[] sums) {
        int width = j1 - j0;
        int strips = width / STRIP;
        if (panel.length < ROW_PANEL * strips * STRIP) {
            panel = new double[ROW_PANEL * strips * STRIP];
        }
        java.util.Arrays.fill(sums, 0, (i1 - i0) * width, 0.0);
        for (int pc = 0; pc < rows; pc += ROW_PANEL) {
            int pe = Math.min(rows, pc + ROW_PANEL);
            pack(columns, j0, strips, pc, pe);
            int i = i0;
            for (; i + 4 <= i1; i += 4) {
                for (int s = 0; s < strips; s++) {
                    block4(columns, i, s, pc, pe, sums, (i - i0) * width + s * STRIP, width);
                }
            }
            for (; i < i1; i++) {
                for (int s = 0; s < strips; s++) {
                    block1(columns[i], s, pc, pe, sums, (i - i0) * width + s * STRIP);
                }
            }
            for (int j = j0 + strips * STRIP; j < j1; j++) {
                for (i = i0; i < i1; i++) {
                    int o = (i - i0) * width + j - j0;
                    sums[o] = TileKernel.crossProduct(columns[i], columns[j], pc, pe, sums[o]);
                }
            }
        }
    }

    /** Strip s of rows [pc, pe): panel[s·h·STRIP + (r − pc)·STRIP + c] = column j0 + s·STRIP + c at row r. */
    private void pack(double[][] columns, int j0, int strips, int pc, int pe) {
        int h = pe - pc;
        for (int s = 0; s < strips; s++) {
            int base = s * h * STRIP;
            for (int c = 0; c < STRIP; c++) {
                double[] col = columns[j0 + s * STRIP + c];
                for (int r = pc, at = base + c; r < pe; r++, at += STRIP) {
                    panel[at] = col[r];
                }
            }
        }
    }

    /** Output rows i … i + 3 against strip s over rows [pc, pe), added into sums at offset o (row stride width). */
    private void block4(double[][] columns, int i, int s, int pc, int pe, double[] sums, int o, int width) {
        double[] a0 = columns[i];
        double[] a1 = columns[i + 1];
        double[] a2 = columns[i + 2];
        double[] a3 = columns[i + 3];
        double[] x = panel;
        DoubleVector c00 = DoubleVector.fromArray(S, sums, o);
        DoubleVector c01 = DoubleVector.fromArray(S, sums, o + L);
        DoubleVector c10 = DoubleVector.fromArray(S, sums, o + width);
        DoubleVector c11 = DoubleVector.fromArray(S, sums, o + width + L);
        DoubleVector c20 = DoubleVector.fromArray(S, sums, o + 2 * width);
        DoubleVector c21 = DoubleVector.fromArray(S, sums, o + 2 * width + L);
        DoubleVector c30 = DoubleVector.fromArray(S, sums, o + 3 * width);
        DoubleVector c31 = DoubleVector.fromArray(S, sums, o + 3 * width + L);
        int r = pc;
        int b = s * (pe - pc) * STRIP;
        for (; r + 4 <= pe; r += 4, b += 4 * STRIP) {
            DoubleVector u0 = DoubleVector.fromArray(S, x, b);
            DoubleVector v0 = DoubleVector.fromArray(S, x, b + L);
            DoubleVector u1 = DoubleVector.fromArray(S, x, b + STRIP);
            DoubleVector v1 = DoubleVector.fromArray(S, x, b + STRIP + L);
            DoubleVector u2 = DoubleVector.fromArray(S, x, b + 2 * STRIP);
            DoubleVector v2 = DoubleVector.fromArray(S, x, b + 2 * STRIP + L);
            DoubleVector u3 = DoubleVector.fromArray(S, x, b + 3 * STRIP);
            DoubleVector v3 = DoubleVector.fromArray(S, x, b + 3 * STRIP + L);
            double p0 = a0[r], p1 = a0[r + 1], p2 = a0[r + 2], p3 = a0[r + 3];
            c00 = c00.add(u0.mul(p0).add(u1.mul(p1)).add(u2.mul(p2)).add(u3.mul(p3)));
            c01 = c01.add(v0.mul(p0).add(v1.mul(p1)).add(v2.mul(p2)).add(v3.mul(p3)));
            p0 = a1[r];
            p1 = a1[r + 1];
            p2 = a1[r + 2];
            p3 = a1[r + 3];
            c10 = c10.add(u0.mul(p0).add(u1.mul(p1)).add(u2.mul(p2)).add(u3.mul(p3)));
            c11 = c11.add(v0.mul(p0).add(v1.mul(p1)).add(v2.mul(p2)).add(v3.mul(p3)));
            p0 = a2[r];
            p1 = a2[r + 1];
            p2 = a2[r + 2];
            p3 = a2[r + 3];
            c20 = c20.add(u0.mul(p0).add(u1.mul(p1)).add(u2.mul(p2)).add(u3.mul(p3)));
            c21 = c21.add(v0.mul(p0).add(v1.mul(p1)).add(v2.mul(p2)).add(v3.mul(p3)));
            p0 = a3[r];
            p1 = a3[r + 1];
            p2 = a3[r + 2];
            p3 = a3[r + 3];
            c30 = c30.add(u0.mul(p0).add(u1.mul(p1)).add(u2.mul(p2)).add(u3.mul(p3)));
            c31 = c31.add(v0.mul(p0).add(v1.mul(p1)).add(v2.mul(p2)).add(v3.mul(p3)));
        }
        for (; r < pe; r++, b += STRIP) {
            DoubleVector u0 = DoubleVector.fromArray(S, x, b);
            DoubleVector v0 = DoubleVector.fromArray(S, x, b + L);
            c00 = c00.add(u0.mul(a0[r]));
            c01 = c01.add(v0.mul(a0[r]));
            c10 = c10.add(u0.mul(a1[r]));
            c11 = c11.add(v0.mul(a1[r]));
            c20 = c20.add(u0.mul(a2[r]));
            c21 = c21.add(v0.mul(a2[r]));
            c30 = c30.add(u0.mul(a3[r]));
            c31 = c31.add(v0.mul(a3[r]));
        }
        c00.intoArray(sums, o);
        c01.intoArray(sums, o + L);
        c10.intoArray(sums, o + width);
        c11.intoArray(sums, o + width + L);
        c20.intoArray(sums, o + 2 * width);
        c21.intoArray(sums, o + 2 * width + L);
        c30.intoArray(sums, o + 3 * width);
        c31.intoArray(sums, o + 3 * width + L);
    }

    /** One output row against strip s (the rows of a tile that do not fill a block of four). */
    private void block1(double[] a, int s, int pc, int pe, double[] sums, int o) {
        double[] x = panel;
        DoubleVector c0 = DoubleVector.fromArray(S, sums, o);
        DoubleVector c1 = DoubleVector.fromArray(S, sums, o + L);
        int r = pc;
        int b = s * (pe - pc) * STRIP;
        for (; r + 4 <= pe; r += 4, b += 4 * STRIP) {
            double p0 = a[r], p1 = a[r + 1], p2 = a[r + 2], p3 = a[r + 3];
            c0 = c0.add(DoubleVector.fromArray(S, x, b).mul(p0).add(DoubleVector.fromArray(S, x, b + STRIP).mul(p1))
                    .add(DoubleVector.fromArray(S, x, b + 2 * STRIP).mul(p2))
                    .add(DoubleVector.fromArray(S, x, b + 3 * STRIP).mul(p3)));
            c1 = c1.add(DoubleVector.fromArray(S, x, b + L).mul(p0).add(DoubleVector.fromArray(S, x, b + STRIP + L).mul(p1))
                    .add(DoubleVector.fromArray(S, x, b + 2 * STRIP + L).mul(p2))
                    .add(DoubleVector.fromArray(S, x, b + 3 * STRIP + L).mul(p3)));
        }
        for (; r < pe; r++, b += STRIP) {
            c0 = c0.add(DoubleVector.fromArray(S, x, b).mul(a[r]));
            c1 = c1.add(DoubleVector.fromArray(S, x, b + L).mul(a[r]));
        }
        c0.intoArray(sums, o);
        c1.intoArray(sums, o + L);
    }
}
