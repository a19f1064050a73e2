package org.polebench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.stream.Stream;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.polebench.InputProblem;
import org.polebench.lot.LotFindings;

class LotReportWriterTest {
    private static final Instant ISSUED = Instant.parse("2026-05-05T12:00:00Z");

    @Test
    void theFolderHoldsThePageTheJsonTheCsvAndTheCharts(@TempDir Path dir) throws Exception {
        LotFindings lot = DemoLot.findings();
        Path out = dir.resolve("lot-report");
        new LotReportWriter().write(out, lot, false, ISSUED);

        for (String name : LotReportWriter.FILES) {
            assertTrue(Files.isRegularFile(out.resolve(name)), name);
        }
        // no temporary folder left beside it
        try (Stream<Path> left = Files.list(dir)) {
            assertEquals(1, left.count());
        }
        // parsed by jsoup, an independent HTML parser: the sections by id, five inline charts
        Document page = Jsoup.parse(out.resolve(LotReportWriter.HTML).toFile(), "UTF-8");
        assertEquals("HP-lot-7", page.getElementById("lot-name").text());
        assertTrue(page.getElementById("systematic").text().contains("C2 reads ×"));
        assertTrue(page.getElementById("single-board").text().contains("HP-012"));
        assertEquals(5, page.select("figure.chart svg").size());
        assertEquals(DemoLot.BOARDS, page.select("#board-table tbody tr").size());
        // the board named as a formula is text in the page, escaped, never markup
        assertEquals(DemoLot.FORMULA_BOARD, page.select("#board-table tbody tr").get(6).child(1).text());
        assertTrue(page.getElementById("end-of-report") != null);
        // the same findings and date give the same page, byte for byte
        Path again = dir.resolve("again");
        new LotReportWriter().write(again, lot, false, ISSUED);
        assertEquals(Files.readString(out.resolve(LotReportWriter.HTML)), Files.readString(again.resolve(LotReportWriter.HTML)));
    }

    @Test
    void anEarlierReportIsKeptUnlessForced(@TempDir Path dir) throws Exception {
        LotFindings lot = DemoLot.findings();
        Path out = dir.resolve("r");
        new LotReportWriter().write(out, lot, false, ISSUED);
        Files.writeString(out.resolve("notes.txt"), "mine");
        InputProblem refused = assertThrows(InputProblem.class, () -> new LotReportWriter().write(out, lot, false, ISSUED));
        assertTrue(refused.getMessage().contains("already holds a lot report"), refused.getMessage());
        new LotReportWriter().write(out, lot, true, ISSUED.plusSeconds(60));
        assertTrue(Files.readString(out.resolve(LotReportWriter.HTML)).contains("2026-05-05T12:01:00Z"));
        assertEquals("mine", Files.readString(out.resolve("notes.txt")));
    }

    @Test
    void aLotWithNoBoardsGetsAPageWithoutCharts(@TempDir Path dir) throws Exception {
        LotFindings empty = org.polebench.lot.LotAnalysis.of("empty-lot", java.util.List.of(),
                new org.polebench.circuit.StageReader().read(Path.of("sample-measurements/hydrophone-preamp-ce.stage.yaml"))
                        .stage(), 1, 20);
        Path out = dir.resolve("r");
        new LotReportWriter().write(out, empty, false, ISSUED);
        try (Stream<Path> files = Files.list(out)) {
            // the page, the JSON and the header-only CSV; no chart has anything to draw
            assertEquals(java.util.Set.of(LotReportWriter.HTML, LotReportWriter.JSON, LotReportWriter.CSV),
                    files.map(p -> p.getFileName().toString()).collect(java.util.stream.Collectors.toSet()));
        }
        Document page = Jsoup.parse(out.resolve(LotReportWriter.HTML).toFile(), "UTF-8");
        assertEquals("Lot empty-lot: no boards recorded.", page.getElementById("counts").text());
        assertEquals(0, page.select("figure.chart").size());
    }
}
