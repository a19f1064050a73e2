package org.polebench.cli;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.io.PrintWriter;

/** Prints one JSON object, indented, as every {@code --json} option does. */
final class JsonOutput {
    private final ObjectMapper mapper = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    void print(JsonNode node, PrintWriter out) {
        printValue(node, out);
    }

    /** @param value a tree, or plain maps, lists, strings and numbers */
    void printValue(Object value, PrintWriter out) {
        try {
            out.println(mapper.writeValueAsString(value));
        } catch (JsonProcessingException e) {
            // plain values and our own trees always serialise; this is a defect, not input
            throw new IllegalStateException("could not write JSON", e);
        }
    }
}
