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
        try {
            out.println(mapper.writeValueAsString(node));
        } catch (JsonProcessingException e) {
            // a tree built from our own nodes always serialises; this is a defect, not input
            throw new IllegalStateException("could not write JSON", e);
        }
    }
}
