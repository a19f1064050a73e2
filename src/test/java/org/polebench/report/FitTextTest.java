package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.OptionalDouble;
import java.util.Random;
import java.util.ArrayList;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.fit.FitResult;
import org.polebench.fit.FitSettings;
import org.polebench.fit.KnownResponse;
import org.polebench.fit.SweepFitter;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;
import org.polebench.units.MeasuredValueFormat;

class FitTextTest {

    // GUM (JCGM 100:2008) 7.2.6: U to at most two significant figures, the value to the same digit
    @Test
    void roundsUncertaintyToTwoFiguresAndTheValueToMatch() {
        assertArrayEquals(new String[]{"181.33", "0.72"}, MeasuredValueFormat.withUncertainty(181.32976, 0.7234));
        assertArrayEquals(new String[]{"−15.9", "1.2"}, MeasuredValueFormat.withUncertainty(-15.9155, 1.2345));
        assertArrayEquals(new String[]{"1235", "45"}, MeasuredValueFormat.withUncertainty(1234.5678, 45.1));
        assertArrayEquals(new String[]{"1230", "120"}, MeasuredValueFormat.withUncertainty(1234.5678, 123.4));
        assertArrayEquals(new String[]{"32.464986", "0.000097"},
                MeasuredValueFormat.withUncertainty(32.464986, 0.0000971));
    }

    // a noisy sweep with stated σ (seed 3): the summary names the model, both corners for what
    // they are, the basis of the uncertainties and k
    @Test
    void summaryLabelsBothCornersAndTheUncertaintyBasis() throws InputProblem {
        Sweep clean = ReportFixtures.stage(true, 1);
        Random random = new Random(3);
        List<SweepPoint> noisy = new ArrayList<>();
        for (SweepPoint p : clean.points()) {
            noisy.add(new SweepPoint(p.frequencyHz(), p.gainDb() + 0.05 * random.nextGaussian(),
                    OptionalDouble.of(p.phaseDeg().getAsDouble() + 0.5 * random.nextGaussian()),
                    OptionalDouble.of(0.05), OptionalDouble.of(0.5)));
        }
        FitResult result = new SweepFitter(FitSettings.defaults()).fit(new Sweep(clean.source(), noisy));
        String text = new FitText().format(result);
        assertTrue(text.contains("3 poles, 2 DC zeros, 1 real zero"), text);
        assertTrue(text.contains("of the fitted model (exact)"), text);
        assertTrue(text.contains("interpolated between data points"), text);
        assertTrue(text.contains("k = 2"), text);
        assertTrue(text.contains("stated point uncertainties"), text);
        assertTrue(text.contains("structural"), text);
        assertTrue(text.contains("Correlation of the fit parameters"), text);
    }

    @Test
    void unidentifiablePolesAreNamedNotQuoted() throws InputProblem {
        FitResult result = new SweepFitter(FitSettings.defaults().withPoleCount(3).withDcZeros(2))
                .fit(ReportFixtures.stage(true, 500));
        String text = new FitText().format(result);
        assertTrue(text.contains("unidentifiable"), text);
    }

    // issue 4: a double real pole (K·s²/(s + a)², a = 2π·20 Hz: closed-form truth, seed 5) was printed
    // as "0 Hz u = 64000", the value rounded to the digits of an uncertainty that first-order
    // propagation makes infinite at a double root. Now one quote for the two roots, finite, and its
    // expanded interval around 20 Hz
    @Test
    void doublePoleIsPrintedOnceByItsGeometricMeanAndNeverAsZero() throws InputProblem {
        KnownResponse truth = new KnownResponse(10, 2, new double[0][], KnownResponse.real(-20, -20), Double.NaN);
        FitResult result = new SweepFitter(FitSettings.defaults()).fit(
                truth.noisySweep(KnownResponse.logSpaced(1, 20_000, 100), 0.05, 0.5, new Random(5), true));
        String text = new FitText().format(result);
        String poles = text.substring(text.indexOf("Poles"), text.indexOf("Zeros"));
        assertTrue(poles.contains("p1,p2"), text);
        assertFalse(poles.contains(" 0 Hz"), text);
        assertFalse(poles.contains("NaN") || poles.contains("Infinity"), text);
        Matcher quote = Pattern.compile("(natural frequency|geometric mean) +([0-9.]+) ± ([0-9.]+) Hz \\(U, k = ")
                .matcher(poles);
        assertTrue(quote.find(), text);
        double value = Double.parseDouble(quote.group(2));
        double expanded = Double.parseDouble(quote.group(3));
        // synthetic truth 20 Hz inside the printed U (k = 2, 95 % coverage; this seed's fit covers it)
        assertTrue(Math.abs(value - 20) <= expanded, text);
    }

    // a value whose U exceeds it keeps its digits and is said to be undetermined: rounded to the
    // digits of U, as GUM 7.2.6 has it otherwise, −2.705 Hz with U = 55 000 Hz would read "0"
    @Test
    void valueSmallerThanItsUncertaintyIsNotPrintedAsZero() {
        String text = FitText.withU(-2.70521, 27_000, 2, "Hz");
        assertTrue(text.startsWith("−2.70521 Hz"), text);
        assertTrue(text.contains("U = 54 kHz (k = 2") && text.contains("these data do not determine it"), text);
        // below U the GUM rounding stands: U = 0.64 to two figures, the value to match, k beside U
        assertEquals("−10.59 ± 0.64 Hz (U, k = 2; u = 0.32 Hz)", FitText.withU(-10.5924, 0.32, 2, "Hz"));
    }
}
