package org.polebench.profile;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.polebench.InputProblem;

/**
 * The instrument profiles polebench knows: the shipped set, bundled in the jar under
 * {@code instrument-profiles/} and listed in {@code instrument-profiles/index.txt} (a jar's
 * directories cannot be listed), plus any {@code *.yaml} in a working tree's
 * {@code instrument-profiles/} directory, which win over a bundled profile of the same name.
 *
 * <p>A shipped profile is read when it is first asked for, by name or as part of the whole list:
 * reading all nine costs a cold start about as much as the stage file itself, and a named
 * profile, or a canonical sweep read with {@code auto}, needs one. A shipped profile's name is
 * its file name without {@code .yaml} ({@code ProfileLibraryTest} checks it), which is what lets
 * a name be found without reading the others. A working tree's profiles are read at once, so
 * a broken one is reported whatever is asked.
 */
public final class ProfileLibrary {
    /** Classpath folder and working-tree directory of the profiles. */
    public static final String FOLDER = "instrument-profiles";
    static final String INDEX = FOLDER + "/index.txt";
    private static final String EXTENSION = ".yaml";

    /** Shipped profiles by name, in index order; each read once, on first use. */
    private final Map<String, Shipped> shipped;
    /** A working tree's profiles by name, in file-name order; they win over shipped ones. */
    private final Map<String, InstrumentProfile> own;
    private final List<String> order;

    private ProfileLibrary(Map<String, Shipped> shipped, Map<String, InstrumentProfile> own) {
        this.shipped = Collections.unmodifiableMap(new LinkedHashMap<>(shipped));
        this.own = Collections.unmodifiableMap(new LinkedHashMap<>(own));
        List<String> names = new ArrayList<>(shipped.keySet());
        for (String name : own.keySet()) {
            if (!shipped.containsKey(name)) {
                names.add(name);
            }
        }
        this.order = List.copyOf(names);
    }

    /** @return the shipped profiles, read from the classpath as they are asked for */
    public static ProfileLibrary bundled() {
        ClassLoader loader = ProfileLibrary.class.getClassLoader();
        Map<String, Shipped> found = new LinkedHashMap<>();
        for (String file : index(loader)) {
            String name = file.endsWith(EXTENSION) ? file.substring(0, file.length() - EXTENSION.length()) : file;
            found.put(name, new Shipped(loader, file, name));
        }
        return new ProfileLibrary(found, Map.of());
    }

    /**
     * @return the bundled profiles plus those in {@code workingDirectory/instrument-profiles},
     *         when that directory exists
     * @throws InputProblem when a profile in the directory does not read
     */
    public static ProfileLibrary standard(Path workingDirectory) throws InputProblem {
        return bundled().withDirectory(workingDirectory.resolve(FOLDER));
    }

    /** @return this library plus every {@code *.yaml} profile in the directory (if it exists) */
    public ProfileLibrary withDirectory(Path directory) throws InputProblem {
        if (!Files.isDirectory(directory)) {
            return this;
        }
        List<Path> files = new ArrayList<>();
        try (DirectoryStream<Path> listing = Files.newDirectoryStream(directory, "*.yaml")) {
            listing.forEach(files::add);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot list " + directory + ": " + e.getMessage(), e);
        }
        files.sort(null);
        Map<String, InstrumentProfile> merged = new LinkedHashMap<>(own);
        ProfileReader reader = new ProfileReader();
        for (Path file : files) {
            if (isShippedCopy(file)) {
                // the very file polebench ships (a clone's own instrument-profiles/): the shipped
                // profile is the same, read only when asked for
                continue;
            }
            InstrumentProfile profile = reader.read(file);
            merged.put(profile.name(), profile);
        }
        return new ProfileLibrary(shipped, merged);
    }

    // whether a working-tree file is byte for byte the shipped profile of the same file name
    private boolean isShippedCopy(Path file) {
        String name = file.getFileName().toString();
        Shipped entry = shipped.get(name.endsWith(EXTENSION) ? name.substring(0, name.length() - EXTENSION.length()) : name);
        if (entry == null) {
            return false;
        }
        try (InputStream in = entry.loader.getResourceAsStream(FOLDER + "/" + entry.file)) {
            return in != null && java.util.Arrays.equals(in.readAllBytes(), Files.readAllBytes(file));
        } catch (IOException e) {
            return false;    // unreadable here: read it as the user's own, which reports the fault
        }
    }

    private static List<String> index(ClassLoader loader) {
        try (InputStream in = loader.getResourceAsStream(INDEX)) {
            if (in == null) {
                throw new IllegalStateException(INDEX + " is not on the classpath; the build did not bundle the profiles");
            }
            List<String> names = new ArrayList<>();
            BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
            String line;
            while ((line = reader.readLine()) != null) {
                String name = line.strip();
                if (!name.isEmpty() && !name.startsWith("#")) {
                    names.add(name);
                }
            }
            return names;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** @return every profile, shipped ones in index order, then the directory's */
    public List<InstrumentProfile> profiles() {
        return order.stream().map(name -> find(name).orElseThrow()).toList();
    }

    /** @return the profiles that read table files, in {@link #profiles()} order */
    public List<TableProfile> tableProfiles() {
        List<TableProfile> out = new ArrayList<>();
        for (InstrumentProfile profile : profiles()) {
            profile.asTable().ifPresent(out::add);
        }
        return out;
    }

    /** @return the profiles of serial instruments, in {@link #profiles()} order */
    public List<SerialProfile> serialProfiles() {
        List<SerialProfile> out = new ArrayList<>();
        for (InstrumentProfile profile : profiles()) {
            profile.asSerial().ifPresent(out::add);
        }
        return out;
    }

    /** @return the profiles of scope waveform records, in {@link #profiles()} order */
    public List<WaveformProfile> waveformProfiles() {
        List<WaveformProfile> out = new ArrayList<>();
        for (InstrumentProfile profile : profiles()) {
            profile.asWaveform().ifPresent(out::add);
        }
        return out;
    }

    public Optional<InstrumentProfile> find(String name) {
        InstrumentProfile mine = own.get(name);
        if (mine != null) {
            return Optional.of(mine);
        }
        Shipped entry = shipped.get(name);
        return entry == null ? Optional.empty() : Optional.of(entry.profile());
    }

    /**
     * @param nameOrPath a profile's name, or the path of a {@code .yaml} profile file
     * @throws InputProblem when there is no such profile, or the file does not read
     */
    public InstrumentProfile resolve(String nameOrPath) throws InputProblem {
        if (nameOrPath.toLowerCase(Locale.ROOT).endsWith(".yaml") || nameOrPath.toLowerCase(Locale.ROOT).endsWith(".yml")) {
            return new ProfileReader().read(Path.of(nameOrPath));
        }
        Optional<InstrumentProfile> profile = find(nameOrPath);
        if (profile.isEmpty()) {
            throw new InputProblem(null, 0, "no profile named '" + nameOrPath + "'",
                    "use one of: auto, " + String.join(", ", order) + "; or the path of a .yaml profile");
        }
        return profile.get();
    }

    /** One shipped profile, read from the classpath on first use and kept. */
    private static final class Shipped {
        private final ClassLoader loader;
        private final String file;
        private final String name;
        private InstrumentProfile profile;

        Shipped(ClassLoader loader, String file, String name) {
            this.loader = loader;
            this.file = file;
            this.name = name;
        }

        synchronized InstrumentProfile profile() {
            if (profile == null) {
                profile = read();
            }
            return profile;
        }

        private InstrumentProfile read() {
            String resource = FOLDER + "/" + file;
            try (InputStream in = loader.getResourceAsStream(resource)) {
                if (in == null) {
                    throw new IllegalStateException("the profile index names " + resource + ", which is not bundled");
                }
                InstrumentProfile read = new ProfileReader().read(Path.of(FOLDER, file),
                        new InputStreamReader(in, StandardCharsets.UTF_8));
                if (!read.name().equals(name)) {
                    throw new IllegalStateException("bundled profile " + resource + " is named '" + read.name()
                            + "'; a shipped profile's name is its file name, so that it can be found unread");
                }
                return read;
            } catch (InputProblem e) {
                // a shipped profile that does not read is polebench's defect, not the user's input
                throw new IllegalStateException("bundled profile is broken: " + e.describe(), e);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
    }
}
