package org.polebench.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.polebench.InputProblem;
import org.polebench.circuit.StageFile;
import org.polebench.circuit.StageReader;
import org.polebench.ledger.Ledger;
import org.polebench.ledger.LedgerLocation;
import org.polebench.lot.BoardOutcome;
import org.polebench.lot.LotAnalysis;
import org.polebench.lot.LotFindings;
import org.polebench.report.LotJson;
import org.polebench.report.LotReportWriter;
import org.polebench.report.LotText;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code polebench lot}: what a lot's boards in the ledger say together. */
@Command(name = "lot", mixinStandardHelpOptions = true,
        description = {"Reads every test of one lot from the ledger and says what the lot says that one board cannot: "
                + "yield and counts by station and by day, the lower corner and midband gain against the predicted "
                + "tolerance spread, individuals control charts with run rules, Cpk against the stage's limits, "
                + "a Pareto of culprits, and parts shifted on most boards (systematic shifts).",
                "The stage is the one the lot was tested against, as the ledger keeps it."},
        footer = {"", "Example:", "  polebench lot --lot saltmarsh-run3",
                "  polebench lot --ledger jdbc:postgresql://testdb/line1 --lot 2026-W49 --json",
                "  polebench lot --lot saltmarsh-run3 --report lot-report"})
final class LotCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    LedgerOption ledger = new LedgerOption();

    @Option(names = "--lot", paramLabel = "NAME", required = true, description = "the lot's name, as batch recorded it")
    String lot;

    @Option(names = "--json", description = "print one JSON object instead of the text")
    boolean json;

    @Option(names = "--report", paramLabel = "DIR",
            description = "also write the lot report (lot.html, lot.json, boards.csv and its charts) into DIR")
    Path report;

    @Option(names = "--force", description = "replace a lot report already in DIR")
    boolean force;

    @Option(names = "--draws", paramLabel = "N", defaultValue = "" + LotAnalysis.DEFAULT_DRAWS,
            description = "boards drawn for the predicted tolerance band (default ${DEFAULT-VALUE})")
    int draws;

    @Option(names = "--seed", paramLabel = "SEED", defaultValue = "" + LotAnalysis.DEFAULT_SEED,
            description = "the seed of those draws (default ${DEFAULT-VALUE})")
    long seed;

    @Override
    public Integer call() throws InputProblem, IOException {
        if (draws < 20) {
            throw new InputProblem(null, 0, "--draws " + draws + " is too few for the band's 5 % and 95 % points",
                    "use at least 20 (the default is " + LotAnalysis.DEFAULT_DRAWS + ")");
        }
        CountLimits.samples(draws);
        LedgerLocation location = ledger.existing();
        List<BoardOutcome> boards;
        Optional<String> stageText;
        try (Ledger opened = Ledger.open(location)) {
            boards = opened.lot(lot);
            stageText = opened.stageTextOfLot(lot);
        }
        if (boards.isEmpty() || stageText.isEmpty()) {
            throw new InputProblem(null, 0, "the ledger " + location + " holds no test of lot " + lot,
                    "check the lot's name (polebench batch prints it in its summary)");
        }
        // the name messages give the stage: it is the ledger's copy, not a file on disk
        Path stageName = Path.of(lot + ".stage.yaml (as kept in the ledger)");
        StageFile stage = new StageReader().read(stageName, stageText.get());
        LotFindings findings = LotAnalysis.of(lot, boards, stage.stage(), seed, draws);
        if (report != null) {
            new LotReportWriter().write(report, findings, force, Instant.now());
        }
        if (json) {
            new JsonOutput().print(new LotJson().of(findings), spec.commandLine().getOut());
        } else {
            new LotText().write(findings, spec.commandLine().getOut());
            if (report != null) {
                spec.commandLine().getOut().println("lot report: " + report.resolve(LotReportWriter.HTML));
            }
        }
        return ExitCodes.OK;
    }
}
