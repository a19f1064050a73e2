package org.polebench.cli;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import org.polebench.InputProblem;
import org.polebench.bench.Bench;
import org.polebench.bench.BenchReader;
import org.polebench.InputWarning;
import org.polebench.fit.FitBand;
import org.polebench.fit.FitResult;
import org.polebench.fit.FitSettings;
import org.polebench.fit.SweepFitter;
import org.polebench.sweepfile.ImportedSweep;
import org.polebench.report.BodeChart;
import org.polebench.report.FitJson;
import org.polebench.report.FitText;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code polebench fit SWEEP}: the measured low-frequency poles and zeros, with uncertainties. */
@Command(name = "fit", mixinStandardHelpOptions = true,
        description = "Fits H(s) = K·Π(s − z)/Π(s − p) to a sweep's low band (complex-log residuals, "
                + "Levenberg–Marquardt, order chosen by BIC) and prints the midband gain, the poles and "
                + "zeros with standard and expanded (k = 2) uncertainties, the lower corner of the fitted "
                + "model and the one read from the data, and the fit quality.",
        footer = {"", "Example:", "  polebench fit sample-measurements/imports/db-degrees.csv --plot bode.svg"})
final class FitCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Parameters(index = "0", arity = "1..*", paramLabel = "SWEEP", description = "the sweep file: CSV or other table, "
            + "or a serial log; or a folder or list of scope waveform records, one per frequency")
    List<Path> sweepFiles;

    @Mixin
    SweepLayoutOption layout = new SweepLayoutOption();

    @Option(names = "--max-poles", paramLabel = "N", defaultValue = "" + FitSettings.DEFAULT_MAX_POLES,
            description = "highest number of low-band poles tried (default ${DEFAULT-VALUE})")
    int maxPoles;

    @Option(names = "--band", paramLabel = "F1:F2", description = "fit only this range, e.g. 1Hz:20kHz")
    String band;

    @Option(names = "--json", description = "print one JSON object instead of the summary")
    boolean json;

    @Option(names = "--plot", paramLabel = "FILE", description = "write a Bode plot of data and fit (.svg or .png)")
    Path plot;

    @Option(names = "--force", description = "let --plot replace an existing file")
    boolean force;

    @Option(names = "--bench", paramLabel = "FILE",
            description = "the bench file (*.bench.yaml) the sweep was measured on: the fit is of the as-measured"
                    + " response, board and bench together, and the output says so")
    Path benchFile;

    @Override
    public Integer call() throws InputProblem, IOException {
        if (maxPoles < 1) {
            throw new InputProblem(null, 0, "--max-poles " + maxPoles + " leaves nothing to fit", "use 1 or more");
        }
        if (plot != null && Files.exists(plot) && !force) {
            throw new InputProblem(plot, 0, "the plot file exists already and is kept",
                    "name another file, or add --force to replace it");
        }
        Bench bench = benchFile == null ? null : new BenchReader().read(benchFile);
        ImportedSweep imported = layout.read(sweepFiles);
        FitSettings settings = FitSettings.defaults().withMaxPoles(maxPoles);
        if (band != null) {
            settings = settings.withBand(FitBand.parse(band));
        }
        FitResult result = new SweepFitter(settings).fit(imported.sweep());
        if (plot != null) {
            BodeChart.ofFit("Bode plot: " + sweepFiles.get(0).getFileName(), imported.sweep(), result).write(plot);
        }
        PrintWriter out = spec.commandLine().getOut();
        if (json) {
            ObjectNode root = new FitJson().toJson(result);
            ArrayNode warnings = (ArrayNode) root.get("warnings");
            for (InputWarning warning : imported.warnings()) {
                warnings.add(warning.describe());
            }
            root.put("profile", imported.profileName());
            if (bench != null) {
                ObjectNode declared = root.putObject("bench");
                declared.put("file", benchFile.toString());
                declared.put("description", bench.describe());
                declared.put("model", "as-measured");
            }
            new JsonOutput().print(root, out);
        } else {
            out.println("sweep:    " + SweepLayoutOption.label(sweepFiles) + " (" + imported.sweep().size() + " points, profile "
                    + imported.profileName() + ")");
            for (InputWarning warning : imported.warnings()) {
                out.println("import warning: " + warning.describe());
            }
            if (bench != null) {
                out.println("bench:    " + benchFile + " declared (" + bench.describe() + "); the fit below is of"
                        + " the as-measured response, board and bench together");
            }
            out.print(new FitText().format(result));
            if (plot != null) {
                out.println("plot:     " + plot);
            }
        }
        return ExitCodes.OK;
    }
}
