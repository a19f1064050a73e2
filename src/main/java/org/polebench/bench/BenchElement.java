package org.polebench.bench;

/** One element of a bench, as {@link BenchEffect} weighs it alone. */
public enum BenchElement {
    /** The gain's reference and the input channel's point, against the stage file's own convention. */
    REFERENCE,
    /** The generator's output resistance. */
    GENERATOR_RESISTANCE,
    /** The output channel's AC coupling. */
    OUTPUT_COUPLING,
    /** The output channel's R ∥ C. */
    OUTPUT_LOAD,
    /** The input channel's AC coupling. */
    INPUT_COUPLING,
    /** The input channel's R ∥ C. */
    INPUT_LOAD
}
