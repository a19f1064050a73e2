package org.polebench.circuit;

import java.util.Locale;

/**
 * A part's tolerance band as fractions of its nominal value: {@code 5%} is
 * {@code [−0.05, +0.05]}, an aluminium electrolytic's {@code -20%/+80%} is {@code [−0.20, +0.80]}.
 * The value lies in {@code [nominal·(1 + lowerFraction), nominal·(1 + upperFraction)]}.
 *
 * <p>The back-solve works in ln-value, where a band is {@code [ln(1 + lower), ln(1 + upper)]}
 * ({@link #lnLower()}, {@link #lnUpper()}); how that band becomes a prior standard deviation is
 * the reconcile package's choice (stated in docs/method.md, "The back-solve").
 *
 * @param lowerFraction greater than −1 (a part cannot reach zero), at most {@code upperFraction}
 * @param upperFraction finite
 */
public record Tolerance(double lowerFraction, double upperFraction) {
    public Tolerance {
        if (!Double.isFinite(lowerFraction) || !Double.isFinite(upperFraction)) {
            throw new IllegalArgumentException("tolerance fractions must be finite");
        }
        if (!(lowerFraction > -1)) {
            throw new IllegalArgumentException("the lower tolerance must be above -100%, was " + lowerFraction);
        }
        if (lowerFraction > upperFraction) {
            throw new IllegalArgumentException("lower tolerance " + lowerFraction + " above upper " + upperFraction);
        }
    }

    /** @param fraction half-width, such as 0.05 for ±5 %; in [0, 1) */
    public static Tolerance symmetric(double fraction) {
        return new Tolerance(-fraction, fraction);
    }

    /** @return ln(1 + lowerFraction), the band's lower end in ln(value / nominal) */
    public double lnLower() {
        return Math.log1p(lowerFraction);
    }

    /** @return ln(1 + upperFraction), the band's upper end in ln(value / nominal) */
    public double lnUpper() {
        return Math.log1p(upperFraction);
    }

    public boolean isSymmetric() {
        return lowerFraction == -upperFraction;
    }

    /** @return as a stage file writes it: {@code ±5%} or {@code -20%/+80%} */
    public String describe() {
        if (isSymmetric()) {
            return "±" + percent(upperFraction) + "%";
        }
        return (lowerFraction < 0 ? "-" : "+") + percent(Math.abs(lowerFraction)) + "%/"
                + (upperFraction < 0 ? "-" : "+") + percent(Math.abs(upperFraction)) + "%";
    }

    private static String percent(double fraction) {
        String text = String.format(Locale.ROOT, "%.6f", fraction * 100).replaceAll("0+$", "");
        return text.endsWith(".") ? text.substring(0, text.length() - 1) : text;
    }
}
