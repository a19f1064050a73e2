package org.polebench.reconcile;

import java.util.List;

/**
 * The resistors that set one transistor's bias current (a divider, an emitter or source
 * resistor): changing any of them moves the current, which is all a sweep sees of them.
 *
 * @param transistor the transistor's designator
 * @param resistors  its bias-setting resistors, in the stage's order
 */
public record BiasSetters(String transistor, List<String> resistors) {
    public BiasSetters {
        resistors = List.copyOf(resistors);
    }

    /** @return whether a single fault on this parameter is one of this transistor's bias causes */
    boolean covers(ModelParameter parameter) {
        return parameter.kind() == ParameterKind.BIAS ? parameter.label().equals(transistor)
                : parameter.kind() == ParameterKind.RESISTOR && resistors.contains(parameter.label());
    }
}
