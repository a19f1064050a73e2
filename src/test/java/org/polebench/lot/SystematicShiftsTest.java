package org.polebench.lot;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.polebench.circuit.Stage;
import org.polebench.lot.BoardOutcome.Outcome;
import org.polebench.lot.BoardOutcome.PartFactor;

/**
 * Lots made up with known truth on the demo hydrophone stage's tolerances (C1 ±10 %, C2 ±20 %,
 * C3 −20 %/+80 %): each board's true ln-factor is drawn uniform in ln across the band, as
 * spread's tolerance draws are, and read with a stated u and Gaussian noise, seeds fixed.
 */
class SystematicShiftsTest {
    private static final Stage STAGE = TestLotStage.read();

    private static double uniform(SplittableRandom r, double lowFactor, double highFactor) {
        return Math.log(lowFactor) + (Math.log(highFactor) - Math.log(lowFactor)) * r.nextDouble();
    }

    private static PartFactor read(SplittableRandom r, String part, double trueLn, double u) {
        return new PartFactor(part, trueLn + u * r.nextGaussian(), u, true);
    }

    /** Boards of the stage within tolerance; {@code shiftedBoards} of them have C2 at ×{@code c2Factor}. */
    private static List<BoardOutcome> lot(long seed, int boards, int shiftedBoards, double c2Factor) {
        SplittableRandom r = new SplittableRandom(seed);
        List<BoardOutcome> out = new ArrayList<>();
        for (int b = 0; b < boards; b++) {
            double c2 = uniform(r, 0.8, 1.2) + (b < shiftedBoards ? Math.log(c2Factor) : 0);
            out.add(LotBoards.board(String.format(java.util.Locale.ROOT, "B%02d", b + 1), b + 1, Outcome.PASS, 30, 20,
                    read(r, "C1", uniform(r, 0.9, 1.1), 0.03), read(r, "C2", c2, 0.03),
                    read(r, "C3", uniform(r, 0.8, 1.8), 0.05)));
        }
        return out;
    }

    private static PartShift part(List<PartShift> parts, String name) {
        return parts.stream().filter(p -> p.part().equals(name)).findFirst().orElseThrow();
    }

    @Test
    void aPartReadingTwoThirdsOnFortySevenOfFiftyBoardsIsOneLotFindingNotFortySevenFaults() {
        List<PartShift> parts = SystematicShifts.of(lot(47, 50, 47, 0.68), STAGE);
        PartShift c2 = part(parts, "C2");

        assertEquals(PartShift.Finding.SYSTEMATIC, c2.finding());
        // the truth of the 47: ln 0.68 plus the mean of a uniform draw in [ln 0.8, ln 1.2],
        // (ln 0.8 + ln 1.2)/2; the estimate must hold it within 3u (and the 3 boards built
        // right either sit apart or pull it by at most 3/50 of 0.386)
        double truth = Math.log(0.68) + (Math.log(0.8) + Math.log(1.2)) / 2;
        double mu = c2.pooled().orElseThrow().mean();
        assertTrue(Math.abs(mu - truth) <= 3 * c2.pooled().get().uMean() + 3 / 50.0 * 0.386,
                "μ " + mu + " truth " + truth);
        assertTrue(c2.boardsPooled() >= 47, "pooled " + c2.boardsPooled());
        // no board of the 47 is a single-board fault, and the boards apart (if any) read within tolerance
        assertEquals(List.of(), c2.singleBoardFaults());
        assertTrue(c2.apart().stream().allMatch(a -> Integer.parseInt(a.boardId().substring(1)) > 47));
        assertEquals(PartShift.Finding.WITHIN_TOLERANCE, part(parts, "C1").finding());
        assertEquals(PartShift.Finding.WITHIN_TOLERANCE, part(parts, "C3").finding());
    }

    @Test
    void aHealthyLotHasNoSystematicFindingAndNoSingleBoardFault() {
        for (long seed = 1; seed <= 20; seed++) {
            List<PartShift> parts = SystematicShifts.of(lot(seed, 40, 0, 1), STAGE);
            for (PartShift p : parts) {
                // every true value lies within the band by construction: no lot finding can be true
                assertEquals(PartShift.Finding.WITHIN_TOLERANCE, p.finding(), p.part() + " seed " + seed);
                assertEquals(List.of(), p.singleBoardFaults(), p.part() + " seed " + seed);
            }
        }
    }

    @Test
    void aDecadeSlipOnOneBoardIsKeptApartAsASingleBoardFault() {
        List<BoardOutcome> boards = new ArrayList<>(lot(5, 40, 0, 1));
        SplittableRandom r = new SplittableRandom(9);
        // board 41 has C3 = 47 µF for 470 µF: ln 0.1, read with u = 0.05
        boards.add(LotBoards.board("B41", 41, Outcome.FAIL, 90, 20, read(r, "C1", 0, 0.03), read(r, "C2", 0, 0.03),
                new PartFactor("C3", Math.log(0.1), 0.05, true)));
        PartShift c3 = part(SystematicShifts.of(boards, STAGE), "C3");

        assertEquals(PartShift.Finding.WITHIN_TOLERANCE, c3.finding());
        assertEquals(List.of("B41"), c3.singleBoardFaults().stream().map(ApartBoard::boardId).toList());
        assertEquals(0.1, c3.singleBoardFaults().get(0).factor(), 1e-12);
        assertEquals(40, c3.boardsPooled());
    }

    @Test
    void unidentifiableReadingsCarryNoWeight() {
        // 30 boards whose C1 reading only echoes its prior (ln factor 0, u of a ±10 % band read as
        // rectangular, 0.2/√12 · … ≈ 0.058) and 2 that identify it at ×0.5: the echoes must not
        // outvote the two, nor shrink u towards the prior; two boards are too few for a lot
        // finding, so each is a fault of its own board (×0.5 ± 2·0.02 in ln lies outside ±10 %)
        List<BoardOutcome> boards = new ArrayList<>();
        for (int b = 0; b < 30; b++) {
            boards.add(LotBoards.board("E" + b, b, Outcome.PASS, 30, 20, new PartFactor("C1", 0, 0.058, false)));
        }
        boards.add(LotBoards.board("F1", 31, Outcome.FAIL, 30, 20, new PartFactor("C1", Math.log(0.5), 0.02, true)));
        boards.add(LotBoards.board("F2", 32, Outcome.FAIL, 30, 20, new PartFactor("C1", Math.log(0.5), 0.02, true)));
        PartShift c1 = part(SystematicShifts.of(boards, STAGE), "C1");

        assertEquals(32, c1.readings());
        assertEquals(2, c1.identifiable());
        assertEquals(PartShift.Finding.TOO_FEW_READINGS, c1.finding());
        assertEquals(List.of("F1", "F2"), c1.singleBoardFaults().stream().map(ApartBoard::boardId).toList());
        assertEquals(0.5, c1.singleBoardFaults().get(0).factor(), 1e-12);
        assertTrue(c1.pooled().isEmpty());
    }

    @Test
    void theToleranceBandComesFromTheStageFile() {
        // C3: −20 %/+80 % in the demo stage file; the gain: ±1 dB, the default calibration band
        double[] c3 = SystematicShifts.band(STAGE, "C3");
        assertEquals(Math.log(0.8), c3[0], 1e-12);
        assertEquals(Math.log(1.8), c3[1], 1e-12);
        double[] gain = SystematicShifts.band(STAGE, "gain");
        assertEquals(Math.log(10) / 20, gain[1], 1e-12);
        // β: the stage file's beta-tolerance: 50 %; the bias current, solved from its parts:
        // ±20 %, the back-solve's default band (docs/method.md, "The hypotheses")
        assertEquals(Math.log(0.5), SystematicShifts.band(STAGE, "Q1 beta")[0], 1e-12);
        assertEquals(Math.log(1.5), SystematicShifts.band(STAGE, "Q1 beta")[1], 1e-12);
        assertEquals(Math.log(0.8), SystematicShifts.band(STAGE, "Q1 bias")[0], 1e-9);
        assertEquals(Math.log(1.2), SystematicShifts.band(STAGE, "Q1 bias")[1], 1e-9);
        // a name the stage does not know: the point 0
        assertEquals(0, SystematicShifts.band(STAGE, "bench")[1]);
    }

    @Test
    void theLotNamesTheShiftedPartOnceAndAHealthyLotNamesNone() {
        // through LotAnalysis, as the lot command calls it (bands given: no Monte Carlo needed)
        PredictedBand none = new PredictedBand(Double.NaN, Double.NaN, Double.NaN, 0.9, 0, 0, 1);
        LotFindings shifted = LotAnalysis.of("demo-lot", lot(47, 50, 47, 0.68), STAGE, none, none, 1, 0);
        assertEquals(List.of("C2"), shifted.systematic().stream().map(PartShift::part).toList());
        assertEquals(0, shifted.parts().stream().mapToInt(p -> p.singleBoardFaults().size()).sum());
        LotFindings healthy = LotAnalysis.of("demo-lot", lot(3, 40, 0, 1), STAGE, none, none, 1, 0);
        assertEquals(List.of(), healthy.systematic());
    }
}
