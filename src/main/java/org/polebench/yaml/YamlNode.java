package org.polebench.yaml;

import java.util.List;
import java.util.Optional;

/** One node of a YAML document, with the 1-based line where it starts. */
public sealed interface YamlNode permits YamlNode.Scalar, YamlNode.Sequence, YamlNode.Mapping {

    /** @return the 1-based line where this node starts */
    int line();

    /** @return a word for error messages: "a value", "a list", "a map" */
    String kind();

    /** A plain value; YAML's null and empty values read as an empty text. */
    record Scalar(String text, int line) implements YamlNode {
        @Override
        public String kind() {
            return "a value";
        }
    }

    record Sequence(List<YamlNode> items, int line) implements YamlNode {
        public Sequence {
            items = List.copyOf(items);
        }

        @Override
        public String kind() {
            return "a list";
        }
    }

    /** A key with the line of the key itself and the value under it. */
    record Entry(String key, int line, YamlNode value) {
    }

    /** A map in document order; duplicate keys are refused by {@link YamlReader}. */
    record Mapping(List<Entry> entries, int line) implements YamlNode {
        public Mapping {
            entries = List.copyOf(entries);
        }

        public Optional<Entry> entry(String key) {
            for (Entry entry : entries) {
                if (entry.key().equals(key)) {
                    return Optional.of(entry);
                }
            }
            return Optional.empty();
        }

        public Optional<YamlNode> get(String key) {
            return entry(key).map(Entry::value);
        }

        public List<String> keys() {
            return entries.stream().map(Entry::key).toList();
        }

        @Override
        public String kind() {
            return "a map";
        }
    }
}
