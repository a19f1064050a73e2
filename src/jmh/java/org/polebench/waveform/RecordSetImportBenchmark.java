package org.polebench.waveform;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Random;
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
import org.polebench.ThreadCpuTime;
import org.polebench.profile.ProfileLibrary;
import org.polebench.sweep.Sweep;
import org.polebench.sweepfile.SweepReader;

/**
 * Import of a folder of 61 scope records of 100,000 samples each (issue 17 target: at most 3 s,
 * memory bounded by one record). The records are written in setup in the shipped
 * {@code scope-time-volts} layout (a first-order high-pass at 100 Hz, 10 Hz to 100 kHz, noise
 * seed 61, about 190 MB in all), and read through {@link SweepReader} as the commands read
 * them: {@code stated} takes the frequency from the file names (three-parameter fits),
 * {@code free} reads the same files with a profile that estimates it (four-parameter fits from
 * the FFT peak). The fork runs with {@code -Xmx64m}: the 61 records held at once would need
 * about 100 MB of sample arrays alone, so an import that kept them would fail.
 * The auxiliary counter {@code cpuMicros} is the import thread's own CPU time, which stays
 * meaningful on a machine other jobs share. Run:
 * {@code java -jar target/benchmarks.jar RecordSetImportBenchmark -f 1}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 2)
@Measurement(iterations = 5)
@Fork(value = 1, jvmArgsAppend = {"-Xmx64m"})
public class RecordSetImportBenchmark {
    private static final int RECORDS = 61;
    private static final int SAMPLES = 100_000;

    @Param({"stated", "free"})
    public String frequency;

    private Path directory;
    private Path records;
    private String profile;
    private SweepReader reader;

    @Setup(Level.Trial)
    public void writeRecords() throws IOException {
        directory = Files.createTempDirectory("polebench-record-bench");
        records = Files.createDirectory(directory.resolve("records"));
        Random random = new Random(61);
        for (int r = 0; r < RECORDS; r++) {
            double f = Math.rint(10 * Math.pow(1e4, r / (double) (RECORDS - 1)) * 1000) / 1000;
            double x = f / 100;
            double gain = x / Math.sqrt(1 + x * x);
            double lead = Math.PI / 2 - Math.atan(x);
            double interval = 7.3 / (f * SAMPLES);
            Path file = records.resolve(String.format(Locale.ROOT, "rec-%s Hz.csv", Double.toString(f)));
            try (BufferedWriter out = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
                out.write("# benchmark record\ntime (s),ch1 (V),ch2 (V)\n");
                for (int i = 0; i < SAMPLES; i++) {
                    double theta = 2 * Math.PI * f * i * interval;
                    out.write(Double.toString(i * interval));
                    out.write(',');
                    out.write(Double.toString(Math.cos(theta) + 1e-3 * random.nextGaussian()));
                    out.write(',');
                    out.write(Double.toString(gain * Math.cos(theta + lead) + 1e-3 * random.nextGaussian()));
                    out.write('\n');
                }
            }
        }
        if (frequency.equals("free")) {
            Path yaml = directory.resolve("free.yaml");
            Files.writeString(yaml, String.join("\n", "kind: waveform", "name: bench-free",
                    "description: scope-time-volts with the frequency estimated", "layout: {header-lines: 1}",
                    "time: {column: 1}", "channels: {input: 2, output: 3}", ""));
            profile = yaml.toString();
        } else {
            profile = "scope-time-volts";
        }
        reader = new SweepReader(ProfileLibrary.bundled());
    }

    @TearDown(Level.Trial)
    public void removeRecords() throws IOException {
        try (Stream<Path> paths = Files.walk(directory)) {
            for (Path path : paths.sorted(Comparator.reverseOrder()).toList()) {
                Files.delete(path);
            }
        }
    }

    @Benchmark
    public Sweep importSixtyOneRecords(ThreadCpuTime cpu) throws InputProblem {
        return reader.read(List.of(records), profile).sweep();
    }
}
