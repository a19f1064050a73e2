package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.polebench.circuit.StageReader;
import org.polebench.profile.ProfileLibrary;
import org.polebench.reconcile.DecisionRule;
import org.polebench.reconcile.ReconcileResult;
import org.polebench.reconcile.Reconciler;
import org.polebench.spread.StageAnalysis;
import org.polebench.spread.StagePrediction;
import org.polebench.spread.ToleranceSpread;
import org.polebench.sweepfile.SweepReader;

/** The tolerance band a batch shares between boards is the one each board would draw alone. */
class ReportCurvesSharingTest {
    @Test
    void aSharedBandIsTheBandDrawnAlone() throws Exception {
        StagePrediction predicted = new StageAnalysis()
                .withSpread(new ToleranceSpread(DemoResult.SAMPLES, ToleranceSpread.DEFAULT_SEED))
                .analyse(new StageReader().read(DemoResult.STAGE));
        ReconcileResult result = new Reconciler().reconcile(predicted,
                new SweepReader(ProfileLibrary.standard(Path.of(""))).read(DemoResult.SWEEP, SweepReader.AUTO).sweep(),
                DecisionRule.SIMPLE);
        ReportCurves shared = ReportCurves.sharingBands(ResultJson.bandSpread(DemoResult.SAMPLES,
                ToleranceSpread.DEFAULT_SEED));
        // the reference: a band drawn by a fresh ReportCurves, as reconcile --report draws it;
        // the seeded draws make the shared one (first drawn, then reused) equal to the last bit
        String alone = new ReportCurves(ResultJson.bandSpread(DemoResult.SAMPLES, ToleranceSpread.DEFAULT_SEED))
                .of(result).toString();
        assertEquals(alone, shared.of(result).toString());
        assertEquals(alone, shared.of(result).toString());
    }
}
