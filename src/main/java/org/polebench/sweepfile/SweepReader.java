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
import org.polebench.InputProblem;
import org.polebench.profile.InstrumentProfile;
import org.polebench.profile.ProfileLibrary;
import org.polebench.profile.SerialProfile;
import org.polebench.profile.TableProfile;

/**
 * Reads a sweep file, a table or a serial log, with a named profile or by sniffing its
 * layout ({@code auto}). The one entry point the fit, reconcile and CLI code use.
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
