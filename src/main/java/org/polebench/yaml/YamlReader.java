package org.polebench.yaml;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.polebench.InputLimits;
import org.polebench.InputProblem;

/**
 * Reads one YAML document into a {@link YamlNode} tree with line numbers. Refuses duplicate
 * keys (YAML 1.2 §3.2.1.1 requires unique keys; a silent last-one-wins would lose what the
 * user wrote) and files that are not UTF-8.
 */
public final class YamlReader {
    private final YAMLFactory factory = new YAMLFactory();
    private final long maxBytes;
    private final long maxLineChars;

    /** A reader under the limits this JVM was started with ({@link InputLimits#standing()}). */
    public YamlReader() {
        this(InputLimits.standing().maxYamlBytes(), InputLimits.standing().maxLineChars());
    }

    /**
     * @param maxBytes     the largest file read; a larger one is refused before it is read
     * @param maxLineChars the longest line; a file with a longer one is refused before it is parsed
     */
    public YamlReader(long maxBytes, long maxLineChars) {
        this.maxBytes = maxBytes;
        this.maxLineChars = maxLineChars;
    }

    /** @return the root node; an empty document reads as an empty map */
    public YamlNode read(Path file) throws InputProblem {
        String text;
        try {
            if (Files.size(file) > maxBytes) {
                throw new InputProblem(file, 0, "the file has " + Files.size(file) + " bytes, more than " + maxBytes
                        + ", the limit on a stage, profile or bench file (" + InputLimits.MAX_YAML_BYTES + ")",
                        InputLimits.raise(InputLimits.MAX_YAML_BYTES, maxBytes, "check that this is the right file"));
            }
            byte[] bytes = Files.readAllBytes(file);
            text = StandardCharsets.UTF_8.newDecoder().decode(java.nio.ByteBuffer.wrap(bytes)).toString();
        } catch (NoSuchFileException e) {
            throw new InputProblem(file, 0, "file not found", "check the path");
        } catch (CharacterCodingException e) {
            throw new InputProblem(file, 0, "the file is not UTF-8 text", "save it as UTF-8");
        } catch (IOException e) {
            throw new InputProblem(file, 0, "cannot read the file: " + e.getMessage(),
                    "check that it exists and is readable");
        }
        if (!text.isEmpty() && text.charAt(0) == '\uFEFF') {
            text = text.substring(1);
        }
        checkLines(file, text);
        return read(file, new StringReader(text));
    }

    /**
     * Refuses a line past the limit before the YAML scanner sees it: the scanner's time grows
     * with the square of an unbroken value's length (a 50 MB value ran for over 15 minutes).
     */
    private void checkLines(Path file, String text) throws InputProblem {
        long line = 1;
        int start = 0;
        for (int i = 0; i <= text.length(); i++) {
            if (i == text.length() || text.charAt(i) == '\n') {
                if (i - start > maxLineChars) {
                    throw new InputProblem(file, line, "the line has " + (i - start) + " characters, more than "
                            + maxLineChars + ", the limit on one line (" + InputLimits.MAX_LINE_CHARS + ")",
                            InputLimits.raise(InputLimits.MAX_LINE_CHARS, maxLineChars,
                                    "check that this is the right file"));
                }
                line++;
                start = i + 1;
            }
        }
    }

    /** @param file named in errors; may be null for text that came from elsewhere */
    public YamlNode read(Path file, Reader text) throws InputProblem {
        try (JsonParser parser = factory.createParser(text)) {
            JsonToken first = parser.nextToken();
            if (first == null) {
                return new YamlNode.Mapping(List.of(), 1);
            }
            YamlNode root = readNode(parser, file);
            return root;
        } catch (JsonProcessingException e) {
            JsonLocation where = e.getLocation();
            int line = where == null ? 0 : Math.max(0, where.getLineNr());
            throw new InputProblem(file, line, "not valid YAML: " + e.getOriginalMessage(),
                    "check the indentation and the ':' after each key near this line");
        } catch (IOException e) {
            throw new InputProblem(file, 0, "cannot read the file: " + e.getMessage(), "");
        }
    }

    private YamlNode readNode(JsonParser parser, Path file) throws IOException, InputProblem {
        JsonToken token = parser.currentToken();
        int line = lineOf(parser);
        switch (token) {
            case START_OBJECT: {
                List<YamlNode.Entry> entries = new ArrayList<>();
                Set<String> seen = new HashSet<>();
                while (parser.nextToken() == JsonToken.FIELD_NAME) {
                    String key = parser.currentName();
                    int keyLine = lineOf(parser);
                    if (!seen.add(key)) {
                        throw new InputProblem(file, keyLine, "'" + key + "' is given twice in the same map",
                                "keep one of them");
                    }
                    parser.nextToken();
                    entries.add(new YamlNode.Entry(key, keyLine, readNode(parser, file)));
                }
                return new YamlNode.Mapping(entries, line);
            }
            case START_ARRAY: {
                List<YamlNode> items = new ArrayList<>();
                while (parser.nextToken() != JsonToken.END_ARRAY) {
                    items.add(readNode(parser, file));
                }
                return new YamlNode.Sequence(items, line);
            }
            case VALUE_NULL:
                return new YamlNode.Scalar("", line);
            default:
                return new YamlNode.Scalar(parser.getText(), line);
        }
    }

    private static int lineOf(JsonParser parser) {
        return Math.max(1, parser.currentTokenLocation().getLineNr());
    }
}
