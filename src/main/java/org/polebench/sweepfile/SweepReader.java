package org.polebench.sweepfile;

import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.security.DigestInputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import org.polebench.InputLimits;
import java.util.List;
import org.polebench.InputProblem;
import org.polebench.profile.InstrumentProfile;
import org.polebench.profile.ProfileLibrary;
import org.polebench.profile.SerialProfile;
import org.polebench.profile.TableProfile;
import org.polebench.profile.WaveformProfile;
import org.polebench.waveform.RecordFiles;
import org.polebench.waveform.RecordSetReader;
import org.polebench.waveform.WaveformImport;
import org.polebench.waveform.WaveformSniffer;

/**
 * Reads a sweep file, a table or a serial log, or a set of scope waveform records, with a named
 * profile or by sniffing its layout ({@code auto}). The one entry point the fit, reconcile and
 * CLI code use.
 */
public final class SweepReader {
    /** The profile name that asks for the layout to be sniffed. */
    public static final String AUTO = "auto";

    private final ProfileLibrary profiles;
    private final InputLimits limits;

    /** A reader under the limits this JVM was started with ({@link InputLimits#standing()}). */
    public SweepReader(ProfileLibrary profiles) {
        this(profiles, InputLimits.standing());
    }

    /** @param limits the limits on file size, line length and points that a file is refused past */
    public SweepReader(ProfileLibrary profiles, InputLimits limits) {
        this.profiles = profiles;
        this.limits = limits;
    }

    /**
     * @param profileName {@code auto}, a profile's name, or the path of a {@code .yaml} profile
     * @throws InputProblem when the file or profile is at fault; the problem names file and line
     * @throws UncheckedIOException when the file exists but cannot be read (an I/O fault)
     */
    public ImportedSweep read(Path file, String profileName) throws InputProblem {
        checkSize(file);
        if (AUTO.equals(profileName)) {
            LayoutSniffer.Choice choice = new LayoutSniffer(profiles, limits).sniff(file);
            return read(file, choice.profile(), AUTO, choice.preface());
        }
        InstrumentProfile profile = profiles.resolve(profileName);
        return read(file, profile, profile.name(), "");
    }

    /**
     * Reads one sweep file as {@link #read(Path, String)} does, or a set of scope waveform
     * records: a folder, or more than one file (docs/user-guide.md, "Scope waveform records").
     */
    public ImportedSweep read(List<Path> paths, String profileName) throws InputProblem {
        if (!RecordFiles.isRecordSet(paths)) {
            return read(paths.get(0), profileName);
        }
        WaveformProfile profile;
        if (AUTO.equals(profileName)) {
            profile = WaveformSniffer.choose(paths, profiles.waveformProfiles());
        } else {
            InstrumentProfile named = profiles.resolve(profileName);
            profile = named.asWaveform().orElseThrow(() -> new InputProblem(paths.get(0), 0, "profile '"
                    + named.name() + "' reads one sweep file, not a set of waveform records",
                    "name a waveform profile (polebench profiles lists them) or give one sweep file"));
        }
        return readRecords(paths, profile, AUTO.equals(profileName) ? AUTO : profile.name(),
                AUTO.equals(profileName) ? "sniffed: records match profile " + profile.name() + "; " : "");
    }

    private static ImportedSweep readRecords(List<Path> paths, WaveformProfile profile, String label, String preface)
            throws InputProblem {
        List<Path> files = RecordFiles.expand(paths, profile.layout().files());
        Path origin = paths.size() == 1 ? paths.get(0) : files.get(0).toAbsolutePath().getParent();
        WaveformImport records = new RecordSetReader(profile).read(files, origin == null ? files.get(0) : origin, label);
        return new ImportedSweep(records.sweep(), label, preface + records.mapping(), records.warnings());
    }

    private ImportedSweep read(Path file, InstrumentProfile profile, String label, String preface) throws InputProblem {
        // the visitor cannot throw InputProblem, so each kind gives the import to run
        Import reading = profile.match(new InstrumentProfile.Cases<Import>() {
            @Override
            public Import table(TableProfile table) {
                return () -> new TableSweepParser(file, table, limits).read(label, preface);
            }

            @Override
            public Import serial(SerialProfile serial) {
                return () -> {
                    ImportedSweep log = readLog(file, serial, limits);
                    return preface.isEmpty() ? log
                            : new ImportedSweep(log.sweep(), label, preface + log.mapping(), log.warnings());
                };
            }

            @Override
            public Import waveform(WaveformProfile waveform) {
                return () -> readRecords(List.of(file), waveform, label, preface);
            }
        });
        return reading.run();
    }

    /** Refuses a file larger than the limit before reading a byte of it. */
    private void checkSize(Path file) throws InputProblem {
        long bytes;
        try {
            bytes = Files.size(file);
        } catch (NoSuchFileException e) {
            throw new InputProblem(file, 0, "file not found", "check the path");
        } catch (IOException e) {
            // a special file or one that cannot be examined: the read itself says what is wrong
            return;
        }
        if (bytes > limits.maxFileBytes()) {
            throw new InputProblem(file, 0, "the file has " + bytes + " bytes, more than " + limits.maxFileBytes()
                    + ", the limit on one sweep file (" + InputLimits.MAX_FILE_BYTES + ")",
                    InputLimits.raise(InputLimits.MAX_FILE_BYTES, limits.maxFileBytes(),
                            "keep every n-th row, or split the file"));
        }
    }

    /** One file's import as its profile's kind reads it. */
    @FunctionalInterface
    private interface Import {
        ImportedSweep run() throws InputProblem;
    }

    /**
     * Feeds a saved log to {@link SerialLogParser} line by line. Bytes that are not UTF-8 (line
     * noise, a wrong baud rate) become replacement characters, so such a line is skipped and
     * listed rather than stopping the import.
     */
    private static ImportedSweep readLog(Path file, SerialProfile profile, InputLimits limits) throws InputProblem {
        MessageDigest sha256;
        try {
            sha256 = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform has SHA-256", e);
        }
        SerialLogParser parser = new SerialLogParser(profile, file, limits.maxPoints());
        try (InputStream raw = Files.newInputStream(file);
             DigestInputStream hashed = new DigestInputStream(raw, sha256)) {
            CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(CodingErrorAction.REPLACE).onUnmappableCharacter(CodingErrorAction.REPLACE);
            BoundedLines reader = new BoundedLines(new InputStreamReader(hashed, decoder), file, limits.maxLineChars());
            String line;
            while ((line = reader.next()) != null) {
                parser.accept(reader.lineNo(), line);
            }
        } catch (NoSuchFileException e) {
            throw new InputProblem(file, 0, "file not found", "check the path");
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + file + ": " + e.getMessage(), e);
        }
        return parser.result(HexFormat.of().formatHex(sha256.digest()));
    }
}
