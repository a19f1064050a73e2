package org.polebench.waveform;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.polebench.InputProblem;
import org.polebench.profile.WaveformProfile;

/**
 * Chooses the waveform profile for a set of records nobody named one for ({@code --profile auto}):
 * the profiles whose {@code detect} expression matches one of the first record's header lines.
 * Exactly one must; otherwise the problem lists what was tried.
 */
public final class WaveformSniffer {
    /** How many lines of a record's top are looked at. */
    static final int LINES = 64;

    private WaveformSniffer() {
    }

    /**
     * @param paths      the folder or files the user gave
     * @param candidates the waveform profiles to try, in library order
     * @return the chosen profile
     */
    public static WaveformProfile choose(List<Path> paths, List<WaveformProfile> candidates) throws InputProblem {
        List<WaveformProfile> matching = new ArrayList<>();
        Path first = null;
        for (WaveformProfile profile : candidates) {
            if (profile.signature().isEmpty()) {
                continue;
            }
            List<Path> files;
            try {
                files = RecordFiles.expand(paths, profile.layout().files());
            } catch (InputProblem noneOfItsFiles) {
                continue;
            }
            first = files.get(0);
            for (String line : head(first, LINES)) {
                if (profile.signature().get().matcher(line).find()) {
                    matching.add(profile);
                    break;
                }
            }
        }
        if (matching.size() == 1) {
            return matching.get(0);
        }
        String names = String.join(", ", candidates.stream().map(WaveformProfile::name).toList());
        Path where = first != null ? first : paths.get(0);
        if (matching.isEmpty()) {
            throw new InputProblem(where, 0, "no waveform profile recognises these records (tried " + names + ")",
                    "name one with --profile, or write a waveform profile for this layout "
                            + "(docs/user-guide.md, \"Scope waveform records\")");
        }
        throw new InputProblem(where, 0, "more than one waveform profile recognises these records: "
                + String.join(", ", matching.stream().map(WaveformProfile::name).toList()), "name one with --profile");
    }

    private static List<String> head(Path file, int count) {
        List<String> lines = new ArrayList<>();
        try (InputStream in = Files.newInputStream(file)) {
            BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8.newDecoder()
                    .onMalformedInput(CodingErrorAction.REPLACE).onUnmappableCharacter(CodingErrorAction.REPLACE)));
            String line;
            while (lines.size() < count && (line = reader.readLine()) != null) {
                lines.add(lines.isEmpty() && line.startsWith("\uFEFF") ? line.substring(1) : line);
            }
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + file + ": " + e.getMessage(), e);
        }
        return lines;
    }
}
