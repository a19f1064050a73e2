package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.OptionalDouble;
import java.util.Random;
import java.util.ArrayList;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;
import org.polebench.fit.FitResult;
import org.polebench.fit.FitSettings;
import org.polebench.fit.SweepFitter;
import org.polebench.measure.Sweep;
import org.polebench.measure.SweepPoint;

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
        assertTrue(text.contains("k = 2.00"), text);
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
}
