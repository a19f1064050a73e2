package org.polebench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.FileSystemException;
import java.util.List;
import org.polebench.InputLimits;
import org.polebench.InputProblem;
import org.polebench.OutputFile;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.UsageMessageSpec;

/** The {@code polebench} command: subcommands, version, and the mapping of problems to exit codes. */
@Command(name = "polebench",
        mixinStandardHelpOptions = true,
        versionProvider = VersionProvider.class,
        description = "Reconciles an amplifier stage as designed with the same stage as built: "
                + "predicts its low-frequency response, fits a bench sweep, finds the capacitor "
                + "that explains the difference and writes a test report.",
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {
                "0:done; every verdict passed",
                "1:a verdict failed (the board does not meet its limits)",
                "2:bad input or usage (stage file, sweep, profile or option)",
                "3:instrument or I/O fault (port, timeout, file not writable)",
                "4:a verdict is incomplete: no check failed, but the sweep does not decide a limit (or the stage "
                        + "names none); never a pass"})
public final class Main implements Runnable {

    /**
     * The subcommands, in the order the usage lists them, by name and class name. They are added
     * in {@link #run}, not named in {@code @Command}: picocli builds the whole model of every
     * command it is given (options, mixins, help sections) by reflection, which cost about a tenth
     * of a second of every start; a command line that names its subcommand gets only that one's
     * model. Names and class names, not class literals, so that naming one command loads none of
     * the others (a class literal loads its class, and reading each one's annotation to find the
     * named one parsed them all); MainTest checks each name against its class's annotation.
     */
    private static final List<Subcommand> SUBCOMMANDS = List.of(
            new Subcommand("help", "picocli.CommandLine$HelpCommand"),
            new Subcommand("predict", "org.polebench.cli.PredictCommand"),
            new Subcommand("inspect", "org.polebench.cli.InspectCommand"),
            new Subcommand("profiles", "org.polebench.cli.ProfilesCommand"),
            new Subcommand("fit", "org.polebench.cli.FitCommand"),
            new Subcommand("reconcile", "org.polebench.cli.ReconcileCommand"),
            new Subcommand("report", "org.polebench.cli.ReportCommand"),
            new Subcommand("synthesize", "org.polebench.cli.SynthesizeCommand"),
            new Subcommand("capture", "org.polebench.cli.CaptureCommand"),
            new Subcommand("simulate", "org.polebench.cli.SimulateCommand"),
            new Subcommand("batch", "org.polebench.cli.BatchCommand"),
            new Subcommand("lot", "org.polebench.cli.LotCommand"),
            new Subcommand("history", "org.polebench.cli.HistoryCommand"));

    /** A subcommand's name on the command line and the class that implements it. */
    private record Subcommand(String name, String className) {
        Class<?> type() {
            try {
                return Class.forName(className);
            } catch (ClassNotFoundException missing) {
                throw new IllegalStateException("the subcommand " + name + "'s class is not in the jar", missing);
            }
        }
    }

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    public static void main(String[] args) {
        System.exit(run(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true)));
    }

    /** Runs one command line with the given writers; returns the exit code. Tests call this. */
    public static int run(String[] args, PrintWriter out, PrintWriter err) {
        if (args.length == 1 && (args[0].equals("--version") || args[0].equals("-V"))) {
            // answered before picocli builds any model: a version query is a script's start-up
            // check and should cost no more than the JVM's start (issue 15)
            out.println(VersionProvider.versionLine());
            out.flush();
            return ExitCodes.OK;
        }
        CommandLine line = new CommandLine(new Main());
        for (Class<?> subcommand : subcommandsFor(args)) {
            line.addSubcommand(subcommand);
        }
        line.setOut(out);
        line.setErr(err);
        line.setUsageHelpAutoWidth(true);
        keepExamplesWhole(line);
        line.setParameterExceptionHandler(Main::usageError);
        line.setExecutionExceptionHandler(Main::handle);
        int code;
        try {
            // a limit set to nonsense is refused before any command runs (InputLimits)
            InputLimits.from(System.getProperties());
            code = line.execute(args);
        } catch (InputProblem badLimit) {
            err.println("polebench: " + badLimit.describe());
            code = ExitCodes.BAD_INPUT;
        } catch (OutOfMemoryError exhausted) {
            // picocli hands on errors; a file or option too large for the heap is the user's to
            // size, so it gets a message and the I/O exit code, never a stack trace (issue 15)
            err.println("polebench: out of memory (" + exhausted.getMessage() + "): the input or an option is too "
                    + "large for this Java heap");
            err.println("  fix: give Java more memory (java -Xmx4g -jar target/polebench.jar …), or split the file or "
                    + "lower --samples / --points");
            code = ExitCodes.INSTRUMENT_OR_IO;
        }
        out.flush();
        err.flush();
        return code;
    }

    /**
     * @return the one subcommand the first argument names, when it names one other than
     *         {@code help}; otherwise all of them (usage, help, a misspelt name's suggestions)
     */
    static List<Class<?>> subcommandsFor(String[] args) {
        List<Class<?>> types = new java.util.ArrayList<>();
        for (Subcommand subcommand : SUBCOMMANDS) {
            if (args.length > 0 && !args[0].equals("help") && subcommand.name().equals(args[0])) {
                return List.of(subcommand.type());
            }
        }
        for (Subcommand subcommand : SUBCOMMANDS) {
            types.add(subcommand.type());
        }
        return types;
    }

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    /**
     * Sets each command's footer (its examples) line by line as written, never wrapped at the
     * usage width: an example broken across lines, or a quoted argument split in two, cannot be
     * copied. The rest of the help wraps at the terminal's width (picocli's auto width, 80
     * columns when there is no terminal).
     */
    private static void keepExamplesWhole(CommandLine line) {
        line.getHelpSectionMap().put(UsageMessageSpec.SECTION_KEY_FOOTER, help -> {
            StringBuilder text = new StringBuilder();
            for (String example : help.commandSpec().usageMessage().footer()) {
                // picocli's footers are format strings; ours use no specifier but the escaped percent
                text.append(example.replace("%%", "%")).append(System.lineSeparator());
            }
            return text.toString();
        });
        for (CommandLine sub : line.getSubcommands().values()) {
            keepExamplesWhole(sub);
        }
    }

    /**
     * A usage error (an unknown option, a missing parameter, a value picocli cannot convert) in
     * the project's own form, as an {@link InputProblem} is printed: {@code polebench: …} and a
     * {@code fix:} line, with picocli's suggestions for a misspelt name; exit code 2.
     */
    private static int usageError(CommandLine.ParameterException failure, String[] args) {
        CommandLine line = failure.getCommandLine();
        String command = line.getCommandSpec().qualifiedName();
        List<String> near = new java.util.ArrayList<>();
        if (failure instanceof CommandLine.UnmatchedArgumentException) {
            for (String suggestion : ((CommandLine.UnmatchedArgumentException) failure).getSuggestions()) {
                near.add(line.getSubcommands().containsKey(suggestion) ? command + " " + suggestion : suggestion);
            }
        }
        String hint = (near.isEmpty() ? "" : "did you mean " + String.join(" or ", near) + "? ")
                + "see '" + command + " --help'";
        line.getErr().println("polebench: " + new InputProblem(null, 0, failure.getMessage(), hint).describe());
        return ExitCodes.BAD_INPUT;
    }

    private static int handle(Exception failure, CommandLine line, CommandLine.ParseResult parsed) {
        PrintWriter err = line.getErr();
        if (failure instanceof InputProblem) {
            err.println("polebench: " + ((InputProblem) failure).describe());
            return ExitCodes.BAD_INPUT;
        }
        if (failure instanceof FileSystemException) {
            // its message is the bare path; say the cause (permission denied, no space left) beside it
            err.println("polebench: " + OutputFile.cause((FileSystemException) failure));
            return ExitCodes.INSTRUMENT_OR_IO;
        }
        if (failure instanceof IOException || failure instanceof UncheckedIOException) {
            err.println("polebench: " + failure.getMessage());
            return ExitCodes.INSTRUMENT_OR_IO;
        }
        // a defect in polebench itself: say so plainly, keep the detail for a bug report
        err.println("polebench: internal error (" + failure.getClass().getSimpleName() + ": "
                + failure.getMessage() + "); please report it with the command line and input files");
        return 70;
    }
}
