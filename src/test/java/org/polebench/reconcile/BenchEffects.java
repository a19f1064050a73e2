package org.polebench.reconcile;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

/**
 * Things real benches do to a sweep that the stage's model does not know, applied to a
 * synthesized sweep for tests: the truth is the transformation itself.
 */
final class BenchEffects {
    private BenchEffects() {
    }

    /**
     * A first-order high-pass on the reading, as a scope channel's AC coupling adds:
     * H·jω/(jω + ωc), the textbook single-pole RC high-pass (closed form).
     */
    static Sweep acCoupled(Sweep sweep, double cornerHz) {
        List<SweepPoint> points = new ArrayList<>();
        for (SweepPoint point : sweep.points()) {
            double x = point.frequencyHz() / cornerHz;
            double gainDb = point.gainDb() + 10 * Math.log10(x * x / (1 + x * x));
            OptionalDouble phase = point.phaseDeg().isPresent()
                    ? OptionalDouble.of(point.phaseDeg().getAsDouble() + Math.toDegrees(Math.atan2(1, x)))
                    : OptionalDouble.empty();
            points.add(new SweepPoint(point.frequencyHz(), gainDb, phase, point.gainUncertaintyDb(),
                    point.phaseUncertaintyDeg()));
        }
        return new Sweep(sweep.source(), points);
    }

    /** Every point with its own stated standard uncertainties, as a profile's accuracy gives them. */
    static Sweep withStatedUncertainty(Sweep sweep, double gainSigmaDb, double phaseSigmaDeg) {
        List<SweepPoint> points = new ArrayList<>();
        for (SweepPoint point : sweep.points()) {
            points.add(new SweepPoint(point.frequencyHz(), point.gainDb(), point.phaseDeg(),
                    OptionalDouble.of(gainSigmaDb), point.phaseDeg().isPresent()
                    ? OptionalDouble.of(phaseSigmaDeg) : OptionalDouble.empty()));
        }
        return new Sweep(sweep.source(), points);
    }

    /**
     * The frequency and gain columns read the wrong way round, as a wrong column mapping gives:
     * the gains become frequencies (made positive and ascending, as the importer would demand
     * of them) and the frequencies gains; the phase is dropped.
     */
    static Sweep swappedColumns(Sweep sweep) {
        List<SweepPoint> points = new ArrayList<>();
        for (SweepPoint point : sweep.points()) {
            points.add(new SweepPoint(Math.abs(point.gainDb()) + 1e-3 * points.size(), point.frequencyHz(),
                    OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty()));
        }
        points.sort((a, b) -> Double.compare(a.frequencyHz(), b.frequencyHz()));
        List<SweepPoint> distinct = new ArrayList<>();
        for (SweepPoint point : points) {
            if (distinct.isEmpty() || point.frequencyHz() > distinct.get(distinct.size() - 1).frequencyHz()) {
                distinct.add(point);
            }
        }
        return new Sweep(sweep.source(), distinct);
    }
}
