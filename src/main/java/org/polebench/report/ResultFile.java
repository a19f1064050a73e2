package org.polebench.report;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import org.polebench.InputProblem;

/** Reads a saved {@code result.json} back for {@code polebench report}, refusing anything else. */
public final class ResultFile {
    private static final String[] REQUIRED = {"diagnosis", "predicted", "measured", "side_by_side", "capacitors", "hypotheses",
        "verdict", "sweep", "curves", "run"};

    private final ObjectMapper mapper = new ObjectMapper();

    /**
     * @throws InputProblem naming the file and line when it is not JSON, or not a result written
     *                      by {@code polebench reconcile}
     * @throws IOException  when it cannot be read
     */
    public JsonNode read(Path file) throws InputProblem, IOException {
        JsonNode root;
        try {
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
        return root;
    }
}
