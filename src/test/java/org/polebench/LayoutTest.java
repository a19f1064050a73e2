package org.polebench;

import static java.util.Map.entry;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * The package layout of docs/contributing.md, "Layout": every main source file uses only the
 * polebench packages its own package may use, so dependencies run one way. A plain scan of
 * {@code import org.polebench.x…} lines and of fully qualified {@code org.polebench.x.Type} uses
 * in code (comments left out); the table below is the one in docs/contributing.md and in each
 * {@code package-info.java}.
 */
class LayoutTest {
    private static final Path MAIN = Path.of("src", "main", "java", "org", "polebench");

    /** Package → the polebench packages it may use (the root package is usable by all). */
    private static final Map<String, Set<String>> MAY_USE = Map.ofEntries(
            entry("units", Set.of()),
            entry("yaml", Set.of()),
            entry("linalg", Set.of()),
            entry("circuit", Set.of("units", "yaml", "linalg")),
            entry("analysis", Set.of("units", "linalg", "circuit")),
            entry("spread", Set.of("units", "circuit", "analysis")),
            entry("bench", Set.of("units", "yaml", "circuit", "analysis")),
            entry("sweep", Set.of()),
            entry("profile", Set.of("units", "yaml", "sweep", "bench")),
            entry("waveform", Set.of("units", "yaml", "sweep", "profile")),
            entry("sweepfile", Set.of("units", "sweep", "profile", "waveform")),
            entry("capture", Set.of("units", "sweep", "profile", "sweepfile", "waveform")),
            entry("synth", Set.of("units", "circuit", "analysis", "bench", "sweep", "profile", "capture", "waveform")),
            entry("fit", Set.of("units", "linalg", "sweep")),
            entry("reconcile", Set.of("units", "linalg", "circuit", "analysis", "spread", "bench", "sweep", "fit")),
            entry("lot", Set.of("units", "circuit", "analysis", "spread", "bench", "sweep", "fit", "reconcile")),
            entry("ledger", Set.of("units", "circuit", "analysis", "spread", "bench", "sweep", "profile", "sweepfile",
                    "fit", "reconcile", "lot")),
            entry("report", Set.of("units", "circuit", "analysis", "spread", "bench", "sweep", "fit", "reconcile",
                    "lot", "ledger")),
            entry("cli", Set.of("units", "yaml", "linalg", "circuit", "analysis", "spread", "bench", "sweep", "profile",
                    "sweepfile", "capture", "synth", "fit", "reconcile", "report", "waveform", "lot", "ledger")));

    private static final Pattern IMPORT = Pattern.compile("^import\\s+(?:static\\s+)?org\\.polebench\\.([a-z]\\w*)\\.");
    private static final Pattern QUALIFIED = Pattern.compile("\\borg\\.polebench\\.([a-z]\\w*)\\.[A-Z]");
    // unrolled loops (Friedl, Mastering Regular Expressions, 3rd ed., 6.7): java.util.regex
    // recurses once per repetition of a group, so "(?:a|b)*" overflows the stack on a long
    // string or comment, where a possessive character class does not
    private static final Pattern BLOCK_COMMENT = Pattern.compile("/\\*[^*]*+\\*++(?:[^/*][^*]*+\\*++)*+/");
    private static final Pattern STRING = Pattern.compile("\"[^\"\\\\\n]*+(?:\\\\.[^\"\\\\\n]*+)*+\"");

    @Test
    void everyMainFileUsesOnlyThePackagesItsPackageMayUse() throws IOException {
        List<String> violations = new ArrayList<>();
        for (Path file : mainSources()) {
            String pkg = MAIN.relativize(file).getName(0).toString();
            if (file.getParent().equals(MAIN)) {
                continue;   // the root package: InputProblem, InputWarning and OutputFile, which use none
            }
            violations.addAll(violations(pkg, MAIN.relativize(file).toString(),
                    Files.readString(file, StandardCharsets.UTF_8)));
        }
        assertEquals(List.of(), violations, "uses that docs/contributing.md, \"Layout\" does not allow");
    }

    @Test
    void everyPackageIsInTheTableAndItsPackageInfoNamesWhatItMayUse() throws IOException {
        Set<String> packages;
        try (Stream<Path> dirs = Files.list(MAIN)) {
            packages = dirs.filter(Files::isDirectory).map(p -> p.getFileName().toString())
                    .collect(Collectors.toCollection(TreeSet::new));
        }
        assertEquals(new TreeSet<>(MAY_USE.keySet()), packages, "a package missing from the layout table, or a stale row");
        for (String pkg : packages) {
            Path info = MAIN.resolve(pkg).resolve("package-info.java");
            assertTrue(Files.exists(info), pkg + " has no package-info.java saying what it owns and uses");
            String text = Files.readString(info, StandardCharsets.UTF_8);
            for (String used : MAY_USE.get(pkg)) {
                if (!pkg.equals("cli")) {   // cli's says it may use every package
                    assertTrue(Pattern.compile("\\b" + used + "\\b").matcher(text).find(),
                            pkg + "/package-info.java does not name " + used + ", which the layout lets it use");
                }
            }
        }
    }

    @Test
    void aForbiddenImportIsNamedWithItsFileAndLine() {
        // a synthetic source, so that the scan is seen to fail: units may use no other package
        String source = "package org.polebench.units;\n\nimport java.util.List;\nimport org.polebench.circuit.Stage;\n"
                + "/** see org.polebench.fit.SweepFitter */\nfinal class Bad {\n"
                + "    Object s = \"org.polebench.report.X\";\n    org.polebench.sweep.Sweep sweep;\n}\n";
        assertEquals(List.of("units/Bad.java:4 uses org.polebench.circuit (units may use none)",
                        "units/Bad.java:8 uses org.polebench.sweep (units may use none)"),
                violations("units", "units/Bad.java", source));
    }

    /** @return one line per use of a package that {@code pkg} may not use, naming the file and line */
    private static List<String> violations(String pkg, String fileName, String source) {
        Set<String> allowed = MAY_USE.get(pkg);
        if (allowed == null) {
            return List.of(fileName + ": package " + pkg + " is not in the layout table");
        }
        // comments and strings blanked out, keeping line breaks so that line numbers hold
        String code = blank(BLOCK_COMMENT, source);
        code = blank(STRING, code);
        List<String> found = new ArrayList<>();
        String[] lines = code.split("\n", -1);
        for (int i = 0; i < lines.length; i++) {
            String line = lines[i];
            int comment = line.indexOf("//");
            if (comment >= 0) {
                line = line.substring(0, comment);
            }
            Set<String> used = new TreeSet<>();
            Matcher imported = IMPORT.matcher(line.strip());
            if (imported.find()) {
                used.add(imported.group(1));
            } else {
                Matcher qualified = QUALIFIED.matcher(line);
                while (qualified.find()) {
                    used.add(qualified.group(1));
                }
            }
            for (String target : used) {
                if (!target.equals(pkg) && !allowed.contains(target)) {
                    found.add(fileName + ":" + (i + 1) + " uses org.polebench." + target + " (" + pkg + " may use "
                            + (allowed.isEmpty() ? "none" : String.join(", ", new TreeSet<>(allowed))) + ")");
                }
            }
        }
        return found;
    }

    private static String blank(Pattern pattern, String text) {
        Matcher m = pattern.matcher(text);
        StringBuilder out = new StringBuilder(text.length());
        while (m.find()) {
            m.appendReplacement(out, "");
            out.append(m.group().replaceAll("[^\n]", " "));
        }
        m.appendTail(out);
        return out.toString();
    }

    private static List<Path> mainSources() throws IOException {
        try (Stream<Path> files = Files.walk(MAIN)) {
            return files.filter(p -> p.toString().endsWith(".java")).sorted().collect(Collectors.toList());
        }
    }
}
