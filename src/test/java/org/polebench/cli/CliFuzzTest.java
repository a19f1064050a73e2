package org.polebench.cli;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import java.util.function.Function;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Seeded mutations of every kind of input polebench reads, run through {@link Main#run} in this
 * JVM: stage files, bench files, sweep tables, serial logs, instrument profiles, report result
 * files and option values. Whatever the input, the exit code is one of the documented 0–4 and nothing
 * prints a stack trace (issue 15). Each kind runs {@link #ROUNDS} mutations by default; a longer
 * run is {@code mvn -B -o test -Dtest=CliFuzzTest -Dpolebench.fuzz.rounds=5000}
 * (docs/contributing.md, "Build, test, benchmark").
 */
class CliFuzzTest {
    /** Mutations of each kind in the ordinary suite: a few hundred, about ten seconds a kind here. */
    static final int ROUNDS = 200;
    private static final long SEED = 20_261_202L;
    private static final List<String> STACK_TRACE_SIGNS = List.of("\tat org.", "\tat java.", "Exception in thread",
            "java.lang.", "at picocli.");

    @TempDir
    static Path scratch;
    private static Path result;

    private final int rounds = Integer.getInteger("polebench.fuzz.rounds", ROUNDS);

    @BeforeAll
    static void aResultToMutate() {
        Main.run(new String[] {"reconcile", "--samples", "100", "--report", scratch.resolve("demo").toString()},
                new PrintWriter(new StringWriter(), true), new PrintWriter(new StringWriter(), true));
        result = scratch.resolve("demo").resolve("result.json");
        assertTrue(Files.exists(result), "the demo reconcile wrote a result");
    }

    /** One command line run in process; a failure message that names it, or null when it kept to the rules. */
    private static String check(String kind, int round, List<String> args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int exit;
        try {
            exit = Main.run(args.toArray(String[]::new), new PrintWriter(out, true), new PrintWriter(err, true));
        } catch (RuntimeException | Error escaped) {
            return kind + " round " + round + ": " + escaped + " escaped Main.run for " + args;
        }
        String printed = out + "\n" + err;
        if (exit < 0 || exit > 4) {
            return kind + " round " + round + ": exit " + exit + " for " + args + "\n" + abbreviate(err.toString());
        }
        for (String sign : STACK_TRACE_SIGNS) {
            if (printed.contains(sign)) {
                return kind + " round " + round + ": '" + sign.strip() + "' printed for " + args + "\n" + abbreviate(printed);
            }
        }
        return null;
    }

    private static String abbreviate(String text) {
        return text.length() > 600 ? text.substring(0, 600) + "…" : text;
    }

    /**
     * Runs {@code rounds} mutations of the given files, each written to a fresh file, through
     * the command line {@code command} makes of its path; fails listing every broken rule.
     */
    private void fuzz(String kind, List<Path> originals, String suffix, Function<Path, List<String>> command)
            throws IOException {
        Random random = new Random(SEED ^ kind.hashCode());
        List<byte[]> texts = new ArrayList<>();
        for (Path original : originals) {
            texts.add(Files.readAllBytes(original));
        }
        Path folder = Files.createDirectories(scratch.resolve(kind));
        List<String> failures = new ArrayList<>();
        for (int round = 0; round < rounds; round++) {
            byte[] mutated = Mutation.apply(texts.get(random.nextInt(texts.size())), random);
            Path file = folder.resolve("input-" + round + suffix);
            Files.write(file, mutated);
            String failure = check(kind, round, command.apply(file));
            if (failure != null) {
                failures.add(failure);
            }
            Files.deleteIfExists(file);
        }
        assertTrue(failures.isEmpty(), failures.size() + " of " + rounds + " broke the rules:\n"
                + failures.stream().limit(5).collect(Collectors.joining("\n")));
    }

    private static List<Path> files(Path folder, String... endings) throws IOException {
        try (Stream<Path> listed = Files.list(folder)) {
            return listed.filter(p -> Arrays.stream(endings).anyMatch(e -> p.toString().endsWith(e))).sorted()
                    .collect(Collectors.toList());
        }
    }

    @Test
    void mutatedStageFiles() throws IOException {
        fuzz("stage", files(Path.of("sample-measurements"), ".stage.yaml"), ".stage.yaml",
                stage -> List.of("predict", "--samples", "20", stage.toString()));
    }

    @Test
    void mutatedSweepTables() throws IOException {
        List<Path> tables = files(Path.of("sample-measurements", "imports"), ".csv", ".txt");
        tables.add(Path.of("sample-measurements", "geophone-gf2-board-0417.sweep.csv"));
        fuzz("sweep", tables, ".csv", sweep -> List.of("inspect", sweep.toString()));
    }

    @Test
    void mutatedSerialLogs() throws IOException {
        List<Path> logs = files(Path.of("sample-measurements", "imports"), ".log");
        Random pick = new Random(SEED);
        fuzz("log", logs, ".log", log -> List.of("inspect", log.toString(), "--profile",
                pick.nextBoolean() ? "auto" : "scpi-generator-meter"));
    }

    @Test
    void mutatedProfiles() throws IOException {
        // each mutated profile reads the sample made for the shipped profile it came from
        fuzz("profile", files(Path.of("instrument-profiles"), ".yaml"), ".yaml", profile -> {
            String name = Mutation.sourceName(profile);
            return List.of("inspect", sampleFor(name).toString(), "--profile", profile.toString());
        });
    }

    private static Path sampleFor(String profileName) {
        try {
            for (Path sample : files(Path.of("sample-measurements", "imports"), "")) {
                if (sample.getFileName().toString().startsWith(profileName + ".")) {
                    return sample;
                }
            }
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
        return Path.of("sample-measurements", "imports", "db-degrees.csv");
    }

    @Test
    void mutatedBenchFiles() throws IOException {
        String stage = Path.of("sample-measurements", "hydrophone-preamp-ce.stage.yaml").toString();
        fuzz("bench", files(Path.of("sample-measurements", "benches"), ".yaml"), ".bench.yaml",
                bench -> List.of("predict", "--samples", "20", "--bench", bench.toString(), stage));
    }

    @Test
    void mutatedResultFiles() throws IOException {
        Path out = scratch.resolve("reissued");
        fuzz("result", List.of(result), ".json", json -> List.of("report", json.toString(), "--out", out.toString(),
                "--force"));
    }

    @Test
    void hostileOptionValues() {
        Random random = new Random(SEED);
        String stage = Path.of("sample-measurements", "hydrophone-preamp-ce.stage.yaml").toString();
        String sweep = Path.of("sample-measurements", "imports", "db-degrees.csv").toString();
        List<String> failures = new ArrayList<>();
        for (int round = 0; round < rounds; round++) {
            String value = Mutation.hostileValue(random);
            List<String> args = switch (random.nextInt(7)) {
                case 0 -> List.of("predict", "--samples", value, stage);
                case 1 -> List.of("fit", sweep, "--max-poles", value);
                case 2 -> List.of("fit", sweep, "--band", value);
                case 3 -> List.of("inspect", sweep, "--profile", value);
                case 4 -> List.of("synthesize", "--stage", stage, "--points", value, "--out",
                        scratch.resolve("synth-" + round + ".csv").toString());
                case 5 -> List.of("synthesize", "--stage", stage, "--fault", value, "--points", "20", "--out",
                        scratch.resolve("fault-" + round + ".csv").toString());
                default -> List.of("synthesize", "--stage", stage, "--noise", value, "--from", value, "--points", "20",
                        "--out", scratch.resolve("noise-" + round + ".csv").toString());
            };
            String failure = check("option", round, args);
            if (failure != null) {
                failures.add(failure);
            }
        }
        assertTrue(failures.isEmpty(), failures.size() + " of " + rounds + " broke the rules:\n"
                + failures.stream().limit(5).collect(Collectors.joining("\n")));
    }

    /** The mutations: seeded, each a small change of the kind a damaged or hand-edited file shows. */
    static final class Mutation {
        private static final String[] HOSTILE = {"", "-1", "0", "-0", "1e309", "-1e309", "NaN", "Infinity", "1e-320",
            "99999999999999999999", "2147483648", "-2147483649", "0x10", "1,5", "1.5.5", "\u0000", "\u001b[2J", "'",
            "\"", "{", "[", "]:", "~", "null", ".inf", "*a", "&a", "!!binary", "?", "é", "\uFFFF", "10k:1", "1Hz:",
            ":", "C1=", "=", "C99=1u", "bias:Q9=1", "1u1u", "1e999u", "--", "-", "5:5", "1Hz:0.5Hz", "x".repeat(5000)};
        private static final String CHANGED = ":{}[],#'\"\t -|>&*!%@`\\\u0000\u00ff";

        private Mutation() {
        }

        static String hostileValue(Random random) {
            String value = HOSTILE[random.nextInt(HOSTILE.length)];
            return random.nextInt(4) == 0 ? value + HOSTILE[random.nextInt(HOSTILE.length)] : value;
        }

        /** @return the shipped profile a mutated copy came from, by the name it keeps in its text */
        static String sourceName(Path profile) {
            try {
                for (String line : Files.readAllLines(profile, StandardCharsets.ISO_8859_1)) {
                    if (line.startsWith("name:")) {
                        return line.substring(5).strip();
                    }
                }
            } catch (IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
            return "";
        }

        static byte[] apply(byte[] original, Random random) {
            // Latin-1 keeps every byte as one char, so byte-level damage survives the round trip
            String text = new String(original, StandardCharsets.ISO_8859_1);
            int changes = 1 + random.nextInt(3);
            for (int i = 0; i < changes; i++) {
                text = once(text, random);
            }
            return text.getBytes(StandardCharsets.ISO_8859_1);
        }

        private static String once(String text, Random random) {
            List<String> lines = new ArrayList<>(Arrays.asList(text.split("\n", -1)));
            int at = random.nextInt(Math.max(1, lines.size()));
            switch (random.nextInt(9)) {
                case 0 -> lines.remove(Math.min(at, lines.size() - 1));
                case 1 -> lines.add(at, lines.get(Math.min(at, lines.size() - 1)));
                case 2 -> {
                    int other = random.nextInt(lines.size());
                    String line = lines.get(at);
                    lines.set(at, lines.get(other));
                    lines.set(other, line);
                }
                case 3 -> lines.set(at, lines.get(at).replaceFirst("-?\\d+(\\.\\d+)?(e-?\\d+)?",
                        java.util.regex.Matcher.quoteReplacement(hostileValue(random))));
                case 4 -> {
                    int position = random.nextInt(text.length() + 1);
                    StringBuilder bytes = new StringBuilder();
                    for (int k = 1 + random.nextInt(8); k > 0; k--) {
                        bytes.append((char) random.nextInt(256));
                    }
                    return text.substring(0, position) + bytes + text.substring(position);
                }
                case 5 -> {
                    return text.substring(0, random.nextInt(text.length() + 1));
                }
                case 6 -> {
                    int position = random.nextInt(text.length() + 1);
                    return text.substring(0, position) + hostileValue(random) + text.substring(position);
                }
                case 7 -> {
                    if (!text.isEmpty()) {
                        int position = random.nextInt(text.length());
                        return text.substring(0, position) + CHANGED.charAt(random.nextInt(CHANGED.length()))
                                + text.substring(position + 1);
                    }
                }
                default -> lines.set(at, "  " + lines.get(at));
            }
            return String.join("\n", lines);
        }
    }
}
