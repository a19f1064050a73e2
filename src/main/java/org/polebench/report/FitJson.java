package org.polebench.report;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.List;
import org.polebench.InputWarning;
import org.polebench.fit.CalibrationTerm;
import org.polebench.fit.Estimate;
import org.polebench.fit.FitResult;
import org.polebench.fit.FittedRoot;
import org.polebench.fit.RootStatus;

/**
 * The machine-readable fit: one JSON object with exactly these keys (issue 4):
 * <ul>
 * <li>{@code midband_gain_db}: 20·log10|K|;</li>
 * <li>{@code poles_hz}, {@code zeros_hz}: arrays of {@code {re, im, u}} in Hz, where {@code u} is
 *     the standard uncertainty of |root| (the corner frequency the root sets). A DC zero is
 *     {@code {0, 0, 0}} (structural); an unidentifiable root has all three {@code null};</li>
 * <li>{@code lower_corner_hz}: {@code {value, u}} of the fitted model's exact lower −3 dB corner,
 *     both {@code null} when it is not quoted;</li>
 * <li>{@code order}: number of poles, the high-band one included;</li>
 * <li>{@code residual_rms_db}, {@code residual_rms_deg} (null for a magnitude-only sweep);</li>
 * <li>{@code warnings}: the result's warnings as text.</li>
 * </ul>
 */
public final class FitJson {
    private final JsonNodeFactory nodes = JsonNodeFactory.instance;

    public ObjectNode toJson(FitResult result) {
        ObjectNode root = nodes.objectNode();
        root.put("midband_gain_db", result.midbandGainDb().value());
        root.put("midband_gain_u_db", result.midbandGainDb().standardUncertainty());
        root.put("coverage_factor", result.coverageFactor());
        root.set("poles_hz", roots(result.poles()));
        root.set("zeros_hz", roots(result.zeros()));
        ObjectNode corner = root.putObject("lower_corner_hz");
        if (result.lowerCornerModelHz().isPresent()) {
            Estimate c = result.lowerCornerModelHz().get();
            corner.put("value", c.value());
            corner.put("u", c.standardUncertainty());
        } else {
            corner.putNull("value");
            corner.putNull("u");
        }
        root.put("order", result.order());
        root.put("residual_rms_db", result.quality().residualRmsDb());
        if (result.quality().residualRmsDeg().isPresent()) {
            root.put("residual_rms_deg", result.quality().residualRmsDeg().getAsDouble());
        } else {
            root.putNull("residual_rms_deg");
        }
        CalibrationTerm calibration = result.quality().calibration();
        ObjectNode cal = root.putObject("calibration");
        cal.put("basis", calibration.basis().word());
        cal.put("u_gain_db", calibration.gainStandardUncertaintyDb());
        if (calibration.phaseStandardUncertaintyDeg().isPresent()) {
            cal.put("u_phase_deg", calibration.phaseStandardUncertaintyDeg().getAsDouble());
        } else {
            cal.putNull("u_phase_deg");
        }
        cal.put("statement", calibration.statement());
        ArrayNode warnings = root.putArray("warnings");
        for (InputWarning warning : result.warnings()) {
            warnings.add(warning.describe());
        }
        return root;
    }

    /** The object as indented text with a final newline, as {@code --json} prints it. */
    public String write(FitResult result) {
        try {
            return new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT).writeValueAsString(toJson(result))
                    + System.lineSeparator();
        } catch (com.fasterxml.jackson.core.JsonProcessingException impossible) {
            // a tree of plain nodes always serialises; anything else is a defect here
            throw new IllegalStateException(impossible);
        }
    }

    private ArrayNode roots(List<FittedRoot> roots) {
        ArrayNode array = nodes.arrayNode();
        for (FittedRoot r : roots) {
            ObjectNode entry = array.addObject();
            if (r.status() == RootStatus.UNIDENTIFIABLE) {
                entry.putNull("re");
                entry.putNull("im");
                entry.putNull("u");
            } else {
                entry.put("re", r.realHz());
                entry.put("im", r.imaginaryHz());
                entry.put("u", r.uMagnitudeHz());
            }
        }
        return array;
    }
}
