package org.polebench.cli;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/**
 * The demo files a command falls back on when the user names none: the working tree's
 * {@code sample-measurements/} when polebench runs from a checkout, else the copies bundled in
 * the jar, unpacked into a fresh temporary folder (never over a user's file).
 */
final class BundledSamples {
    static final String FOLDER = "sample-measurements";
    /** The demo stage {@code predict} and {@code reconcile} use with no arguments. */
    static final String DEMO_STAGE = "geophone-two-stage.stage.yaml";

    private BundledSamples() {
    }

    /** @return a readable path to the named demo file */
    static Path locate(String name) throws IOException {
        Path local = Path.of(FOLDER, name);
        if (Files.isRegularFile(local)) {
            return local;
        }
        try (InputStream bundled = BundledSamples.class.getResourceAsStream("/" + FOLDER + "/" + name)) {
            if (bundled == null) {
                throw new IOException("the demo file " + name + " is missing from this build of polebench");
            }
            Path folder = Files.createTempDirectory("polebench-demo");
            Path copy = folder.resolve(name);
            // deleteOnExit deletes in the reverse order of registration: the folder is registered
            // first so that it goes after the file in it (registered the other way round, its
            // delete came first, failed on a folder not yet empty, and every demo run left one, issue 15)
            folder.toFile().deleteOnExit();
            copy.toFile().deleteOnExit();
            Files.copy(bundled, copy, StandardCopyOption.REPLACE_EXISTING);
            return copy;
        }
    }
}
