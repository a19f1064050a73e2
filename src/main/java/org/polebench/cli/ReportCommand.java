package org.polebench.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.time.Instant;
import java.util.concurrent.Callable;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.polebench.InputProblem;
import org.polebench.report.Identification;
import org.polebench.report.ReportStamp;
import org.polebench.report.ResultFile;
import org.polebench.report.ResultJson;
import org.polebench.report.TestReportWriter;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code polebench report}: a test report re-rendered from a saved result.json. */
@Command(name = "report", mixinStandardHelpOptions = true,
        description = {"Writes the test report of a saved reconcile result (the result.json of a report folder, or "
                + "the output of reconcile --json) into a folder: report.html, result.json, capacitors.csv and the "
                + "charts. The report gets a new id and date of issue; everything else comes from the result.",
                "Exit code 0 once the report is written, whatever its verdict: the verdict (pass, fail or "
                        + "incomplete) is the result's own, not decided again."},
        footer = {"", "Example:", "  polebench report board-12-report/result.json --out board-12-reissued"})
final class ReportCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "RESULT.json", description = "a result written by polebench reconcile")
    Path result;

    @Option(names = "--out", paramLabel = "DIR", required = true, description = "the folder to write the report into")
    Path out;

    @Mixin
    IdentificationOptions identification = new IdentificationOptions();

    @Option(names = "--force", description = "replace an earlier report in DIR")
    boolean force;

    @Option(names = "--png", description = "also write each chart as PNG")
    boolean png;

    @Override
    public Integer call() throws InputProblem, IOException {
        Identification given = identification.read();
        ResultFile file = new ResultFile();
        JsonNode root = file.read(result);
        // options given here complete or correct the identification the result holds
        new ResultJson().identify((ObjectNode) root, given);
        for (String line : file.checkInputs(result, root)) {
            spec.commandLine().getOut().println(line);
        }
        ReportStamp stamp = new TestReportWriter().write(root, out, force, png, Instant.now());
        spec.commandLine().getOut().println("Test report " + stamp.reportId() + " written to "
                + out.resolve(TestReportWriter.HTML));
        return ExitCodes.OK;
    }
}
