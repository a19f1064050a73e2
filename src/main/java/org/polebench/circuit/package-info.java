/**
 * The stage model: nodes, parts, transistors, bias and the small-signal expansion, and the
 * stage-file reader. Produces a {@link org.polebench.circuit.SmallSignalNetwork} for analysis.
 * Uses units, yaml and linalg.
 *
 * <p>Flow: {@link org.polebench.circuit.StageReader} reads a {@code *.stage.yaml} file into a
 * {@link org.polebench.circuit.Stage} (records; {@link org.polebench.circuit.Part} is sealed over
 * {@link org.polebench.circuit.Resistor}, {@link org.polebench.circuit.Capacitor},
 * {@link org.polebench.circuit.Bjt} and {@link org.polebench.circuit.Mosfet}), with
 * warnings about implausible values; {@link org.polebench.circuit.BiasSolver} finds the DC
 * {@link org.polebench.circuit.OperatingPoints}; {@link org.polebench.circuit.SmallSignalExpansion}
 * turns stage and operating points into the network.
 *
 * <p>Stage-file conventions this package owns (full list in docs/user-guide.md, "Stage files"):
 * <ul>
 *   <li>tolerances: {@code tolerance: 5%} (also {@code ±5%}) or {@code -20%/+80%}; default ±5 %
 *       for resistors (IEC 60062 code J), ±20 % for capacitors (code M);</li>
 *   <li>β spread: {@code beta: 200, beta-tolerance: 50%} (or {@code -50%/+100%}), the same
 *       tolerance form as the parts'; default ±50 %;</li>
 *   <li>bias-current prior {@code bias-tolerance}, default ±20 %; {@code gain-calibration: 1 dB}
 *       is read as ±1 dB;</li>
 *   <li>capacitor band: part capacitors of 1 nF or more are LOW unless {@code band: high};
 *       device capacitances ({@code cpi}, {@code cmu}, {@code cgs}, {@code cgd}) are HIGH;</li>
 *   <li>MOSFET body: optional terminal {@code b} with {@code gamma} (√V) and
 *       {@code surface-potential} (2φF, default 0.6 V, Sedra and Smith, from memory).</li>
 * </ul>
 */
package org.polebench.circuit;
