package org.polebench.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import org.apache.commons.math3.complex.Complex;
import org.polebench.analysis.FullResponse;
import org.polebench.spread.GainSpread;
import org.polebench.analysis.Prediction;
import org.polebench.circuit.Stage;
import org.polebench.spread.ResponseSpread;
import org.polebench.fit.FittedModel;
import org.polebench.reconcile.ReconcileResult;

/**
 * The curves of the report's Bode plot, sampled on one log-spaced grid across the sweep
 * ({@value #POINTS_PER_DECADE} points per decade), as the JSON object {@code curves}:
 * <ul>
 * <li>{@code frequency_hz}: the grid;</li>
 * <li>{@code fitted_gain_db}, {@code fitted_phase_deg}: the fitted rational model;</li>
 * <li>{@code nominal_gain_db}, {@code nominal_phase_deg}: the nominal stage's exact response,
 *     both bands, by the complex MNA solve ({@link FullResponse}); null where it is singular;</li>
 * <li>{@code sctc_gain_db}, {@code sctc_phase_deg}: the SCTC single-pole estimate
 *     D·s/(s + ω_SCTC), the midband gain D with one high-pass pole at the SCTC corner;</li>
 * <li>{@code band_low_db}, {@code band_high_db}: at each frequency, the central
 *     {@code band_coverage} of |H| over {@code band_boards} boards drawn across the part
 *     tolerances ({@link ResponseSpread}, the corner spread's first boards, same seed).</li>
 * </ul>
 * Phases are arg H in degrees, leads positive, as computed (the chart unwraps them).
 */
public final class ReportCurves {
    public static final int POINTS_PER_DECADE = 40;

    /** The most tolerance bands {@link #sharingBands} keeps; past it, it starts afresh. */
    static final int SHARED_BANDS = 64;

    private final JsonNodeFactory nodes = JsonNodeFactory.instance;
    private final ResponseSpread spread;
    private final Optional<Map<BandKey, GainSpread>> shared;

    public ReportCurves(ResponseSpread spread) {
        this(spread, Optional.empty());
    }

    private ReportCurves(ResponseSpread spread, Optional<Map<BandKey, GainSpread>> shared) {
        this.spread = spread;
        this.shared = shared;
    }

    /**
     * @return curves that draw the tolerance band once per stage and swept band and reuse it: a
     *         batch reconciles many boards of one stage, usually swept over one band, and the
     *         band (hundreds of boards' full responses) would otherwise cost as much as the
     *         reconcile itself. The band depends only on the stage, the grid and the spread's
     *         seeded draws, so a reused one is the same to the last bit. Safe for many threads.
     */
    public static ReportCurves sharingBands(ResponseSpread spread) {
        return new ReportCurves(spread, Optional.of(new ConcurrentHashMap<>()));
    }

    /** What a tolerance band depends on besides the spread's own settings. */
    private record BandKey(Stage stage, List<Double> grid) {
    }

    private GainSpread band(Stage stage, List<Double> grid) {
        if (shared.isEmpty()) {
            return spread.gain(stage, grid);
        }
        Map<BandKey, GainSpread> bands = shared.get();
        if (bands.size() >= SHARED_BANDS) {
            // sweeps over ever new bands: keep the memory bounded
            bands.clear();
        }
        return bands.computeIfAbsent(new BandKey(stage, List.copyOf(grid)), key -> spread.gain(key.stage(), key.grid()));
    }

    public ObjectNode of(ReconcileResult result) {
        List<Double> grid = grid(result.sweep().lowestHz(), result.sweep().highestHz());
        Prediction prediction = result.predicted().prediction();
        FittedModel fitted = result.measured().model();
        FullResponse nominal = new FullResponse(result.predicted().network());
        double d = prediction.midbandGain();
        double cornerRadPerS = prediction.sctc().cornerRadPerS();
        ObjectNode node = nodes.objectNode();
        ArrayNode frequency = node.putArray("frequency_hz");
        ArrayNode fitGain = node.putArray("fitted_gain_db");
        ArrayNode fitPhase = node.putArray("fitted_phase_deg");
        ArrayNode nomGain = node.putArray("nominal_gain_db");
        ArrayNode nomPhase = node.putArray("nominal_phase_deg");
        ArrayNode sctcGain = node.putArray("sctc_gain_db");
        ArrayNode sctcPhase = node.putArray("sctc_phase_deg");
        for (double f : grid) {
            frequency.add(f);
            Complex h = fitted.responseAt(f);
            fitGain.add(20 * Math.log10(h.abs()));
            fitPhase.add(Math.toDegrees(h.getArgument()));
            Optional<Complex> exact = nominal.atHz(f);
            if (exact.isPresent() && exact.get().abs() > 0) {
                nomGain.add(20 * Math.log10(exact.get().abs()));
                nomPhase.add(Math.toDegrees(exact.get().getArgument()));
            } else {
                nomGain.addNull();
                nomPhase.addNull();
            }
            Complex s = new Complex(0, 2 * Math.PI * f);
            Complex single = s.multiply(d).divide(s.add(cornerRadPerS));
            sctcGain.add(20 * Math.log10(single.abs()));
            sctcPhase.add(Math.toDegrees(single.getArgument()));
        }
        GainSpread band = band(result.predicted().stage(), grid);
        ArrayNode low = node.putArray("band_low_db");
        ArrayNode high = node.putArray("band_high_db");
        for (int i = 0; i < grid.size(); i++) {
            addFinite(low, band.lowDb().get(i));
            addFinite(high, band.highDb().get(i));
        }
        node.put("band_coverage", band.coverage());
        node.put("band_boards", band.boardsDrawn());
        node.put("band_boards_out_of_active_region", band.biasFailures());
        node.put("band_seed", band.seed());
        node.put("sctc_corner_hz", prediction.sctcLowerCornerHz());
        return node;
    }

    /** Log-spaced from lowHz to highHz inclusive, at least two points. */
    static List<Double> grid(double lowHz, double highHz) {
        int n = Math.max(2, (int) Math.ceil(POINTS_PER_DECADE * Math.log10(highHz / lowHz)) + 1);
        List<Double> grid = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            grid.add(i == n - 1 ? highHz : lowHz * Math.pow(highHz / lowHz, i / (double) (n - 1)));
        }
        return grid;
    }

    private static void addFinite(ArrayNode array, double value) {
        if (Double.isFinite(value)) {
            array.add(value);
        } else {
            array.addNull();
        }
    }
}
