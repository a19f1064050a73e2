package org.polebench.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.polebench.lot.BoardOutcome;
import org.polebench.lot.LotFindings;

/**
 * The lot's board table as CSV ({@code boards.csv}): one row per test in test order, with the
 * columns {@code board, test_order, tested_utc, station, operator, outcome, midband_gain_db,
 * midband_gain_expanded_u_db, lower_corner_hz, lower_corner_expanded_u_hz, coverage_factor,
 * explained, top_hypothesis, top_probability, problem}. Written as {@link CapacitorCsv} writes
 * its table: a UTF-8 byte-order mark, RFC 4180 quoting, CRLF line ends, numbers to 12
 * significant digits, and a text field that a spreadsheet would read as a formula neutralised
 * with a leading single quote (its {@code field} and {@code number}).
 */
public final class LotCsv {
    private static final String[] HEADER = {"board", "test_order", "tested_utc", "station", "operator", "outcome",
        "midband_gain_db", "midband_gain_expanded_u_db", "lower_corner_hz", "lower_corner_expanded_u_hz",
        "coverage_factor", "explained", "top_hypothesis", "top_probability", "problem"};

    /** @return the CSV text, byte-order mark first */
    public String of(LotFindings lot) {
        StringBuilder out = new StringBuilder(CapacitorCsv.BOM);
        List<String> header = new ArrayList<>();
        for (String name : HEADER) {
            header.add(CapacitorCsv.field(name));
        }
        out.append(String.join(",", header)).append("\r\n");
        for (BoardOutcome b : lot.tests()) {
            List<String> cells = new ArrayList<>();
            cells.add(CapacitorCsv.field(b.boardId()));
            cells.add(Long.toString(b.testOrder()));
            cells.add(CapacitorCsv.field(b.testedAt().toString()));
            cells.add(CapacitorCsv.field(b.station()));
            cells.add(CapacitorCsv.field(b.operator()));
            cells.add(b.outcome().word());
            cells.add(number(b.midbandGainDb()));
            cells.add(number(b.midbandGainUDb()));
            cells.add(number(b.lowerCornerHz()));
            cells.add(number(b.lowerCornerUHz()));
            cells.add(CapacitorCsv.number(b.coverageFactor()));
            cells.add(b.explained() ? "yes" : "no");
            cells.add(CapacitorCsv.field(b.topHypothesis()));
            cells.add(CapacitorCsv.number(b.topProbability()));
            cells.add(CapacitorCsv.field(b.problem().orElse("")));
            out.append(String.join(",", cells)).append("\r\n");
        }
        return out.toString();
    }

    private static String number(Optional<Double> value) {
        return value.map(CapacitorCsv::number).orElse("");
    }
}
