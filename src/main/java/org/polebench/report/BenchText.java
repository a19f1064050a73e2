package org.polebench.report;

import java.io.PrintWriter;
import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import org.polebench.bench.Bench;
import org.polebench.bench.BenchEffect;
import org.polebench.bench.BenchElement;
import org.polebench.bench.Channel;
import org.polebench.bench.ProbePoint;
import org.polebench.bench.Reference;
import org.polebench.units.Decibels;
import org.polebench.units.EngineeringValue;

/**
 * The bench's effect on a prediction, for people: the board's own midband gain and lower
 * corner beside the ones this bench will show, and a warning for each element that moves either
 * by more than 1 %, saying what to change (docs/user-guide.md, "The bench file").
 */
public final class BenchText {
    /** Writes the side-by-side block and the warnings, after a prediction's summary. */
    public void write(BenchEffect effect, PrintWriter out) {
        out.println();
        out.println("Bench" + effect.bench().source().map(f -> " (" + f + ")").orElse("") + ": "
                + effect.bench().describe());
        out.println(String.format(Locale.ROOT, "  %-16s %-16s %s", "", "board alone", "as measured"));
        out.println(String.format(Locale.ROOT, "  %-16s %-16s %s", "midband gain", db(effect.own().midbandGain()),
                db(effect.measured().midbandGain())));
        out.println(String.format(Locale.ROOT, "  %-16s %-16s %s", "lower corner", hz(effect.own().lowerCornerHz()),
                hz(effect.measured().lowerCornerHz())));
        for (String warning : warnings(effect)) {
            out.println("warning: " + warning);
        }
    }

    /**
     * @return one sentence per element that alone moves the corner or the midband gain by more
     *         than 1 %, or one for the whole bench when it does and no element alone does
     */
    public List<String> warnings(BenchEffect effect) {
        List<String> result = new ArrayList<>();
        BenchEffect.Response own = effect.own();
        for (BenchEffect.ElementEffect element : effect.elements()) {
            String what = phrase(effect.bench(), element.element());
            String advice = advice(effect.bench(), element.element());
            if (element.measured().movesCornerFrom(own)) {
                result.add(what + " moves the measured corner from " + hz(own.lowerCornerHz()) + " to "
                        + hz(element.measured().lowerCornerHz()) + ": " + advice);
            }
            if (element.measured().movesMidbandFrom(own)) {
                result.add(what + " moves the measured midband gain from " + db(own.midbandGain()) + " to "
                        + db(element.measured().midbandGain()) + ": " + advice);
            }
        }
        if (result.isEmpty() && effect.notable()) {
            result.add("the bench as a whole moves the measured corner from " + hz(own.lowerCornerHz()) + " to "
                    + hz(effect.measured().lowerCornerHz()) + " and the midband gain from " + db(own.midbandGain())
                    + " to " + db(effect.measured().midbandGain()) + ", though no element alone moves either by"
                    + " 1 %: check each element's value in the bench file");
        }
        return result;
    }

    private static String phrase(Bench bench, BenchElement element) {
        switch (element) {
            case REFERENCE:
                return "taking the gain against " + referenceWords(bench);
            case GENERATOR_RESISTANCE:
                return "the generator's " + EngineeringValue.format(bench.generatorOhms(), "Ω") + " output resistance";
            case OUTPUT_COUPLING:
                return "the output channel's AC coupling at " + given(bench.output().cornerHz());
            case OUTPUT_LOAD:
                return "the output channel's load (" + load(bench.output()) + ")";
            case INPUT_COUPLING:
                return "the input channel's AC coupling at " + given(bench.inputChannel().channel().cornerHz());
            case INPUT_LOAD:
                return "the input channel's load (" + load(bench.inputChannel().channel()) + ")";
            default:
                throw new IllegalArgumentException("no words for " + element);
        }
    }

    private static String advice(Bench bench, BenchElement element) {
        switch (element) {
            case REFERENCE:
                return "the stage file's gain is taken otherwise; make the stage's input reference and the bench's"
                        + " reference agree, or compare against the as-measured figures";
            case GENERATOR_RESISTANCE:
                return "add it to the stage's source-resistance if the stage is meant to be driven through it, or"
                        + " take the gain against an input channel at the stage's input";
            case OUTPUT_COUPLING:
            case INPUT_COUPLING:
                return "use DC coupling";
            case OUTPUT_LOAD:
            case INPUT_LOAD:
                return "measure through a higher-impedance probe (a 10:1 divider probe) or a buffer";
            default:
                throw new IllegalArgumentException("no advice for " + element);
        }
    }

    private static String referenceWords(Bench bench) {
        if (bench.reference().orElse(Reference.GENERATOR) == Reference.GENERATOR) {
            return "the generator's set level";
        }
        return bench.inputChannel().at() == ProbePoint.GENERATOR ? "an input channel at the generator's terminal"
                : "an input channel at the stage's input";
    }

    private static String load(Channel channel) {
        List<String> parts = new ArrayList<>();
        channel.ohms().ifPresent(r -> parts.add(EngineeringValue.format(r, "Ω")));
        channel.farads().ifPresent(c -> parts.add(EngineeringValue.format(c, "F")));
        return String.join(" ∥ ", parts);
    }

    /** @return a value the bench file gave, as short as it reads: {@code 3.3 Hz} */
    private static String given(OptionalDouble hz) {
        return hz.isPresent() ? EngineeringValue.format(hz.getAsDouble(), "Hz") : "an unknown corner";
    }

    /** @return three significant digits, trailing zeros kept below 1 kHz ({@code 15.0 Hz}), none when empty */
    static String hz(OptionalDouble hz) {
        if (hz.isEmpty()) {
            return "none";
        }
        double value = hz.getAsDouble();
        if (value >= 1 && value < 1000) {
            return new BigDecimal(value).round(new MathContext(3)).toPlainString() + " Hz";
        }
        return EngineeringValue.format(value, "Hz");
    }

    static String db(double ratio) {
        return String.format(Locale.ROOT, "%.2f dB", Decibels.fromRatio(ratio));
    }
}
