package org.polebench.report;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.time.LocalDate;
import java.time.format.DateTimeFormatter;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.Optional;
import org.polebench.spread.ResponseSpread;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.SweepPoint;
import org.polebench.reconcile.ParameterEstimate;
import org.polebench.reconcile.ReconcileResult;

/**
 * The whole reconcile result as one JSON object: what {@code reconcile --json} prints and what a
 * report writes as {@code result.json}. It is {@link ReconcileJson}'s object with, beside it,
 * everything the HTML report draws and states, so that {@code polebench report RESULT.json}
 * renders the same report from the file alone:
 * <ul>
 * <li>{@code format} ("polebench-reconcile-result") and {@code format_version}
 *     ({@value #FORMAT_VERSION}: version 2 says of every limit whether the sweep decides it,
 *     issue 11);</li>
 * <li>{@code polebench_version}, {@code stage_file}, {@code stage_sha256}, {@code sweep_file},
 *     {@code sweep_sha256}, {@code profile}, {@code import_warnings};</li>
 * <li>{@code run}: operator, board (and where the board id came from), spread samples and seed;
 *     {@code approved_by}, {@code ambient_celsius}, {@code supply_volts}, {@code test_level_volts},
 *     {@code test_level_measure}, {@code test_level_from} and {@code instruments} (each
 *     {@code identity}, {@code serial}, {@code calibration_due} as an ISO-8601 date), null or
 *     empty when not given (issue 14);</li>
 * <li>{@code sweep}: the instrument, capture time (ISO-8601 UTC), board, notes and the points;</li>
 * <li>{@code curves}: the Bode plot's curves on one frequency grid ({@link ReportCurves});</li>
 * <li>each {@code capacitors} row also gets its tolerance band, C/C_nom and the standard
 *     uncertainty of ln C ({@code u_ln}).</li>
 * </ul>
 * The object holds no time of its own making: two runs on the same input give the same bytes.
 */
public final class ResultJson {
    /** The value of {@code format}, which {@code polebench report} checks. */
    public static final String FORMAT = "polebench-reconcile-result";
    /** The value of {@code format_version}, the only one {@code polebench report} reads. */
    public static final int FORMAT_VERSION = 2;
    /** Board draws for the Bode plot's tolerance band when the spread drew more. */
    public static final int BAND_BOARDS = 200;

    private final ObjectMapper mapper = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    public ObjectNode of(ReconcileResult result, RunDetails run) {
        return of(result, run, new ReportCurves(bandSpread(run)));
    }

    /**
     * @param curves the Bode curves' maker, made with {@link #bandSpread}: one that shares its
     *               tolerance bands serves a batch of boards
     */
    public ObjectNode of(ReconcileResult result, RunDetails run, ReportCurves curves) {
        ObjectNode root = mapper.createObjectNode();
        root.put("format", FORMAT);
        root.put("format_version", FORMAT_VERSION);
        root.put("polebench_version", RunDetails.polebenchVersion());
        root.put("stage_file", run.stageFile().toString());
        root.put("stage_sha256", run.stageSha256());
        Provenance source = result.sweep().source();
        root.put("sweep_file", run.sweepFile().toString());
        root.put("sweep_sha256", source.sha256());
        root.put("profile", run.profile());
        ArrayNode importWarnings = root.putArray("import_warnings");
        run.importWarnings().forEach(importWarnings::add);
        root.setAll(new ReconcileJson().of(result));
        root.put("fit_model", result.measured().structure().describe());
        addTolerances(root.withArray("capacitors"), result.capacitors());

        ObjectNode runNode = root.putObject("run");
        putText(runNode, "operator", run.operator());
        Optional<String> board = run.board().isPresent() ? run.board() : source.board();
        putText(runNode, "board", board);
        runNode.put("board_from", run.board().isPresent() ? "command line" : source.board().isPresent() ? "sweep" : "none");
        runNode.put("spread_samples", run.samples());
        runNode.put("spread_seed", run.seed());
        identify(runNode, run.identification(), false);
        ArrayNode reportWarnings = root.putArray("report_warnings");
        if (run.board().isPresent() && source.board().isPresent() && !run.board().get().equals(source.board().get())) {
            reportWarnings.add("the sweep names board '" + source.board().get() + "' but --board says '"
                    + run.board().get() + "'; the report names the board given on the command line");
        }

        ObjectNode sweep = root.putObject("sweep");
        sweep.put("instrument", source.instrument());
        sweep.put("profile_used", source.profile());
        putText(sweep, "captured_utc", source.captured().map(t ->
                DateTimeFormatter.ISO_INSTANT.format(t.truncatedTo(ChronoUnit.SECONDS))));
        putText(sweep, "board", source.board());
        ArrayNode notes = sweep.putArray("notes");
        source.notes().forEach(notes::add);
        sweep.put("has_phase", result.sweep().hasPhase());
        ArrayNode points = sweep.putArray("points");
        for (SweepPoint p : result.sweep().points()) {
            ObjectNode row = points.addObject();
            row.put("frequency_hz", p.frequencyHz());
            row.put("gain_db", p.gainDb());
            // the fitted model's gain at this point's own frequency: the report's residual panel
            row.put("fitted_gain_db", 20 * Math.log10(result.measured().model().responseAt(p.frequencyHz()).abs()));
            if (p.phaseDeg().isPresent()) {
                row.put("phase_deg", p.phaseDeg().getAsDouble());
            } else {
                row.putNull("phase_deg");
            }
        }
        root.set("curves", curves.of(result));
        return root;
    }

    /** @return the spread of the Bode plot's tolerance band for a run of these details */
    public static ResponseSpread bandSpread(RunDetails run) {
        return bandSpread(run.samples(), run.seed());
    }

    /** @return the spread of the Bode plot's tolerance band for a predicted spread of these samples and seed */
    public static ResponseSpread bandSpread(int samples, long seed) {
        return new ResponseSpread(Math.max(20, Math.min(BAND_BOARDS, samples)), seed, ResponseSpread.DEFAULT_COVERAGE);
    }

    /** The object as indented UTF-8 text with a final newline: the bytes of {@code result.json}. */
    public String text(JsonNode root) {
        try {
            return mapper.writeValueAsString(root) + "\n";
        } catch (JsonProcessingException impossible) {
            // a tree of plain nodes always serialises; anything else is a defect here
            throw new IllegalStateException(impossible);
        }
    }

    /**
     * Sets the approver, conditions and instruments given on a report's command line into a result
     * read back, leaving what the file holds where an option was not given (a list of instruments
     * given replaces the file's).
     *
     * @param root a result object, as {@link ResultFile} reads it
     */
    public void identify(ObjectNode root, Identification given) {
        JsonNode run = root.path("run");
        identify(run.isObject() ? (ObjectNode) run : root.putObject("run"), given, true);
    }

    /** @param onlyGiven leave a field alone when it is not given, rather than writing null */
    private static void identify(ObjectNode run, Identification given, boolean onlyGiven) {
        if (given.approvedBy().isPresent() || !onlyGiven) {
            putText(run, "approved_by", given.approvedBy());
        }
        if (given.ambientCelsius().isPresent()) {
            run.put("ambient_celsius", given.ambientCelsius().getAsDouble());
        } else if (!onlyGiven) {
            run.putNull("ambient_celsius");
        }
        if (given.supplyVolts().isPresent()) {
            run.put("supply_volts", given.supplyVolts().getAsDouble());
        } else if (!onlyGiven) {
            run.putNull("supply_volts");
        }
        if (given.testLevel().isPresent() || !onlyGiven) {
            if (given.testLevel().isPresent()) {
                run.put("test_level_volts", given.testLevel().get().volts());
            } else {
                run.putNull("test_level_volts");
            }
            putText(run, "test_level_measure", given.testLevel().flatMap(TestLevel::measure));
            putText(run, "test_level_from", given.testLevel().map(TestLevel::from));
        }
        if (!given.instruments().isEmpty() || !onlyGiven) {
            ArrayNode list = run.putArray("instruments");
            for (Instrument instrument : given.instruments()) {
                ObjectNode row = list.addObject();
                row.put("identity", instrument.identity());
                putText(row, "serial", instrument.serial());
                putText(row, "calibration_due", instrument.calibrationDue().map(LocalDate::toString));
            }
        }
    }

    private static void addTolerances(ArrayNode rows, List<ParameterEstimate> capacitors) {
        for (int i = 0; i < rows.size() && i < capacitors.size(); i++) {
            ObjectNode row = (ObjectNode) rows.get(i);
            ParameterEstimate estimate = capacitors.get(i);
            row.put("factor", estimate.factor());
            row.put("u_ln", estimate.logUncertainty());
            if (estimate.parameter().tolerance().isPresent()) {
                var tolerance = estimate.parameter().tolerance().get();
                double nominal = estimate.parameter().nominal();
                row.put("tolerance", tolerance.describe());
                row.put("min_farads", nominal * (1 + tolerance.lowerFraction()));
                row.put("max_farads", nominal * (1 + tolerance.upperFraction()));
                row.put("within_tolerance", estimate.factor() >= 1 + tolerance.lowerFraction()
                        && estimate.factor() <= 1 + tolerance.upperFraction());
            } else {
                row.putNull("tolerance");
                row.putNull("min_farads");
                row.putNull("max_farads");
                row.putNull("within_tolerance");
            }
        }
    }

    private static void putText(ObjectNode node, String key, Optional<String> value) {
        if (value.isPresent()) {
            node.put(key, value.get());
        } else {
            node.putNull(key);
        }
    }
}
