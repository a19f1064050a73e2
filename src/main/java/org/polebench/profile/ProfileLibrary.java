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
 */
public final class ProfileLibrary {
    /** Classpath folder and working-tree directory of the profiles. */
    public static final String FOLDER = "instrument-profiles";
    static final String INDEX = FOLDER + "/index.txt";

    private final Map<String, InstrumentProfile> profiles;
    private final List<String> order;

    private ProfileLibrary(Map<String, InstrumentProfile> profiles) {
        this.profiles = Map.copyOf(profiles);
        this.order = List.copyOf(profiles.keySet());
    }

    /** @return the shipped profiles, read from the classpath */
    public static ProfileLibrary bundled() {
        ClassLoader loader = ProfileLibrary.class.getClassLoader();
        ProfileReader reader = new ProfileReader();
        Map<String, InstrumentProfile> found = new LinkedHashMap<>();
        for (String name : index(loader)) {
            String resource = FOLDER + "/" + name;
            try (InputStream in = loader.getResourceAsStream(resource)) {
                if (in == null) {
                    throw new IllegalStateException("the profile index names " + resource + ", which is not bundled");
                }
                InstrumentProfile profile = reader.read(Path.of(FOLDER, name),
                        new InputStreamReader(in, StandardCharsets.UTF_8));
                found.put(profile.name(), profile);
            } catch (InputProblem e) {
                // a shipped profile that does not read is polebench's defect, not the user's input
                throw new IllegalStateException("bundled profile is broken: " + e.describe(), e);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
        return new ProfileLibrary(found);
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
        Map<String, InstrumentProfile> merged = new LinkedHashMap<>();
        for (String name : order) {
            merged.put(name, profiles.get(name));
        }
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
        ProfileReader reader = new ProfileReader();
        for (Path file : files) {
            InstrumentProfile profile = reader.read(file);
            merged.put(profile.name(), profile);
        }
        return new ProfileLibrary(merged);
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
        return order.stream().map(profiles::get).toList();
    }

    public List<TableProfile> tableProfiles() {
        List<TableProfile> out = new ArrayList<>();
        for (InstrumentProfile profile : profiles()) {
            if (profile instanceof TableProfile) {
                out.add((TableProfile) profile);
            }
        }
        return out;
    }

    public List<SerialProfile> serialProfiles() {
        List<SerialProfile> out = new ArrayList<>();
        for (InstrumentProfile profile : profiles()) {
            if (profile instanceof SerialProfile) {
                out.add((SerialProfile) profile);
            }
        }
        return out;
    }

    public Optional<InstrumentProfile> find(String name) {
        return Optional.ofNullable(profiles.get(name));
    }

    /**
     * @param nameOrPath a profile's name, or the path of a {@code .yaml} profile file
     * @throws InputProblem when there is no such profile, or the file does not read
     */
    public InstrumentProfile resolve(String nameOrPath) throws InputProblem {
        if (nameOrPath.toLowerCase(Locale.ROOT).endsWith(".yaml") || nameOrPath.toLowerCase(Locale.ROOT).endsWith(".yml")) {
            return new ProfileReader().read(Path.of(nameOrPath));
        }
        InstrumentProfile profile = profiles.get(nameOrPath);
        if (profile == null) {
            throw new InputProblem(null, 0, "no profile named '" + nameOrPath + "'",
                    "use one of: auto, " + String.join(", ", order) + "; or the path of a .yaml profile");
        }
        return profile;
    }
}
