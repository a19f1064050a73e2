package org.polebench.bench;

import java.util.List;
import java.util.OptionalDouble;

/**
 * What a bench does to a board's measured midband gain and lower corner: the board's own, the
 * as-measured with the whole bench, and the as-measured with each element alone
 * ({@link BenchEffects}).
 *
 * @param bench    the bench weighed
 * @param own      the board alone (an ideal bench)
 * @param measured the board through the whole bench
 * @param elements each element that is not ideal, alone on an otherwise ideal bench (the
 *                 reference and the input channel's point kept), in {@link BenchElement} order
 */
public record BenchEffect(Bench bench, Response own, Response measured, List<ElementEffect> elements) {
    /** A move larger than this share of the board's own value is worth a warning (issue 13: 1 %). */
    public static final double NOTABLE_SHARE = 0.01;

    public BenchEffect {
        elements = List.copyOf(elements);
    }

    /**
     * @param midbandGain    signed, V/V
     * @param lowerCornerHz  the −3 dB lower corner in Hz; empty when there is none
     */
    public record Response(double midbandGain, OptionalDouble lowerCornerHz) {
        /** @return true when this differs from {@code reference} by more than {@link #NOTABLE_SHARE} in the corner */
        public boolean movesCornerFrom(Response reference) {
            return moved(reference.lowerCornerHz, lowerCornerHz);
        }

        /** @return true when the midband gain's magnitude differs by more than {@link #NOTABLE_SHARE} */
        public boolean movesMidbandFrom(Response reference) {
            return Math.abs(Math.abs(midbandGain) - Math.abs(reference.midbandGain))
                    > NOTABLE_SHARE * Math.abs(reference.midbandGain);
        }

        private static boolean moved(OptionalDouble from, OptionalDouble to) {
            if (from.isPresent() != to.isPresent()) {
                return true;
            }
            return from.isPresent()
                    && Math.abs(to.getAsDouble() - from.getAsDouble()) > NOTABLE_SHARE * from.getAsDouble();
        }
    }

    /** One element alone: how the board reads through an otherwise ideal bench with just it. */
    public record ElementEffect(BenchElement element, Response measured) {
    }

    /** @return true when the whole bench moves the corner or the midband gain by more than 1 % */
    public boolean notable() {
        return measured.movesCornerFrom(own) || measured.movesMidbandFrom(own);
    }
}
