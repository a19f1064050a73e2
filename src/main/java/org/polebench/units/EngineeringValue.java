package org.polebench.units;

import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads and writes values in engineering notation with SI prefixes (BIPM, The International
 * System of Units, 9th edition, 2019, table 7): {@code 4.7u}, {@code 4u7} (the prefix as the
 * decimal mark, IEC 60062 style), {@code 4.7 µF}, {@code 10k}, {@code 2.2M}, {@code 100n}.
 * {@code M} is mega and {@code m} milli, as in SI; {@code u} and {@code µ} are micro.
 *
 * <p>Parsing is strict: the whole text must be consumed. {@link Double#parseDouble} alone is
 * not used on user text because it accepts {@code NaN}, {@code Infinity}, hex and trailing
 * {@code d}/{@code f}.
 */
public final class EngineeringValue {

    private static final String DECIMAL = "[+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?";
    private static final Pattern PLAIN = Pattern.compile("(" + DECIMAL + ")\\s*(.*)");
    // 4u7, 4k7, 2M2, 4R7 (R for ohms): the prefix letter stands where the decimal mark would.
    // 4,7u or 4,7 µF: a decimal comma, which would otherwise read as 4 followed by a bad unit
    private static final Pattern DECIMAL_COMMA = Pattern.compile("([+-]?\\d+),(\\d+)(\\s*\\D*)");
    private static final Pattern INFIX = Pattern.compile("([+-]?\\d+)([pnuµμmkKMGR])(\\d+)\\s*(.*)");

    private EngineeringValue() {
    }

    /**
     * @param text     what the user wrote, such as {@code "4.7 µF"}
     * @param quantity what the value stands for; its unit symbol may follow the number
     * @return the value in the base SI unit (farads, ohms, hertz, …)
     * @throws IllegalArgumentException with a message fit to show the user when the text is
     *         not a finite number in engineering notation for this quantity
     */
    public static double parse(String text, Quantity quantity) {
        return read(text, quantity).value();
    }

    /**
     * A value as the user wrote it.
     *
     * @param value  in the base SI unit (farads, ohms, hertz, …)
     * @param prefix the SI prefix letter written ({@code "m"} in {@code 4.7mF}), empty when none
     * @param unit   the unit symbol written ({@code "F"}), empty when none
     */
    public record Written(double value, String prefix, String unit) {
        /** @return true when the prefix is milli ({@code 4.7mF}), which some write meaning micro */
        public boolean milli() {
            return prefix.equals("m");
        }

        /** @return true when neither a prefix nor a unit follows the number, as in {@code 4.7} */
        public boolean bare() {
            return prefix.isEmpty() && unit.isEmpty();
        }
    }

    /**
     * Like {@link #parse(String, Quantity)}, keeping the prefix and unit written, so that a
     * reader can refuse a bare capacitor value or warn about {@code mF}.
     */
    public static Written read(String text, Quantity quantity) {
        if (text == null || text.isBlank()) {
            throw new IllegalArgumentException("no value given");
        }
        // what polebench prints (U+2212) reads back
        String trimmed = text.strip().replace(MeasuredValueFormat.MINUS, "-");
        Matcher infix = INFIX.matcher(trimmed);
        if (infix.matches()) {
            String letter = infix.group(2);
            double scale = letter.equals("R")
                    ? (quantity == Quantity.OHMS ? 1.0 : Double.NaN)
                    : prefixScale(letter.charAt(0));
            if (!Double.isNaN(scale)) {
                double mantissa = Double.parseDouble(infix.group(1) + "." + infix.group(3));
                String unit = checkUnit(infix.group(4), quantity, trimmed);
                return new Written(finite(mantissa * scale, trimmed), letter.equals("R") ? "" : letter,
                        letter.equals("R") ? "R" : unit);
            }
        }
        Matcher comma = DECIMAL_COMMA.matcher(trimmed);
        if (comma.matches()) {
            // 4,7u: Double.parseDouble would stop at the comma and the rest would read as a unit
            throw new IllegalArgumentException("'" + trimmed + "' has a comma in the number, which is read with a decimal point: "
                    + "write " + comma.group(1) + "." + comma.group(2) + comma.group(3).strip() + " (and no thousands separator)");
        }
        Matcher plain = PLAIN.matcher(trimmed);
        if (!plain.matches()) {
            throw new IllegalArgumentException("'" + trimmed + "' does not start with a number");
        }
        double number = Double.parseDouble(plain.group(1));
        String rest = plain.group(2).strip();
        if (rest.isEmpty()) {
            return new Written(finite(number, trimmed), "", "");
        }
        String unit = matchUnit(rest, quantity);
        if (unit != null && rest.equals(unit)) {
            return new Written(finite(number, trimmed), "", unit);
        }
        String beforeUnit = unit == null ? rest : rest.substring(0, rest.length() - unit.length()).strip();
        if (beforeUnit.length() == 1) {
            char letter = beforeUnit.charAt(0);
            // 'K' is kelvin for temperatures, never a prefix there
            if (!(quantity == Quantity.KELVIN && letter == 'K')) {
                double scale = prefixScale(letter);
                if (!Double.isNaN(scale)) {
                    return new Written(finite(number * scale, trimmed), beforeUnit, unit == null ? "" : unit);
                }
            }
        }
        throw new IllegalArgumentException("'" + trimmed + "': cannot read '" + rest + "' as "
                + describeExpected(quantity));
    }

    /**
     * A capacitor's value, which must say its scale: a bare {@code 4.7} is refused, since 4.7 F
     * is almost never meant, while {@code 4.7u}, {@code 4u7}, {@code 100nF} and {@code 4.7F}
     * are read; a bare {@code 0} is zero in any unit.
     *
     * @throws IllegalArgumentException as {@link #parse(String, Quantity)}, and for a bare number
     */
    public static Written capacitance(String text) {
        Written written = read(text, Quantity.FARADS);
        if (written.bare() && written.value() != 0) {
            throw new IllegalArgumentException("'" + text.strip() + "' has neither a prefix nor the unit F");
        }
        return written;
    }

    /** Like {@link #parse(String, Quantity)} for a dimensionless number, such as a β of 200. */
    public static double parseNumber(String text) {
        return parse(text, Quantity.DIMENSIONLESS);
    }

    /**
     * Formats with three significant digits and an SI prefix: {@code 4.7e-6, "F"} gives
     * {@code "4.7 µF"}; zero gives {@code "0 F"}; non-finite values print as they are.
     */
    public static String format(double value, String unitSymbol) {
        return format(value, unitSymbol, 3);
    }

    /**
     * @param significant significant digits, 1 to 15
     * @see MeasuredValueFormat#engineering the one implementation: U+2212 for a minus, no negative zero
     */
    public static String format(double value, String unitSymbol, int significant) {
        return MeasuredValueFormat.engineering(value, unitSymbol, significant);
    }

    /** @return the SI prefix's factor, or NaN when the character is no prefix */
    private static double prefixScale(char prefix) {
        switch (prefix) {
            case 'f': return 1e-15;
            case 'p': return 1e-12;
            case 'n': return 1e-9;
            case 'u': case 'µ': case 'μ': return 1e-6;
            case 'm': return 1e-3;
            case 'k': case 'K': return 1e3;
            case 'M': return 1e6;
            case 'G': return 1e9;
            case 'T': return 1e12;
            default: return Double.NaN;
        }
    }

    private static String matchUnit(String rest, Quantity quantity) {
        String best = null;
        for (String symbol : quantity.acceptedSymbols()) {
            if (rest.endsWith(symbol) && (best == null || symbol.length() > best.length())) {
                best = symbol;
            }
        }
        return best;
    }

    /** @return the unit written after an infix value, empty when none */
    private static String checkUnit(String rest, Quantity quantity, String whole) {
        String unit = rest.strip();
        if (!unit.isEmpty() && !quantity.acceptedSymbols().contains(unit)) {
            throw new IllegalArgumentException("'" + whole + "': cannot read '" + unit + "' as "
                    + describeExpected(quantity));
        }
        return unit;
    }

    private static String describeExpected(Quantity quantity) {
        if (quantity.acceptedSymbols().isEmpty()) {
            return "an SI prefix (p n u µ m k M G)";
        }
        return "an SI prefix (p n u µ m k M G) and/or the unit " + String.join(" or ", quantity.acceptedSymbols());
    }

    private static double finite(double value, String whole) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("'" + whole + "' is out of range");
        }
        return value;
    }
}
