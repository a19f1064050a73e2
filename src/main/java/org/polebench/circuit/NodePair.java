package org.polebench.circuit;

import java.util.List;

/** The two nodes a two-terminal part sits between, in the order the stage file gives them. */
public record NodePair(String a, String b) {
    public NodePair {
        if (a == null || b == null || a.isBlank() || b.isBlank()) {
            throw new IllegalArgumentException("both nodes must be named");
        }
    }

    public List<String> asList() {
        return List.of(a, b);
    }
}
