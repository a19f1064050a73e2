package org.polebench.lot;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.polebench.circuit.Part;
import org.polebench.circuit.Stage;
import org.polebench.circuit.Bjt;
import org.polebench.circuit.Tolerance;
import org.polebench.circuit.Transistor;

/**
 * For each part, pools the boards' back-solved ln-factors into a lot mean and a between-board
 * spread (docs/method.md, "Systematic shifts across a lot").
 *
 * <p>Only identifiable readings of boards whose sweep the stage explains are pooled: an
 * unidentifiable one echoes its tolerance prior, so pooling k of them would count that prior k
 * times and shrink u(μ̂) towards it without any measurement behind it; and the back-solve of an
 * unexplained sweep is the closest of several wrong models, whose values are not readings of
 * the parts (those boards are in the Pareto of culprits instead). Boards far from the rest are kept apart before pooling, because the
 * DerSimonian–Laird τ̂² is a moment estimate and one decade slip among fifty boards would swell
 * it until the shift of the other 49 hid in it. The screen starts robustly, from the median and
 * the median absolute deviation (MAD × 1.4826 estimates σ of a normal population; Rousseeuw and
 * Croux, JASA 88, 1993), and keeps a board when |yᵢ − centre| ≤ 3.5·scaleᵢ (the 3.5 cut-off of
 * Iglewicz and Hoaglin's modified z-score, "How to Detect and Handle Outliers", 1993); it then
 * alternates the random-effects pool ({@link RandomEffects}) over the kept boards and the screen
 * with scaleᵢ = √(τ̂² + uᵢ²) about μ̂, until the kept set no longer changes.
 *
 * <p>A part is a lot finding when μ̂ ± 2u(μ̂) lies wholly outside its tolerance band in
 * ln(value/nominal) (the band the stage file gives; a point at 0 for a parameter without one,
 * such as the flat gain): the lot's typical part is not the part the design asked for, whatever
 * any single board shows.
 */
final class SystematicShifts {
    /** The modified z-score cut-off of Iglewicz and Hoaglin (1993). */
    static final double APART = 3.5;
    /** MAD to σ for a normal population, 1/Φ⁻¹(3/4). */
    private static final double MAD_TO_SIGMA = 1.4826;
    /** The coverage factor of the finding's interval (about 95 %). */
    static final double K = 2;
    private static final int MAX_ROUNDS = 50;
    /** The name a board's result gives the flat gain parameter (reconcile's ModelParameter label). */
    static final String GAIN = "gain";

    private SystematicShifts() {
    }

    /**
     * @param boards each board's test whose readings are pooled (one per board), in test order
     * @return one entry per part named by any board, in order of first appearance
     */
    static List<PartShift> of(List<BoardOutcome> boards, Stage stage) {
        Map<String, List<Reading>> byPart = new LinkedHashMap<>();
        for (BoardOutcome board : boards) {
            if (!board.explained()) {
                continue;
            }
            for (BoardOutcome.PartFactor f : board.parts()) {
                byPart.computeIfAbsent(f.part(), k -> new ArrayList<>()).add(new Reading(board.boardId(), f));
            }
        }
        List<PartShift> out = new ArrayList<>();
        for (Map.Entry<String, List<Reading>> e : byPart.entrySet()) {
            out.add(part(e.getKey(), e.getValue(), band(stage, e.getKey())));
        }
        return out;
    }

    private record Reading(String boardId, BoardOutcome.PartFactor factor) {
        double y() {
            return factor.lnFactor();
        }

        double u() {
            return factor.uLnFactor();
        }
    }

    private static PartShift part(String name, List<Reading> all, double[] band) {
        List<Reading> usable = all.stream().filter(r -> r.factor().identifiable() && r.u() > 0
                && Double.isFinite(r.y()) && Double.isFinite(r.u())).toList();
        if (usable.isEmpty()) {
            return new PartShift(name, all.size(), 0, Optional.empty(), band[0], band[1],
                    PartShift.Finding.TOO_FEW_READINGS, List.of());
        }
        boolean[] kept = robustStart(usable);
        PooledEstimate pooled = pool(usable, kept);
        for (int round = 0; round < MAX_ROUNDS; round++) {
            boolean[] next = new boolean[usable.size()];
            int count = 0;
            for (int i = 0; i < usable.size(); i++) {
                Reading r = usable.get(i);
                double scale = Math.sqrt(pooled.tau() * pooled.tau() + r.u() * r.u());
                next[i] = Math.abs(r.y() - pooled.mean()) <= APART * scale;
                count += next[i] ? 1 : 0;
            }
            if (count == 0 || java.util.Arrays.equals(next, kept)) {
                break;
            }
            kept = next;
            pooled = pool(usable, kept);
        }
        if (pooled.count() < PartShift.FEWEST_BOARDS) {
            // too few boards to have a lot distribution: a reading outside the band is a fault of
            // its board on its own evidence
            for (int i = 0; i < usable.size(); i++) {
                if (kept[i] && outside(usable.get(i), band)) {
                    kept[i] = false;
                }
            }
        }
        List<ApartBoard> apart = new ArrayList<>();
        for (int i = 0; i < usable.size(); i++) {
            if (!kept[i]) {
                Reading r = usable.get(i);
                apart.add(new ApartBoard(r.boardId(), r.y(), r.u(), outside(r, band)));
            }
        }
        boolean anyKept = false;
        for (boolean k : kept) {
            anyKept |= k;
        }
        if (!anyKept) {
            return new PartShift(name, all.size(), usable.size(), Optional.empty(), band[0], band[1],
                    PartShift.Finding.TOO_FEW_READINGS, apart);
        }
        pooled = pool(usable, kept);
        PartShift.Finding finding;
        if (pooled.count() < PartShift.FEWEST_BOARDS) {
            finding = PartShift.Finding.TOO_FEW_READINGS;
        } else if (pooled.mean() + K * pooled.uMean() < band[0] || pooled.mean() - K * pooled.uMean() > band[1]) {
            finding = PartShift.Finding.SYSTEMATIC;
        } else {
            finding = PartShift.Finding.WITHIN_TOLERANCE;
        }
        return new PartShift(name, all.size(), usable.size(), Optional.of(pooled), band[0], band[1], finding, apart);
    }

    private static boolean outside(Reading r, double[] band) {
        return r.y() + K * r.u() < band[0] || r.y() - K * r.u() > band[1];
    }

    /** Keeps the boards within 3.5 robust scales of the median. */
    private static boolean[] robustStart(List<Reading> usable) {
        List<Double> ys = usable.stream().map(Reading::y).sorted().toList();
        double median = Quantiles.of(ys, 0.5);
        List<Double> deviations = ys.stream().map(y -> Math.abs(y - median)).sorted().toList();
        double spread = MAD_TO_SIGMA * Quantiles.of(deviations, 0.5);
        boolean[] kept = new boolean[usable.size()];
        for (int i = 0; i < kept.length; i++) {
            Reading r = usable.get(i);
            kept[i] = Math.abs(r.y() - median) <= APART * Math.sqrt(spread * spread + r.u() * r.u());
        }
        return kept;
    }

    private static PooledEstimate pool(List<Reading> usable, boolean[] kept) {
        List<Double> y = new ArrayList<>();
        List<Double> u = new ArrayList<>();
        for (int i = 0; i < kept.length; i++) {
            if (kept[i]) {
                y.add(usable.get(i).y());
                u.add(usable.get(i).u());
            }
        }
        return RandomEffects.pool(y, u);
    }

    /**
     * @return the part's tolerance band in ln(value/nominal): a part's drawn tolerance, the bias
     *         current's tolerance for "Q1 bias", the beta-tolerance for "Q1 beta", the gain
     *         calibration's band for "gain", else the point 0
     */
    static double[] band(Stage stage, String name) {
        if (stage == null) {
            return new double[]{0, 0};
        }
        if (name.equals(GAIN) && stage.part(name).isEmpty()) {
            // the flat gain's prior is ±gainCalibrationDb (docs/method.md, "The hypotheses"), in nepers
            double half = stage.gainCalibrationDb() * Math.log(10) / 20;
            return new double[]{-half, half};
        }
        Optional<Tolerance> tolerance = stage.part(name).flatMap(Part::drawnTolerance);
        // a transistor's bias and β carry the bands the back-solve's tolerance priors use
        // (docs/method.md, "The hypotheses"): the bias its own (±20 % unless the stage says, for a
        // solved bias as for a given one), β its beta-tolerance (±50 % unless the stage says).
        // Without them a β that spreads within its band read as a lot finding on every board.
        if (tolerance.isEmpty() && name.endsWith(" bias")) {
            String id = name.substring(0, name.length() - " bias".length());
            tolerance = stage.transistors().stream().filter(t -> t.name().equals(id))
                    .map(Transistor::biasTolerance).findFirst();
        }
        if (tolerance.isEmpty() && name.endsWith(" beta")) {
            String id = name.substring(0, name.length() - " beta".length());
            tolerance = stage.part(id).filter(p -> p instanceof Bjt).flatMap(Part::drawnTolerance);
        }
        return tolerance.map(t -> new double[]{t.lnLower(), t.lnUpper()}).orElse(new double[]{0, 0});
    }
}
