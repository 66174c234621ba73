package dev.touchstone.harness.execution;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.function.Consumer;

/**
 * The append-only record of finished runs that makes a study resumable: {@code journal.jsonl},
 * one JSON line per run (see {@link JournalCodec}).
 *
 * <p>A run counts as done only once its line is on disk: lines are written by one writer
 * thread that takes everything queued, writes it with one call and forces it to the device
 * before reporting those runs done (group commit). A crash loses at most the runs not yet
 * reported, which a resume redoes. On opening, a torn last line (from a crash in the middle
 * of a write) is ignored and cut off so that later lines start clean; a damaged line
 * elsewhere is refused, since it means the file was edited or corrupted.
 *
 * <p>Cost per run: encoding one line (microseconds); the device sync is shared by every
 * line of a batch.
 */
public final class Journal implements AutoCloseable {

    /** The file name inside a study's output folder. */
    public static final String FILE_NAME = "journal.jsonl";
    /** The kept estimates beside the journal: one {@link EstimateCodec} line per journal line. */
    public static final String ESTIMATES_FILE = "estimates.jsonl";

    private static final Pending STOP = new Pending(null, null, null, null);

    private final Path file;
    private final Map<String, JournalCodec.Line> existing;
    private final boolean tornTail;
    private final FileChannel channel;
    private final FileChannel estimates;
    private final BlockingQueue<Pending> queue = new LinkedBlockingQueue<>();
    private final Thread writer;
    private volatile Throwable failure;

    private record Pending(String text, String estimate, JournalCodec.Line line,
                           Consumer<JournalCodec.Line> onDurable) {
    }

    private Journal(Path file, Map<String, JournalCodec.Line> existing, boolean tornTail, FileChannel channel,
                    FileChannel estimates) {
        this.file = file;
        this.existing = Collections.unmodifiableMap(existing);
        this.tornTail = tornTail;
        this.channel = channel;
        this.estimates = estimates;
        this.writer = new Thread(this::writeLoop, "journal-writer");
        this.writer.setDaemon(true);
        this.writer.start();
    }

    /**
     * Opens (or creates) a journal, reading the runs it already holds, and its kept-estimates
     * file beside it ({@link #ESTIMATES_FILE}), cut back to the lines whose runs the journal
     * holds.
     *
     * <p>Why the two files stay consistent: each batch's estimate lines are written and forced
     * before its journal lines, in the same order. After a crash the estimates file may thus
     * hold lines of runs whose journal lines never reached the disk, always at its end; they
     * are cut off here, and those runs are redone. A journal line never lacks its estimate line.
     *
     * @throws JournalException when a line other than the last cannot be read
     */
    public static Journal open(Path file) {
        try {
            Contents c = read(file);
            FileChannel ch = FileChannel.open(file, StandardOpenOption.CREATE, StandardOpenOption.WRITE);
            if (c.goodBytes() < ch.size()) {
                ch.truncate(c.goodBytes());
                ch.force(true);
            }
            ch.position(ch.size());
            Path kept = file.resolveSibling(ESTIMATES_FILE);
            long keep = consistentPrefix(kept, c.lines().keySet());
            FileChannel est = FileChannel.open(kept, StandardOpenOption.CREATE, StandardOpenOption.WRITE);
            if (keep < est.size()) {
                est.truncate(keep);
                est.force(true);
            }
            est.position(est.size());
            return new Journal(file, c.lines(), c.torn(), ch, est);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot open the journal " + file, e);
        }
    }

    /**
     * The length of the estimates file's longest prefix of complete lines, each of a run the
     * journal holds and seen once: what a crash left beyond it belongs to runs to be redone.
     */
    private static long consistentPrefix(Path kept, java.util.Set<String> journaled) throws IOException {
        if (!Files.exists(kept)) {
            return 0;
        }
        return consistentPrefix(Files.readAllBytes(kept), journaled);
    }

    /** As {@link #consistentPrefix(Path, java.util.Set)}, on the file's bytes already read. */
    private static long consistentPrefix(byte[] bytes, java.util.Set<String> journaled) {
        java.util.Set<String> seen = new java.util.HashSet<>();
        int start = 0;
        while (start < bytes.length) {
            int end = start;
            while (end < bytes.length && bytes[end] != '\n') {
                end++;
            }
            if (end >= bytes.length) {
                break;
            }
            String key;
            try {
                key = EstimateCodec.key(new String(bytes, start, end - start, StandardCharsets.UTF_8));
            } catch (IllegalArgumentException e) {
                break;
            }
            if (!journaled.contains(key) || !seen.add(key)) {
                break;
            }
            start = end + 1;
        }
        return start;
    }

    /** What a journal file holds: its good lines by key, whether the last line was torn, and the length of the good part. */
    public record Contents(Map<String, JournalCodec.Line> lines, boolean torn, long goodBytes) {
    }

    /**
     * Reads a journal without opening it for writing (for reports and checks). A torn last
     * line is left out; the first of two lines with the same key wins.
     */
    public static Contents read(Path file) throws IOException {
        Map<String, JournalCodec.Line> lines = new LinkedHashMap<>();
        if (!Files.exists(file)) {
            return new Contents(lines, false, 0);
        }
        byte[] bytes = Files.readAllBytes(file);
        int start = 0;
        int lineNo = 0;
        long good = 0;
        boolean torn = false;
        while (start < bytes.length) {
            int end = start;
            while (end < bytes.length && bytes[end] != '\n') {
                end++;
            }
            lineNo++;
            boolean complete = end < bytes.length;
            boolean last = !complete || end + 1 >= bytes.length;
            String text = new String(bytes, start, end - start, StandardCharsets.UTF_8);
            if (!text.isBlank()) {
                try {
                    if (!complete) {
                        throw new IllegalArgumentException("the line is not finished");
                    }
                    JournalCodec.Line line = JournalCodec.read(text);
                    lines.putIfAbsent(line.result().key(), line);
                } catch (IllegalArgumentException e) {
                    if (!last) {
                        throw new JournalException(file + ":" + lineNo + ": the journal line cannot be read ("
                                + e.getMessage() + "); the file was changed or damaged. Move it away to start"
                                + " the study afresh");
                    }
                    torn = true;
                    break;
                }
            }
            good = complete ? end + 1 : end;
            start = end + 1;
        }
        return new Contents(lines, torn, torn ? good : bytes.length);
    }

    /**
     * Reads the estimates kept beside a journal without opening either for writing (for
     * reports and exports): the lines of runs the journal holds, by key, in file order; lines
     * a crash left beyond the journal's runs are left out, as {@link #open} would cut them.
     */
    public static Map<String, EstimateCodec.Kept> readEstimates(Path file) throws IOException {
        return readEstimates(file, key -> true);
    }

    /**
     * As {@link #readEstimates(Path)}, decoding only the lines whose key {@code wanted}
     * accepts (a report pictures a handful of runs: the others' graphs are not parsed).
     */
    public static Map<String, EstimateCodec.Kept> readEstimates(Path file, java.util.function.Predicate<String> wanted)
            throws IOException {
        return readEstimates(file, read(file).lines().keySet(), wanted);
    }

    /**
     * As {@link #readEstimates(Path, java.util.function.Predicate)}, for a caller that has read the
     * journal already ({@link #read}): {@code journaled} is the keys it holds, so the journal is not
     * decoded again, and the estimates file is read once.
     */
    public static Map<String, EstimateCodec.Kept> readEstimates(Path file, java.util.Set<String> journaled,
                                                               java.util.function.Predicate<String> wanted)
            throws IOException {
        Path kept = file.resolveSibling(ESTIMATES_FILE);
        Map<String, EstimateCodec.Kept> out = new LinkedHashMap<>();
        if (!Files.exists(kept)) {
            return out;
        }
        byte[] bytes = Files.readAllBytes(kept);
        long good = consistentPrefix(bytes, journaled);
        String text = new String(bytes, 0, (int) good, StandardCharsets.UTF_8);
        int lineNo = 0;
        for (String line : text.split("\n")) {
            lineNo++;
            if (line.isEmpty()) {
                continue;
            }
            try {
                if (wanted.test(EstimateCodec.key(line))) {
                    EstimateCodec.Kept k = EstimateCodec.read(line);
                    out.put(k.key(), k);
                }
            } catch (IllegalArgumentException e) {
                throw new JournalException(kept + ":" + lineNo + ": the kept estimate cannot be read ("
                        + e.getMessage() + ")");
            }
        }
        return out;
    }

    /** The runs the journal held when opened, by key. */
    public Map<String, JournalCodec.Line> existing() {
        return existing;
    }

    /** Whether a torn last line was found (and cut off) when the journal was opened. */
    public boolean hadTornLine() {
        return tornTail;
    }

    public Path file() {
        return file;
    }

    /**
     * Queues a finished run; {@code onDurable} is called (on the writer thread) once its line
     * is on disk.
     *
     * @throws JournalException if an earlier write failed
     */
    public void append(JournalCodec.Line line, Consumer<JournalCodec.Line> onDurable) {
        append(line, null, onDurable);
    }

    /**
     * Queues a finished run with its estimate (null when it returned none); {@code onDurable}
     * is called (on the writer thread) once both its estimate line and its journal line are on disk.
     *
     * @throws JournalException if an earlier write failed
     */
    public void append(JournalCodec.Line line, dev.touchstone.core.learner.Estimate estimate,
                       Consumer<JournalCodec.Line> onDurable) {
        checkHealthy();
        queue.add(new Pending(JournalCodec.write(line) + "\n",
                EstimateCodec.write(line.result().key(), estimate) + "\n", line, onDurable));
    }

    private void writeLoop() {
        List<Pending> batch = new ArrayList<>();
        boolean stop = false;
        while (!stop) {
            try {
                batch.add(queue.take());
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                return;
            }
            queue.drainTo(batch);
            StringBuilder sb = new StringBuilder();
            StringBuilder kept = new StringBuilder();
            List<Pending> written = new ArrayList<>(batch.size());
            for (Pending p : batch) {
                if (p == STOP) {
                    stop = true;
                } else {
                    sb.append(p.text());
                    kept.append(p.estimate());
                    written.add(p);
                }
            }
            batch.clear();
            if (written.isEmpty()) {
                continue;
            }
            try {
                // Estimates first: a journal line on disk always has its estimate line.
                writeAll(estimates, kept);
                writeAll(channel, sb);
            } catch (IOException | RuntimeException e) {
                failure = e;
                return;
            }
            for (Pending p : written) {
                if (p.onDurable() != null) {
                    p.onDurable().accept(p.line());
                }
            }
        }
    }

    private static void writeAll(FileChannel ch, CharSequence text) throws IOException {
        ByteBuffer buf = ByteBuffer.wrap(text.toString().getBytes(StandardCharsets.UTF_8));
        while (buf.hasRemaining()) {
            ch.write(buf);
        }
        ch.force(false);
    }

    private void checkHealthy() {
        Throwable f = failure;
        if (f != null) {
            throw new JournalException("writing the journal " + file + " failed: " + f.getMessage(), f);
        }
    }

    /** Writes and syncs everything queued, then closes the file. */
    @Override
    public void close() {
        queue.add(STOP);
        try {
            writer.join();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        try {
            channel.close();
            estimates.close();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        checkHealthy();
    }

    /** The journal cannot be read or written. */
    public static final class JournalException extends dev.touchstone.harness.BadInputException {
        private static final long serialVersionUID = 1L;

        public JournalException(String message) {
            super(message);
        }

        public JournalException(String message, Throwable cause) {
            super(message, cause);
        }
    }
}
