package org.polebench.lot;

import java.util.List;
import java.util.Optional;

/**
 * One part across a lot: the pooled estimate of its back-solved ln-factor over the boards that
 * identified it (docs/method.md, "Systematic shifts across a lot"), the boards kept apart, and
 * whether the lot as a whole reads outside the part's tolerance.
 *
 * @param part         the part's name as the boards' results give it
 * @param readings     boards whose sweep the stage explains that gave a reading of the part,
 *                     identifiable or not
 * @param identifiable boards whose reading the sweep determined; only these are pooled
 * @param pooled       the random-effects estimate over the identifiable boards not kept apart;
 *                     empty when there were none
 * @param lnBandLow    the lower end of the part's tolerance band in ln(value/nominal); 0 when the
 *                     stage gives the part no band
 * @param lnBandHigh   the upper end
 * @param finding      what the lot says of the part
 * @param apart        identifiable boards whose reading lies far from the lot's, in test order
 */
public record PartShift(String part, int readings, int identifiable, Optional<PooledEstimate> pooled,
                        double lnBandLow, double lnBandHigh, Finding finding, List<ApartBoard> apart) {
    /** Fewest identifiable boards a lot finding rests on. */
    public static final int FEWEST_BOARDS = 3;

    public PartShift {
        apart = List.copyOf(apart);
    }

    /** What the lot says of one part. */
    public enum Finding {
        /** The lot mean ± 2u lies wholly outside the part's tolerance band: a lot finding. */
        SYSTEMATIC,
        /** The lot mean is within, or not distinguishable from, the tolerance band. */
        WITHIN_TOLERANCE,
        /** Fewer than {@link #FEWEST_BOARDS} boards identified the part. */
        TOO_FEW_READINGS
    }

    /** @return the pooled lot mean as a factor on the nominal value, exp(μ̂); NaN when not pooled */
    public double factor() {
        return pooled.map(p -> Math.exp(p.mean())).orElse(Double.NaN);
    }

    /** @return the standard uncertainty of {@link #factor()}, exp(μ̂)·u(μ̂) to first order */
    public double uFactor() {
        return pooled.map(p -> Math.exp(p.mean()) * p.uMean()).orElse(Double.NaN);
    }

    /** @return boards pooled into the lot estimate */
    public int boardsPooled() {
        return pooled.map(PooledEstimate::count).orElse(0);
    }

    /** @return the boards kept apart whose own reading lies outside the tolerance band */
    public List<ApartBoard> singleBoardFaults() {
        return apart.stream().filter(ApartBoard::outsideTolerance).toList();
    }
}
