package org.polebench.report;

import java.util.List;

/** What a Bode plot can show: measured points, a computed curve, or a shaded gain band. */
public sealed interface BodeSeries permits BodeSeries.Measured, BodeSeries.Curve, BodeSeries.GainBand {

    /** The legend's words for it. */
    String label();

    /** Measured points, drawn as markers without lines. */
    record Measured(String label, List<ResponsePoint> points) implements BodeSeries {
        public Measured {
            points = List.copyOf(points);
        }
    }

    /** A computed response (the fit, an exact prediction, an SCTC estimate), drawn as a line. */
    record Curve(String label, List<ResponsePoint> points) implements BodeSeries {
        public Curve {
            points = List.copyOf(points);
        }
    }

    /** A shaded band on the gain panel (a tolerance spread, say). */
    record GainBand(String label, List<GainBandPoint> points) implements BodeSeries {
        public GainBand {
            points = List.copyOf(points);
        }
    }
}
