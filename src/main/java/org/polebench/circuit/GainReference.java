package org.polebench.circuit;

/** What the stage's gain is measured against (docs/method.md, "The small-signal network"). */
public enum GainReference {
    /** V(output)/V(source EMF): the generator's open-circuit voltage behind the source resistance. */
    SOURCE_EMF,
    /** V(output)/V(input node): {@code reference: node}, as a two-channel measurement sees it. */
    INPUT_NODE
}
