package org.polebench.report;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;

/**
 * Headless Chromium for the rendering tests (Debian's package, which .ci/run installs): where it
 * is on the PATH, and one run of it on a page with the flags every test uses (no sandbox, no
 * first-run or background traffic, a profile folder of its own).
 */
final class HeadlessChromium {
    private HeadlessChromium() {
    }

    /** @return the browser's executable on the PATH, under either name Debian and Ubuntu give it */
    static Optional<Path> find() {
        for (String name : new String[]{"chromium", "chromium-browser"}) {
            for (String folder : System.getenv().getOrDefault("PATH", "/usr/bin").split(":")) {
                Path candidate = Path.of(folder, name);
                if (Files.isExecutable(candidate)) {
                    return Optional.of(candidate);
                }
            }
        }
        return Optional.empty();
    }

    /**
     * Runs the browser on {@code page} with the test's own flags ({@code --screenshot=…},
     * {@code --print-to-pdf=…}), its log in {@code dir/chromium.log}.
     *
     * @return empty when it ran and exited 0, else why not (for the test's assumption message)
     */
    static Optional<String> run(Path chromium, Path dir, Path page, List<String> flags)
            throws IOException, InterruptedException {
        Path profile = Files.createDirectories(dir.resolve("chromium-profile"));
        List<String> command = new ArrayList<>(List.of(chromium.toString(), "--headless", "--no-sandbox",
                "--disable-gpu", "--no-first-run", "--disable-background-networking", "--disable-component-update",
                "--disable-sync", "--user-data-dir=" + profile));
        command.addAll(flags);
        command.add(page.toUri().toString());
        Path log = dir.resolve("chromium.log");
        Process process = new ProcessBuilder(command).redirectErrorStream(true).redirectOutput(log.toFile()).start();
        boolean done = process.waitFor(120, TimeUnit.SECONDS);
        if (!done) {
            process.destroyForcibly();
            return Optional.of("timed out");
        }
        return process.exitValue() == 0 ? Optional.empty() : Optional.of("exit " + process.exitValue() + ": " + tail(log));
    }

    private static String tail(Path log) {
        try {
            String text = Files.readString(log);
            return text.length() > 400 ? text.substring(text.length() - 400) : text;
        } catch (IOException e) {
            return "no log";
        }
    }
}
