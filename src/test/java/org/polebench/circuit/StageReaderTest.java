package org.polebench.circuit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.polebench.InputProblem;
import org.polebench.InputWarning;

/**
 * Every expected line number below is found in the test's own text by {@link StageFiles#lineOf},
 * never taken from the reader.
 */
class StageReaderTest {
    @TempDir
    Path dir;

    private InputProblem refused(String text) {
        return assertThrows(InputProblem.class, () -> StageFiles.read(dir, text));
    }

    private void assertMentions(String text, String... words) {
        for (String word : words) {
            assertTrue(text.contains(word), "expected '" + word + "' in: " + text);
        }
    }

    @Test
    void readsTheDesignExampleValuesAndDefaults() throws InputProblem {
        Stage stage = StageFiles.stage(dir, StageFiles.COMMON_EMITTER);

        assertEquals("test common emitter", stage.name());
        assertEquals("gnd", stage.ground());
        assertEquals(List.of(new Supply("vcc", 12, 3)), stage.supplies());
        assertEquals(600, stage.input().sourceOhms());
        assertEquals(GainReference.SOURCE_EMF, stage.input().reference());
        assertEquals(47e3, stage.output().loadOhms().getAsDouble());
        // defaults of docs/method.md, "The small-signal network": 300 K, ±1 dB gain calibration, VBE(on) 0.65 V, bias tolerance ±20 %
        assertEquals(300, stage.temperatureKelvin());
        assertEquals(1, stage.gainCalibrationDb());
        assertEquals(0.65, stage.bjt("Q1").vbeOnVolts());
        assertEquals(Tolerance.symmetric(0.20), stage.bjt("Q1").biasTolerance());
        assertEquals(Tolerance.symmetric(0.05), stage.resistor("R1").tolerance());
        assertEquals(4.7e-6, stage.capacitor("C1").farads(), 1e-21);
        assertEquals(Band.LOW, stage.capacitor("C1").band());
        assertEquals(StageFiles.lineOf(StageFiles.COMMON_EMITTER, "C3:"), stage.capacitor("C3").line());
        assertTrue(stage.limits().isEmpty());
    }

    @Test
    void readsAsymmetricTolerancesBandsAndTransistorKeys() throws InputProblem {
        String text = StageFiles.COMMON_EMITTER
                .replace("{capacitor: 470u, between: [e, gnd]}", "{capacitor: 470u, between: [e, gnd], tolerance: -20%/+80%}")
                .replace("  C1: {capacitor: 4.7u, between: [in, b]}", "  C1: {capacitor: 4u7, between: [in, b], band: high}\n"
                        + "  C9: {capacitor: 100p, between: [c, b]}")
                .replace("beta: 150, bias: auto", "beta: 150, beta-tolerance: -50%/+100%, vbe-on: 0.7,"
                        + " early-voltage: 100, rx: 50, cpi: 12p, cmu: 2p, bias: auto, bias-tolerance: 10%")
                + "temperature: 27 °C\ngain-calibration: ±0.5 dB\n"
                + "limits: {lower-corner-max: 20 Hz, lower-corner-min: 2 Hz, upper-corner-min: 20kHz,"
                + " midband-gain: {min: 17 dB, max: 19 dB}}\n";

        Stage stage = StageFiles.stage(dir, text);

        Tolerance electrolytic = stage.capacitor("C3").tolerance();
        assertEquals(-0.20, electrolytic.lowerFraction(), 1e-15);
        assertEquals(0.80, electrolytic.upperFraction(), 1e-15);
        // the band in ln-value is [ln 0.8, ln 1.8] by definition
        assertEquals(Math.log(0.8), electrolytic.lnLower(), 1e-15);
        assertEquals(Math.log(1.8), electrolytic.lnUpper(), 1e-15);
        assertEquals(Band.HIGH, stage.capacitor("C1").band());
        assertEquals(4.7e-6, stage.capacitor("C1").farads(), 1e-21);
        assertEquals(Band.HIGH, stage.capacitor("C9").band());  // 100 pF < 1 nF: high by default
        Bjt q1 = stage.bjt("Q1");
        assertEquals(new Tolerance(-0.5, 1.0), q1.betaTolerance());
        assertEquals(0.7, q1.vbeOnVolts());
        assertEquals(100, q1.earlyVolts().getAsDouble());
        assertEquals(50, q1.rxOhms());
        assertEquals(12e-12, q1.cpiFarads(), 1e-24);
        assertEquals(Tolerance.symmetric(0.10), q1.biasTolerance());
        // 27 °C = 300.15 K (SI: T/K = t/°C + 273.15)
        assertEquals(300.15, stage.temperatureKelvin(), 1e-12);
        assertEquals(0.5, stage.gainCalibrationDb());
        assertEquals(20, stage.limits().lowerCornerMaxHz().getAsDouble());
        assertEquals(2, stage.limits().lowerCornerMinHz().getAsDouble());
        assertEquals(20e3, stage.limits().upperCornerMinHz().getAsDouble());
        assertEquals(17, stage.limits().midbandGainMinDb().getAsDouble());
        assertEquals(19, stage.limits().midbandGainMaxDb().getAsDouble());
    }

    @Test
    void readsMosfetKeysAndAGivenBias() throws InputProblem {
        String text = StageFiles.COMMON_EMITTER.replace("Q1: {npn: {c: c, b: b, e: e}, beta: 150, bias: auto}",
                "M1: {pmos: {d: c, g: b, s: e, b: vcc}, vth: -1.2, k: 4m, lambda: 0.02, gamma: 0.45,"
                        + " surface-potential: 0.7, cgs: 30p, cgd: 3p, bias: {id: 1m}}");

        Mosfet m1 = StageFiles.stage(dir, text).mosfet("M1");

        assertEquals(Mosfet.Channel.PMOS, m1.channel());
        assertEquals(-1.2, m1.vthVolts());
        assertEquals(1.2, m1.thresholdMagnitudeVolts());
        assertEquals(4e-3, m1.kAmpsPerVoltSquared());
        assertEquals("vcc", m1.body().get());
        assertEquals(0.45, m1.gammaRootVolts());
        assertEquals(0.7, m1.surfacePotentialVolts());
        assertEquals(new Bias.Given(1e-3), m1.bias());
    }

    @Test
    void stageCopiesChangeOnePartOnly() throws InputProblem {
        Stage stage = StageFiles.stage(dir, StageFiles.COMMON_EMITTER);

        Stage changed = stage.withCapacitance("C3", 47e-6).withResistance("RE", 1e3).withBeta("Q1", 300);

        assertEquals(47e-6, changed.capacitor("C3").farads());
        assertEquals(1e3, changed.resistor("RE").ohms());
        assertEquals(300, changed.bjt("Q1").beta());
        assertEquals(470e-6, stage.capacitor("C3").farads(), 1e-18);  // the original is untouched
        assertEquals(stage.capacitor("C1"), changed.capacitor("C1"));
        assertThrows(IllegalArgumentException.class, () -> stage.withCapacitance("R1", 1e-6));
        assertThrows(IllegalArgumentException.class, () -> stage.withBeta("Q7", 100));
    }

    // ---- refusals: each names the line and says what would fix it

    @Test
    void unknownTopLevelKeyGetsADidYouMean() {
        String text = StageFiles.COMMON_EMITTER + "limts: {lower-corner-max: 20 Hz}\n";
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "limts"), problem.line());
        assertMentions(problem.getMessage(), "unknown key 'limts'", "Did you mean 'limits'?");
        assertMentions(problem.hint(), "name, ground, supplies");
        assertTrue(problem.file().isPresent());
    }

    @Test
    void unknownPartKeyGetsADidYouMean() {
        String text = StageFiles.COMMON_EMITTER.replace("{resistor: 15k, between: [b, gnd]}",
                "{resistor: 15k, between: [b, gnd], tolerence: 1%}");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "tolerence"), problem.line());
        assertMentions(problem.getMessage(), "R2", "tolerence", "Did you mean 'tolerance'?");
    }

    @Test
    void keyOfAnotherPartKindSaysWhereItBelongs() {
        String text = StageFiles.COMMON_EMITTER.replace("beta: 150, bias: auto", "beta: 150, vth: 1, bias: auto");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "vth"), problem.line());
        assertMentions(problem.getMessage(), "Q1", "'vth' belongs to nmos and pmos");
    }

    @Test
    void misspelledPartKindGetsADidYouMean() {
        String text = StageFiles.COMMON_EMITTER.replace("R2: {resistor: 15k", "R2: {resistr: 15k");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "resistr"), problem.line());
        assertMentions(problem.getMessage(), "R2 does not say what kind", "did you mean 'resistor'?");
    }

    @Test
    void partWithTwoKindsIsRefused() {
        String text = StageFiles.COMMON_EMITTER.replace("R2: {resistor: 15k,", "R2: {resistor: 15k, capacitor: 1u,");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "R2:"), problem.line());
        assertMentions(problem.getMessage(), "both resistor and capacitor");
    }

    @Test
    void transistorWithAMissingOrUnknownTerminalIsRefused() {
        String missing = StageFiles.COMMON_EMITTER.replace("{c: c, b: b, e: e}", "{c: c, b: b}");
        InputProblem problem = refused(missing);
        assertEquals(StageFiles.lineOf(missing, "Q1:"), problem.line());
        assertMentions(problem.getMessage(), "no 'e' terminal");

        String unknown = StageFiles.COMMON_EMITTER.replace("{c: c, b: b, e: e}", "{c: c, b: b, x: e}");
        problem = refused(unknown);
        assertMentions(problem.getMessage(), "'x' is not a terminal of an npn");
    }

    @Test
    void nodeNamedOnlyOnceIsCalledALikelyTypo() {
        String text = StageFiles.COMMON_EMITTER.replace("RC: {resistor: 4.7k, between: [vcc, c]}",
                "RC: {resistor: 4.7k, between: [vcc, cx]}");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "RC:"), problem.line());
        assertMentions(problem.getMessage(), "node 'cx' is named only once", "by RC", "typo for 'c'");
    }

    @Test
    void missingInputIsRefused() {
        String text = StageFiles.COMMON_EMITTER.replace("input: {node: in, source-resistance: 600}\n", "");
        InputProblem problem = refused(text);
        assertEquals(1, problem.line());  // the stage file's top-level map starts on line 1
        assertMentions(problem.getMessage(), "has no 'input'");
        assertMentions(problem.hint(), "input: {node: in");
    }

    @Test
    void missingOutputIsRefused() {
        String text = StageFiles.COMMON_EMITTER.replace("output: {node: out, load: 47k}\n", "");
        InputProblem problem = refused(text);
        assertEquals(1, problem.line());
        assertMentions(problem.getMessage(), "has no 'output'");
    }

    @Test
    void missingSourceResistanceIsRefused() {
        String text = StageFiles.COMMON_EMITTER.replace("input: {node: in, source-resistance: 600}",
                "input: {node: in}");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "input:"), problem.line());
        assertMentions(problem.getMessage(), "no 'source-resistance'");
    }

    @ParameterizedTest
    @CsvSource(delimiter = ';', value = {
            "resistor: 68k;resistor: abc;R1: resistor",
            "capacitor: 4.7u;capacitor: u;C1: capacitor",
            "beta: 150;beta: many;Q1: beta",
            "{vcc: 12};{vcc: twelve};supply 'vcc'",
            "source-resistance: 600;source-resistance: ;source-resistance"})
    void valueWithoutANumberIsRefusedOnItsLine(String from, String to, String named) {
        String text = StageFiles.COMMON_EMITTER.replaceFirst(java.util.regex.Pattern.quote(from), to);
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, to.strip()), problem.line());
        assertMentions(problem.getMessage(), named);
        assertTrue(!problem.hint().isEmpty());
    }

    @Test
    void unknownInputNodeIsRefusedWithADidYouMean() {
        String text = StageFiles.COMMON_EMITTER.replace("input: {node: in,", "input: {node: inp,");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "input:"), problem.line());
        assertMentions(problem.getMessage(), "input node 'inp' is not connected to any part", "Did you mean 'in'?");
    }

    @Test
    void unknownOutputNodeIsRefused() {
        String text = StageFiles.COMMON_EMITTER.replace("output: {node: out,", "output: {node: outt,");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "output:"), problem.line());
        assertMentions(problem.getMessage(), "output node 'outt'", "Did you mean 'out'?");
    }

    @Test
    void unusedSupplyIsRefused() {
        String text = StageFiles.COMMON_EMITTER.replace("supplies: {vcc: 12}", "supplies: {vcc: 12, vee: -12}");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "supplies:"), problem.line());
        assertMentions(problem.getMessage(), "supply 'vee' is not connected");
    }

    @Test
    void parallelLowBandCapacitorsAreACapacitorLoop() {
        String text = StageFiles.COMMON_EMITTER + "  C4: {capacitor: 100n, between: [e, gnd]}\n";
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "C4:"), problem.line());
        assertMentions(problem.getMessage(), "C4 closes a loop of low-band capacitors (C3, C4");
        assertMentions(problem.hint(), "band: high");
    }

    @Test
    void threeCapacitorsAroundALoopAreNamed() {
        // C1 (in–b), C5 (b–e), and C6 (e–in) close a loop in → b → e → in
        String text = StageFiles.COMMON_EMITTER.replace("  C3: {capacitor: 470u, between: [e, gnd]}\n", "")
                + "  C5: {capacitor: 10n, between: [b, e]}\n  C6: {capacitor: 10n, between: [e, in]}\n";
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "C6:"), problem.line());
        assertMentions(problem.getMessage(), "C1", "C5", "C6");
    }

    @Test
    void nodeReachedOnlyThroughCapacitorsHasNoDcPath() {
        // m sits between two series capacitors and nothing else
        String text = StageFiles.COMMON_EMITTER.replace("C1: {capacitor: 4.7u, between: [in, b]}",
                "C1: {capacitor: 4.7u, between: [in, m]}\n  C4: {capacitor: 4.7u, between: [m, b]}");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "C1:"), problem.line());
        assertMentions(problem.getMessage(), "node 'm' has no DC path", "C1, C4");
        assertMentions(problem.hint(), "only through capacitors");
    }

    @Test
    void unloadedOutputBehindACouplingCapacitorHasNoDcPath() {
        String text = StageFiles.COMMON_EMITTER.replace("output: {node: out, load: 47k}", "output: {node: out}");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "C2:"), problem.line());
        assertMentions(problem.getMessage(), "node 'out' has no DC path");
        assertMentions(problem.hint(), "load");
    }

    @Test
    void floatingBaseIsNamedWithItsTransistor() {
        String text = StageFiles.COMMON_EMITTER.replace("  R1: {resistor: 68k, between: [vcc, b]}\n", "")
                .replace("  R2: {resistor: 15k, between: [b, gnd]}\n", "")
                .replace("supplies: {vcc: 12}", "supplies: {vcc: 12}");
        InputProblem problem = refused(text);
        assertMentions(problem.getMessage(), "node 'b' has no DC path", "Q1 (base)");
        assertMentions(problem.hint(), "base a DC bias path");
    }

    @Test
    void malformedToleranceIsRefused() {
        String text = StageFiles.COMMON_EMITTER.replace("{capacitor: 470u, between: [e, gnd]}",
                "{capacitor: 470u, between: [e, gnd], tolerance: -20%+80%}");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "C3:"), problem.line());
        assertMentions(problem.hint(), "-20%/+80%");
    }

    @Test
    void pmosThresholdMustBeWrittenNegative() {
        String text = StageFiles.COMMON_EMITTER.replace("Q1: {npn: {c: c, b: b, e: e}, beta: 150, bias: auto}",
                "M1: {pmos: {d: c, g: b, s: e}, vth: 1.2, k: 4m, bias: auto}");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "M1:"), problem.line());
        assertMentions(problem.hint(), "vth: -1.2");
    }

    @Test
    void transistorWithoutBiasIsRefused() {
        String text = StageFiles.COMMON_EMITTER.replace(", bias: auto}", "}");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "Q1:"), problem.line());
        assertMentions(problem.hint(), "bias: auto", "bias: {ic: 1.1m}");
    }

    @Test
    void mosfetBiasKeyOnABjtIsExplained() {
        String text = StageFiles.COMMON_EMITTER.replace("bias: auto", "bias: {id: 1m}");
        InputProblem problem = refused(text);
        assertMentions(problem.getMessage(), "'id' is for MOSFETs");
    }

    @Test
    void duplicatePartIsRefusedByTheYamlReader() {
        String text = StageFiles.COMMON_EMITTER + "  R1: {resistor: 1k, between: [c, gnd]}\n";
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "R1: {resistor: 1k"), problem.line());
    }

    // ---- warnings: implausible values are accepted, with the line

    @ParameterizedTest
    @CsvSource(delimiter = ';', value = {
            "capacitor: 470u;capacitor: 2.2 F;1 F or more",
            "resistor: 1.2k;resistor: 0.5;outside 1 Ω to 1 GΩ",
            "resistor: 68k;resistor: 2.2G;outside 1 Ω to 1 GΩ",
            "beta: 150;beta: 5000;outside 10 to 2000"})
    void implausibleValueIsAcceptedWithAWarningOnItsLine(String from, String to, String said) throws InputProblem {
        String text = StageFiles.COMMON_EMITTER.replaceFirst(java.util.regex.Pattern.quote(from), to);

        StageFile file = StageFiles.read(dir, text);

        assertEquals(1, file.warnings().size(), file.warnings().toString());
        InputWarning warning = file.warnings().get(0);
        assertEquals(StageFiles.lineOf(text, to), warning.line());
        assertMentions(warning.message(), said, "accepted");
    }

    @Test
    void capacitorWithoutPrefixOrUnitIsRefusedOnItsLine() {
        // issue 14: a bare 4.7 would be 4.7 F; the scale must be written
        String text = StageFiles.COMMON_EMITTER.replace("{capacitor: 4.7u, between: [in, b]}", "{capacitor: 4.7, between: [in, b]}");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "C1:"), problem.line());
        assertMentions(problem.getMessage(), "C1", "'4.7' has neither a prefix nor the unit F");
        assertMentions(problem.hint(), "10u, 4u7 or 100n", "unit F");
    }

    @Test
    void capacitorInFaradsIsReadWhenTheUnitIsWritten() throws InputProblem {
        // the unit F states farads; 4.7 F gets the existing 1 F-or-more warning and is read as given
        String text = StageFiles.COMMON_EMITTER.replace("{capacitor: 4.7u, between: [in, b]}", "{capacitor: 4.7F, between: [in, b]}");
        StageFile file = StageFiles.read(dir, text);
        assertEquals(4.7, file.stage().capacitor("C1").farads());
        assertMentions(file.warnings().get(0).message(), "1 F or more");
    }

    @Test
    void decimalCommaInACapacitorGetsAHint() {
        String text = StageFiles.COMMON_EMITTER.replace("{capacitor: 4.7u, between: [in, b]}", "{capacitor: '4,7u', between: [in, b]}");
        InputProblem problem = refused(text);
        assertEquals(StageFiles.lineOf(text, "C1:"), problem.line());
        assertMentions(problem.getMessage(), "comma", "write 4.7u");
    }

    @Test
    void milliFaradIsReadAsMilliWithAWarning() throws InputProblem {
        // SI: m is milli (BIPM SI Brochure, table 7), so 4.7mF is 4.7e-3 F; some mean micro by it
        String text = StageFiles.COMMON_EMITTER.replace("{capacitor: 4.7u, between: [in, b]}", "{capacitor: 4.7mF, between: [in, b]}");
        StageFile file = StageFiles.read(dir, text);
        assertEquals(4.7e-3, file.stage().capacitor("C1").farads(), 1e-18);
        assertEquals(1, file.warnings().size(), file.warnings().toString());
        assertEquals(StageFiles.lineOf(text, "C1:"), file.warnings().get(0).line());
        assertMentions(file.warnings().get(0).message(), "m is milli", "write u or µ");
    }

    @Test
    void railDecouplingCapacitorIsNotedAndLeftOut() throws InputProblem {
        String text = StageFiles.COMMON_EMITTER + "  C9: {capacitor: 100u, between: [vcc, gnd]}\n";

        StageFile file = StageFiles.read(dir, text);

        assertEquals(1, file.warnings().size());
        assertEquals(StageFiles.lineOf(text, "C9:"), file.warnings().get(0).line());
        assertMentions(file.warnings().get(0).message(), "no effect");
        SmallSignalNetwork network = new SmallSignalExpansion().expand(file.stage());
        assertTrue(network.elements().stream().noneMatch(e -> e.name().equals("C9")));
    }

    @Test
    void highBandLoopIsOnlyAWarning() throws InputProblem {
        // C8 from b to gnd parallels Cπ once the emitter bypass C3 is shorted in the high band
        String text = StageFiles.COMMON_EMITTER.replace("beta: 150, bias: auto", "beta: 150, cpi: 10p, bias: auto")
                + "  C8: {capacitor: 47p, between: [b, gnd]}\n";

        StageFile file = StageFiles.read(dir, text);

        assertEquals(1, file.warnings().size(), file.warnings().toString());
        assertMentions(file.warnings().get(0).message(), "C8", "Q1.cpi", "loop");
    }
}
