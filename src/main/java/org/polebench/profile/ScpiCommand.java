package org.polebench.profile;

import java.util.Locale;
import com.google.re2j.Matcher;
import com.google.re2j.Pattern;

/**
 * One command of a SCPI exchange, as a template. Placeholders are {@code {frequency_nr3}} and
 * {@code {amplitude_nr3}}, sent as NR3 numbers ({@code 1.000000E+03}; IEEE 488.2 §7.7.2.2,
 * from memory), never with a suffix: SCPI reads {@code M} as milli except in MHZ and MOHM.
 *
 * @param instrument the instrument it goes to, as named in the profile
 * @param template   the command text with placeholders
 * @param role       what it does
 */
public record ScpiCommand(String instrument, String template, CommandRole role) {
    static final String FREQUENCY = "{frequency_nr3}";
    public static final String AMPLITUDE = "{amplitude_nr3}";
    // NR1, NR2 or NR3 (IEEE 488.2 §7.7.2): what a device may send back for a number we sent
    private static final String NUMBER = "[+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?";

    public ScpiCommand {
        if (template == null || template.isBlank()) {
            throw new IllegalArgumentException("a command needs text");
        }
        if (role == CommandRole.SETS_FREQUENCY && !template.contains(FREQUENCY)) {
            throw new IllegalArgumentException("a frequency command needs " + FREQUENCY);
        }
        if (role == CommandRole.SETS_AMPLITUDE && !template.contains(AMPLITUDE)) {
            throw new IllegalArgumentException("an amplitude command needs " + AMPLITUDE);
        }
    }

    /** @return the command to send, numbers in NR3 */
    public String render(double frequencyHz, double amplitude) {
        return template.replace(FREQUENCY, nr3(frequencyHz)).replace(AMPLITUDE, nr3(amplitude));
    }

    /** @return the number in NR3 form with 7 significant digits, such as {@code 1.234500E+03} */
    public static String nr3(double value) {
        return String.format(Locale.ROOT, "%.6E", value);
    }

    /**
     * A pattern that recognises this command in a log: blanks may be any run of blanks,
     * letters match in either case (SCPI headers are case-insensitive, SCPI-99 vol. 1 §6.1),
     * and each placeholder is one captured number (group "value").
     */
    public Pattern logPattern() {
        StringBuilder regex = new StringBuilder("(?i)");
        String text = template.strip();
        int i = 0;
        while (i < text.length()) {
            if (text.startsWith(FREQUENCY, i) || text.startsWith(AMPLITUDE, i)) {
                regex.append("(?<value>").append(NUMBER).append(')');
                i += FREQUENCY.length();
                continue;
            }
            char c = text.charAt(i);
            if (Character.isWhitespace(c)) {
                regex.append("\\s+");
                while (i < text.length() && Character.isWhitespace(text.charAt(i))) {
                    i++;
                }
                continue;
            }
            regex.append(Pattern.quote(String.valueOf(c)));
            i++;
        }
        return Pattern.compile(regex.toString());
    }

    /** @return the number in a logged command matched by {@link #logPattern()}, or NaN */
    public static double argumentOf(Matcher matched) {
        try {
            return Double.parseDouble(matched.group("value"));
        } catch (IllegalArgumentException e) {
            return Double.NaN;
        }
    }
}
