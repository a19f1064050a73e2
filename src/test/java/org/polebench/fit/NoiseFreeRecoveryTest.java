package org.polebench.fit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Comparator;
import java.util.List;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;

class NoiseFreeRecoveryTest {

    private static FitResult fit(KnownResponse truth, double lowHz, double highHz, int n) throws InputProblem {
        return new SweepFitter(FitSettings.defaults()).fit(truth.sweep(KnownResponse.logSpaced(lowHz, highHz, n), true));
    }

    private static List<FittedRoot> fitted(List<FittedRoot> roots) {
        return roots.stream().filter(r -> r.status() == RootStatus.FITTED)
                .sorted(Comparator.comparingDouble(FittedRoot::magnitudeHz).thenComparingDouble(FittedRoot::imaginaryHz))
                .collect(Collectors.toList());
    }

    // synthetic sweep from a known first-order high-pass (one coupling capacitor): truth by construction.
    // 1e-6 relative: the tolerance the issue sets; LM stops at 1e-13 relative cost change.
    @Test
    void recoversOneCouplingPole() throws InputProblem {
        KnownResponse truth = new KnownResponse(10, 1, new double[0][], KnownResponse.real(-15.9), Double.NaN);
        FitResult result = fit(truth, 1, 20_000, 60);
        assertEquals(1, result.structure().lowBandPoles());
        assertEquals(1, result.structure().dcZeros());
        assertEquals(-15.9, result.poles().get(0).realHz(), 1e-6 * 15.9);
        assertEquals(20, result.midbandGainDb().value(), 1e-6 * 20);
    }


    // two coupling capacitors: H = K·s²/((s − p1)(s − p2)); truth by construction
    @Test
    void recoversTwoCouplingPoles() throws InputProblem {
        KnownResponse truth = new KnownResponse(-31.6, 2, new double[0][], KnownResponse.real(-8, -45), Double.NaN);
        FitResult result = fit(truth, 1, 20_000, 80);
        assertRecovered(truth, result);
        assertTrue(result.inverting());
    }

    // common-emitter stage: two coupling zeros at DC plus the bypass zero; three poles
    @Test
    void recoversThirdOrderStage() throws InputProblem {
        KnownResponse truth = new KnownResponse(42, 2, KnownResponse.real(-4.2), KnownResponse.real(-3, -16, -180),
                Double.NaN);
        FitResult result = fit(truth, 1, 50_000, 100);
        assertRecovered(truth, result);
    }

    // a bypassed emitter alone: one finite zero below one pole, no DC zero (a shelf)
    @Test
    void recoversBypassedEmitterPoleZeroPair() throws InputProblem {
        KnownResponse truth = new KnownResponse(20, 0, KnownResponse.real(-9), KnownResponse.real(-160), Double.NaN);
        FitResult result = fit(truth, 1, 20_000, 60);
        assertRecovered(truth, result);
    }

    // two poles within a factor of 2 (40 Hz and 70 Hz) with two DC zeros
    @Test
    void recoversTwoPolesWithinAFactorOfTwo() throws InputProblem {
        KnownResponse truth = new KnownResponse(5, 2, new double[0][], KnownResponse.real(-40, -70), Double.NaN);
        FitResult result = fit(truth, 2, 20_000, 80);
        assertRecovered(truth, result);
    }

    // an underdamped pair (ζ = 0.3, ω0 = 2π·50 Hz) with two DC zeros: the data demand a complex pair
    @Test
    void recoversAComplexPolePair() throws InputProblem {
        double zeta = 0.3;
        double w0 = 50;
        double[][] poles = {{-zeta * w0, w0 * Math.sqrt(1 - zeta * zeta)}, {-zeta * w0, -w0 * Math.sqrt(1 - zeta * zeta)}};
        KnownResponse truth = new KnownResponse(3, 2, new double[0][], poles, Double.NaN);
        FitResult result = fit(truth, 2, 20_000, 80);
        assertRecovered(truth, result);
    }

    private static void assertRecovered(KnownResponse truth, FitResult result) {
        List<FittedRoot> poles = fitted(result.poles());
        assertEquals(truth.polesHz.length, poles.size(), "pole count");
        double[][] expected = truth.polesHz.clone();
        java.util.Arrays.sort(expected, Comparator.<double[]>comparingDouble(r -> Math.hypot(r[0], r[1]))
                .thenComparingDouble(r -> r[1]));
        for (int i = 0; i < poles.size(); i++) {
            double scale = Math.hypot(expected[i][0], expected[i][1]);
            assertEquals(expected[i][0], poles.get(i).realHz(), 1e-6 * scale, "pole re " + i);
            assertEquals(expected[i][1], poles.get(i).imaginaryHz(), 1e-6 * scale, "pole im " + i);
        }
        List<FittedRoot> zeros = fitted(result.zeros());
        assertEquals(truth.zerosHz.length, zeros.size(), "finite zero count");
        for (int i = 0; i < zeros.size(); i++) {
            assertEquals(truth.zerosHz[i][0], zeros.get(i).realHz(), 1e-6 * Math.abs(truth.zerosHz[i][0]), "zero " + i);
        }
        assertEquals(truth.dcZeros, result.structure().dcZeros(), "DC zeros");
        double gainDb = 20 * Math.log10(Math.abs(truth.gain));
        assertEquals(gainDb, result.midbandGainDb().value(), 1e-6 * Math.abs(gainDb) + 1e-9);
        assertEquals(truth.gain < 0, result.inverting());
    }

}
