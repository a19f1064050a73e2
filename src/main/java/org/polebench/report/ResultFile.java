package org.polebench.report;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.polebench.InputProblem;

/** Reads a saved {@code result.json} back for {@code polebench report}, refusing anything else. */
public final class ResultFile {
    private static final String[] REQUIRED = {"diagnosis", "predicted", "measured", "side_by_side", "capacitors", "hypotheses",
        "verdict", "sweep", "curves", "run"};

    /** No result is larger: 64 MiB is over ten times a 100,000-point sweep's result. */
    static final long MAX_BYTES = 64L << 20;

    private final ObjectMapper mapper = new ObjectMapper();

    /**
     * @throws InputProblem naming the file and line when it is not JSON, or not a result written
     *                      by {@code polebench reconcile}
     * @throws IOException  when it cannot be read
     */
    public JsonNode read(Path file) throws InputProblem, IOException {
        JsonNode root;
        try {
            // a result of the densest sweep a bench makes is a few MB; reading is bounded before parsing
            if (Files.size(file) > MAX_BYTES) {
                throw new InputProblem(file, 0, "the file holds " + Files.size(file) + " bytes, more than any result ("
                        + MAX_BYTES + ")", "give the result.json that polebench reconcile wrote");
            }
            root = mapper.readTree(Files.readAllBytes(file));
        } catch (NoSuchFileException missing) {
            throw new InputProblem(file, 0, "no such file", "give the path of a result.json from polebench reconcile");
        } catch (JsonProcessingException bad) {
            JsonLocation at = bad.getLocation();
            throw new InputProblem(file, at == null ? 0 : Math.max(0, at.getLineNr()),
                    "not valid JSON: " + bad.getOriginalMessage(), "give the result.json that polebench reconcile wrote");
        }
        if (root == null || !root.isObject() || !ResultJson.FORMAT.equals(root.path("format").asText())) {
            throw new InputProblem(file, 1, "not a polebench reconcile result (no \"format\": \"" + ResultJson.FORMAT + "\")",
                    "give the result.json of a report folder, or the output of polebench reconcile --json");
        }
        if (root.path("format_version").asInt() == 1) {
            // version 1 passed a verdict whose limits the sweep did not all decide, and does not
            // say which ones it decided: re-rendering it would repeat that pass (issue 11)
            throw new InputProblem(file, 1, "result format version 1 does not say which limits the sweep decided",
                    "re-run polebench reconcile with this version to write a version "
                            + ResultJson.FORMAT_VERSION + " result");
        }
        if (root.path("format_version").asInt() != ResultJson.FORMAT_VERSION) {
            throw new InputProblem(file, 1, "result format version " + root.path("format_version").asText()
                    + " is not one this polebench reads", "re-run polebench reconcile with this version");
        }
        for (String key : REQUIRED) {
            if (!root.has(key)) {
                throw new InputProblem(file, 1, "the result has no \"" + key + "\" section",
                        "re-run polebench reconcile; the file may have been cut short or edited");
            }
        }
        new ResultCheck().check(file, root);
        return root;
    }

    /**
     * Checks the stage and sweep files the result names against their recorded SHA-256, where
     * they are at hand: at the recorded path, or beside the result when that path is relative or
     * gone. A file that differs is refused; one not found is only stated.
     *
     * @param resultFile the result.json, whose folder is the second place looked in
     * @return one sentence per file: checked, or not at hand
     * @throws InputProblem when a file at hand does not have the recorded digest
     * @throws IOException  when a file at hand cannot be read
     */
    public List<String> checkInputs(Path resultFile, JsonNode root) throws InputProblem, IOException {
        List<String> said = new ArrayList<>();
        said.add(digest(resultFile, "stage", root.path("stage_file").asText(), root.path("stage_sha256").asText()));
        said.add(digest(resultFile, "sweep", root.path("sweep_file").asText(), root.path("sweep_sha256").asText()));
        return said;
    }

    private static String digest(Path resultFile, String what, String recorded, String sha256)
            throws InputProblem, IOException {
        Optional<Path> found = atHand(resultFile, recorded);
        if (found.isEmpty() || sha256.isEmpty()) {
            return what + " file " + recorded + ": not at hand, SHA-256 not checked";
        }
        String actual = FileDigest.sha256(found.get());
        if (!actual.equalsIgnoreCase(sha256)) {
            throw new InputProblem(resultFile, 0, "$." + what + "_sha256 is " + sha256 + " but " + found.get()
                    + " has SHA-256 " + actual + ": the " + what + " file changed since the result was written",
                    "run polebench reconcile again on the files as they are, or restore the " + what + " file");
        }
        return what + " file " + found.get() + ": SHA-256 matches";
    }

    private static Optional<Path> atHand(Path resultFile, String recorded) {
        if (recorded.isEmpty()) {
            return Optional.empty();
        }
        Path path;
        try {
            path = Path.of(recorded);
        } catch (InvalidPathException notAPath) {
            return Optional.empty();
        }
        if (Files.isRegularFile(path)) {
            return Optional.of(path);
        }
        Path folder = resultFile.toAbsolutePath().getParent();
        Path beside = folder == null || path.getFileName() == null ? null : folder.resolve(path.getFileName());
        return beside != null && Files.isRegularFile(beside) ? Optional.of(beside) : Optional.empty();
    }
}
