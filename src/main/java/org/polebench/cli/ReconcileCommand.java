package org.polebench.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.time.Instant;
import java.util.Optional;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.polebench.InputProblem;
import org.polebench.bench.Bench;
import org.polebench.bench.BenchReader;
import org.polebench.InputWarning;
import org.polebench.spread.StageAnalysis;
import org.polebench.spread.StagePrediction;
import org.polebench.spread.ToleranceSpread;
import org.polebench.circuit.StageReader;
import org.polebench.sweepfile.ImportedSweep;
import org.polebench.sweepfile.SweepWriter;
import org.polebench.reconcile.DecisionRule;
import org.polebench.reconcile.OverallResult;
import org.polebench.reconcile.ReconcileResult;
import org.polebench.reconcile.Reconciler;
import org.polebench.report.Identification;
import org.polebench.report.ReportStamp;
import org.polebench.report.ResultJson;
import org.polebench.report.RunDetails;
import org.polebench.report.TestReportWriter;
import org.polebench.report.ReconcileText;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code polebench reconcile}: a stage as designed against a sweep of the board as built. */
@Command(name = "reconcile", mixinStandardHelpOptions = true,
        description = {"Predicts the stage, fits the sweep and sets them side by side; splits the corner error "
                + "among the capacitors; back-solves every low-band capacitor, each transistor's bias current, "
                + "each bipolar transistor's beta (device spread) and a flat gain calibration on the stage's own "
                + "model; ranks the fault hypotheses by evidence (a capacitor, a resistor, a bias current or the "
                + "gain freed; pairs of them when no single one explains the sweep); says first whether the "
                + "stage explains the sweep at all; and decides the stage's limits under a stated decision rule.",
                "With no stage and sweep it runs on the bundled demo stage and a faulty demo board's sweep "
                        + "(invented demo data).",
                "A limit is decided only from a quantity the sweep itself determines: a corner outside the swept "
                        + "band, a value from the stage model alone or from a fit that does not describe the sweep "
                        + "leaves its limit not decided, and the result is then incomplete, never a pass.",
                "Exit code 0 when the verdict passes, 1 when it fails, 4 when it is incomplete."},
        footer = {"", "Example:", "  polebench reconcile --stage my.stage.yaml --sweep board-12.csv --decision-rule guarded",
                "  polebench reconcile --stage my.stage.yaml --sweep board-12.csv --operator \"A. Tester\" --report board-12-report"})
final class ReconcileCommand implements Callable<Integer> {
    /** The faulty demo board's sweep, made by the board synthesizer (invented demo data). */
    static final String DEMO_SWEEP = "geophone-gf2-board-0417.sweep.csv";

    @Spec
    CommandSpec spec;

    @Option(names = "--stage", paramLabel = "S", description = "the stage file (*.stage.yaml)")
    Path stage;

    @Option(names = "--bench", paramLabel = "FILE",
            description = "the bench file (*.bench.yaml) the sweep was measured on: its generator resistance and "
                    + "channel loads are part of the model, its AC couplings part of the reading (a corner 'unknown' "
                    + "is estimated), and the limits are decided on the board's own response")
    Path benchFile;

    @Option(names = "--sweep", paramLabel = "W", arity = "1..*", description = "the sweep file: CSV or other table, "
            + "or a serial log; or a folder or list of scope waveform records, one per frequency")
    List<Path> sweep;

    @Mixin
    SweepLayoutOption layout = new SweepLayoutOption();

    @Option(names = "--decision-rule", paramLabel = "RULE", defaultValue = "simple",
            description = "simple (default) or guarded: pass only inside each limit by the expanded uncertainty U "
                    + "(ILAC-G8:09/2019)")
    String rule;

    @Option(names = "--json", description = "print one JSON object instead of the summary (the report's result.json)")
    boolean json;

    @Option(names = "--report", paramLabel = "DIR",
            description = "also write a test report into DIR: report.html, result.json, capacitors.csv and the charts "
                    + "as SVG; a folder that already holds a report is refused without --force")
    Path report;

    @Option(names = "--force", description = "with --report: replace an earlier report in DIR")
    boolean force;

    @Option(names = "--png", description = "with --report: also write each chart as PNG")
    boolean png;

    @Option(names = "--operator", paramLabel = "NAME", description = "who ran the test, for the report")
    String operator;

    @Mixin
    IdentificationOptions identification = new IdentificationOptions();

    @Option(names = "--board", paramLabel = "ID",
            description = "the board's id or serial number, for the report (default: the sweep's own, if it names one)")
    String board;

    @Option(names = "--samples", paramLabel = "N", defaultValue = "1000",
            description = "boards drawn for the predicted corner's tolerance spread (default ${DEFAULT-VALUE})")
    int samples;

    @Option(names = "--seed", paramLabel = "SEED", defaultValue = "" + ToleranceSpread.DEFAULT_SEED,
            description = "random seed of the tolerance spread (default ${DEFAULT-VALUE})")
    long seed;

    @Override
    public Integer call() throws InputProblem, IOException {
        if ((stage == null) != (sweep == null)) {
            throw new InputProblem(null, 0, "reconcile needs a stage and a sweep, or neither (for the demo)",
                    stage == null ? "add --stage with the board's stage file" : "add --sweep with the board's sweep");
        }
        if (samples < 20) {
            throw new InputProblem(null, 0, "--samples " + samples + " is too few for a tolerance spread",
                    "use at least 20");
        }
        CountLimits.samples(samples);
        DecisionRule decisionRule = decisionRule(rule);
        if (report == null && (force || png)) {
            throw new InputProblem(null, 0, (force ? "--force" : "--png") + " only applies to --report",
                    "add --report DIR, or leave the option out");
        }
        Identification identified = identification.read();
        Path stageFile = stage != null ? stage : BundledSamples.locate(BundledSamples.DEMO_STAGE);
        List<Path> sweepFiles = sweep != null ? sweep : List.of(BundledSamples.locate(DEMO_SWEEP));
        Path sweepFile = sweepFiles.get(0);
        StagePrediction predicted = new StageAnalysis().withSpread(new ToleranceSpread(samples, seed))
                .analyse(new StageReader().read(stageFile), new SpreadProgressLine(spec.commandLine().getErr()));
        // the bundled demo sweep is canonical: no need to sniff its layout
        ImportedSweep imported = sweep == null && layout.isAuto()
                ? layout.read(sweepFile, SweepWriter.CANONICAL) : layout.read(sweepFiles);
        Optional<Bench> bench = benchFile != null ? Optional.of(new BenchReader().read(benchFile)) : Optional.empty();
        ReconcileResult result = new Reconciler().reconcile(predicted, imported.sweep(), decisionRule, bench);
        // the result document (with its Bode curves and their tolerance band) only for --json
        // and --report: the summary does not need it, and it costs as much as the reconcile
        ObjectNode root = null;
        if (json || report != null) {
            RunDetails run = RunDetails.of(stageFile, sweepFile, imported.profileName(), imported.warnings(),
                    Optional.ofNullable(operator), Optional.ofNullable(board), samples, seed)
                    .with(IdentificationOptions.withEquipment(
                            IdentificationOptions.withRecordedLevel(identified, imported.sweep().source().notes()),
                            bench, imported.sweep().source().instrument()));
            root = new ResultJson().of(result, run);
        }
        var out = spec.commandLine().getOut();
        if (json) {
            out.print(new ResultJson().text(root));
        } else {
            out.println("Stage file: " + stageFile);
            out.println("Sweep file: " + SweepLayoutOption.label(sweepFiles) + " (profile " + imported.profileName() + ")");
            for (InputWarning warning : predicted.warnings()) {
                out.println("stage warning: " + warning.describe());
            }
            for (InputWarning warning : imported.warnings()) {
                out.println("import warning: " + warning.describe());
            }
            new ReconcileText().write(result, out);
        }
        if (report != null) {
            ReportStamp stamp = new TestReportWriter().write(root, report, force, png, Instant.now());
            (json ? spec.commandLine().getErr() : out).println("Test report " + stamp.reportId() + " written to "
                    + report.resolve(TestReportWriter.HTML));
        }
        return exitCode(result.conformity().verdict().overall());
    }

    /** @return 0 for a pass, 1 for a fail, 4 for an incomplete verdict (issue 11) */
    static int exitCode(OverallResult overall) {
        switch (overall) {
            case PASS:
                return ExitCodes.OK;
            case FAIL:
                return ExitCodes.VERDICT_FAILED;
            case INCOMPLETE:
                return ExitCodes.INCOMPLETE;
            default:
                throw new IllegalStateException("no exit code for " + overall);
        }
    }

    private static DecisionRule decisionRule(String text) throws InputProblem {
        switch (text.toLowerCase(Locale.ROOT)) {
            case "simple":
                return DecisionRule.SIMPLE;
            case "guarded":
                return DecisionRule.GUARDED;
            default:
                throw new InputProblem(null, 0, "--decision-rule " + text + " is not a rule polebench knows",
                        "use simple or guarded");
        }
    }
}
