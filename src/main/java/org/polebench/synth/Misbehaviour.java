package org.polebench.synth;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.polebench.InputProblem;
import org.polebench.units.EngineeringValue;
import org.polebench.units.Quantity;

/**
 * A fault the {@link InstrumentSimulator} commits on request, to test a capture's handling
 * of a bad line: at the {@code step}-th frequency command it receives (counting from 1,
 * repeats included; for a streaming profile, at the {@code step}-th point it streams), it
 * drops the next answer, sends garbage instead, stalls before it, or closes the port. Each
 * fires once.
 *
 * @param kind    what goes wrong
 * @param step    when, counted from 1
 * @param stallMs how long a stall lasts, in ms; 0 for the other kinds
 */
public record Misbehaviour(Kind kind, int step, long stallMs) {
    private static final Pattern TEXT = Pattern.compile("(?<kind>[a-z-]+)@(?<step>\\d+)(?:=(?<time>.+))?");

    public Misbehaviour {
        if (step < 1) {
            throw new IllegalArgumentException("a misbehaviour's step counts from 1");
        }
        if (stallMs < 0 || kind == Kind.STALL && stallMs == 0) {
            throw new IllegalArgumentException("a stall needs a positive time");
        }
    }

    /** What the simulator does wrong. */
    public enum Kind {
        /** The next answer is never sent. */
        DROP("drop"),
        /** The next answer is replaced by unreadable text. */
        GARBAGE("garbage"),
        /** The next answer comes late, after the stall. */
        STALL("stall"),
        /** The port is closed at once, as if the instrument were switched off. */
        CLOSE("close");

        private final String word;

        Kind(String word) {
            this.word = word;
        }

        public String word() {
            return word;
        }
    }

    /**
     * Reads {@code drop@5}, {@code garbage@9}, {@code stall@12=4s} or {@code close@20}.
     *
     * @throws InputProblem when the text is none of these
     */
    public static Misbehaviour parse(String text) throws InputProblem {
        Matcher m = TEXT.matcher(text.strip().toLowerCase(Locale.ROOT));
        String usage = "write drop@N, garbage@N, stall@N=TIME (such as stall@3=5s) or close@N, N counting "
                + "frequency commands from 1";
        if (!m.matches()) {
            throw new InputProblem(null, 0, "'" + text + "' is not a misbehaviour", usage);
        }
        Kind kind = null;
        for (Kind k : Kind.values()) {
            if (k.word.equals(m.group("kind"))) {
                kind = k;
            }
        }
        if (kind == null) {
            throw new InputProblem(null, 0, "'" + m.group("kind") + "' is not a misbehaviour", usage);
        }
        int step;
        try {
            step = Integer.parseInt(m.group("step"));
        } catch (NumberFormatException e) {
            throw new InputProblem(null, 0, "'" + text + "' has no usable step number", usage);
        }
        long stallMs = 0;
        if (kind == Kind.STALL) {
            if (m.group("time") == null) {
                throw new InputProblem(null, 0, "'" + text + "' says how long to stall", usage);
            }
            double seconds;
            try {
                seconds = EngineeringValue.parse(m.group("time"), Quantity.SECONDS);
            } catch (IllegalArgumentException e) {
                throw new InputProblem(null, 0, "'" + m.group("time") + "' is not a time", usage);
            }
            stallMs = Math.round(seconds * 1000);
        } else if (m.group("time") != null) {
            throw new InputProblem(null, 0, "only a stall takes a time: '" + text + "'", usage);
        }
        if (step < 1 || kind == Kind.STALL && stallMs <= 0) {
            throw new InputProblem(null, 0, "'" + text + "' is out of range", usage);
        }
        return new Misbehaviour(kind, step, stallMs);
    }

    @Override
    public String toString() {
        return kind.word + "@" + step + (kind == Kind.STALL ? "=" + stallMs + "ms" : "");
    }
}
