package org.polebench.cli;

import java.io.PrintWriter;

/** The bench cautions of docs/user-guide.md ("Cautions for bench work"), shown before a sweep drives a real instrument. */
final class BenchCautions {
    private BenchCautions() {
    }

    static void print(PrintWriter err, double amplitude, double maxAmplitude, String kind, boolean scope) {
        err.println("polebench: before this sweep drives the bench (suppress with --no-cautions):");
        err.println("  - follow your local electrical-safety rules and the instrument makers' manuals first;");
        err.println("  - prefer a battery-powered or isolated stage; mains-powered instruments share protective");
        err.println("    earth through their probe grounds: never clip a ground lead to a point not at earth");
        err.println("    potential, and never defeat a protective earth;");
        err.println("  - keep every input within the instrument's rated voltage and category and within the");
        err.println(String.format(java.util.Locale.ROOT,
                "    stage's input rating: the generator will be set to %s %s (the profile allows at most %s %s);",
                amplitude, kind, maxAmplitude, kind));
        if (scope) {
            // docs/user-guide.md, "Live scope capture": the cautions for scope probes
            err.println("  - scope probes: both ground clips go to the stage's ground only; set each probe's");
            err.println("    attenuation in the scope, and keep the stage's output (its input times its gain)");
            err.println("    within the probe's and the channel's rating;");
        }
        err.println("  - discharge large electrolytic capacitors before handling the board.");
        err.flush();
    }
}
