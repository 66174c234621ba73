package dev.touchstone.harness.execution;

import dev.touchstone.metrics.results.RunResult;

import java.io.PrintWriter;
import java.util.Locale;

/**
 * Receives a study's progress: the total, each run as it becomes durable, the end. Live
 * progress and final files are different listeners; this one only informs
 * people. Implementations must be thread-safe ({@link #finished} is called from the
 * journal's writer thread).
 */
public interface Progress {

    /** Called once before any run: {@code total} runs in the study, {@code done} of them already in the journal. */
    void start(int total, int done);

    /** Called once per run, after its journal line is on disk. */
    void finished(RunResult result);

    /** Called once at the end. */
    void end();

    /** Says nothing ({@code --quiet}). */
    static Progress quiet() {
        return new Progress() {
            @Override
            public void start(int total, int done) {
            }

            @Override
            public void finished(RunResult result) {
            }

            @Override
            public void end() {
            }
        };
    }

    /**
     * A live line rewritten in place (for a terminal) or, when {@code live} is false, a plain
     * line at most every {@code everySeconds} seconds: runs done / total, rate, time left,
     * failures so far.
     */
    static Progress lines(PrintWriter out, boolean live, double everySeconds) {
        return new LineProgress(out, live, everySeconds);
    }

    /** Formats the progress line; shared by both styles. */
    final class LineProgress implements Progress {
        private final PrintWriter out;
        private final boolean live;
        private final long intervalNanos;
        private int total;
        private int alreadyDone;
        private int done;
        private int failed;
        private int timedOut;
        private long startNanos;
        private long lastNanos;
        private int lastLength;

        LineProgress(PrintWriter out, boolean live, double everySeconds) {
            this.out = out;
            this.live = live;
            this.intervalNanos = (long) (everySeconds * 1e9);
        }

        @Override
        public synchronized void start(int total, int done) {
            this.total = total;
            this.alreadyDone = done;
            this.done = done;
            this.startNanos = System.nanoTime();
            this.lastNanos = startNanos;
        }

        @Override
        public synchronized void finished(RunResult result) {
            done++;
            switch (result.status()) {
                case FAILED:
                    failed++;
                    break;
                case TIMEOUT:
                    timedOut++;
                    break;
                default:
                    break;
            }
            long now = System.nanoTime();
            if (now - lastNanos >= intervalNanos) {
                lastNanos = now;
                print(now, false);
            }
        }

        @Override
        public synchronized void end() {
            if (total > alreadyDone) {
                print(System.nanoTime(), true);
            }
        }

        private void print(long now, boolean last) {
            String line = line(now);
            if (live) {
                StringBuilder sb = new StringBuilder("\r").append(line);
                for (int i = line.length(); i < lastLength; i++) {
                    sb.append(' ');
                }
                lastLength = line.length();
                out.print(sb);
                if (last) {
                    out.println();
                }
            } else {
                out.println(line);
            }
            out.flush();
        }

        /** E.g. {@code runs 1,200/10,000 (12%)  410 runs/s  about 21 s left  failed 3, timed out 0}. */
        synchronized String line(long now) {
            double seconds = Math.max(1e-9, (now - startNanos) / 1e9);
            int thisSession = done - alreadyDone;
            double rate = thisSession / seconds;
            String left = rate > 0 ? duration((total - done) / rate) : "unknown";
            return String.format(Locale.ROOT, "runs %,d/%,d (%d%%)  %s runs/s  %s left  failed %d, timed out %d",
                    done, total, total == 0 ? 100 : (int) (100L * done / total),
                    rate >= 10 ? String.format(Locale.ROOT, "%.0f", rate) : String.format(Locale.ROOT, "%.2f", rate),
                    done >= total ? "nothing" : "about " + left, failed, timedOut);
        }

        private static String duration(double s) {
            if (s < 90) {
                return Math.round(s) + " s";
            }
            if (s < 5400) {
                return Math.round(s / 60) + " min";
            }
            return String.format(Locale.ROOT, "%.1f h", s / 3600);
        }
    }
}
