package org.polebench.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.polebench.InputProblem;
import org.polebench.circuit.Stage;

/**
 * Weighs a bench against a board: the board's own response ({@link Bench#IDEAL}), the response
 * through the whole bench, and through each of its elements alone, so that a warning can name
 * the element to change (issue 13: "the output channel's AC coupling at 3.3 Hz moves the
 * measured corner …"). The element benches keep the bench's reference and input channel's
 * point, with every other element ideal. Stateless.
 */
public final class BenchEffects {
    /**
     * @throws InputProblem when a channel's corner is unknown, or the stage with the bench cannot
     *                      be biased or analysed
     */
    public BenchEffect of(Stage stage, Bench bench) throws InputProblem {
        BenchEffect.Response own = response(stage, Bench.IDEAL, "predict");
        BenchEffect.Response measured = response(stage, bench, "predict --bench");
        Optional<InputChannel> idealInput = bench.input().map(i -> new InputChannel(i.at(), Channel.IDEAL));
        Bench base = new Bench(0, bench.reference(), Channel.IDEAL, idealInput, bench.sourceFile());
        List<BenchEffect.ElementEffect> elements = new ArrayList<>();
        if (!bench.referenceFor(stage).equals(Bench.IDEAL.referenceFor(stage))
                || (bench.referenceFor(stage) == Reference.INPUT_CHANNEL
                    && bench.inputChannel().at() != ProbePoint.STAGE_INPUT)) {
            elements.add(element(stage, BenchElement.REFERENCE, base));
        }
        if (bench.generatorOhms() > 0) {
            elements.add(element(stage, BenchElement.GENERATOR_RESISTANCE, new Bench(bench.generatorOhms(),
                    base.reference(), base.output(), base.input(), base.sourceFile())));
        }
        Channel out = bench.output();
        if (out.coupling() == Coupling.AC) {
            elements.add(element(stage, BenchElement.OUTPUT_COUPLING, new Bench(0, base.reference(),
                    new Channel(Coupling.AC, out.cornerHz(), emptyD(), emptyD(), out.line()), base.input(),
                    base.sourceFile())));
        }
        if (out.loads()) {
            elements.add(element(stage, BenchElement.OUTPUT_LOAD, new Bench(0, base.reference(),
                    new Channel(Coupling.DC, emptyD(), out.ohms(), out.farads(), out.line()), base.input(),
                    base.sourceFile())));
        }
        if (bench.input().isPresent()) {
            InputChannel in = bench.input().get();
            Channel c = in.channel();
            if (c.coupling() == Coupling.AC) {
                elements.add(element(stage, BenchElement.INPUT_COUPLING, new Bench(0, base.reference(),
                        Channel.IDEAL, Optional.of(new InputChannel(in.at(),
                        new Channel(Coupling.AC, c.cornerHz(), emptyD(), emptyD(), c.line()))), base.sourceFile())));
            }
            if (c.loads()) {
                elements.add(element(stage, BenchElement.INPUT_LOAD, new Bench(0, base.reference(),
                        Channel.IDEAL, Optional.of(new InputChannel(in.at(),
                        new Channel(Coupling.DC, emptyD(), c.ohms(), c.farads(), c.line()))), base.sourceFile())));
            }
        }
        return new BenchEffect(bench, own, measured, elements);
    }

    private static OptionalDouble emptyD() {
        return OptionalDouble.empty();
    }

    private static BenchEffect.ElementEffect element(Stage stage, BenchElement element, Bench alone)
            throws InputProblem {
        return new BenchEffect.ElementEffect(element, response(stage, alone, "predict --bench"));
    }

    private static BenchEffect.Response response(Stage stage, Bench bench, String purpose) throws InputProblem {
        AsMeasuredResponse r = MeasuringChain.of(bench, purpose).response(stage);
        return new BenchEffect.Response(r.midbandGain(), r.lowerCornerHz());
    }
}
