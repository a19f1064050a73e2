package org.polebench.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import org.polebench.InputWarning;
import org.polebench.analysis.CapacitorSensitivity;
import org.polebench.analysis.ComplexFrequency;
import org.polebench.analysis.Spectrum;
import org.polebench.spread.CornerSpread;
import org.polebench.analysis.Prediction;
import org.polebench.analysis.SctcTerm;
import org.polebench.spread.StagePrediction;
import org.polebench.analysis.UpperBand;
import org.polebench.circuit.OperatingPoint;

/**
 * The JSON object of {@code polebench predict --json}, also embedded as {@code predicted} in
 * {@code reconcile --json}. Keys are snake_case and carry their unit; poles and zeros are
 * given in Hz as s/2π ({@code re}, {@code im}).
 */
public final class PredictionJson {
    private final JsonNodeFactory nodes = JsonNodeFactory.instance;

    public ObjectNode of(StagePrediction result) {
        Prediction prediction = result.prediction();
        ObjectNode root = nodes.objectNode();
        root.put("stage", result.stage().name());
        root.put("midband_gain_db", prediction.midbandGainDb());
        root.put("midband_gain_ratio", prediction.midbandGain());
        root.put("inverting", prediction.inverting());
        root.put("sctc_lower_corner_hz", prediction.sctcLowerCornerHz());
        putOptional(root, "exact_lower_corner_hz", prediction.exactLowerCornerHz());
        ArrayNode capacitors = root.putArray("capacitors");
        List<CapacitorSensitivity> sensitivities = prediction.capacitorSensitivities();
        for (int i = 0; i < prediction.sctc().terms().size(); i++) {
            SctcTerm term = prediction.sctc().terms().get(i);
            ObjectNode row = capacitors.addObject();
            row.put("id", term.capacitor());
            row.put("farads", term.farads());
            row.put("sctc_resistance_ohm", term.ohms());
            row.put("sctc_time_constant_s", term.seconds());
            row.put("share", term.share());
            putOptional(row, "corner_sensitivity", sensitivities.get(i).exactCornerPerLnC());
        }
        root.set("poles_hz", roots(prediction.poles()));
        root.set("zeros_hz", prediction.zeros().isPresent() ? roots(prediction.zeros().get())
                : nodes.arrayNode());
        root.put("zeros_at_dc", prediction.zeros().map(Spectrum::atDc).orElse(0));
        if (prediction.upperBand().isPresent()) {
            UpperBand upper = prediction.upperBand().get();
            ObjectNode high = root.putObject("upper_band");
            high.put("octc_upper_corner_hz", upper.octcUpperCornerHz());
            putOptional(high, "exact_upper_corner_hz", upper.exactUpperCornerHz());
            high.set("poles_hz", roots(upper.poles()));
        }
        CornerSpread spread = result.spread();
        ObjectNode tolerance = root.putObject("tolerance_spread");
        putOptional(tolerance, "p05_hz", spread.percentileHz(0.05));
        putOptional(tolerance, "p50_hz", spread.percentileHz(0.50));
        putOptional(tolerance, "p95_hz", spread.percentileHz(0.95));
        tolerance.put("samples", spread.samplesDrawn());
        tolerance.put("samples_planned", spread.samplesPlanned());
        tolerance.put("stopped_early", spread.stoppedEarly());
        tolerance.put("stopped_at_precision", spread.stoppedAt());
        tolerance.put("samples_analysed", spread.analysed());
        tolerance.put("samples_out_of_active_region", spread.biasFailures());
        tolerance.put("seed", spread.seed());
        ArrayNode points = root.putArray("operating_points");
        for (OperatingPoint point : result.operatingPoints().transistors()) {
            points.add(operatingPoint(point));
        }
        root.set("warnings", warnings(result.warnings()));
        return root;
    }

    private ObjectNode operatingPoint(OperatingPoint point) {
        ObjectNode row = nodes.objectNode();
        row.put("id", point.transistor());
        row.put("region", point.region().name().toLowerCase(Locale.ROOT).replace('_', '-'));
        row.put("current_given", point.currentGiven());
        return point.match(new OperatingPoint.Cases<>() {
            @Override
            public ObjectNode bjt(OperatingPoint.BjtPoint bjt) {
                row.put("ic_a", bjt.collectorAmps());
                row.put("ib_a", bjt.baseAmps());
                row.put("vce_v", bjt.vceVolts());
                row.put("vbe_v", bjt.vbeVolts());
                return row;
            }

            @Override
            public ObjectNode mosfet(OperatingPoint.MosfetPoint mosfet) {
                row.put("id_a", mosfet.drainAmps());
                row.put("vds_v", mosfet.vdsVolts());
                row.put("vgs_v", mosfet.vgsVolts());
                row.put("vsb_v", mosfet.vsbVolts());
                return row;
            }
        });
    }

    ArrayNode roots(List<ComplexFrequency> roots) {
        ArrayNode list = nodes.arrayNode();
        for (ComplexFrequency root : roots) {
            ObjectNode entry = list.addObject();
            entry.put("re", root.realHz());
            entry.put("im", root.imaginaryHz());
        }
        return list;
    }

    /**
     * Each root with its relative condition number ({@code condition}, {@link Spectrum#conditions()};
     * 0 for a zero at DC, null where infinite) and whether it is determined to the digits printed
     * ({@code determined}).
     */
    ArrayNode roots(Spectrum spectrum) {
        ArrayNode list = roots(spectrum.roots());
        for (int i = 0; i < list.size(); i++) {
            ObjectNode entry = (ObjectNode) list.get(i);
            double condition = spectrum.conditions().get(i);
            if (Double.isFinite(condition)) {
                entry.put("condition", condition);
            } else {
                entry.putNull("condition");
            }
            entry.put("determined", spectrum.determined(i));
        }
        return list;
    }

    ArrayNode warnings(List<InputWarning> warnings) {
        ArrayNode list = nodes.arrayNode();
        for (InputWarning warning : warnings) {
            list.add(warning.describe());
        }
        return list;
    }

    private static void putOptional(ObjectNode node, String key, OptionalDouble value) {
        if (value.isPresent()) {
            node.put(key, value.getAsDouble());
        } else {
            node.putNull(key);
        }
    }
}
