package org.polebench.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.polebench.InputProblem;
import org.polebench.bench.Bench;
import org.polebench.bench.BenchEffect;
import org.polebench.bench.BenchEffects;
import org.polebench.bench.BenchReader;
import org.polebench.spread.StageAnalysis;
import org.polebench.spread.StagePrediction;
import org.polebench.spread.ToleranceSpread;
import org.polebench.circuit.StageReader;
import org.polebench.report.BenchJson;
import org.polebench.report.BenchText;
import org.polebench.report.PredictionJson;
import org.polebench.report.PredictionText;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code polebench predict}: a stage file's predicted low-frequency response. */
@Command(name = "predict", mixinStandardHelpOptions = true,
        description = {"Predicts a stage's response: operating points, the SCTC resistance and time constant "
                + "of every low-band capacitor, the SCTC and exact lower corners, poles and zeros, midband "
                + "gain, the upper corner when device capacitances are given, and the spread of the lower "
                + "corner over the part tolerances.",
                "With no stage it runs on the bundled demo stage (demo data)."},
        footer = {"", "Example:", "  polebench predict sample-measurements/hydrophone-preamp-ce.stage.yaml --json"})
final class PredictCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Parameters(index = "0", arity = "0..1", paramLabel = "STAGE", description = "the stage file (*.stage.yaml)")
    Path positionalStage;

    @Option(names = "--stage", paramLabel = "STAGE", description = "the stage file, as an option")
    Path stageOption;

    @Option(names = "--json", description = "print one JSON object instead of the summary")
    boolean json;

    @Option(names = "--samples", paramLabel = "N", defaultValue = "" + ToleranceSpread.DEFAULT_SAMPLES,
            description = "boards drawn for the tolerance spread (default ${DEFAULT-VALUE})")
    int samples;

    @Option(names = "--seed", paramLabel = "SEED", defaultValue = "" + ToleranceSpread.DEFAULT_SEED,
            description = "random seed of the tolerance spread (default ${DEFAULT-VALUE})")
    long seed;

    @Option(names = "--spread-precision", paramLabel = "FRACTION", defaultValue = "" + ToleranceSpread.DEFAULT_PRECISION,
            description = "stop the tolerance spread once its 5, 50 and 95 %% points are known to this relative"
                    + " precision (95 %% intervals; default ${DEFAULT-VALUE}, 0 to draw every board)")
    double spreadPrecision;

    @Option(names = "--bench", paramLabel = "FILE",
            description = "a bench file (*.bench.yaml): also show the response this bench will measure, and warn"
                    + " when it moves the lower corner or the midband gain by more than 1 %%")
    Path benchFile;

    @Override
    public Integer call() throws InputProblem, IOException {
        Path stage = StageChoice.resolve(positionalStage, stageOption);
        if (samples < 20) {
            throw new InputProblem(null, 0, "--samples " + samples + " is too few for 5 % and 95 % points",
                    "use at least 20 (the default is " + ToleranceSpread.DEFAULT_SAMPLES + ")");
        }
        CountLimits.samples(samples);
        if (!(spreadPrecision >= 0 && spreadPrecision < 1)) {
            throw new InputProblem(null, 0, "--spread-precision " + spreadPrecision + " is not a fraction in [0, 1)",
                    "write it as a fraction, such as 0.005 for ±0.5 %, or 0 to draw every board");
        }
        Bench bench = benchFile == null ? null : new BenchReader().read(benchFile);
        StagePrediction result = new StageAnalysis()
                .withSpread(new ToleranceSpread(samples, seed).withPrecision(spreadPrecision))
                .analyse(new StageReader().read(stage), new SpreadProgressLine(spec.commandLine().getErr()));
        BenchEffect effect = bench == null ? null : new BenchEffects().of(result.stage(), bench);
        if (json) {
            ObjectNode root = new PredictionJson().of(result);
            if (effect != null) {
                root.set("bench", new BenchJson().of(effect));
            }
            new JsonOutput().print(root, spec.commandLine().getOut());
        } else {
            new PredictionText().write(result, spec.commandLine().getOut());
            if (effect != null) {
                new BenchText().write(effect, spec.commandLine().getOut());
            }
        }
        return ExitCodes.OK;
    }
}
