package org.polebench.report;

import java.util.List;

/**
 * What a Bode plot can show: measured points, a computed curve, or a shaded gain band. The
 * chart tells them apart through {@link #match} with a {@link Cases}, so a new kind fails to
 * compile until it is drawn.
 */
public sealed interface BodeSeries permits BodeSeries.Measured, BodeSeries.Curve, BodeSeries.GainBand {

    /** The legend's words for it. */
    String label();

    /** @return what {@code cases} gives for this series' kind */
    <R> R match(Cases<R> cases);

    /** One method per kind of series: adding one breaks every implementation until it handles it. */
    interface Cases<R> {
        R measured(Measured measured);

        R curve(Curve curve);

        R gainBand(GainBand band);
    }

    /** Measured points, drawn as markers without lines. */
    record Measured(String label, List<ResponsePoint> points) implements BodeSeries {
        public Measured {
            points = List.copyOf(points);
        }

        @Override
        public <R> R match(Cases<R> cases) {
            return cases.measured(this);
        }
    }

    /** A computed response (the fit, an exact prediction, an SCTC estimate), drawn as a line. */
    record Curve(String label, List<ResponsePoint> points) implements BodeSeries {
        public Curve {
            points = List.copyOf(points);
        }

        @Override
        public <R> R match(Cases<R> cases) {
            return cases.curve(this);
        }
    }

    /** A shaded band on the gain panel (a tolerance spread, say). */
    record GainBand(String label, List<GainBandPoint> points) implements BodeSeries {
        public GainBand {
            points = List.copyOf(points);
        }

        @Override
        public <R> R match(Cases<R> cases) {
            return cases.gainBand(this);
        }
    }
}
