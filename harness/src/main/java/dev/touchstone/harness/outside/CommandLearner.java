package dev.touchstone.harness.outside;

import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.DeadlineExceededException;
import dev.touchstone.core.learner.Estimate;
import dev.touchstone.core.learner.Learner;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.learner.LearnerException;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.harness.io.DataCsv;
import dev.touchstone.harness.io.GraphCsv;
import dev.touchstone.harness.io.GraphJson;
import dev.touchstone.harness.study.Canonical;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * A learner that is an external command in any language: writes the run's data as CSV into
 * a fresh temporary folder, runs the declared argument list there (no shell: an argument
 * is never split or interpreted), waits at most until the run's deadline, and reads the
 * graph file the command wrote, strictly (GraphJson / GraphCsv: unknown variables, marks
 * the declared class does not allow, a cycle where a DAG is declared are all refused).
 *
 * <p>Placeholders in arguments: {@code {data}} the CSV file, {@code {output}} the graph file
 * to write, {@code {seed}} the run's seed, {@code {dir}} the learners file's folder,
 * {@code {workdir}} the temporary folder, {@code {kinds}} a kinds file with the kind of every
 * column ({@link dev.touchstone.harness.io.ColumnKinds}: {@code column,kind} rows),
 * {@code {knowledge}} the run's background knowledge as JSON (required, forbidden, tiers;
 * empty lists when there is none; {@link dev.touchstone.harness.io.KnowledgeFile}), and {@code {NAME}} the value of parameter NAME.
 * At the limit, the command and every process it started are killed (descendants first)
 * and the run is recorded {@code timeout}; a non-zero exit status, a missing or malformed
 * output file are recorded {@code failed} with the reason and the last line the command
 * wrote to its error stream. Processes left running after a normal exit are killed too.
 * The temporary folder is deleted afterwards. Cost: the command's, plus writing the CSV.
 */
public final class CommandLearner implements Learner {

    /** The kinds file's name in the run's folder. */
    static final String KINDS_FILE = "data.kinds.csv";
    /** The knowledge file's name in the run's folder. */
    static final String KNOWLEDGE_FILE = "knowledge.json";

    private static final Pattern PLACEHOLDER = Pattern.compile("\\{([a-z_][a-z0-9_]*)}");

    private final CommandSpec spec;

    public CommandLearner(CommandSpec spec) {
        this.spec = spec;
    }

    public CommandSpec spec() {
        return spec;
    }

    @Override
    public LearnerDescription description() {
        return spec.description();
    }

    @Override
    public Estimate learn(LearnerInput input, Knowledge knowledge, ParameterValues parameters, RunContext context) {
        String id = spec.description().id();
        if (input.isOracle()) {
            throw new LearnerException("learner " + id + " is an external command and cannot use the oracle");
        }
        Path work;
        try {
            work = Files.createTempDirectory("touchstone-" + id + "-");
        } catch (IOException e) {
            throw new UncheckedIOException("cannot make a temporary folder for " + id, e);
        }
        try {
            Path data = work.resolve("data.csv");
            Path output = work.resolve(spec.output().fileName());
            DataCsv.write(data, input.data());
            List<String> used = placeholders(spec.command());
            if (used.contains("kinds")) {
                dev.touchstone.harness.io.ColumnKinds.write(work.resolve(KINDS_FILE), input.data());
            }
            if (used.contains("knowledge")) {
                dev.touchstone.harness.io.AtomicFiles.writeString(work.resolve(KNOWLEDGE_FILE),
                        dev.touchstone.harness.io.KnowledgeFile.toJson(knowledge));
            }
            List<String> args = arguments(data, output, work, context.seed(), parameters);
            Process p = new ProcessBuilder(args).directory(work.toFile())
                    .redirectOutput(work.resolve("stdout.txt").toFile())
                    .redirectError(work.resolve("stderr.txt").toFile())
                    .start();
            try {
                boolean finished = waitFor(p, context);
                if (!finished) {
                    killTree(p);
                    throw new DeadlineExceededException("external command " + id + " was killed at the time limit");
                }
            } finally {
                killTree(p); // nothing it started may outlive the run
            }
            int status = p.exitValue();
            if (status != 0) {
                throw new LearnerException("external command " + id + " exited with status " + status
                        + lastError(work));
            }
            if (!Files.isRegularFile(output)) {
                throw new LearnerException("external command " + id + " wrote no graph file (expected "
                        + spec.output().word() + " at {output})" + lastError(work));
            }
            Graph g = read(output, input.variableNames());
            if (!g.names().equals(input.variableNames())) {
                throw new LearnerException("external command " + id + " wrote a graph over " + g.names()
                        + ", not over the data's variables " + input.variableNames());
            }
            return Estimate.of(g, spec.description().returns());
        } catch (IOException e) {
            throw new LearnerException("external command " + id + " could not be run: " + e.getMessage());
        } catch (dev.touchstone.harness.io.FileFormatException e) {
            throw new LearnerException("external command " + id + " wrote a graph that cannot be read: "
                    + e.getMessage().replace(work.toString(), "{workdir}"));
        } finally {
            deleteTree(work);
        }
    }

    /** The argument list with every placeholder replaced. */
    List<String> arguments(Path data, Path output, Path work, long seed, ParameterValues parameters) {
        List<String> out = new ArrayList<>(spec.command().size());
        Map<String, Object> values = parameters.asMap();
        for (String a : spec.command()) {
            Matcher m = PLACEHOLDER.matcher(a);
            StringBuilder sb = new StringBuilder();
            while (m.find()) {
                String name = m.group(1);
                String v;
                switch (name) {
                    case "data": v = data.toString(); break;
                    case "output": v = output.toString(); break;
                    case "seed": v = Long.toString(seed); break;
                    case "dir": v = spec.dir().toString(); break;
                    case "workdir": v = work.toString(); break;
                    case "kinds": v = work.resolve(KINDS_FILE).toString(); break;
                    case "knowledge": v = work.resolve(KNOWLEDGE_FILE).toString(); break;
                    default:
                        if (!values.containsKey(name)) {
                            throw new IllegalStateException("placeholder {" + name + "} names no parameter");
                        }
                        v = Canonical.value(values.get(name));
                }
                m.appendReplacement(sb, Matcher.quoteReplacement(v));
            }
            m.appendTail(sb);
            out.add(sb.toString());
        }
        return out;
    }

    /** The placeholder names used in an argument list (for checking a learners file). */
    static List<String> placeholders(List<String> command) {
        List<String> out = new ArrayList<>();
        for (String a : command) {
            Matcher m = PLACEHOLDER.matcher(a);
            while (m.find()) {
                out.add(m.group(1));
            }
        }
        return out;
    }

    private Graph read(Path output, List<String> variables) throws IOException {
        switch (spec.output()) {
            case CSV:
                return GraphCsv.read(output, variables, spec.description().returns());
            default:
                return GraphJson.read(output, spec.description().returns());
        }
    }

    /** Waits until the process ends (true) or the run's deadline passes (false). */
    private static boolean waitFor(Process p, RunContext context) {
        while (true) {
            long left = context.remainingNanos();
            if (left <= 0) {
                return !p.isAlive();
            }
            try {
                if (p.waitFor(Math.min(left, TimeUnit.SECONDS.toNanos(3600)), TimeUnit.NANOSECONDS)) {
                    return true;
                }
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                return false;
            }
        }
    }

    /** Kills a process and all its descendants, deepest first, and waits for them. */
    static void killTree(Process p) {
        for (int pass = 0; pass < 2; pass++) {
            List<ProcessHandle> tree = new ArrayList<>();
            p.toHandle().descendants().forEach(tree::add);
            java.util.Collections.reverse(tree);
            for (ProcessHandle h : tree) {
                h.destroyForcibly();
            }
            p.destroyForcibly();
            for (ProcessHandle h : tree) {
                try {
                    h.onExit().get(5, TimeUnit.SECONDS);
                } catch (Exception e) {
                    // gone already, or not ours to wait for
                }
            }
        }
        try {
            p.waitFor(5, TimeUnit.SECONDS);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    private static String lastError(Path work) {
        try {
            List<String> lines = Files.readAllLines(work.resolve("stderr.txt"), StandardCharsets.UTF_8);
            for (int i = lines.size() - 1; i >= 0; i--) {
                if (!lines.get(i).isBlank()) {
                    String l = lines.get(i).trim();
                    return "; it said: " + (l.length() > 300 ? l.substring(0, 300) + "…" : l);
                }
            }
        } catch (IOException | RuntimeException e) {
            // no error output to quote
        }
        return "";
    }

    private static void deleteTree(Path dir) {
        try (Stream<Path> s = Files.walk(dir)) {
            s.sorted(Comparator.reverseOrder()).forEach(p -> {
                try {
                    Files.deleteIfExists(p);
                } catch (IOException e) {
                    // best effort: a temporary folder
                }
            });
        } catch (IOException e) {
            // best effort
        }
    }
}
