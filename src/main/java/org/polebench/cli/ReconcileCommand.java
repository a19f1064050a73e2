package org.polebench.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.polebench.InputProblem;
import org.polebench.InputWarning;
import org.polebench.analysis.StageAnalysis;
import org.polebench.analysis.StagePrediction;
import org.polebench.analysis.ToleranceSpread;
import org.polebench.circuit.StageReader;
import org.polebench.measure.ImportedSweep;
import org.polebench.measure.ProfileLibrary;
import org.polebench.measure.SweepReader;
import org.polebench.measure.SweepWriter;
import org.polebench.reconcile.DecisionRule;
import org.polebench.reconcile.ReconcileResult;
import org.polebench.reconcile.Reconciler;
import org.polebench.report.ReconcileJson;
import org.polebench.report.ReconcileText;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code polebench reconcile}: a stage as designed against a sweep of the board as built. */
@Command(name = "reconcile", mixinStandardHelpOptions = true,
        description = {"Predicts the stage, fits the sweep and sets them side by side; splits the corner error "
                + "among the capacitors; back-solves every low-band capacitor, each transistor's bias current "
                + "and a flat gain calibration on the stage's own model; ranks the single-fault hypotheses by "
                + "evidence; and decides the stage's limits under a stated decision rule.",
                "With no stage and sweep it runs on the bundled demo stage and a faulty demo board's sweep "
                        + "(invented demo data).",
                "Exit code 1 when the verdict fails."},
        footer = {"", "Example:", "  polebench reconcile --stage my.stage.yaml --sweep board-12.csv --decision-rule guarded"})
final class ReconcileCommand implements Callable<Integer> {
    /** The faulty demo board's sweep, made by the board synthesizer (invented demo data). */
    static final String DEMO_SWEEP = "geophone-gf2-board-0417.sweep.csv";

    @Spec
    CommandSpec spec;

    @Option(names = "--stage", paramLabel = "S", description = "the stage file (*.stage.yaml)")
    Path stage;

    @Option(names = "--sweep", paramLabel = "W", description = "the sweep file: CSV or other table, or a serial log")
    Path sweep;

    @Option(names = "--profile", paramLabel = "P", defaultValue = SweepReader.AUTO,
            description = "profile name, path of a .yaml profile, or auto (default: sniff the layout)")
    String profile;

    @Option(names = "--decision-rule", paramLabel = "RULE", defaultValue = "simple",
            description = "simple (default) or guarded: pass only inside each limit by the expanded uncertainty U "
                    + "(ILAC-G8:09/2019)")
    String rule;

    @Option(names = "--json", description = "print one JSON object instead of the summary")
    boolean json;

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
        DecisionRule decisionRule = decisionRule(rule);
        Path stageFile = stage != null ? stage : BundledSamples.locate(BundledSamples.DEMO_STAGE);
        Path sweepFile = sweep != null ? sweep : BundledSamples.locate(DEMO_SWEEP);
        StagePrediction predicted = new StageAnalysis().withSpread(new ToleranceSpread(samples, seed))
                .analyse(new StageReader().read(stageFile));
        // the bundled demo sweep is canonical: no need to sniff its layout
        String profileName = sweep == null && profile.equals(SweepReader.AUTO) ? SweepWriter.CANONICAL : profile;
        ImportedSweep imported = new SweepReader(ProfileLibrary.standard(Path.of(""))).read(sweepFile, profileName);
        ReconcileResult result = new Reconciler().reconcile(predicted, imported.sweep(), decisionRule);
        if (json) {
            var root = new ReconcileJson().of(result);
            root.put("stage_file", stageFile.toString());
            root.put("sweep_file", sweepFile.toString());
            root.put("profile", imported.profileName());
            var warnings = root.putArray("import_warnings");
            for (InputWarning warning : imported.warnings()) {
                warnings.add(warning.describe());
            }
            new JsonOutput().print(root, spec.commandLine().getOut());
        } else {
            var out = spec.commandLine().getOut();
            out.println("Stage file: " + stageFile);
            out.println("Sweep file: " + sweepFile + " (profile " + imported.profileName() + ")");
            for (InputWarning warning : imported.warnings()) {
                out.println("import warning: " + warning.describe());
            }
            new ReconcileText().write(result, out);
        }
        return result.conformity().verdict().passed() || result.conformity().verdict().nothingToCheck()
                ? ExitCodes.OK : ExitCodes.VERDICT_FAILED;
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
