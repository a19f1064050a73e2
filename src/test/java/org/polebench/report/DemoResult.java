package org.polebench.report;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.polebench.spread.StageAnalysis;
import org.polebench.spread.StagePrediction;
import org.polebench.spread.ToleranceSpread;
import org.polebench.circuit.StageReader;
import org.polebench.sweepfile.ImportedSweep;
import org.polebench.profile.ProfileLibrary;
import org.polebench.sweep.Sweep;
import org.polebench.sweepfile.SweepReader;
import org.polebench.reconcile.DecisionRule;
import org.polebench.reconcile.ReconcileResult;
import org.polebench.reconcile.Reconciler;

/**
 * The bundled demo stage against the bundled faulty demo board's sweep (invented demo data; the
 * sweep's notes say how it was synthesized: C2 fitted as 220 nF), reconciled end to end as the
 * CLI does, with a small spread so the tests stay quick.
 */
final class DemoResult {
    static final Path STAGE = Path.of("sample-measurements", "geophone-two-stage.stage.yaml");
    static final Path SWEEP = Path.of("sample-measurements", "geophone-gf2-board-0417.sweep.csv");
    static final int SAMPLES = 200;

    private DemoResult() {
    }

    /** A fresh run each call: nothing is shared between the runs a test compares. */
    static ObjectNode run(Optional<String> operator) throws Exception {
        StagePrediction predicted = new StageAnalysis()
                .withSpread(new ToleranceSpread(SAMPLES, ToleranceSpread.DEFAULT_SEED))
                .analyse(new StageReader().read(STAGE));
        ImportedSweep imported = new SweepReader(ProfileLibrary.standard(Path.of(""))).read(SWEEP, SweepReader.AUTO);
        ReconcileResult result = new Reconciler().reconcile(predicted, imported.sweep(), DecisionRule.SIMPLE);
        RunDetails run = RunDetails.of(STAGE, SWEEP, imported.profileName(), imported.warnings(), operator,
                Optional.empty(), SAMPLES, ToleranceSpread.DEFAULT_SEED);
        return new ResultJson().of(result, run);
    }

    /**
     * Any sweep against any stage file, reconciled as the CLI does with the same small spread: for
     * the cases the bundled demo does not cover (a sweep the stage does not explain, a resistor
     * fault).
     *
     * @param sweepName the name the result gives the sweep's file (a synthesized sweep has none)
     */
    static ObjectNode reconcile(Path stageFile, Sweep sweep, Path sweepName) throws Exception {
        StagePrediction predicted = new StageAnalysis()
                .withSpread(new ToleranceSpread(SAMPLES, ToleranceSpread.DEFAULT_SEED))
                .analyse(new StageReader().read(stageFile));
        ReconcileResult result = new Reconciler().reconcile(predicted, sweep, DecisionRule.SIMPLE);
        RunDetails run = RunDetails.of(stageFile, sweepName, "canonical", List.of(), Optional.of("A. Tester"),
                Optional.empty(), SAMPLES, ToleranceSpread.DEFAULT_SEED);
        return new ResultJson().of(result, run);
    }

    /** The bundled demo board's sweep, as read for {@link #run}. */
    static Sweep demoSweep() throws Exception {
        return new SweepReader(ProfileLibrary.standard(Path.of(""))).read(SWEEP, SweepReader.AUTO).sweep();
    }

    /** One run shared by the tests that only read it (initialised once, never changed). */
    static ObjectNode shared() {
        return Holder.ROOT.deepCopy();
    }

    private static final class Holder {
        static final ObjectNode ROOT;

        static {
            try {
                ROOT = run(Optional.of("A. Tester"));
            } catch (Exception e) {
                throw new IllegalStateException("the demo reconcile failed", e);
            }
        }
    }
}
