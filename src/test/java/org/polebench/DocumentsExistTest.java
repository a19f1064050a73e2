package org.polebench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Every document that the code, a message or a document names is in the repository (issue 12):
 * the names of {@code .md} files and the relative links in src/main, src/test, the README, the
 * contributor's pointer and docs/, the anchors of those links, and the sections cited as
 * {@code docs/<name>.md, "Heading"}.
 */
class DocumentsExistTest {
    private static final Path ROOT = Path.of("").toAbsolutePath();
    /** Written apart from the names so that this file names no document itself. */
    private static final String MD = ".md";

    @Test
    void everyNamedDocumentLinkAndCitedSectionIsInTheRepository() throws IOException {
        DocumentReferences references = new DocumentReferences(ROOT);
        List<Path> files = new ArrayList<>();
        for (String tree : List.of("src/main", "src/test", "docs")) {
            try (Stream<Path> walk = Files.walk(ROOT.resolve(tree))) {
                walk.filter(Files::isRegularFile).filter(DocumentsExistTest::isText).forEach(files::add);
            }
        }
        files.add(ROOT.resolve("README.md"));
        files.add(ROOT.resolve("DEVELOPERS.md"));
        // the three documents issue 12 asks for, so that an empty docs/ cannot pass
        for (String document : List.of("user-guide", "method", "contributing")) {
            Path path = ROOT.resolve("docs").resolve(document + MD);
            assertTrue(Files.isRegularFile(path), path + " is missing");
        }

        List<String> problems = new ArrayList<>();
        for (Path file : files) {
            problems.addAll(references.problems(file, DocumentReferences.read(file)));
        }

        assertEquals("", problems.stream().collect(Collectors.joining("\n")),
                "documents, links or sections named but not in the repository");
    }

    @Test
    void aMissingDocumentABrokenLinkAndAMissingSectionAreEachFound(@TempDir Path repository) throws IOException {
        // a made-up repository whose truth is known: one document with one heading
        Files.createDirectories(repository.resolve("docs"));
        String guide = "docs/guide" + MD;
        Files.writeString(repository.resolve(guide), "# Guide\n\n## Stage files\n\n```\n# not a heading\n```\n");
        String missing = "NOSUCH" + MD;
        Path code = repository.resolve("Code.java");
        String text = "// see " + guide + ", \"Stage files\"\n"
                + "// see " + missing + "\n"
                + "/* " + guide + ",\n * \"Bands\" */\n";
        Path readme = repository.resolve("README.md");
        String markdown = "[ok](" + guide + "#stage-files) [gone](docs/" + missing + ") "
                + "[no anchor](" + guide + "#not-a-heading) [web](https://example.org/x" + MD + ")\n";

        DocumentReferences references = new DocumentReferences(repository);
        List<String> inCode = references.problems(code, text);
        List<String> inMarkdown = references.problems(readme, markdown);

        assertEquals(List.of("Code.java:2: names " + missing + ", which is not in the repository",
                "Code.java:3: cites " + guide + ", \"Bands\", which is no heading there"), inCode);
        assertEquals(List.of("README.md:1: names docs/" + missing + ", which is not in the repository",
                "README.md:1: links to docs/" + missing + ", which is not in the repository",
                "README.md:1: links to " + guide + "#not-a-heading, but " + guide + " has no heading with that anchor"),
                inMarkdown);
    }

    @Test
    void anchorsAreMadeAsGitHubMakesThem() {
        // GitHub's section links, checked by hand against rendered pages (from memory)
        assertEquals("1-does-the-stage-explain-the-sweep", DocumentReferences.slug("1. Does the stage explain the sweep?"));
        assertEquals("what-resultjson-adds-to-the-reconcile-json",
                DocumentReferences.slug("What `result.json` adds to the reconcile JSON"));
        assertEquals("sctc-and-octc-estimates", DocumentReferences.slug("SCTC and OCTC estimates"));
    }

    private static boolean isText(Path file) {
        String name = file.getFileName().toString();
        return name.endsWith(".java") || name.endsWith(".md") || name.endsWith(".yaml") || name.endsWith(".txt")
                || name.endsWith(".properties") || name.endsWith(".html") || name.endsWith(".css");
    }
}
