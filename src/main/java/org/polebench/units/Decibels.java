package org.polebench.units;

/** Voltage-ratio decibels: 20·log10 of an amplitude ratio (IEC 60027-3). */
public final class Decibels {
    /** One decibel of amplitude ratio in nepers: ln(10)/20 ≈ 0.1151 (IEC 60027-3). */
    public static final double NEPERS_PER_DB = Math.log(10) / 20;

    private Decibels() {
    }

    public static double fromRatio(double amplitudeRatio) {
        return 20 * Math.log10(Math.abs(amplitudeRatio));
    }

    public static double toRatio(double gainDb) {
        return Math.pow(10, gainDb / 20);
    }

    public static double toNepers(double gainDb) {
        return gainDb * NEPERS_PER_DB;
    }

    public static double fromNepers(double nepers) {
        return nepers / NEPERS_PER_DB;
    }
}
