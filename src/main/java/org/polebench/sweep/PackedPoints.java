package org.polebench.sweep;

import java.util.AbstractList;
import java.util.Arrays;
import java.util.List;
import java.util.OptionalDouble;
import java.util.RandomAccess;

/**
 * A sweep's points held as columns of doubles: three doubles a point with phase, two without,
 * and the uncertainty columns only when some point states one. A list of {@link SweepPoint}
 * records costs about 70 bytes a point (a record, a boxed phase, a reference); a
 * 10-million-point import needs this form to fit a 1 GB heap (issue 15). Reading a point makes
 * its record on demand. Unmodifiable; equal to any list of the same points.
 */
public final class PackedPoints extends AbstractList<SweepPoint> implements RandomAccess {
    private final double[] frequencyHz;
    private final double[] gainDb;
    private final double[] phaseDeg;
    private final double[] gainUncertaintyDb;
    private final double[] phaseUncertaintyDeg;

    private PackedPoints(double[] frequencyHz, double[] gainDb, double[] phaseDeg, double[] gainUncertaintyDb,
                         double[] phaseUncertaintyDeg) {
        this.frequencyHz = frequencyHz;
        this.gainDb = gainDb;
        this.phaseDeg = phaseDeg;
        this.gainUncertaintyDb = gainUncertaintyDb;
        this.phaseUncertaintyDeg = phaseUncertaintyDeg;
    }

    /** @return the same points packed; a packed list is returned as it is */
    public static PackedPoints of(List<SweepPoint> points) {
        if (points instanceof PackedPoints packed) {
            return packed;
        }
        int n = points.size();
        double[] f = new double[n];
        double[] g = new double[n];
        boolean phase = n > 0 && points.get(0).hasPhase();
        double[] p = phase ? new double[n] : null;
        double[] ug = new double[n];
        double[] up = new double[n];
        boolean anyUg = false;
        boolean anyUp = false;
        for (int i = 0; i < n; i++) {
            SweepPoint point = points.get(i);
            if (point.hasPhase() != phase) {
                throw new IllegalArgumentException("point " + i + " differs from point 0 in having a phase");
            }
            f[i] = point.frequencyHz();
            g[i] = point.gainDb();
            if (phase) {
                p[i] = point.phaseDeg().getAsDouble();
            }
            ug[i] = point.gainUncertaintyDb().orElse(Double.NaN);
            up[i] = point.phaseUncertaintyDeg().orElse(Double.NaN);
            anyUg |= point.gainUncertaintyDb().isPresent();
            anyUp |= point.phaseUncertaintyDeg().isPresent();
        }
        return new PackedPoints(f, g, p, anyUg ? ug : null, anyUp ? up : null);
    }

    /**
     * Takes over the caller's arrays without copying them, so that a large import needs no
     * second copy; the caller hands over arrays it no longer uses. NaN in an uncertainty column
     * means the point states none.
     *
     * @param phaseDeg            null for a magnitude-only sweep
     * @param gainUncertaintyDb   null when no point states one
     * @param phaseUncertaintyDeg null when no point states one
     * @throws IllegalArgumentException when the columns differ in length or hold a value no
     *                                  {@link SweepPoint} may hold
     */
    public static PackedPoints adopt(double[] frequencyHz, double[] gainDb, double[] phaseDeg,
                                     double[] gainUncertaintyDb, double[] phaseUncertaintyDeg) {
        int n = frequencyHz.length;
        for (double[] column : new double[][] {gainDb, phaseDeg, gainUncertaintyDb, phaseUncertaintyDeg}) {
            if (column != null && column.length != n) {
                throw new IllegalArgumentException("columns of " + n + " and " + column.length + " points");
            }
        }
        for (int i = 0; i < n; i++) {
            if (!(frequencyHz[i] > 0) || !Double.isFinite(frequencyHz[i])) {
                throw new IllegalArgumentException("frequency must be positive and finite, was " + frequencyHz[i]);
            }
            if (!Double.isFinite(gainDb[i])) {
                throw new IllegalArgumentException("gain must be finite, was " + gainDb[i]);
            }
            if (phaseDeg != null && !Double.isFinite(phaseDeg[i])) {
                throw new IllegalArgumentException("phase must be finite, was " + phaseDeg[i]);
            }
        }
        return new PackedPoints(frequencyHz, gainDb, phaseDeg, gainUncertaintyDb, phaseUncertaintyDeg);
    }

    @Override
    public SweepPoint get(int index) {
        return new SweepPoint(frequencyHz[index], gainDb[index],
                phaseDeg == null ? OptionalDouble.empty() : OptionalDouble.of(phaseDeg[index]),
                optional(gainUncertaintyDb, index), optional(phaseUncertaintyDeg, index));
    }

    private static OptionalDouble optional(double[] column, int index) {
        if (column == null || Double.isNaN(column[index])) {
            return OptionalDouble.empty();
        }
        return OptionalDouble.of(column[index]);
    }

    @Override
    public int size() {
        return frequencyHz.length;
    }

    /** @return point {@code index}'s frequency in Hz, without making its record */
    public double frequencyHz(int index) {
        return frequencyHz[index];
    }

    /** @return point {@code index}'s gain in dB, without making its record */
    public double gainDb(int index) {
        return gainDb[index];
    }

    /** @return whether the points carry a phase */
    public boolean hasPhase() {
        return phaseDeg != null;
    }

    @Override
    public boolean equals(Object other) {
        if (other instanceof PackedPoints packed) {
            return Arrays.equals(frequencyHz, packed.frequencyHz) && Arrays.equals(gainDb, packed.gainDb)
                    && Arrays.equals(phaseDeg, packed.phaseDeg)
                    && sameUncertainties(gainUncertaintyDb, packed.gainUncertaintyDb, size())
                    && sameUncertainties(phaseUncertaintyDeg, packed.phaseUncertaintyDeg, size());
        }
        return super.equals(other);
    }

    private static boolean sameUncertainties(double[] a, double[] b, int n) {
        for (int i = 0; i < n; i++) {
            double x = a == null ? Double.NaN : a[i];
            double y = b == null ? Double.NaN : b[i];
            if (Double.compare(x, y) != 0) {
                return false;
            }
        }
        return true;
    }

    @Override
    public int hashCode() {
        return super.hashCode();
    }
}
