package dev.touchstone.reports.calibration;

import dev.touchstone.reports.tables.Numbers;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;

/**
 * Answers "how many rows would make this metric reach this value?" for one learner from
 * the means at the simulated sizes: the first size from which on every mean reaches the
 * value (a mean that dips below again at a larger size, noise of few replicates, does not
 * count as reached), refined by linear interpolation in log(rows) between it and the size before (means rise roughly
 * linearly in log n over a few doublings; common practice for reading learning curves).
 * The answer says so plainly when no size tried reaches the value, and never extrapolates.
 */
public final class SizeAnswer {

    private SizeAnswer() {
    }

    /** The number of rows (interpolated), or null when the largest size tried does not reach {@code target}. */
    public static Double rowsToReach(List<CalibrationView.SizePoint> points, double target) {
        List<CalibrationView.SizePoint> sorted = new ArrayList<>();
        for (CalibrationView.SizePoint p : points) {
            if (p.mean() != null) {
                sorted.add(p);
            }
        }
        sorted.sort(Comparator.comparingInt(CalibrationView.SizePoint::rows));
        // the last size whose mean falls short: the answer lies after it, where every larger size reaches the target
        int below = -1;
        for (int i = 0; i < sorted.size(); i++) {
            if (sorted.get(i).mean() < target) {
                below = i;
            }
        }
        if (sorted.isEmpty() || below == sorted.size() - 1) {
            return null;
        }
        if (below < 0) {
            return (double) sorted.get(0).rows();
        }
        CalibrationView.SizePoint q = sorted.get(below);
        CalibrationView.SizePoint p = sorted.get(below + 1);
        double f = (target - q.mean()) / (p.mean() - q.mean());
        double logRows = Math.log(q.rows()) + f * (Math.log(p.rows()) - Math.log(q.rows()));
        return (double) Math.round(Math.exp(logRows));
    }

    /** The answer in one sentence for one learner. */
    public static String sentence(String learner, List<CalibrationView.SizePoint> points, CalibrationView.Target t,
                                  int analystRows) {
        Double rows = rowsToReach(points, t.value());
        int smallest = Integer.MAX_VALUE;
        int largest = 0;
        for (CalibrationView.SizePoint p : points) {
            smallest = Math.min(smallest, p.rows());
            largest = Math.max(largest, p.rows());
        }
        String goal = t.metric() + " " + Numbers.format(t.value());
        if (rows == null) {
            boolean somewhere = points.stream().anyMatch(p -> p.mean() != null && p.mean() >= t.value());
            if (somewhere) {
                return String.format(Locale.ROOT, "%s: its mean %s reaches %s at some sizes but falls below it again"
                        + " by the largest size tried (%,d rows); the curve is too noisy to say, more replicates"
                        + " would help.", learner, t.metric(), Numbers.format(t.value()), largest);
            }
            return String.format(Locale.ROOT, "%s: does not reach a mean %s within the sizes tried (up to %,d rows);"
                    + " more rows may or may not help.", learner, goal, largest);
        }
        if (rows <= smallest) {
            return String.format(Locale.ROOT, "%s: reaches a mean %s already at the smallest size tried (%,d rows).",
                    learner, goal, smallest);
        }
        long r = Math.round(rows);
        String relation = r <= analystRows ? "at or below your " + String.format(Locale.ROOT, "%,d", analystRows)
                + " rows" : String.format(Locale.ROOT, "about %.1f times your %,d rows", r / (double) analystRows,
                analystRows);
        return String.format(Locale.ROOT, "%s: reaches a mean %s at about %,d rows (%s; interpolated between the"
                + " sizes tried).", learner, goal, r, relation);
    }
}
