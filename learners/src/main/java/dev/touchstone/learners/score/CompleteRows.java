package dev.touchstone.learners.score;

import dev.touchstone.core.data.DataSet;

/** List-wise deletion: the rows of a data set with no missing cell (common practice). Cost O(n p). */
final class CompleteRows {

    private CompleteRows() {
    }

    /** The data set itself when nothing is missing, else its complete rows. */
    static DataSet of(DataSet data) {
        if (!data.hasMissing()) {
            return data;
        }
        int[] keep = new int[data.rows()];
        int k = 0;
        for (int r = 0; r < data.rows(); r++) {
            boolean ok = true;
            for (int j = 0; j < data.columns() && ok; j++) {
                ok = !data.isMissing(r, j);
            }
            if (ok) {
                keep[k++] = r;
            }
        }
        return data.rows(java.util.Arrays.copyOf(keep, k));
    }
}
