package dev.touchstone.harness.cli;

import dev.touchstone.harness.BadInputException;
import dev.touchstone.harness.WorkStoppedException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

import java.io.PrintWriter;

/**
 * The {@code touchstone} command line. Exit status: 0 done, 2 bad input or usage (one line
 * {@code error: …} per problem: a study file with several independent problems gets one line
 * each), 1 anything else. A stack trace is printed only with {@code --debug}.
 */
@Command(name = "touchstone",
        mixinStandardHelpOptions = true,
        versionProvider = VersionProvider.class,
        description = "Benchmark causal-discovery learners against known truth.",
        subcommands = {CommandLine.HelpCommand.class, RunCommand.class, CheckCommand.class, LearnersCommand.class,
                LearnCommand.class, SimulateCommand.class, ScoreCommand.class, ReportCommand.class,
                DemoCommand.class, CalibrateCommand.class, ShowCommand.class})
public final class Main implements Runnable {

    /** Exit status for a finished command (failed runs are counted in the output, not here). */
    public static final int DONE = 0;
    /** Exit status for an unexpected failure. */
    public static final int FAILED = 1;
    /** Exit status for bad input or usage. */
    public static final int BAD_INPUT = 2;

    @Option(names = "--debug", scope = CommandLine.ScopeType.INHERIT,
            description = "Print stack traces for errors.")
    boolean debug;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    public static void main(String[] args) {
        System.exit(execute(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true)));
    }

    /** Runs the command line with these arguments and streams; returns the exit status. */
    public static int execute(String[] args, PrintWriter out, PrintWriter err) {
        Main main = new Main();
        CommandLine cl = new CommandLine(main);
        addHelpOption(cl);
        cl.setOut(out);
        cl.setErr(err);
        cl.setExecutionExceptionHandler((ex, commandLine, parseResult) -> {
            boolean debug = parseResult.matchedOption("--debug") != null
                    || hasDebug(parseResult);
            if (debug) {
                ex.printStackTrace(err);
            }
            BadInputException bad = BadInputException.from(ex);
            if (bad != null) {
                for (String line : bad.lines()) {
                    err.println("error: " + line);
                }
                return BAD_INPUT;
            }
            if (ex instanceof WorkStoppedException) {
                err.println("error: " + BadInputException.oneLine(ex.getMessage()));
                return FAILED;
            }
            err.println("error: " + internal(ex));
            return FAILED;
        });
        cl.setParameterExceptionHandler((ex, a) -> {
            err.println("error: " + ex.getMessage());
            err.println("(see 'touchstone " + commandName(ex.getCommandLine()) + "--help')");
            return BAD_INPUT;
        });
        return cl.execute(args);
    }

    /**
     * Gives every verb a {@code -h/--help} option (usage, exit 0) unless it declares one, so
     * that {@code touchstone VERB --help}, which the usage-error hint names, works everywhere.
     */
    private static void addHelpOption(CommandLine cl) {
        for (CommandLine sub : cl.getSubcommands().values()) {
            CommandLine.Model.CommandSpec spec = sub.getCommandSpec();
            if (spec.optionsMap().containsKey("--help") || sub.getCommand() instanceof CommandLine.HelpCommand) {
                continue;
            }
            spec.addOption(CommandLine.Model.OptionSpec.builder("-h", "--help").usageHelp(true)
                    .description("Show this help message and exit.").build());
        }
    }

    /**
     * The line for a fault of the tool: its message without Java class names, and how to see
     * more. The message of an exception that has none is not shown at all.
     */
    static String internal(Throwable ex) {
        String m = ex.getMessage() == null ? null : BadInputException.oneLine(ex.getMessage())
                .replaceAll("\\b(?:[a-z][a-z0-9_]*\\.)+[A-Z][A-Za-z0-9_$]*(?:Exception|Error)\\b:?\\s*", "");
        return "unexpected failure" + (m == null || m.isBlank() ? "" : ": " + m.strip())
                + " (run again with --debug to see where, and please report it)";
    }

    private static boolean hasDebug(CommandLine.ParseResult pr) {
        for (CommandLine.ParseResult r = pr; r != null; r = r.subcommand()) {
            if (r.matchedOption("--debug") != null) {
                return true;
            }
        }
        return false;
    }

    private static String commandName(CommandLine cl) {
        String name = cl.getCommandSpec().qualifiedName(" ");
        String rest = name.startsWith("touchstone") ? name.substring("touchstone".length()).trim() : name;
        return rest.isEmpty() ? "" : rest + " ";
    }
}
