package org.polebench.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.OptionalDouble;
import java.util.Random;
import java.util.stream.Collectors;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.InputWarning;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

class FitScenarioTest {
    // a common-emitter stage: two coupling zeros at DC, a bypass zero, three poles (synthetic truth)
    private static final KnownResponse STAGE = new KnownResponse(42, 2, KnownResponse.real(-4.2),
            KnownResponse.real(-3, -16, -180), Double.NaN);

    private static List<Double> fittedPolesHz(FitResult result) {
        return result.poles().stream().filter(r -> r.status() == RootStatus.FITTED).map(FittedRoot::magnitudeHz)
                .sorted().collect(Collectors.toList());
    }

    private static boolean warns(FitResult result, String words) {
        return result.warnings().stream().map(InputWarning::message).anyMatch(m -> m.contains(words));
    }

    // synthetic truth; a magnitude-only sweep of a minimum-phase stage determines it (Bode's
    // gain–phase relation), so noise-free data recover it; 1e-6 relative as in the issue
    @Test
    void magnitudeOnlySweepRecoversAMinimumPhaseStage() throws InputProblem {
        Sweep sweep = STAGE.sweep(KnownResponse.logSpaced(1, 50_000, 100), false);
        FitResult result = new SweepFitter(FitSettings.defaults()).fit(sweep);
        List<Double> poles = fittedPolesHz(result);
        assertEquals(List.of(3.0, 16.0, 180.0).size(), poles.size());
        assertEquals(3, poles.get(0), 3e-6);
        assertEquals(16, poles.get(1), 16e-6);
        assertEquals(180, poles.get(2), 180e-6);
        assertEquals(2, result.structure().dcZeros());
        assertEquals(20 * Math.log10(42), result.midbandGainDb().value(), 1e-6 * 32.5);
        assertTrue(result.quality().residualRmsDeg().isEmpty());
        assertTrue(warns(result, "magnitude-only"));
    }

    // an inverting stage (K < 0): phase near 180° at midband; the sign is free, the poles unchanged
    @Test
    void invertingStageKeepsItsPolesAndReportsTheSign() throws InputProblem {
        KnownResponse inverted = new KnownResponse(-42, 2, KnownResponse.real(-4.2), KnownResponse.real(-3, -16, -180),
                Double.NaN);
        FitResult result = new SweepFitter(FitSettings.defaults())
                .fit(inverted.noisySweep(KnownResponse.logSpaced(1, 50_000, 100), 0.05, 0.5, new Random(7), true));
        assertTrue(result.inverting());
        assertTrue(result.model().midbandGain() < 0);
        List<Double> poles = fittedPolesHz(result);
        assertEquals(3, poles.size());
        // within 4 standard uncertainties of the truth: a 1-in-15000 miss for a normal estimate
        List<FittedRoot> sorted = result.poles().stream().sorted(Comparator.comparingDouble(FittedRoot::magnitudeHz))
                .collect(Collectors.toList());
        double[] truth = {3, 16, 180};
        for (int i = 0; i < 3; i++) {
            assertEquals(truth[i], sorted.get(i).magnitudeHz(), 4 * sorted.get(i).uMagnitudeHz());
        }
    }

    /** The stage with noise (seed 11) and points 17, 45 and 80 spoiled by +3 dB and −20°. */
    private static Sweep spoiledSweep() {
        Sweep clean = STAGE.noisySweep(KnownResponse.logSpaced(1, 50_000, 100), 0.05, 0.5, new Random(11), true);
        List<SweepPoint> points = new ArrayList<>(clean.points());
        for (int i : new int[]{17, 45, 80}) {
            SweepPoint p = points.get(i);
            points.set(i, new SweepPoint(p.frequencyHz(), p.gainDb() + 3, OptionalDouble.of(p.phaseDeg().getAsDouble() - 20),
                    p.gainUncertaintyDb(), p.phaseUncertaintyDeg()));
        }
        return new Sweep(clean.source(), points);
    }

    // three points spoiled by +3 dB and −20° (a relay click, a range change): a synthetic fault
    // placed by construction; the screen must drop exactly those and the fit must stay on truth
    @Test
    void threeOutliersAreDroppedAndReported() throws InputProblem {
        FitResult result = new SweepFitter(FitSettings.defaults()).fit(spoiledSweep());
        assertEquals(List.of(17, 45, 80),
                result.droppedPoints().stream().map(DroppedPoint::sweepIndex).sorted().collect(Collectors.toList()));
        assertEquals(97, result.quality().pointsUsed());
        assertTrue(warns(result, "dropped as an outlier"));
        assertEquals(UncertaintyBasis.STATED, result.quality().basis());
        List<FittedRoot> sorted = result.poles().stream().sorted(Comparator.comparingDouble(FittedRoot::magnitudeHz))
                .collect(Collectors.toList());
        double[] truth = {3, 16, 180};
        assertEquals(3, sorted.size());
        for (int i = 0; i < 3; i++) {
            // 4 u: as above
            assertEquals(truth[i], sorted.get(i).magnitudeHz(), 4 * sorted.get(i).uMagnitudeHz());
        }
    }

    // without the screen the same faults pull the fit: the check above is not vacuous
    @Test
    void withoutTheScreenOutliersInflateTheResiduals() throws InputProblem {
        FitResult result = new SweepFitter(FitSettings.defaults().withLoss(RobustLoss.NONE)).fit(spoiledSweep());
        assertTrue(result.droppedPoints().isEmpty());
        // 3 dB on 3 of 100 points alone gives an RMS of 3·√(3/100) = 0.52 dB, ten times the noise
        assertTrue(result.quality().residualRmsDb() > 0.3, "rms " + result.quality().residualRmsDb());
    }

    // one coupling pole at 2 Hz, swept from 100 Hz: the data are flat to 0.0017 dB, below the
    // noise, so no pole may be invented and no corner quoted (issue 4: "flagged, not invented")
    @Test
    void cornerFarBelowTheBandIsFlaggedNotInvented() throws InputProblem {
        KnownResponse truth = new KnownResponse(10, 1, new double[0][], KnownResponse.real(-2), Double.NaN);
        FitResult result = new SweepFitter(FitSettings.defaults())
                .fit(truth.noisySweep(KnownResponse.logSpaced(100, 20_000, 60), 0.05, 0.5, new Random(3), true));
        assertTrue(result.lowerCornerModelHz().isEmpty());
        assertTrue(result.lowerCornerDataHz().isEmpty());
        assertTrue(result.poles().stream().noneMatch(r -> r.status() == RootStatus.FITTED
                && r.magnitudeHz() < 100 / 10.0));
        assertTrue(warns(result, "below the swept band") || warns(result, "unidentifiable"));
    }

    // a pole far below the band forced into the model (pole count fixed) is flagged, not quoted
    @Test
    void forcedPoleFarBelowTheBandIsUnidentifiable() throws InputProblem {
        KnownResponse truth = new KnownResponse(10, 1, KnownResponse.real(-1.5), KnownResponse.real(-3, -400), Double.NaN);
        FitResult result = new SweepFitter(FitSettings.defaults().withPoleCount(2).withDcZeros(1))
                .fit(truth.sweep(KnownResponse.logSpaced(50, 20_000, 80), true));
        List<FittedRoot> flagged = result.poles().stream().filter(r -> r.status() == RootStatus.UNIDENTIFIABLE)
                .collect(Collectors.toList());
        assertEquals(1, flagged.size());
        assertTrue(flagged.get(0).magnitudeHz() < 5);
        assertTrue(warns(result, "unidentifiable"));
        assertEquals(400, fittedPolesHz(result).get(0), 400e-6);
    }

    // two coupling poles and a high-band pole at 30 kHz, swept to 200 kHz: synthetic truth
    @Test
    void highBandPoleIsDetectedAndFitted() throws InputProblem {
        KnownResponse truth = new KnownResponse(20, 2, new double[0][], KnownResponse.real(-8, -45), 30_000);
        FitResult result = new SweepFitter(FitSettings.defaults())
                .fit(truth.sweep(KnownResponse.logSpaced(1, 200_000, 120), true));
        assertTrue(result.structure().highBandPole());
        assertEquals(2, result.structure().lowBandPoles());
        FittedRoot high = result.poles().get(result.poles().size() - 1);
        assertEquals("ph", high.label());
        assertEquals(30_000, high.magnitudeHz(), 30_000 * 1e-6);
        assertEquals(List.of(8.0, 45.0, 30_000.0).size(), fittedPolesHz(result).size());
        assertEquals(8, fittedPolesHz(result).get(0), 8e-6);
        assertEquals(45, fittedPolesHz(result).get(1), 45e-6);
        // the assembled model evaluates as the independently written truth does, inside and
        // beyond the sweep (1e-6 relative in |H|, 1e-6 rad in phase: the fit's own accuracy)
        for (double f : new double[]{0.5, 3, 45, 1_000, 30_000, 500_000}) {
            double[] h = truth.at(f);
            Complex fitted = result.model().responseAt(f);
            assertEquals(Math.hypot(h[0], h[1]), fitted.abs(), 1e-6 * fitted.abs(), "|H| at " + f);
            assertEquals(0, Math.IEEEremainder(Math.atan2(h[1], h[0]) - fitted.getArgument(), 2 * Math.PI), 1e-6,
                    "arg H at " + f);
        }
    }

    // the band keeps spoiled points out: the top decade is garbage (+10 dB), the band stops below it
    @Test
    void bandRestrictsTheFittedRange() throws InputProblem {
        double[] f = KnownResponse.logSpaced(1, 50_000, 100);
        List<SweepPoint> points = new ArrayList<>();
        for (SweepPoint p : STAGE.sweep(f, true).points()) {
            points.add(p.frequencyHz() > 5_000
                    ? SweepPoint.of(p.frequencyHz(), p.gainDb() + 10, p.phaseDeg().getAsDouble() - 90) : p);
        }
        FitResult result = new SweepFitter(FitSettings.defaults().withBand(new FitBand(1, 5_000)))
                .fit(new Sweep(Provenance.inMemory("synthetic, top decade spoiled"), points));
        long inside = java.util.Arrays.stream(f).filter(v -> v <= 5_000).count();
        assertEquals(inside, result.quality().pointsUsed());
        assertTrue(result.band().highHz() <= 5_000);
        assertTrue(result.droppedPoints().isEmpty());
        List<Double> poles = fittedPolesHz(result);
        assertEquals(3, poles.size());
        // noise-free inside the band: the 1e-6 relative
        assertEquals(180, poles.get(2), 180e-6);
    }

    // a band holding too few points is the user's input at fault: an InputProblem with a hint
    @Test
    void bandWithTooFewPointsIsAnInputProblem() {
        Sweep sweep = STAGE.sweep(KnownResponse.logSpaced(1, 50_000, 40), true);
        InputProblem problem = org.junit.jupiter.api.Assertions.assertThrows(InputProblem.class,
                () -> new SweepFitter(FitSettings.defaults().withBand(new FitBand(300, 310))).fit(sweep));
        assertTrue(problem.hint().contains("--band"));
    }

    // predicted poles 25 % off as the start (what reconcile passes) reach the same optimum
    @Test
    void predictedStartingPolesReachTheSameFit() throws InputProblem {
        Sweep sweep = STAGE.noisySweep(KnownResponse.logSpaced(1, 50_000, 100), 0.05, 0.5, new Random(5), true);
        FitResult free = new SweepFitter(FitSettings.defaults()).fit(sweep);
        List<Complex> predicted = List.of(new Complex(-2 * Math.PI * 3.75, 0), new Complex(-2 * Math.PI * 12, 0),
                new Complex(-2 * Math.PI * 225, 0));
        FitResult started = new SweepFitter(FitSettings.defaults().withStartPoles(predicted)).fit(sweep);
        List<Double> a = fittedPolesHz(free);
        List<Double> b = fittedPolesHz(started);
        assertEquals(a.size(), b.size());
        for (int i = 0; i < a.size(); i++) {
            // same least-squares optimum: agreement far inside the uncertainty (1e-6 relative)
            assertEquals(a.get(i), b.get(i), 1e-6 * a.get(i));
        }
    }

    // corners of H = K·s²/((s + a)(s + b)): |H|² = ½ gives ω² = [(a² + b²) + √((a² + b²)² + 4a²b²)]/2
    // (closed form, derived from the definition); the data corner of a dense noise-free sweep
    // agrees to the interpolation error of 400 points per decade (well under 1e-3)
    @Test
    void lowerCornersMatchTheClosedForm() throws InputProblem {
        double a = 8;
        double b = 45;
        KnownResponse truth = new KnownResponse(5, 2, new double[0][], KnownResponse.real(-a, -b), Double.NaN);
        double s = a * a + b * b;
        double expected = Math.sqrt((s + Math.sqrt(s * s + 4 * a * a * b * b)) / 2);
        FitResult result = new SweepFitter(FitSettings.defaults())
                .fit(truth.sweep(KnownResponse.logSpaced(1, 10_000, 1601), true));
        // 1e-9: Brent stops at 1e-14 in ln f; the fit is exact to about 1e-10
        assertEquals(expected, result.lowerCornerModelHz().orElseThrow().value(), 1e-9 * expected);
        assertEquals(expected, result.lowerCornerDataHz().orElseThrow().value(), 1e-3 * expected);
    }

    // a sweep without stated uncertainties: Type A scale from the residuals, Student's t for k
    @Test
    void unstatedUncertaintiesComeFromTheResiduals() throws InputProblem {
        Sweep sweep = STAGE.noisySweep(KnownResponse.logSpaced(1, 50_000, 30), 0.2, 2, new Random(9), false);
        FitResult result = new SweepFitter(FitSettings.defaults()).fit(sweep);
        assertEquals(UncertaintyBasis.FROM_RESIDUALS, result.quality().basis());
        int nu = result.quality().degreesOfFreedom();
        // t for ν = 55 at 95.45 %: 2.04 (GUM table G.2 lists 2.05 at ν = 50 and 2.03 at ν = 100)
        assertTrue(result.coverageFactor() > 2.02 && result.coverageFactor() < 2.06, "k " + result.coverageFactor()
                + " nu " + nu);
    }
}
