package org.polebench.cli;

import java.io.IOException;
import java.util.List;
import java.util.concurrent.Callable;
import org.polebench.InputProblem;
import org.polebench.ledger.BoardHistory;
import org.polebench.ledger.Ledger;
import org.polebench.ledger.LedgerLocation;
import org.polebench.ledger.RecordedTest;
import org.polebench.report.HistoryJson;
import org.polebench.report.HistoryText;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code polebench history}: every test of one board, and what changed between them. */
@Command(name = "history", mixinStandardHelpOptions = true,
        description = {"Lists every test of one board in the ledger in time order, and between each two what changed: "
                + "whether the verdict changed, and which parts' back-solved values moved beyond the two tests' "
                + "uncertainties (twice the standard uncertainty of the difference), by how much."},
        footer = {"", "Example:", "  polebench history --board gf2-0417",
                "  polebench history --ledger jdbc:postgresql://testdb/line1 --board gf2-0417 --json"})
final class HistoryCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    LedgerOption ledger = new LedgerOption();

    @Option(names = "--board", paramLabel = "ID", required = true, description = "the board's id")
    String board;

    @Option(names = "--json", description = "print one JSON object instead of the text")
    boolean json;

    @Override
    public Integer call() throws InputProblem, IOException {
        LedgerLocation location = ledger.existing();
        List<RecordedTest> tests;
        try (Ledger opened = Ledger.open(location)) {
            tests = opened.history(board);
        }
        if (tests.isEmpty()) {
            throw new InputProblem(null, 0, "the ledger " + location + " holds no test of board " + board,
                    "check the board id (polebench batch prints each board's id as it records it)");
        }
        BoardHistory history = new BoardHistory(board, tests);
        if (json) {
            new JsonOutput().print(new HistoryJson().of(history), spec.commandLine().getOut());
        } else {
            new HistoryText().write(history, spec.commandLine().getOut());
        }
        return ExitCodes.OK;
    }
}
