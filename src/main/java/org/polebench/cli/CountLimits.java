package org.polebench.cli;

import org.polebench.InputLimits;
import org.polebench.InputProblem;

/**
 * The upper bounds on the counts a command line asks for ({@code --samples}, {@code --points}),
 * from the limits this JVM was started with: a mistyped 99999999 is refused at once, naming
 * the limit, instead of running out of memory later (issue 15).
 */
final class CountLimits {
    private CountLimits() {
    }

    /** @throws InputProblem when {@code --samples} asks for more boards than the limit */
    static void samples(long samples) throws InputProblem {
        long most = InputLimits.standing().maxSamples();
        if (samples > most) {
            throw new InputProblem(null, 0, "--samples " + samples + " is more than " + most
                    + ", the limit on boards drawn (" + InputLimits.MAX_SAMPLES + ")",
                    InputLimits.raise(InputLimits.MAX_SAMPLES, most, "use fewer samples (the 5 % and 95 % points "
                            + "of 10000 draws are known to about 1 %)"));
        }
    }

    /** @throws InputProblem when {@code --points} asks for more points than the limit */
    static void points(long points) throws InputProblem {
        long most = InputLimits.standing().maxPoints();
        if (points > most) {
            throw new InputProblem(null, 0, "--points " + points + " is more than " + most
                    + ", the limit on points in one sweep (" + InputLimits.MAX_POINTS + ")",
                    InputLimits.raise(InputLimits.MAX_POINTS, most, "use fewer points"));
        }
    }
}
