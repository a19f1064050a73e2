package org.polebench.sweepfile;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;
import org.polebench.InputProblem;
import org.polebench.profile.ProfileLibrary;
import org.polebench.sweep.Sweep;

/**
 * Import speed and memory of a 1,000,000-row sweep (issue 3: under 2 s, memory not growing
 * with the file beyond the sweep itself).
 *
 * <p>The file is made in setup from a fixed closed form (a first-order high-pass, corner
 * 3 Hz, 1 mHz to 1 MHz, Double.toString cells), in two shapes with the same 1,000,000 points:
 * {@code narrow} (three columns, about 60 MB) and {@code wide} (ten more columns the profile
 * does not read, about 260 MB). The fork runs with {@code -Xmx320m}: the wide file alone,
 * held as bytes, would take most of that and as a String list far more, so an importer that
 * loaded the file whole would fail while this one reads both shapes in the same heap. Run
 * with {@code -prof gc} for allocation per import.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3)
@Measurement(iterations = 5)
@Fork(value = 1, jvmArgsAppend = {"-Xmx320m"})
public class ImportBenchmark {
    @Param({"narrow", "wide"})
    public String shape;

    private Path directory;
    private Path file;
    private SweepReader reader;

    @Setup(Level.Trial)
    public void writeFile() throws IOException {
        directory = Files.createTempDirectory("polebench-import-bench");
        file = directory.resolve("million-" + shape + ".csv");
        int rows = 1_000_000;
        try (BufferedWriter out = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            out.write("Frequency (Hz),Gain (dB),Phase (deg)");
            if (shape.equals("wide")) {
                for (int k = 1; k <= 10; k++) {
                    out.write(",Spare " + k);
                }
            }
            out.write('\n');
            for (int i = 0; i < rows; i++) {
                double f = 1e-3 * Math.pow(1e9, i / (double) (rows - 1));
                double x = f / 3.0;
                out.write(Double.toString(f));
                out.write(',');
                out.write(Double.toString(20 * Math.log10(x / Math.sqrt(1 + x * x))));
                out.write(',');
                out.write(Double.toString(90 - Math.toDegrees(Math.atan(x))));
                if (shape.equals("wide")) {
                    for (int k = 1; k <= 10; k++) {
                        out.write(',');
                        out.write(Double.toString(k * f));
                    }
                }
                out.write('\n');
            }
        }
        reader = new SweepReader(ProfileLibrary.bundled());
    }

    @TearDown(Level.Trial)
    public void removeFile() throws IOException {
        try (Stream<Path> paths = Files.walk(directory)) {
            for (Path path : paths.sorted(Comparator.reverseOrder()).toList()) {
                Files.delete(path);
            }
        }
    }

    @Benchmark
    public Sweep importMillionRows() throws InputProblem {
        Sweep sweep = reader.read(file, "db-degrees").sweep();
        if (sweep.size() != 1_000_000) {
            throw new IllegalStateException("expected 1,000,000 points, read " + sweep.size());
        }
        return sweep;
    }
}
