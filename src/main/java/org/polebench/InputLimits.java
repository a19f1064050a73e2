package org.polebench;

import java.util.Locale;
import java.util.Properties;

/**
 * The stated limits on what polebench reads, so that a huge or hostile input is refused with a
 * message naming the limit and how to raise it instead of exhausting memory (issue 15). Each
 * has a default sized so that the work fits a 1 GB Java heap, and a system property that
 * raises or lowers it, given on the java command line
 * ({@code java -Dpolebench.max-points=40000000 -jar polebench.jar …}); the user guide lists them.
 *
 * @param maxPoints     readings kept from one sweep file, and points one command may make
 * @param maxLineChars  characters in one line of a sweep file, serial log, stage, profile or bench file
 * @param maxFileBytes  bytes in one sweep file or serial log
 * @param maxYamlBytes  bytes in one stage, profile or bench file (YAML)
 * @param maxSamples    boards one tolerance spread may draw ({@code --samples})
 */
public record InputLimits(long maxPoints, long maxLineChars, long maxFileBytes, long maxYamlBytes, long maxSamples) {
    public static final String MAX_POINTS = "polebench.max-points";
    public static final String MAX_LINE_CHARS = "polebench.max-line-chars";
    public static final String MAX_FILE_BYTES = "polebench.max-file-bytes";
    public static final String MAX_YAML_BYTES = "polebench.max-yaml-bytes";
    public static final String MAX_SAMPLES = "polebench.max-samples";

    /**
     * Sized for a 1 GB heap: a sweep point costs at most 64 bytes while it is read
     * (sweepfile's columns), so 12 million of them leave room for the rest; a table row is
     * under 100 characters and a serial-log or YAML line under 1000, so a 64 KiB line is no
     * input of ours (and the YAML scanner copies its buffer for every kilobyte of one unbroken
     * value, so its time grows with the square of a line's length: 14 s for one 1 MB value);
     * 2 GiB of rows would be about 60 million points; stage and profile files are a few
     * kilobytes; a draw of the tolerance spread keeps a few numbers per board.
     */
    public static final InputLimits DEFAULTS =
            new InputLimits(12_000_000L, 1L << 16, 1L << 30, 4L << 20, 1_000_000L);

    public InputLimits {
        if (maxPoints < 1 || maxLineChars < 1 || maxFileBytes < 1 || maxYamlBytes < 1 || maxSamples < 1) {
            throw new IllegalArgumentException("every limit must be positive");
        }
    }

    /**
     * @param properties the JVM's system properties, as the CLI reads them
     * @return the defaults, each replaced by its property when one is set
     * @throws InputProblem when a property is set to something that is not a positive whole number
     */
    public static InputLimits from(Properties properties) throws InputProblem {
        return new InputLimits(read(properties, MAX_POINTS, DEFAULTS.maxPoints),
                read(properties, MAX_LINE_CHARS, DEFAULTS.maxLineChars),
                read(properties, MAX_FILE_BYTES, DEFAULTS.maxFileBytes),
                read(properties, MAX_YAML_BYTES, DEFAULTS.maxYamlBytes),
                read(properties, MAX_SAMPLES, DEFAULTS.maxSamples));
    }

    /**
     * @return the limits this JVM was started with: {@link #from} the system properties, or the
     *         defaults when one is unreadable (the CLI checks them first and refuses a bad one
     *         with exit 2, so a library call that cannot be handed its limits still honours them)
     */
    public static InputLimits standing() {
        try {
            return from(System.getProperties());
        } catch (InputProblem unreadable) {
            return DEFAULTS;
        }
    }

    private static long read(Properties properties, String name, long fallback) throws InputProblem {
        String text = properties.getProperty(name);
        if (text == null) {
            return fallback;
        }
        try {
            long value = Long.parseLong(text.strip().replace("_", ""));
            if (value >= 1) {
                return value;
            }
        } catch (NumberFormatException e) {
            // refused below, with the property's name
        }
        throw new InputProblem(null, 0, "-D" + name + "=" + text + " is not a positive whole number",
                "give a limit such as -D" + name + "=" + fallback + " (the default)");
    }

    /** @return how to raise the limit the named property sets, for the hint of a refusal */
    public static String raise(String property, long current, String otherwise) {
        return String.format(Locale.ROOT, "%s; or raise the limit (now %d) on the java command line, such as "
                + "java -D%s=%d -Xmx4g -jar polebench.jar …", otherwise, current, property, current * 4);
    }
}
