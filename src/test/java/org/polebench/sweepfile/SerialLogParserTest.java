package org.polebench.sweepfile;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.profile.ProfileLibrary;
import org.polebench.profile.ScpiCommand;
import org.polebench.profile.SerialProfile;
import org.polebench.sweep.DemoSweeps;
import org.polebench.sweep.SweepPoint;

/** A log without timestamps or direction markers, fed line by line as live capture will. */
class SerialLogParserTest {
    private static final SerialProfile SCPI =
            (SerialProfile) ProfileLibrary.bundled().find("scpi-generator-meter").orElseThrow();

    @Test
    void plainLogWithEchoesErrorsAndNoiseGivesEveryGoodStep() throws InputProblem {
        List<String> lines = new ArrayList<>();
        double[] f = DemoSweeps.logSpaced(0.5, 20_000, 12);
        for (int i = 0; i < f.length; i++) {
            // the closed form at the frequency as sent (NR3, 7 significant digits)
            double[] h = DemoSweeps.response(Double.parseDouble(ScpiCommand.nr3(f[i])));
            lines.add("FREQ " + ScpiCommand.nr3(f[i]));
            lines.add("FREQ " + ScpiCommand.nr3(f[i]));              // echoed by the instrument
            lines.add("*OPC?");
            lines.add("1");
            lines.add("MEAS:VOLT:AC? (@1)");
            // 0.1 Vrms in, at most 1 Vrms out: below the profile's 7 Vrms full scale
            lines.add(i == 4 ? "9.9E37" : "+1.00000000E-01");            // overrange on step 5
            lines.add("MEAS:VOLT:AC? (@2)");
            lines.add(String.format(Locale.ROOT, "%.12E", 0.1 * Math.pow(10, h[0] / 20)));
            lines.add("MEAS:PHAS? (@2),(@1)");
            lines.add(String.format(Locale.ROOT, "%.12E", h[1]));
            lines.add("SYST:ERR?");
            lines.add(i == 7 ? "-113,\"Undefined header\"" : "0,\"No error\"");
        }
        SerialLogParser parser = new SerialLogParser(SCPI, null);
        for (int i = 0; i < lines.size(); i++) {
            parser.accept(i + 1, lines.get(i));
        }
        ImportedSweep result = parser.result();

        // steps 5 (overrange) and 8 (error answer) are dropped; the rest match the closed form
        // to the 13 significant digits printed (1e-9 dB and degrees is far above that round-off)
        assertEquals(10, result.sweep().size());
        for (SweepPoint p : result.sweep().points()) {
            double[] h = DemoSweeps.response(p.frequencyHz());
            assertEquals(h[0], p.gainDb(), 1e-9);
            assertEquals(h[1], p.phaseDeg().getAsDouble(), 1e-9);
        }
        assertTrue(result.warnings().stream().anyMatch(w -> w.line() == 4 * 12 + 6 && w.message().contains("overrange")),
                result.warnings().toString());
        assertTrue(result.warnings().stream().anyMatch(w -> w.line() == 7 * 12 + 12 && w.message().contains("-113")),
                result.warnings().toString());
        // the profile's ±0.1 dB, read as rectangular: 0.1/√3 (GUM 4.3.7), carried as the sweep's
        // calibration term and no longer as each point's uncertainty (issue 13)
        assertTrue(result.sweep().points().get(0).gainUncertaintyDb().isEmpty());
        assertEquals(0.1 / Math.sqrt(3),
                result.sweep().calibration().orElseThrow().gainStandardUncertaintyDb().getAsDouble(), 1e-15);
    }
}
