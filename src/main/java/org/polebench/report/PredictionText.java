package org.polebench.report;

import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import org.polebench.InputWarning;
import org.polebench.analysis.ComplexFrequency;
import org.polebench.analysis.Spectrum;
import org.polebench.spread.CornerSpread;
import org.polebench.analysis.Prediction;
import org.polebench.analysis.SctcTerm;
import org.polebench.spread.StagePrediction;
import org.polebench.analysis.UpperBand;
import org.polebench.circuit.OperatingPoint;
import org.polebench.units.EngineeringValue;

/** The readable summary {@code polebench predict} prints. */
public final class PredictionText {

    public void write(StagePrediction result, PrintWriter out) {
        Prediction prediction = result.prediction();
        out.println("Stage: " + result.stage().name());
        out.println();
        // warnings first, so that a doubtful value is read before the figures it feeds (issue 14)
        if (!result.warnings().isEmpty()) {
            out.println("Warnings");
            for (InputWarning warning : result.warnings()) {
                out.println("  " + warning.describe());
            }
            out.println();
        }
        out.println("Operating points");
        for (OperatingPoint point : result.operatingPoints().transistors()) {
            out.println("  " + describe(point));
        }
        out.println();
        out.println("Low-band capacitors (SCTC: each seen with the others shorted)");
        out.println(String.format(Locale.ROOT, "  %-8s %10s %12s %12s %7s %10s",
                "part", "value", "R seen", "tau", "share", "dlnf/dlnC"));
        for (int i = 0; i < prediction.sctc().terms().size(); i++) {
            SctcTerm term = prediction.sctc().terms().get(i);
            OptionalDouble sensitivity = prediction.capacitorSensitivities().get(i).exactCornerPerLnC();
            out.println(String.format(Locale.ROOT, "  %-8s %10s %12s %12s %6.1f%% %10s", term.capacitor(),
                    EngineeringValue.format(term.farads(), "F"), EngineeringValue.format(term.ohms(), "Ω"),
                    EngineeringValue.format(term.seconds(), "s"), 100 * term.share(),
                    sensitivity.isPresent() ? String.format(Locale.ROOT, "%.3f", sensitivity.getAsDouble()) : "-"));
        }
        out.println();
        double sctc = prediction.sctcLowerCornerHz();
        out.println("Lower corner");
        out.println("  SCTC estimate      " + EngineeringValue.format(sctc, "Hz", 4));
        if (prediction.exactLowerCornerHz().isPresent()) {
            double exact = prediction.exactLowerCornerHz().getAsDouble();
            out.println("  exact (-3 dB)      " + EngineeringValue.format(exact, "Hz", 4)
                    + String.format(Locale.ROOT, "   (SCTC is %+.1f %% off the exact corner)",
                    100 * (sctc - exact) / exact));
        } else {
            out.println("  exact (-3 dB)      none: the gain never falls 3 dB below midband");
        }
        CornerSpread spread = result.spread();
        if (spread.analysed() > 0) {
            out.println(String.format(Locale.ROOT, "  tolerance spread   5 %% %s   50 %% %s   95 %% %s   (%s, seed %d%s)",
                    EngineeringValue.format(spread.percentileHz(0.05).getAsDouble(), "Hz"),
                    EngineeringValue.format(spread.percentileHz(0.50).getAsDouble(), "Hz"),
                    EngineeringValue.format(spread.percentileHz(0.95).getAsDouble(), "Hz"),
                    boardsDrawn(spread), spread.seed(),
                    spread.biasFailures() > 0 ? ", " + spread.biasFailures() + " left the active region" : ""));
        } else {
            out.println("  tolerance spread   none: no drawn board could be analysed");
        }
        out.println();
        out.println(String.format(Locale.ROOT, "Midband gain         %.2f dB (%s, %s)", prediction.midbandGainDb(),
                String.format(Locale.ROOT, "%.4g V/V", prediction.midbandGain()),
                prediction.inverting() ? "inverting" : "non-inverting"));
        if (prediction.upperBand().isPresent()) {
            UpperBand upper = prediction.upperBand().get();
            out.println("Upper corner         OCTC estimate " + EngineeringValue.format(upper.octcUpperCornerHz(), "Hz", 4)
                    + (upper.exactUpperCornerHz().isPresent()
                    ? ", exact " + EngineeringValue.format(upper.exactUpperCornerHz().getAsDouble(), "Hz", 4) : ""));
        }
        out.println();
        out.println("Low-band poles (Hz, s/2π): " + roots(prediction.poles().roots()));
        out.println("Low-band zeros (Hz, s/2π): " + (prediction.zeros().isPresent()
                ? zeros(prediction.zeros().get()) : "not defined (midband gain is 0)"));
        conditioning(out, "low-band poles", prediction.poles());
        prediction.zeros().ifPresent(zeros -> conditioning(out, "low-band zeros", zeros));
    }

    /**
     * @return "10000 boards drawn", or for a spread that stopped early "3000 of 10000 boards
     *         drawn, stopped with the 5, 50 and 95 % points known to ±0.5 % (95 % intervals)"
     */
    public static String boardsDrawn(CornerSpread spread) {
        if (!spread.stoppedEarly()) {
            return spread.samplesDrawn() + " boards drawn";
        }
        return String.format(Locale.ROOT, "%d of %d boards drawn, stopped with the 5, 50 and 95 %% points known to "
                + "±%.2g %% (95 %% intervals)", spread.samplesDrawn(), spread.samplesPlanned(), 100 * spread.stoppedAt());
    }

    /** @return the line a long tolerance spread shows while it runs */
    public static String spreadProgress(int drawn, int planned, double seconds) {
        return String.format(Locale.ROOT, "tolerance spread: %d of at most %d boards drawn (%.0f s)", drawn, planned,
                seconds);
    }

    // a many-fold zero at DC as one entry ("17 at DC (s = 0)"), then the others
    static String zeros(Spectrum zeros) {
        int atDc = zeros.atDc();
        List<ComplexFrequency> others = new java.util.ArrayList<>();
        for (ComplexFrequency zero : zeros.roots()) {
            if (zero.realRadPerS() != 0 || zero.imaginaryRadPerS() != 0) {
                others.add(zero);
            }
        }
        if (atDc <= 1) {
            return roots(zeros.roots());
        }
        return "s = 0 (" + atDc + "-fold, at DC)" + (others.isEmpty() ? "" : ", " + roots(others));
    }

    /**
     * The warning when some roots are not determined to the 4 digits printed: their relative
     * move under a 1e-15 change of the model exceeds half a unit in the fourth digit (Spectrum).
     */
    static void conditioning(PrintWriter out, String what, Spectrum spectrum) {
        int undetermined = spectrum.undetermined();
        if (undetermined == 0) {
            return;
        }
        out.println(String.format(Locale.ROOT, "  warning: %d of the %s are not determined to the digits printed: "
                        + "a relative change of 1e-15 in the model moves them by up to %s of their size (near-repeated "
                        + "roots, as identical stages in cascade give, are ill-conditioned one by one; their sum "
                        + "and the response are not)", undetermined, what, spectrum.worstRelativeError() >= 1
                        ? "more than all" : String.format(Locale.ROOT, "%.1g", spectrum.worstRelativeError())));
    }

    static String roots(List<ComplexFrequency> roots) {
        if (roots.isEmpty()) {
            return "none";
        }
        StringBuilder text = new StringBuilder();
        for (ComplexFrequency root : roots) {
            if (text.length() > 0) {
                text.append(", ");
            }
            if (root.isReal()) {
                text.append(String.format(Locale.ROOT, "%.4g", root.realHz()));
            } else {
                text.append(String.format(Locale.ROOT, "%.4g%+.4gj", root.realHz(), root.imaginaryHz()));
            }
        }
        return text.toString();
    }

    private static String regionWords(OperatingPoint point) {
        return point.region().name().toLowerCase(Locale.ROOT).replace('_', ' ');
    }

    private static String describe(OperatingPoint point) {
        String given = point.currentGiven() ? " (current given)" : "";
        return point.match(new OperatingPoint.Cases<>() {
            @Override
            public String bjt(OperatingPoint.BjtPoint bjt) {
                return String.format(Locale.ROOT, "%-4s IC %s, VCE %.2f V, VBE %.2f V, %s%s", bjt.transistor(),
                        EngineeringValue.format(bjt.collectorAmps(), "A"), bjt.vceVolts(), bjt.vbeVolts(),
                        regionWords(point), given);
            }

            @Override
            public String mosfet(OperatingPoint.MosfetPoint mosfet) {
                return String.format(Locale.ROOT, "%-4s ID %s, VDS %.2f V, VGS %.2f V, %s%s", mosfet.transistor(),
                        EngineeringValue.format(mosfet.drainAmps(), "A"), mosfet.vdsVolts(), mosfet.vgsVolts(),
                        regionWords(point), given);
            }
        });
    }
}
