package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Issue 12: what polebench prints and writes does not depend on the JVM's locale. {@code fit} and
 * {@code reconcile} run on the bundled demos with the default locale and again under German
 * (decimal comma, "." grouping: it shows a format without {@link Locale#ROOT} at once) or Turkish
 * (its dotless i shows a case conversion without it), and every output (text, JSON, the Bode
 * plot, every file of the test report) must be the same byte for byte, apart from the report's id
 * and date of issue, which change with the clock.
 */
class LocaleIndependenceTest {
    private static final String FIT_SAMPLE = "sample-measurements/imports/db-degrees.csv";
    private static final Pattern ID = Pattern.compile("PB-\\d{8}-[0-9A-F]{8}");
    private static final Pattern ISSUED = Pattern.compile("\\d{4}-\\d\\d-\\d\\dT\\d\\d:\\d\\d:\\d\\dZ");

    @Test
    void fitAndReconcileWriteTheSameBytesUnderAGermanLocale(@TempDir Path dir) throws IOException {
        sameUnder(new Locale("de", "DE"), dir);
    }

    // Turkish lower-cases "I" to a dotless "ı": the locale that shows a toLowerCase() without
    // Locale.ROOT (the JSON's "rule": "sımple")
    @Test
    void fitAndReconcileWriteTheSameBytesUnderATurkishLocale(@TempDir Path dir) throws IOException {
        sameUnder(new Locale("tr", "TR"), dir);
    }

    private static void sameUnder(Locale other, Path dir) throws IOException {
        Map<String, String> usual = outputs(dir.resolve("usual"));
        Locale before = Locale.getDefault();
        Map<String, String> foreign;
        try {
            Locale.setDefault(other);
            foreign = outputs(dir.resolve("other"));
        } finally {
            Locale.setDefault(before);
        }
        assertEquals(usual.keySet(), foreign.keySet());
        for (String name : usual.keySet()) {
            assertEquals(usual.get(name), foreign.get(name), name + " under " + other);
        }
    }

    /** Every output of the runs, by a name that says which, with the folder and the clock masked. */
    private static Map<String, String> outputs(Path folder) throws IOException {
        Files.createDirectories(folder);
        Map<String, String> outputs = new TreeMap<>();
        outputs.put("fit", run("fit", FIT_SAMPLE));
        outputs.put("fit --json", run("fit", FIT_SAMPLE, "--json"));
        outputs.put("reconcile", run("reconcile", "--samples", "200"));
        outputs.put("reconcile --json", run("reconcile", "--samples", "200", "--json"));
        Path plot = folder.resolve("bode.svg");
        outputs.put("fit --plot", run("fit", FIT_SAMPLE, "--plot", plot.toString()));
        outputs.put("fit --plot: bode.svg", Files.readString(plot));
        Path report = folder.resolve("report");
        outputs.put("reconcile --report", run("reconcile", "--samples", "200", "--report", report.toString()));
        try (Stream<Path> files = Files.list(report)) {
            for (Path file : (Iterable<Path>) files.sorted()::iterator) {
                // PNG charts are not asked for; every file written is text
                outputs.put("reconcile --report: " + file.getFileName(), Files.readString(file));
            }
        }
        outputs.replaceAll((name, text) -> ISSUED.matcher(ID.matcher(text.replace(folder.toString(), "<folder>"))
                .replaceAll("<id>")).replaceAll("<issued>"));
        return outputs;
    }

    private static String run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return "exit " + code + "\n" + out + "\n--- stderr\n" + err;
    }
}
