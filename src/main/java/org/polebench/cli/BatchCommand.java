package org.polebench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import java.util.regex.Pattern;
import java.util.regex.PatternSyntaxException;
import org.polebench.InputProblem;
import org.polebench.ledger.BatchListener;
import org.polebench.ledger.BatchRequest;
import org.polebench.ledger.BatchRunner;
import org.polebench.ledger.BatchTally;
import org.polebench.ledger.Ledger;
import org.polebench.ledger.LedgerLocation;
import org.polebench.ledger.ResultDocument;
import org.polebench.ledger.SweepFiles;
import org.polebench.lot.BoardOutcome.Outcome;
import org.polebench.reconcile.DecisionRule;
import org.polebench.report.BatchText;
import org.polebench.report.ReportCurves;
import org.polebench.report.ResultJson;
import org.polebench.report.RunDetails;
import org.polebench.spread.ToleranceSpread;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code polebench batch}: many sweeps of one stage reconciled in one run and recorded in the ledger. */
@Command(name = "batch", mixinStandardHelpOptions = true,
        description = {"Reconciles every sweep against one stage, several boards at once, records each board's test "
                + "in the ledger (an SQLite file, or PostgreSQL for many stations) and ends with the lot's counts "
                + "and yield.",
                "A folder stands for its files ending in .csv, .tsv, .txt, .log or .dat, each one board, and its "
                        + "sub-folders, each one board's scope waveform records. The board id is the sweep's own "
                        + "(# board:), else the file or sub-folder name without its endings; --board-pattern takes it "
                        + "from the name instead.",
                "A sweep the ledger already holds for this stage is counted, not reconciled again: a batch that "
                        + "was stopped resumes by being run again. A file that cannot be read or reconciled is "
                        + "recorded as an input problem and the batch goes on.",
                "Exit code 0 when every board passed, 1 when any failed, 2 when none failed but a file was bad "
                        + "(or the stage is), 4 when none failed but some were incomplete, 3 when the ledger fails."},
        footer = {"", "Example:",
                "  polebench batch --stage my.stage.yaml --lot 2026-W49 --station bench-2 --operator \"A. Tester\" sweeps/",
                "  polebench batch --stage my.stage.yaml --ledger jdbc:postgresql://testdb/line1 --lot L7 sweeps/"})
final class BatchCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Option(names = "--stage", paramLabel = "S", required = true, description = "the stage file (*.stage.yaml)")
    Path stage;

    @Mixin
    LedgerOption ledger = new LedgerOption();

    @Option(names = "--lot", paramLabel = "NAME", description = "the lot's name (default: the stage file's name)")
    String lot;

    @Option(names = "--station", paramLabel = "NAME", defaultValue = "", description = "the test station's name")
    String station;

    @Option(names = "--operator", paramLabel = "NAME", defaultValue = "", description = "who ran the tests")
    String operator;

    @Mixin
    SweepLayoutOption layout = new SweepLayoutOption();

    @Option(names = "--bench", paramLabel = "FILE", description = "the bench file (*.bench.yaml) the sweeps were measured on")
    Path benchFile;

    @Option(names = "--board-pattern", paramLabel = "REGEX",
            description = "take the board id from each file's name: the pattern's first group, or its whole match")
    String boardPattern;

    @Option(names = "--decision-rule", paramLabel = "RULE", defaultValue = "simple",
            description = "simple (default) or guarded (ILAC-G8:09/2019), as for reconcile")
    String rule;

    @Option(names = "--threads", paramLabel = "N",
            description = "boards reconciled at once (default: one per core)")
    Integer threads;

    @Parameters(paramLabel = "SWEEP|FOLDER", arity = "1..*",
            description = "sweep files, or folders of sweep files and of sub-folders of scope records")
    List<Path> sweeps;

    @Override
    public Integer call() throws InputProblem, IOException {
        DecisionRule decisionRule;
        switch (rule.toLowerCase(Locale.ROOT)) {
            case "simple":
                decisionRule = DecisionRule.SIMPLE;
                break;
            case "guarded":
                decisionRule = DecisionRule.GUARDED;
                break;
            default:
                throw new InputProblem(null, 0, "--decision-rule " + rule + " is not a rule polebench knows",
                        "use simple or guarded");
        }
        int workers = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        if (workers < 1) {
            throw new InputProblem(null, 0, "--threads " + workers + " is too few", "use 1 or more");
        }
        Optional<Pattern> pattern = Optional.empty();
        if (boardPattern != null) {
            try {
                pattern = Optional.of(Pattern.compile(boardPattern));
            } catch (PatternSyntaxException e) {
                throw new InputProblem(null, 0, "--board-pattern " + boardPattern + " is not a regular expression: "
                        + e.getDescription(), "write e.g. 'board-(\\d+)'");
            }
        }
        if (!layout.isAuto()) {
            // a profile that does not exist is the command line's fault, not every file's
            SweepLayoutOption.profiles().resolve(layout.profile);
        }
        LedgerLocation location = ledger.location();
        List<Path> files = new SweepFiles().expand(sweeps);
        String lotName = lot != null ? lot : stageName(stage);
        BatchRequest request = new BatchRequest(stage, Optional.ofNullable(benchFile), files, lotName, station,
                operator, layout.profile, SweepLayoutOption.profiles(), pattern, decisionRule,
                RunDetails.polebenchVersion(), workers);
        // one tolerance band for every board swept over the same band: the same bytes, drawn once
        ReportCurves curves = ReportCurves.sharingBands(ResultJson.bandSpread(BatchRunner.SPREAD_SAMPLES,
                ToleranceSpread.DEFAULT_SEED));
        ResultDocument document = (result, stageFile, sweepFile, imported, boardId) -> {
            RunDetails run = RunDetails.of(stageFile, sweepFile, imported.profileName(), imported.warnings(),
                    operator.isEmpty() ? Optional.empty() : Optional.of(operator), Optional.of(boardId),
                    BatchRunner.SPREAD_SAMPLES, ToleranceSpread.DEFAULT_SEED);
            ResultJson json = new ResultJson();
            return json.text(json.of(result, run, curves));
        };
        PrintWriter out = spec.commandLine().getOut();
        BatchTally tally;
        try (Ledger opened = Ledger.open(location)) {
            tally = new BatchRunner().run(request, opened, document,
                    new Progress(spec.commandLine().getErr(), System.console() != null));
        }
        out.print(new BatchText().summary(tally, lotName, location.toString()));
        if (tally.failed() > 0) {
            return ExitCodes.VERDICT_FAILED;
        }
        if (tally.inputProblems() > 0) {
            return ExitCodes.BAD_INPUT;
        }
        return tally.incomplete() > 0 ? ExitCodes.INCOMPLETE : ExitCodes.OK;
    }

    /** @return the stage file's name without {@code .stage.yaml} (or its last ending) */
    private static String stageName(Path stageFile) {
        String name = stageFile.getFileName().toString();
        if (name.endsWith(".stage.yaml")) {
            return name.substring(0, name.length() - ".stage.yaml".length());
        }
        int dot = name.lastIndexOf('.');
        return dot > 0 ? name.substring(0, dot) : name;
    }

    /**
     * The progress on the error stream: on a terminal one bar redrawn in place (at most ten
     * times a second, and once at the end); elsewhere a plain line per board, for logs.
     */
    private static final class Progress implements BatchListener {
        private static final long REDRAW_NANOS = 100_000_000L;
        private final PrintWriter err;
        private final boolean terminal;
        private final BatchText text = new BatchText();
        private long lastDrawn = Long.MIN_VALUE;

        Progress(PrintWriter err, boolean terminal) {
            this.err = err;
            this.terminal = terminal;
        }

        @Override
        public void started(int boards) {
            err.println("batch: " + boards + (boards == 1 ? " sweep" : " sweeps"));
            err.flush();
        }

        @Override
        public void boardDone(BatchTally tally, String boardId, Outcome outcome, boolean earlier) {
            if (!terminal) {
                err.println(text.boardLine(tally, boardId, outcome, earlier));
                err.flush();
                return;
            }
            long now = System.nanoTime();
            boolean last = tally.done() == tally.boards();
            if (last || lastDrawn == Long.MIN_VALUE || now - lastDrawn >= REDRAW_NANOS) {
                // carriage return and erase-line (ECMA-48 EL, CSI 2 K): the bar is redrawn in place
                err.print("\r\u001b[2K" + text.bar(tally));
                if (last) {
                    err.println();
                }
                err.flush();
                lastDrawn = now;
            }
        }
    }
}
