package org.polebench.sweepfile;

import java.io.BufferedReader;
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

    public SweepReader(ProfileLibrary profiles) {
        this.profiles = profiles;
    }

    /**
     * @param profileName {@code auto}, a profile's name, or the path of a {@code .yaml} profile
     * @throws InputProblem when the file or profile is at fault; the problem names file and line
     * @throws UncheckedIOException when the file exists but cannot be read (an I/O fault)
     */
    public ImportedSweep read(Path file, String profileName) throws InputProblem {
        if (AUTO.equals(profileName)) {
            LayoutSniffer.Choice choice = new LayoutSniffer(profiles).sniff(file);
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
                return () -> new TableSweepParser(file, table).read(label, preface);
            }

            @Override
            public Import serial(SerialProfile serial) {
                return () -> {
                    ImportedSweep log = readLog(file, serial);
                    return preface.isEmpty() ? log
                            : new ImportedSweep(log.sweep(), label, preface + log.mapping(), log.warnings());
                };
            }
        });
        return reading.run();
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
    private static ImportedSweep readLog(Path file, SerialProfile profile) throws InputProblem {
        MessageDigest sha256;
        try {
            sha256 = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform has SHA-256", e);
        }
        SerialLogParser parser = new SerialLogParser(profile, file);
        try (InputStream raw = Files.newInputStream(file);
             DigestInputStream hashed = new DigestInputStream(raw, sha256)) {
            CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(CodingErrorAction.REPLACE).onUnmappableCharacter(CodingErrorAction.REPLACE);
            BufferedReader reader = new BufferedReader(new InputStreamReader(hashed, decoder), 1 << 16);
            String line;
            int lineNo = 0;
            while ((line = reader.readLine()) != null) {
                parser.accept(++lineNo, line);
            }
        } catch (NoSuchFileException e) {
            throw new InputProblem(file, 0, "file not found", "check the path");
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + file + ": " + e.getMessage(), e);
        }
        return parser.result(HexFormat.of().formatHex(sha256.digest()));
    }
}
