package org.polebench.lot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.lot.BoardOutcome.Outcome;

class LotAnalysisTest {
    @Test
    void theDemoStagesLotIsReadAgainstItsPredictedBandAndItsOneSidedLimit() throws InputProblem {
        // the demo stage gives only lower-corner-max: 40 Hz, so the corner's Cpk is one-sided
        // (Cpu) and the gain has no Cpk at all
        List<BoardOutcome> boards = new ArrayList<>();
        for (int b = 0; b < 30; b++) {
            boards.add(LotBoards.board("B" + b, b, Outcome.PASS, 30 + (b % 3), 19.5 + 0.1 * (b % 2)));
        }
        LotFindings lot = LotAnalysis.of("demo-lot", boards, TestLotStage.read(), 3, 200);

        QuantityFindings corner = lot.quantity(LotQuantity.LOWER_CORNER);
        PredictedBand band = corner.predicted();
        // the nominal corner lies inside the 5–95 % band of the draws (the band is drawn about it)
        assertTrue(band.low() < band.nominal() && band.nominal() < band.high(), band.toString());
        assertEquals(200, band.drawn());
        Capability cpk = corner.capability().orElseThrow();
        assertTrue(cpk.oneSided());
        assertEquals(40, cpk.upperLimit().getAsDouble());
        // values 30, 31, 32 repeating: mean 31, moving ranges 1, 1, 2 repeating (29 of them:
        // ten 1-1-2 cycles less the last 2 → 9·4 + 1 + 1 = 38, MR̄ = 38/29); Cpu = 9/(3·MR̄/1.128)
        assertEquals(38 / 29.0, corner.chart().orElseThrow().averageMovingRange(), 1e-12);
        assertEquals(9 / (3 * 38 / 29.0 / 1.128), cpk.cpk(), 1e-12);
        assertTrue(lot.quantity(LotQuantity.MIDBAND_GAIN).capability().isEmpty());
        PredictedBand gain = lot.quantity(LotQuantity.MIDBAND_GAIN).predicted();
        assertTrue(gain.low() <= gain.nominal() + 1e-9 && gain.nominal() <= gain.high() + 1e-9, gain.toString());
    }
}
