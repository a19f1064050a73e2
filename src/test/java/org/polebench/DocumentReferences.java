package org.polebench;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Finds the documents a text names and checks that each is in the repository: every name of a
 * {@code .md} file, every relative Markdown link (and its {@code #anchor}), and every section
 * cited as {@code docs/<name>.md, "Heading"}. Used by {@link DocumentsExistTest}.
 */
final class DocumentReferences {
    /** A document's name: path characters ending in {@code .md}, not part of a longer word. */
    private static final Pattern MD_NAME = Pattern.compile("(?<![\\w./:-])([\\w./-]*[\\w-]\\.md)(?![\\w])");
    /** A Markdown link or image: {@code [text](target)}. */
    private static final Pattern LINK = Pattern.compile("\\]\\(([^)\\s]+)\\)");
    /**
     * A cited section: a docs/ document, then {@code , "Heading"} or {@code ("Heading")}, where
     * the comma or parenthesis may be followed by a line break and a Javadoc or comment prefix.
     */
    private static final Pattern SECTION = Pattern.compile(
            "(docs/[\\w-]+\\.md)(?:,|\\s\\()\\s*(?:(?://|\\*)\\s*)?\"([^\"]+)\"");
    private static final Pattern HEADING = Pattern.compile("^#{1,6}\\s+(.*?)\\s*#*\\s*$");

    private final Path root;
    private final Map<Path, List<String>> headings = new HashMap<>();

    /** @param root the repository's top folder, where pom.xml is */
    DocumentReferences(Path root) {
        this.root = root.toAbsolutePath().normalize();
    }

    /**
     * @param file a file of the repository (its folder resolves a Markdown file's relative names)
     * @param text its text
     * @return one line per missing document, link target, anchor or section, naming the file and line
     */
    List<String> problems(Path file, String text) {
        boolean markdown = file.getFileName().toString().endsWith(".md");
        Path folder = file.toAbsolutePath().normalize().getParent();
        Set<String> found = new LinkedHashSet<>();
        String prose = markdown ? withoutFencedCode(text) : text;

        Matcher name = MD_NAME.matcher(prose);
        while (name.find()) {
            String written = name.group(1);
            if (written.startsWith("http") || written.contains("://")) {
                continue;
            }
            if (resolve(folder, written, markdown) == null) {
                found.add(where(file, prose, name.start()) + ": names " + written + ", which is not in the repository");
            }
        }
        if (markdown) {
            Matcher link = LINK.matcher(prose);
            while (link.find()) {
                String target = link.group(1);
                if (target.matches("^[a-z][a-z0-9+.-]*:.*")) {
                    continue; // https:, mailto: and the like are not files of the repository
                }
                int hash = target.indexOf('#');
                String filePart = hash < 0 ? target : target.substring(0, hash);
                Path document = filePart.isEmpty() ? file.toAbsolutePath().normalize() : folder.resolve(filePart).normalize();
                if (!Files.exists(document) || !document.startsWith(root)) {
                    found.add(where(file, prose, link.start()) + ": links to " + target + ", which is not in the repository");
                } else if (hash >= 0 && !anchors(document).contains(target.substring(hash + 1))) {
                    found.add(where(file, prose, link.start()) + ": links to " + target
                            + ", but " + root.relativize(document) + " has no heading with that anchor");
                }
            }
        }
        Matcher section = SECTION.matcher(prose);
        while (section.find()) {
            Path document = root.resolve(section.group(1));
            if (Files.exists(document) && !headingTexts(document).contains(section.group(2).toLowerCase(Locale.ROOT))) {
                found.add(where(file, prose, section.start()) + ": cites " + section.group(1) + ", \""
                        + section.group(2) + "\", which is no heading there");
            }
        }
        return new ArrayList<>(found);
    }

    /** A bare name in code is read from the top folder; in Markdown, from the file's own folder. */
    private Path resolve(Path folder, String written, boolean markdown) {
        Path candidate = (markdown ? folder : root).resolve(written).normalize();
        return Files.isRegularFile(candidate) && candidate.startsWith(root) ? candidate : null;
    }

    private String where(Path file, String text, int offset) {
        int line = 1;
        for (int i = 0; i < offset; i++) {
            if (text.charAt(i) == '\n') {
                line++;
            }
        }
        return root.relativize(file.toAbsolutePath().normalize()) + ":" + line;
    }

    /** Lines inside ``` fences become empty, so that code is neither heading nor link; line numbers stay. */
    static String withoutFencedCode(String text) {
        StringBuilder out = new StringBuilder(text.length());
        boolean fenced = false;
        for (String line : text.split("\n", -1)) {
            if (line.startsWith("```")) {
                fenced = !fenced;
                out.append('\n');
                continue;
            }
            out.append(fenced ? "" : line).append('\n');
        }
        return out.substring(0, out.length() - 1);
    }

    private List<String> headingLines(Path document) {
        return headings.computeIfAbsent(document, d -> {
            List<String> result = new ArrayList<>();
            for (String line : withoutFencedCode(read(d)).split("\n")) {
                Matcher heading = HEADING.matcher(line);
                if (heading.matches()) {
                    result.add(heading.group(1));
                }
            }
            return result;
        });
    }

    private Set<String> headingTexts(Path document) {
        Set<String> texts = new LinkedHashSet<>();
        for (String heading : headingLines(document)) {
            texts.add(heading.replace("`", "").toLowerCase(Locale.ROOT));
        }
        return texts;
    }

    /**
     * The anchors a Markdown renderer gives a document's headings, as GitHub makes them: lower
     * case, every character but letters, digits, blanks, hyphens and underscores dropped, blanks
     * turned to hyphens, and -1, -2 … appended to repeats (GitHub's documented behaviour for
     * section links, from memory).
     */
    Set<String> anchors(Path document) {
        Set<String> anchors = new LinkedHashSet<>();
        Map<String, Integer> seen = new HashMap<>();
        for (String heading : headingLines(document)) {
            String slug = slug(heading);
            int count = seen.merge(slug, 1, Integer::sum);
            anchors.add(count == 1 ? slug : slug + "-" + (count - 1));
        }
        return anchors;
    }

    static String slug(String heading) {
        StringBuilder slug = new StringBuilder();
        heading.toLowerCase(Locale.ROOT).codePoints().forEach(c -> {
            if (Character.isLetterOrDigit(c) || c == '-' || c == '_') {
                slug.appendCodePoint(c);
            } else if (c == ' ') {
                slug.append('-');
            }
        });
        return slug.toString();
    }

    static String read(Path file) {
        try {
            return Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
