package org.polebench.report;

import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;
import org.polebench.lot.ApartBoard;
import org.polebench.lot.Capability;
import org.polebench.lot.Culprit;
import org.polebench.lot.IndividualsChart;
import org.polebench.lot.LotDistribution;
import org.polebench.lot.LotFindings;
import org.polebench.lot.OutcomeCounts;
import org.polebench.lot.PartShift;
import org.polebench.lot.PooledEstimate;
import org.polebench.lot.PredictedBand;
import org.polebench.lot.QuantityFindings;
import org.polebench.lot.RuleBreak;
import org.polebench.units.MeasuredValueFormat;

/**
 * The sentences of a lot's findings, shared by its text summary, its JSON and its HTML page
 * (docs/method.md, "What a lot says"). Numbers go through {@link MeasuredValueFormat}.
 */
final class LotStatements {
    private LotStatements() {
    }

    /** "Lot L: 50 boards; 45 passed, 3 failed, 1 incomplete, 1 input problem: yield 90.0 % (first pass 88.0 %)." */
    static String counts(LotFindings lot) {
        OutcomeCounts c = lot.counts();
        if (c.boards() == 0) {
            return "Lot " + lot.lot() + ": no boards recorded.";
        }
        String retests = lot.tests().size() > c.boards()
                ? " (" + lot.tests().size() + " tests; a retested board counts by its last test)" : "";
        return "Lot " + lot.lot() + ": " + boards(c.boards()) + retests + "; " + c.passed() + " passed, " + c.failed()
                + " failed, " + c.incomplete() + " incomplete, " + c.inputProblems() + " with an input problem: yield "
                + MeasuredValueFormat.percent(c.yield(), 1) + " (first pass " + MeasuredValueFormat.percent(
                lot.firstPass().yield(), 1) + ").";
    }

    static String boards(int n) {
        return n + (n == 1 ? " board" : " boards");
    }

    /** The measured spread of one quantity against the predicted band. */
    static String distribution(QuantityFindings q) {
        String name = capitalised(q.quantity().words());
        if (q.distribution().isEmpty()) {
            return name + ": no board gave one.";
        }
        LotDistribution d = q.distribution().get();
        String unit = q.quantity().unit();
        PredictedBand band = q.predicted();
        StringBuilder s = new StringBuilder(name).append(": median ").append(value(d.median(), unit))
                .append(" over ").append(boards(d.boards()));
        if (d.boards() >= 2) {
            s.append(" (5 % to 95 %: ").append(value(d.q05(), unit)).append(" to ").append(value(d.q95(), unit))
                    .append(")");
        }
        if (Double.isFinite(band.low()) && Double.isFinite(band.high())) {
            s.append("; the stage predicts ").append(value(band.low(), unit)).append(" to ")
                    .append(value(band.high(), unit)).append(" (central ")
                    .append(MeasuredValueFormat.percent(band.coverage(), 0)).append(" of ").append(band.analysed())
                    .append(" boards drawn within the tolerances, seed ").append(band.seed()).append("; nominal ")
                    .append(value(band.nominal(), unit)).append("): ").append(d.insideBand()).append(" of ")
                    .append(d.boards()).append(" inside");
        } else {
            s.append("; the stage gives no predicted band");
        }
        return s.append('.').toString();
    }

    /** The individuals chart's limits and the run rules broken. */
    static String chart(IndividualsChart c) {
        String unit = c.quantity().unit();
        StringBuilder s = new StringBuilder("Individuals chart in test order: centre ").append(value(c.centre(), unit))
                .append(", limits ").append(value(c.lowerLimit(), unit)).append(" to ").append(value(c.upperLimit(), unit))
                .append(" (±3σ, σ = MR̄/1.128 = ").append(value(c.sigma(), unit)).append(")");
        if (!c.setAside().isEmpty()) {
            s.append(", from the ").append(boards(c.pointsUsed())).append(" within them (set aside, beyond the trial "
                    + "limits: ").append(c.setAside().stream().map(i -> c.points().get(i).boardId())
                    .collect(Collectors.joining(", "))).append(")");
        }
        if (c.breaks().isEmpty()) {
            return s.append("; no Western Electric rule broken.").toString();
        }
        s.append("; Western Electric rules broken: ");
        List<String> parts = c.breaks().stream().map(b -> rule(b, c)).toList();
        return s.append(String.join("; ", parts)).append('.').toString();
    }

    private static String rule(RuleBreak b, IndividualsChart c) {
        return "rule " + b.rule().number() + " (" + b.rule().words() + ") at " + b.points().stream()
                .map(i -> c.points().get(i).boardId()).collect(Collectors.joining(", "));
    }

    /** Cpk and what it rests on. */
    static String capability(Capability c) {
        String unit = c.quantity().unit();
        String against;
        if (c.oneSided()) {
            against = c.upperLimit().isPresent()
                    ? "the upper limit " + value(c.upperLimit().getAsDouble(), unit) + " only (one-sided, Cpu)"
                    : "the lower limit " + value(c.lowerLimit().getAsDouble(), unit) + " only (one-sided, Cpl)";
        } else {
            against = "the limits " + value(c.lowerLimit().getAsDouble(), unit) + " and "
                    + value(c.upperLimit().getAsDouble(), unit);
        }
        String within = c.boards() < c.allBoards() ? " within the control limits" : "";
        return "Cpk " + index(c.cpk()) + " against " + against + ", from " + boards(c.boards()) + within
                + " (σ = MR̄/1.128); Ppk " + index(c.ppk()) + " from all " + boards(c.allBoards())
                + " with their mean and standard deviation.";
    }

    /** The Pareto in one sentence. */
    static String culprits(LotFindings lot) {
        if (lot.culprits().isEmpty()) {
            return "No board failed or went unexplained: no culprits to rank.";
        }
        StringBuilder s = new StringBuilder("Most probable causes among the ").append(boards(lot.culpritBoards()))
                .append(" that failed or were not explained: ");
        List<String> bars = lot.culprits().stream().map(LotStatements::bar).toList();
        return s.append(String.join(", ", bars)).append('.').toString();
    }

    private static String bar(Culprit c) {
        return c.name() + " " + c.boards() + " (cumulative " + MeasuredValueFormat.percent(c.cumulative(), 0) + ")";
    }

    /** The statement of a systematic part: the lot finding, then the boards that read apart. */
    static String systematic(PartShift p) {
        PooledEstimate pooled = p.pooled().orElseThrow();
        StringBuilder s = new StringBuilder(p.part()).append(" reads ×").append(factor(p.factor(), p.uFactor()))
                .append(" (standard uncertainty ").append(MeasuredValueFormat.uncertainty(p.uFactor()))
                .append(") on ").append(pooled.count()).append(" of the ").append(boards(p.identifiable()))
                .append(" that identified it, outside its tolerance band ").append(band(p))
                .append(": a lot finding, such as a wrong reel or a wrong value in the bill of materials, not ")
                .append(pooled.count()).append(" single-board faults");
        s.append("; from board to board it spreads by τ = ").append(MeasuredValueFormat.fixed(pooled.tau(), 3))
                .append(" in ln(value), about ").append(MeasuredValueFormat.fixed(100 * pooled.tau(), 0)).append(" %");
        List<ApartBoard> within = p.apart().stream().filter(a -> !a.outsideTolerance()).toList();
        if (!within.isEmpty()) {
            s.append("; ").append(ids(within)).append(within.size() == 1 ? " reads" : " read")
                    .append(" within tolerance, unlike the lot");
        }
        return s.append('.').toString();
    }

    /** One board's reading far from the lot and outside tolerance. */
    static String singleBoard(PartShift p, ApartBoard a) {
        return "Board " + a.boardId() + ": " + p.part() + " reads ×" + factor(a.factor(), a.factor() * a.uLnFactor())
                + ", outside its tolerance band " + band(p) + " and apart from the rest of the lot: a fault of that board.";
    }

    /** The band as factors, "×0.80 to ×1.20", or "nominal" for a parameter without one. */
    static String band(PartShift p) {
        if (p.lnBandLow() == 0 && p.lnBandHigh() == 0) {
            return "(none given: nominal)";
        }
        return "×" + MeasuredValueFormat.fixed(Math.exp(p.lnBandLow()), 2) + " to ×"
                + MeasuredValueFormat.fixed(Math.exp(p.lnBandHigh()), 2);
    }

    private static String ids(List<ApartBoard> boards) {
        return boards.stream().map(ApartBoard::boardId).collect(Collectors.joining(", "));
    }

    /**
     * A factor on the nominal to three significant figures ("0.683", "1.00", "0.0985"): enough for
     * a part's tolerance in percent, and the uncertainty is stated beside it.
     */
    static String factor(double factor, double u) {
        if (!Double.isFinite(factor) || factor <= 0) {
            return "n/a";
        }
        return new java.math.BigDecimal(factor).round(new java.math.MathContext(3, java.math.RoundingMode.HALF_EVEN))
                .toPlainString();
    }

    static String index(double value) {
        return Double.isInfinite(value) ? "∞ (no spread)" : MeasuredValueFormat.fixed(value, 2);
    }

    /** A value in its unit: Hz with an SI prefix to four figures, dB to two decimals. */
    static String value(double v, String unit) {
        if (!Double.isFinite(v)) {
            return "n/a";
        }
        return unit.equals("dB") ? MeasuredValueFormat.fixed(v, 2) + " dB" : MeasuredValueFormat.engineering(v, unit, 4);
    }

    static String capitalised(String text) {
        return text.isEmpty() ? text : text.substring(0, 1).toUpperCase(Locale.ROOT) + text.substring(1);
    }
}
