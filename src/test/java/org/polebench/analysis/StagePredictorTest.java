package org.polebench.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.polebench.circuit.Band;
import org.polebench.circuit.SmallSignalNetwork;

class StagePredictorTest {
    private final StagePredictor predictor = new StagePredictor();

    private Prediction predict(SmallSignalNetwork network) {
        return assertInstanceOf(Prediction.class, predictor.predict(network));
    }

    /** Common-emitter with a collector–base (Cμ) and base–emitter (Cπ) capacitance in the high band. */
    static SmallSignalNetwork commonEmitterWithDeviceCapacitances() {
        Stages.CommonEmitter ce = Stages.typicalCommonEmitter();
        return new NetworkBuilder()
                .resistor("RS", "src", "in", ce.rs()).capacitor("C1", "in", "b", ce.c1())
                .resistor("RB", "b", "gnd", ce.rb()).bjt("Q1", "c", "b", "e", ce.gm(), ce.rpi(), ce.ro())
                .capacitor("Q1.cpi", "b", "e", 20e-12, Band.HIGH).capacitor("Q1.cmu", "b", "c", 3e-12, Band.HIGH)
                .resistor("RC", "c", "gnd", ce.rc()).capacitor("C2", "c", "out", ce.c2())
                .resistor("RL", "out", "gnd", ce.rl()).capacitor("CL", "out", "gnd", 100e-12, Band.HIGH)
                .resistor("RE", "e", "gnd", ce.re()).capacitor("CE", "e", "gnd", ce.ce())
                .build("src", "out");
    }

    @Test
    void rcHighPassCornerIsOneOverTwoPiRc() {
        double r = 10.6e3;
        double c = 1e-6;
        Prediction p = predict(new NetworkBuilder()
                .capacitor("C1", "src", "out", c).resistor("RL", "out", "gnd", r).build("src", "out"));
        double expected = 1 / (2 * Math.PI * r * c);
        // first-order RC high-pass, f = 1/(2πRC): closed form. 1e-10 relative: Brent stops at
        // 1e-12 in ln ω, the rest is round-off.
        assertEquals(expected, p.exactLowerCornerHz().getAsDouble(), 1e-10 * expected);
        assertEquals(expected, p.sctcLowerCornerHz(), 1e-12 * expected);
        assertEquals(expected, predictor.exactLowerCornerHz(new NetworkBuilder()
                .capacitor("C1", "src", "out", c).resistor("RL", "out", "gnd", r).build("src", "out")).getAsDouble(),
                1e-10 * expected);
        // the zero of a coupling capacitor is at DC, the pole at −1/RC
        assertEquals(List.of(new ComplexFrequency(0, 0)), p.zeros().orElseThrow().roots());
        assertEquals(-1 / (r * c), p.poles().roots().get(0).realRadPerS(), 1e-12 / (r * c));
        assertEquals(0, p.midbandGainDb(), 1e-12);
        assertFalse(p.inverting());
    }

    @Test
    void twoEqualRealPolesPutTheExactCornerAt1554TimesThePoleWhileSctcSaysTwice() {
        // two RC high-pass sections with a buffer between them, both τ = 1 ms
        double tau = 1e-3;
        SmallSignalNetwork network = new NetworkBuilder()
                .capacitor("C1", "src", "a", 1e-6).resistor("R1", "a", "gnd", 1e3)
                .transconductance("G1", "gnd", "x", "a", "gnd", 0.1).resistor("RX", "x", "gnd", 10)
                .capacitor("C2", "x", "out", 1e-6).resistor("R2", "out", "gnd", 990).build("src", "out");
        Prediction p = predict(network);
        // |H| = ω²/(ω² + p²) = 1/√2 gives ω = p/√(√2 − 1) ≈ 1.5538·p (closed form; docs/method.md, "SCTC and OCTC estimates")
        double exact = 1 / tau / Math.sqrt(Math.sqrt(2) - 1) / (2 * Math.PI);
        assertEquals(exact, p.exactLowerCornerHz().getAsDouble(), 1e-10 * exact);
        // SCTC: Σ 1/τ_i = 2p, 29 % high
        assertEquals(2 / tau / (2 * Math.PI), p.sctcLowerCornerHz(), 1e-12 / tau);
        // the double pole is defective (a Jordan block): eigenvalues split by about √ε, so 1e-7
        for (ComplexFrequency pole : p.poles().roots()) {
            assertEquals(-1 / tau, pole.realRadPerS(), 1e-7 / tau);
            assertEquals(0, pole.imaginaryRadPerS(), 1e-7 / tau);
        }
        assertTrue(p.poleSensitivities().stream().allMatch(PoleSensitivity::repeated));
    }

    @Test
    void sctcSumEqualsMinusThePoleSumAndTheOtherTraceIdentitiesHold() {
        Prediction p = predict(Stages.typicalCommonEmitter().network());
        StateModel m = p.lowBand();
        Identities.assertLowBandIdentities(m, p.poles());
        assertTrue(p.inverting());
        // the emitter bypass puts a zero at −1/(RE·CE) and the couplings two at DC
        // (Sedra and Smith, Microelectronic Circuits, from memory; exact when ro is infinite)
        Stages.CommonEmitter t = Stages.typicalCommonEmitter();
        Stages.CommonEmitter ce = new Stages.CommonEmitter(t.rs(), t.rb(), t.rpi(), t.gm(), Double.POSITIVE_INFINITY,
                t.rc(), t.rl(), t.re(), t.c1(), t.c2(), t.ce());
        List<ComplexFrequency> zeros = predict(ce.network()).zeros().orElseThrow().roots();
        assertEquals(0, zeros.get(0).magnitudeRadPerS());
        assertEquals(0, zeros.get(1).magnitudeRadPerS());
        double bypassZero = -1 / (ce.re() * ce.ce());
        // 1e-9: the zero is an eigenvalue of A − BC/D, computed to round-off times its condition
        assertEquals(bypassZero, zeros.get(2).realRadPerS(), 1e-9 * Math.abs(bypassZero));
    }

    @Test
    void stateSpaceResponseEqualsTheFullComplexSolveAtFiftyFrequencies() {
        SmallSignalNetwork network = Stages.typicalCommonEmitter().network();
        StateModel model = predict(network).lowBand();
        FullResponse full = new FullResponse(network);
        for (int i = 0; i < 50; i++) {
            double f = 0.01 * Math.pow(10, 6.0 * i / 49);
            Complex h = model.responseAtHz(f);
            Complex reference = full.atHz(f).orElseThrow();
            // two solves of the same linear network by different routes: round-off only, and
            // the port reduction adds one more well-conditioned solve: 1e-9 relative
            assertEquals(0, h.subtract(reference).abs(), 1e-9 * reference.abs(), "at " + f + " Hz");
        }
    }

    @Test
    void exactCornersAreWhereTheFullResponseIsThreeDecibelsDown() {
        SmallSignalNetwork lowOnly = Stages.typicalCommonEmitter().network();
        Prediction p = predict(lowOnly);
        double fl = p.exactLowerCornerHz().getAsDouble();
        // definition of the −3 dB corner, checked on the independent full MNA solve
        assertEquals(Math.abs(p.midbandGain()) / Math.sqrt(2), new FullResponse(lowOnly).atHz(fl).orElseThrow().abs(),
                1e-9 * Math.abs(p.midbandGain()));
        // and above it the response never falls that far again (highest crossing)
        for (double f = fl * 1.01; f < 1e7; f *= 1.05) {
            assertTrue(new FullResponse(lowOnly).atHz(f).orElseThrow().abs() > Math.abs(p.midbandGain()) / Math.sqrt(2));
        }
    }

    @Test
    void upperBandHasTheOctcIdentityAndItsCornerIsThreeDecibelsDownOnTheFullSolve() {
        SmallSignalNetwork network = commonEmitterWithDeviceCapacitances();
        Prediction p = predict(network);
        UpperBand upper = p.upperBand().orElseThrow();
        // Σ τ_i° = trace(−A⁻¹) = −Σ 1/p_i (docs/method.md, "Exact identities"); 1e-9 relative for round-off
        double sumReciprocal = 0;
        for (ComplexFrequency pole : upper.poles().roots()) {
            sumReciprocal += new Complex(pole.realRadPerS(), pole.imaginaryRadPerS()).reciprocal().getReal();
        }
        assertEquals(upper.octc().timeConstantSumSeconds(), -sumReciprocal, 1e-9 * upper.octc().timeConstantSumSeconds());
        // the high-band model at s = 0 (its capacitors open) is the low-band model at s = ∞
        // (its capacitors shorted): both are the midband network. Exact identity.
        assertEquals(p.midbandGain(), upper.model().responseAt(0).getReal(), 1e-10 * Math.abs(p.midbandGain()));
        // the full solve at the upper corner is 3 dB down up to the low-band parts' effect
        // there, about |Z(C1)|/RS = 1/(2π·fH·1 µF·600 Ω) ≈ 3e-4 of the gain: allow 1e-3
        double fh = upper.exactUpperCornerHz().getAsDouble();
        double mid = Math.abs(p.midbandGain());
        assertEquals(mid / Math.sqrt(2), new FullResponse(network).atHz(fh).orElseThrow().abs(), 1e-3 * mid);
        // OCTC is an estimate and errs low (it assumes a dominant pole): common practice
        assertTrue(upper.octcUpperCornerHz() <= fh);
        // Cπ, Cμ and CL form a loop through the shorted CE and C2: one of them is a link
        assertEquals(1, upper.model().linkCapacitorNames().size());
    }

    @Test
    void capacitorLoopInTheHighBandGivesTheExactResponseAndCorner() {
        // direct-coupled common-emitter, emitter grounded: Cπ (b–gnd), Cμ (b–c) and CL (c–gnd)
        // are a loop of capacitors, so only two of the three are states
        Stages.CommonEmitter ce = Stages.typicalCommonEmitter();
        SmallSignalNetwork network = new NetworkBuilder()
                .resistor("RS", "src", "b", ce.rs()).resistor("RB", "b", "gnd", ce.rb())
                .bjt("Q1", "c", "b", "gnd", ce.gm(), ce.rpi(), ce.ro())
                .capacitor("Q1.cpi", "b", "gnd", 20e-12, Band.HIGH).capacitor("Q1.cmu", "b", "c", 3e-12, Band.HIGH)
                .resistor("RC", "c", "gnd", ce.rc()).capacitor("CL", "c", "gnd", 100e-12, Band.HIGH)
                .build("src", "c");
        Prediction p = predict(network);
        UpperBand upper = p.upperBand().orElseThrow();
        assertEquals(2, upper.model().order());
        FullResponse full = new FullResponse(network);
        for (int i = 0; i < 50; i++) {
            double f = 1e3 * Math.pow(10, 6.0 * i / 49);
            // the independent full complex MNA solve has no ports and no links: round-off only
            Complex reference = full.atHz(f).orElseThrow();
            assertEquals(0, upper.model().responseAtHz(f).subtract(reference).abs(), 1e-9 * reference.abs());
        }
        double fh = upper.exactUpperCornerHz().getAsDouble();
        double mid = Math.abs(p.midbandGain());
        // definition of the corner, on the full solve: Brent's 1e-12 in ln ω and round-off
        assertEquals(mid / Math.sqrt(2), full.atHz(fh).orElseThrow().abs(), 1e-9 * mid);
        // Σ τ° = −Σ 1/p with the link's time constant included (exact identity)
        double sumReciprocal = 0;
        for (ComplexFrequency pole : upper.poles().roots()) {
            sumReciprocal += Identities.complex(pole).reciprocal().getReal();
        }
        assertEquals(upper.octc().timeConstantSumSeconds(), -sumReciprocal, 1e-9 * upper.octc().timeConstantSumSeconds());
        assertEquals(3, upper.octc().terms().size());
        // textbook OCTC of the CE stage (Gray and Meyer, Analysis and Design of Analog
        // Integrated Circuits, from memory): with R = RS∥RB∥rπ and RL' = RC∥ro,
        // Cπ sees R, CL sees RL', Cμ sees R + RL' + gm·R·RL'
        double r = Stages.parallel(Stages.parallel(ce.rs(), ce.rb()), ce.rpi());
        double rl = Stages.parallel(ce.rc(), ce.ro());
        double expected = 20e-12 * r + 100e-12 * rl + 3e-12 * (r + rl + ce.gm() * r * rl);
        assertEquals(expected, upper.octc().timeConstantSumSeconds(), 1e-12 * expected);
    }

    @Test
    void capacitorAcrossTheStimulusIsLeftOutOfTheHighBand() {
        // driven at the base (reference: input) with a bypassed emitter, Cπ sits across
        // the stimulus and the shorted bypass: it sets no pole
        Stages.CommonEmitter ce = Stages.typicalCommonEmitter();
        SmallSignalNetwork network = new NetworkBuilder()
                .resistor("RB", "b", "gnd", ce.rb()).bjt("Q1", "c", "b", "e", ce.gm(), ce.rpi(), ce.ro())
                .capacitor("Q1.cpi", "b", "e", 20e-12, Band.HIGH).capacitor("Q1.cmu", "b", "c", 3e-12, Band.HIGH)
                .resistor("RC", "c", "gnd", ce.rc()).resistor("RE", "e", "gnd", ce.re())
                .capacitor("CE", "e", "gnd", ce.ce()).build("b", "c");
        Prediction p = predict(network);
        UpperBand upper = p.upperBand().orElseThrow();
        assertEquals(List.of("Q1.cpi"), upper.model().capacitorsAcrossSources());
        assertEquals(List.of("Q1.cmu"), upper.model().capacitorNames());
        // Cμ alone then sees RC∥ro from the collector to the driven base: τ° = Cμ·(RC∥ro)
        // (Miller-free, the base is an ideal source; closed form); 1e-12 relative: round-off of
        // the nodal LU, whose pivot order (threshold pivoting) moves the last digits
        double octc = 3e-12 * Stages.parallel(ce.rc(), ce.ro());
        assertEquals(octc, upper.octc().timeConstantSumSeconds(), 1e-12 * octc);
    }

    @Test
    void zeroMidbandGainHasNoZerosAndNoCorner() {
        // balanced bridge: the output sits at ground at midband
        SmallSignalNetwork network = new NetworkBuilder()
                .capacitor("C1", "src", "a", 1e-6).resistor("R1", "a", "gnd", 1e3)
                .transconductance("G1", "out", "gnd", "a", "gnd", 0).resistor("RO", "out", "gnd", 1e3)
                .build("src", "out");
        Prediction p = predict(network);
        assertEquals(0, p.midbandGain());
        assertTrue(p.zeros().isEmpty());
        assertTrue(p.exactLowerCornerHz().isEmpty());
    }

    @Test
    void singularLowBandIsReturnedAsTheNamedOutcome() {
        SmallSignalNetwork network = new NetworkBuilder()
                .resistor("RS", "src", "in", 600).capacitor("C1", "in", "m", 1e-6)
                .capacitor("C2", "m", "out", 1e-6).resistor("RL", "out", "gnd", 10e3).build("src", "out");
        Reduction.Singular s = assertInstanceOf(Reduction.Singular.class, predictor.predict(network));
        assertEquals(SingularCase.POLE_AT_ZERO, s.kind());
        assertTrue(predictor.exactLowerCornerHz(network).isEmpty());
    }
}
