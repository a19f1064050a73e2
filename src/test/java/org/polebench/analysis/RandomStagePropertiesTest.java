package org.polebench.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;

import java.util.List;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.LongRange;
import org.polebench.circuit.SmallSignalNetwork;

/** Exact identities and derivative cross-checks over random stages (fixed jqwik seeds). */
class RandomStagePropertiesTest {
    // central differences with h = 1e-4 in ln C: truncation h²/6·(third derivative, O(1)) ≈ 2e-9,
    // plus the corner's 1e-12 accuracy in ln ω divided by 2h ≈ 5e-9: 1e-6 leaves a wide margin
    private static final double H = 1e-4;
    private static final double DERIVATIVE_TOLERANCE = 1e-6;

    private final StagePredictor predictor = new StagePredictor();

    private static double logUniform(Random random, double low, double high) {
        return low * Math.pow(high / low, random.nextDouble());
    }

    /** src —RS— n0 —C1— m1 —R1s— n1 (R1p to ground) —C2— … ; output at the last node. */
    static SmallSignalNetwork rcLadder(int sections, long seed) {
        Random random = new Random(seed);
        NetworkBuilder b = new NetworkBuilder().resistor("RS", "src", "n0", logUniform(random, 10, 10e3));
        for (int i = 1; i <= sections; i++) {
            b.capacitor("C" + i, "n" + (i - 1), "m" + i, logUniform(random, 10e-9, 100e-6))
                    .resistor("R" + i + "s", "m" + i, "n" + i, logUniform(random, 10, 10e3))
                    .resistor("R" + i + "p", "n" + i, "gnd", logUniform(random, 1e3, 1e6));
        }
        return b.build("src", "n" + sections);
    }

    static Stages.CommonEmitter randomCommonEmitter(long seed) {
        Random random = new Random(seed);
        double rpi = logUniform(random, 1e3, 20e3);
        double beta = logUniform(random, 50, 400);
        return new Stages.CommonEmitter(logUniform(random, 50, 10e3), logUniform(random, 5e3, 200e3), rpi, beta / rpi,
                logUniform(random, 20e3, 500e3), logUniform(random, 1e3, 20e3), logUniform(random, 1e3, 100e3),
                logUniform(random, 100, 5e3), logUniform(random, 100e-9, 10e-6), logUniform(random, 1e-6, 100e-6),
                logUniform(random, 10e-6, 1e-3));
    }

    @Property(tries = 200, seed = "20261201")
    void rcLaddersKeepTheTraceAndDeterminantIdentities(@ForAll @IntRange(min = 1, max = 6) int sections,
                                                      @ForAll @LongRange long seed) {
        Prediction p = assertInstanceOf(Prediction.class, predictor.predict(rcLadder(sections, seed)));
        Identities.assertLowBandIdentities(p.lowBand(), p.poles());
    }

    @Property(tries = 200, seed = "20261202")
    void commonEmitterStagesKeepTheTraceAndDeterminantIdentities(@ForAll @LongRange long seed) {
        Prediction p = assertInstanceOf(Prediction.class, predictor.predict(randomCommonEmitter(seed).network()));
        Identities.assertLowBandIdentities(p.lowBand(), p.poles());
    }

    @Property(tries = 60, seed = "20261203")
    void cornerSensitivityMatchesCentralDifferences(@ForAll @LongRange long seed, @ForAll boolean ladder) {
        SmallSignalNetwork network = ladder ? rcLadder(4, seed) : randomCommonEmitter(seed).network();
        Prediction p = assertInstanceOf(Prediction.class, predictor.predict(network));
        double sum = 0;
        for (CapacitorSensitivity s : p.capacitorSensitivities()) {
            String name = s.capacitor();
            double farads = p.lowBand().farads(p.lowBand().capacitorNames().indexOf(name));
            double up = predictor.exactLowerCornerHz(network.withCapacitance(name, farads * Math.exp(H))).getAsDouble();
            double down = predictor.exactLowerCornerHz(network.withCapacitance(name, farads * Math.exp(-H))).getAsDouble();
            double numeric = (Math.log(up) - Math.log(down)) / (2 * H);
            assertEquals(numeric, s.exactCornerPerLnC().getAsDouble(), DERIVATIVE_TOLERANCE, name);
            sum += s.exactCornerPerLnC().getAsDouble();
            // ∂ωL,SCTC/∂ln C_i = −1/τ_i (docs/method.md, "Sensitivities"): ωL,SCTC = Σ 1/τ_j and τ_i ∝ C_i
            double tau = p.sctc().terms().get(p.lowBand().capacitorNames().indexOf(name)).seconds();
            assertEquals(-1 / tau, s.sctcCornerRadPerSPerLnC(), 1e-12 / tau);
        }
        // scaling every capacitor by a scales the corner by 1/a: the sum is −1 (exact)
        assertEquals(-1, sum, 1e-9);
    }

    @Property(tries = 60, seed = "20261204")
    void poleSensitivityFromEigenvectorsMatchesCentralDifferences(@ForAll @LongRange long seed,
                                                                 @ForAll boolean ladder) {
        SmallSignalNetwork network = ladder ? rcLadder(4, seed) : randomCommonEmitter(seed).network();
        Prediction p = assertInstanceOf(Prediction.class, predictor.predict(network));
        List<String> names = p.lowBand().capacitorNames();
        List<ComplexFrequency> poles = p.poles().roots();
        for (int i = 0; i < names.size(); i++) {
            double farads = p.lowBand().farads(i);
            List<ComplexFrequency> up = poles(network.withCapacitance(names.get(i), farads * Math.exp(H)));
            List<ComplexFrequency> down = poles(network.withCapacitance(names.get(i), farads * Math.exp(-H)));
            for (int m = 0; m < poles.size(); m++) {
                PoleSensitivity s = p.poleSensitivities().get(m);
                if (s.repeated() || !wellSeparated(poles, m)) {
                    continue; // the derivative of a (nearly) repeated pole is not defined
                }
                double numeric = (Math.log(up.get(m).magnitudeRadPerS()) - Math.log(down.get(m).magnitudeRadPerS())) / (2 * H);
                // first-order perturbation theory (Wilkinson 1965) against central differences
                assertEquals(numeric, s.lnMagnitudePerLnC().get(i), DERIVATIVE_TOLERANCE, names.get(i) + " pole " + m);
            }
        }
        for (PoleSensitivity s : p.poleSensitivities()) {
            if (!s.repeated()) {
                // every pole scales as 1/C when all capacitors scale together: the sum is −1
                assertEquals(-1, s.lnMagnitudePerLnC().stream().mapToDouble(Double::doubleValue).sum(), 1e-8);
            }
        }
    }

    private List<ComplexFrequency> poles(SmallSignalNetwork network) {
        return assertInstanceOf(Prediction.class, predictor.predict(network)).poles().roots();
    }

    // a neighbour within 1 % makes the finite difference track the wrong branch near a crossing
    private static boolean wellSeparated(List<ComplexFrequency> poles, int m) {
        double size = poles.get(m).magnitudeRadPerS();
        for (int j = 0; j < poles.size(); j++) {
            if (j != m && Math.abs(poles.get(j).magnitudeRadPerS() - size) < 0.01 * size
                    && poles.get(j).imaginaryRadPerS() != -poles.get(m).imaginaryRadPerS()) {
                return false;
            }
        }
        return true;
    }
}
