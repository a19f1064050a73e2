package org.polebench.sweepfile;

import java.io.IOException;
import java.io.StringWriter;
import java.math.BigDecimal;
import java.math.MathContext;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.profile.Delimiter;
import org.polebench.profile.ProfileLibrary;
import org.polebench.profile.ScpiCommand;
import org.polebench.profile.TableProfile;
import org.polebench.sweep.DemoSweeps;
import org.polebench.sweep.Provenance;
import org.polebench.sweep.Sweep;
import org.polebench.sweep.SweepPoint;

/**
 * The generator of {@code sample-measurements/imports/}: one invented demo sweep per shipped
 * table profile and one invented log per serial profile, all from the closed form in
 * {@link DemoSweeps} (corners near 3 Hz), rounded as an instrument prints them (frequency to
 * 5 significant digits, gain to 0.001 dB, phase to 0.01°). Every file says in its header that
 * it is invented demo data. {@code ImportSamplesTest} checks the committed files are exactly
 * what this produces; to regenerate them run
 * {@code java -cp target/classes:target/test-classes org.polebench.sweepfile.DemoImportSamples}.
 */
final class DemoImportSamples {
    static final Path FOLDER = Path.of("sample-measurements", "imports");
    static final String LABEL = "DEMO DATA: invented from a closed form (two-pole high-pass, corners near 3 Hz), "
            + "not a measurement";
    private static final int POINTS = 41;

    private DemoImportSamples() {
    }

    public static void main(String[] args) throws IOException {
        Files.createDirectories(FOLDER);
        for (Map.Entry<String, byte[]> file : render().entrySet()) {
            Files.write(FOLDER.resolve(file.getKey()), file.getValue());
        }
    }

    /** @return every sample's file name and bytes */
    static Map<String, byte[]> render() throws IOException {
        Map<String, byte[]> files = new LinkedHashMap<>();
        ProfileLibrary library = ProfileLibrary.bundled();
        for (TableProfile profile : library.tableProfiles()) {
            if (profile.name().equals(SweepWriter.CANONICAL)) {
                continue;
            }
            Sweep sweep = roundedSweep(profile.name(), profile.columns().phase().isPresent());
            StringWriter text = new StringWriter();
            new SweepWriter().table(sweep, profile, text);
            files.put(profile.name() + (profile.layout().delimiter() == Delimiter.COMMA ? ".csv" : ".txt"),
                    text.toString().getBytes(profile.layout().encoding().charset()));
        }
        files.put("canonical.csv", canonical());
        files.put("scpi-generator-meter.log", scpiLog().getBytes(StandardCharsets.UTF_8));
        files.put("streaming-sweeper.log", streamLog().getBytes(StandardCharsets.UTF_8));
        return files;
    }

    private static byte[] canonical() throws IOException {
        StringWriter text = new StringWriter();
        new SweepWriter().canonical(roundedSweep("canonical", true), text);
        return text.toString().getBytes(StandardCharsets.UTF_8);
    }

    /** The frequencies as printed: 5 significant digits. */
    static double[] frequencies() {
        double[] f = DemoSweeps.logSpaced(0.5, 20_000, POINTS);
        for (int i = 0; i < f.length; i++) {
            f[i] = new BigDecimal(f[i]).round(new MathContext(5)).doubleValue();
        }
        return f;
    }

    static double roundTo(double value, int decimals) {
        return new BigDecimal(value).setScale(decimals, java.math.RoundingMode.HALF_EVEN).doubleValue();
    }

    private static Sweep roundedSweep(String profile, boolean phase) {
        List<SweepPoint> points = new ArrayList<>();
        for (double f : frequencies()) {
            double[] h = DemoSweeps.response(f);
            points.add(new SweepPoint(f, roundTo(h[0], 3), phase ? OptionalDouble.of(roundTo(h[1], 2))
                    : OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty()));
        }
        Provenance source = new Provenance(Optional.empty(), "", "Demo bench analyser (invented)", profile,
                Optional.of(Instant.parse("2031-04-02T14:05:00Z")), Optional.of("demo board 7, Gullhaven rig"),
                List.of(LABEL));
        return new Sweep(source, points);
    }

    private static String nr3(double value) {
        return String.format(Locale.ROOT, "%+.5E", value);
    }

    /**
     * A SCPI session as a terminal program might save it: ISO timestamps, sender names and
     * direction markers. Point 12 gets an error answer and is retried; the meter echoes one
     * command; one line is noise.
     */
    static String scpiLog() {
        StringBuilder log = new StringBuilder();
        log.append("# ").append(LABEL).append('\n');
        log.append("# board: demo board 7, Gullhaven rig\n");
        long ms = Instant.parse("2031-04-02T14:05:00Z").toEpochMilli();
        Clock clock = new Clock(ms);
        log.append(clock.next()).append(" generator> *IDN?\n");
        log.append(clock.next()).append(" generator< Demo Instruments (invented),FG-0,0001,1.0\n");
        log.append(clock.next()).append(" meter> *IDN?\n");
        log.append(clock.next()).append(" meter< Demo Instruments (invented),AC-2,0002,1.0\n");
        for (String setup : List.of("*RST", "*CLS", "FUNC SIN", "VOLT:UNIT VRMS", "VOLT 5.000000E-01", "OUTP ON")) {
            log.append(clock.next()).append(" generator> ").append(setup).append('\n');
        }
        log.append(clock.next()).append(" meter> *RST\n");
        log.append(clock.next()).append(" meter> *CLS\n");
        double level = 0.5;
        double[] f = frequencies();
        for (int i = 0; i < f.length; i++) {
            double[] h = DemoSweeps.response(f[i]);
            log.append(clock.next()).append(" generator> FREQ ").append(ScpiCommand.nr3(f[i])).append('\n');
            log.append(clock.next()).append(" generator> *OPC?\n");
            log.append(clock.next()).append(" generator< 1\n");
            if (i == 12) {
                log.append(clock.next()).append(" meter> MEAS:VOLT:AC? (@1)\n");
                log.append(clock.next()).append(" meter< ").append(nr3(level)).append('\n');
                log.append(clock.next()).append(" meter> SYST:ERR?\n");
                log.append(clock.next()).append(" meter< -230,\"Data corrupt or stale\"\n");
            }
            if (i == 20) {
                log.append(clock.next()).append(" meter< MEAS:VOLT:AC? (@1)\n".replace("meter< ", "meter> "));
                log.append(clock.next()).append(" meter< MEAS:VOLT:AC? (@1)\n");
            } else {
                log.append(clock.next()).append(" meter> MEAS:VOLT:AC? (@1)\n");
            }
            log.append(clock.next()).append(" meter< ").append(nr3(level)).append('\n');
            log.append(clock.next()).append(" meter> MEAS:VOLT:AC? (@2)\n");
            log.append(clock.next()).append(" meter< ").append(nr3(level * Math.pow(10, h[0] / 20))).append('\n');
            log.append(clock.next()).append(" meter> MEAS:PHAS? (@2),(@1)\n");
            log.append(clock.next()).append(" meter< ").append(nr3(h[1])).append('\n');
            log.append(clock.next()).append(" meter> SYST:ERR?\n");
            log.append(clock.next()).append(" meter< +0,\"No error\"\n");
            if (i == 30) {
                log.append(clock.next()).append(" ~~#\u00ff\u00fe noise on the line\n");
            }
        }
        log.append(clock.next()).append(" generator> OUTP OFF\n");
        return log.toString();
    }

    /** A streaming sweeper's session: bracketed timestamps omitted, plain direction markers; one point reports an error. */
    static String streamLog() {
        StringBuilder log = new StringBuilder();
        log.append("# ").append(LABEL).append('\n');
        log.append("# date: 2031-04-02T15:30:00Z\n");
        log.append("> ID?\n");
        log.append("< Demo Instruments (invented),LSW-1,0003,1.0\n");
        double[] f = frequencies();
        log.append("> SWEEP ").append(ScpiCommand.nr3(f[0])).append(' ').append(ScpiCommand.nr3(f[f.length - 1]))
                .append(' ').append(f.length).append(" 5.000000E-01\n");
        log.append("< BEGIN ").append(f.length).append('\n');
        int sent = 0;
        for (int i = 0; i < f.length; i++) {
            double[] h = DemoSweeps.response(f[i]);
            if (i == 5) {
                log.append("< STAT settling\n");
            }
            if (i == 25) {
                log.append("< ERR 21 input overload\n");
                continue;
            }
            log.append(String.format(Locale.ROOT, "< PT %d %.5g %.3f %.2f%n", i + 1, f[i], h[0], h[1]));
            sent++;
        }
        log.append("< END ").append(sent).append('\n');
        return log.toString();
    }

    /** Invented timestamps, 25 ms apart. */
    private static final class Clock {
        private long ms;

        Clock(long start) {
            this.ms = start;
        }

        String next() {
            ms += 25;
            return Instant.ofEpochMilli(ms).toString();
        }
    }
}
