package org.polebench.measure;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.apache.commons.math3.complex.Complex;
import org.polebench.InputProblem;
import org.polebench.analysis.FullResponse;
import org.polebench.circuit.BiasSolver;
import org.polebench.circuit.OperatingPoints;
import org.polebench.circuit.SmallSignalExpansion;
import org.polebench.circuit.Stage;
import org.polebench.units.Decibels;
import org.polebench.units.EngineeringValue;
import org.polebench.units.Quantity;

/**
 * A board built from a stage file: its response is the complex MNA solve of the stage's
 * whole small-signal network at its solved operating point, every capacitor of both bands in
 * place ({@link FullResponse}), times a flat gain factor (a probe or level mistake). Gain is in
 * the stage's own convention (against the source EMF, or the input node with
 * {@code reference: node}). Immutable; safe to share between threads.
 */
public final class StageBoard implements BoardResponse {
    private final FullResponse response;
    private final double gainFactor;
    private final String description;

    private StageBoard(FullResponse response, double gainFactor, String description) {
        this.response = response;
        this.gainFactor = gainFactor;
        this.description = description;
    }

    /**
     * @param built       the stage as built (any wrong part already in it)
     * @param points      its operating points (possibly with a scaled bias current)
     * @param gainFactor  measured over true gain, V/V, positive
     * @param description what differs from the stage as designed, for the notes
     */
    public static StageBoard of(Stage built, OperatingPoints points, double gainFactor, String description) {
        if (!(gainFactor > 0) || !Double.isFinite(gainFactor)) {
            throw new IllegalArgumentException("a gain factor must be positive, was " + gainFactor);
        }
        return new StageBoard(new FullResponse(new SmallSignalExpansion().expand(built, points)), gainFactor,
                "stage \"" + built.name() + "\"" + (description.isEmpty() ? "" : ", " + description));
    }

    /**
     * Solves the bias of the stage as built and makes the board.
     *
     * @throws InputProblem when the stage as built cannot be biased
     */
    public static StageBoard of(Stage built, String description) throws InputProblem {
        return of(built, new BiasSolver().solve(built), 1, description);
    }

    /**
     * The board as built from the stage as designed and faults written as on the command
     * line: {@code C3=4.7u} (a capacitor of that value), {@code Q1.bias=0.8} (a transistor's
     * bias current times 0.8) or {@code gain=10} / {@code gain=20dB} (a flat gain error, such
     * as a ×10 probe read as ×1). The bias is solved for the board with its capacitors as built
     * (a capacitor does not move it), then scaled.
     *
     * @throws InputProblem when a fault names no such part or its value does not read, or the
     *                      board as built cannot be biased
     */
    public static StageBoard asBuilt(Stage designed, List<String> faults) throws InputProblem {
        Stage built = designed;
        Map<String, Double> biasFactors = new LinkedHashMap<>();
        double gainFactor = 1;
        List<String> described = new ArrayList<>();
        for (String fault : faults) {
            int eq = fault.indexOf('=');
            if (eq <= 0 || eq == fault.length() - 1) {
                throw new InputProblem(null, 0, "fault '" + fault + "' is not PART=VALUE", USAGE);
            }
            String what = fault.substring(0, eq).strip();
            String value = fault.substring(eq + 1).strip();
            try {
                if (what.equalsIgnoreCase("gain")) {
                    double factor = value.toLowerCase(Locale.ROOT).endsWith("db")
                            ? Decibels.toRatio(EngineeringValue.parse(value, Quantity.DECIBELS))
                            : EngineeringValue.parseNumber(value);
                    if (!(factor > 0)) {
                        throw new IllegalArgumentException("a gain factor must be positive");
                    }
                    gainFactor *= factor;
                    described.add(String.format(Locale.ROOT, "flat gain ×%.4g", factor));
                } else if (what.toLowerCase(Locale.ROOT).endsWith(".bias")) {
                    String transistor = what.substring(0, what.length() - 5);
                    designed.transistor(transistor);
                    double factor = EngineeringValue.parseNumber(value);
                    if (!(factor > 0)) {
                        throw new IllegalArgumentException("a bias factor must be positive");
                    }
                    biasFactors.merge(transistor, factor, (a, b) -> a * b);
                    described.add(transistor + " bias current ×" + String.format(Locale.ROOT, "%.4g", factor));
                } else {
                    designed.capacitor(what);
                    double farads = EngineeringValue.parse(value, Quantity.FARADS);
                    if (!(farads > 0)) {
                        throw new IllegalArgumentException("a capacitor value must be positive");
                    }
                    built = built.withCapacitance(what, farads);
                    described.add(what + " fitted as " + EngineeringValue.format(farads, "F"));
                }
            } catch (IllegalArgumentException e) {
                throw new InputProblem(designed.sourceFile(), 0, "fault '" + fault + "': " + e.getMessage(), USAGE);
            }
        }
        OperatingPoints points = new BiasSolver().solve(built);
        for (Map.Entry<String, Double> bias : biasFactors.entrySet()) {
            points = points.withCurrentScaled(bias.getKey(), bias.getValue());
        }
        return of(built, points, gainFactor, described.isEmpty() ? "no fault" : String.join("; ", described));
    }

    private static final String USAGE = "write C3=4.7u (a capacitor's value as built), Q1.bias=0.8 (a bias current "
            + "factor) or gain=10 (a flat gain factor, also gain=20dB), naming parts of the stage file";

    @Override
    public Complex atHz(double frequencyHz) {
        Optional<Complex> h = response.atHz(frequencyHz);
        if (h.isEmpty()) {
            throw new IllegalStateException("the board's MNA matrix is singular at " + frequencyHz + " Hz");
        }
        return h.get().multiply(gainFactor);
    }

    @Override
    public String describe() {
        return description;
    }
}
