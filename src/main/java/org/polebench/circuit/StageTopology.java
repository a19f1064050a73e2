package org.polebench.circuit;

import java.nio.file.Path;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.polebench.InputProblem;
import org.polebench.InputWarning;

/**
 * The structural checks that can be made from the connections alone, before any number is
 * solved: every node has a DC path to ground, and no low-band capacitors form a loop (docs/method.md,
 * "Port reduction"). The analysis package still detects singular matrices; these
 * checks exist so that the user hears about the usual mistakes with the part and line.
 */
final class StageTopology {
    private StageTopology() {
    }

    /** A node with no DC path, and the parts (with their role) that touch it. */
    record FloatingNode(String node, List<String> touching, int line, String hint) {
    }

    /**
     * Looks for a node whose DC voltage is not fixed. DC paths are resistors, supply rails, the
     * generator's source resistance, the load, and a transistor's control junction (base to
     * emitter, gate to source) followed from a control terminal that has a path itself: the
     * junction then fixes the emitter or source voltage. Collectors and drains are current
     * sources and give no path; capacitors are open.
     *
     * @param junctionsOfGivenBiasLink false in the bias solve, where a transistor with a given
     *                                 current is current sources only
     */
    static Optional<FloatingNode> floatingNode(Stage stage, boolean junctionsOfGivenBiasLink) {
        Components dc = new Components();
        String ground = stage.ground();
        dc.add(ground);
        for (Part part : stage.parts()) {
            for (String node : part.terminalNodes()) {
                dc.add(node);
            }
            part.match(new Part.Cases<Void>() {
                @Override
                public Void resistor(Resistor resistor) {
                    dc.join(resistor.between().a(), resistor.between().b());
                    return null;
                }

                @Override
                public Void capacitor(Capacitor capacitor) {
                    return null;   // open at DC
                }

                @Override
                public Void bjt(Bjt bjt) {
                    return null;   // its junction is joined below, when its base or emitter side is
                }

                @Override
                public Void mosfet(Mosfet mosfet) {
                    return null;   // as a BJT, with gate and source
                }
            });
        }
        for (Supply supply : stage.supplies()) {
            dc.join(supply.node(), ground);
        }
        dc.join(stage.input().node(), ground);
        if (stage.output().loadOhms().isPresent()) {
            dc.join(stage.output().node(), ground);
        }
        boolean changed = true;
        while (changed) {
            changed = false;
            for (Transistor transistor : stage.transistors()) {
                if (!junctionsOfGivenBiasLink && transistor.bias().givenAmps().isPresent()) {
                    continue;
                }
                String control = transistor.controlNode();
                String common = transistor.commonNode();
                if (dc.same(control, ground) && !dc.same(common, ground)) {
                    dc.join(control, common);
                    changed = true;
                }
            }
        }
        for (String node : stage.nodes()) {
            if (!dc.same(node, ground)) {
                return Optional.of(describeFloating(stage, node));
            }
        }
        return Optional.empty();
    }

    private static FloatingNode describeFloating(Stage stage, String node) {
        List<String> touching = new ArrayList<>();
        int line = 0;
        boolean onlyCapacitors = true;
        String transistorHint = "";
        for (Part part : stage.parts()) {
            List<String> nodes = part.terminalNodes();
            if (!nodes.contains(node)) {
                continue;
            }
            if (line == 0) {
                line = part.line();
            }
            Optional<Transistor> transistor = part.asTransistor();
            if (transistor.isPresent()) {
                String role = transistor.get().terminalRole(node);
                touching.add(part.name() + " (" + role + ")");
                onlyCapacitors = false;
                transistorHint = hintFor(part.name(), role);
            } else {
                touching.add(part.name());
            }
        }
        String hint;
        if (node.equals(stage.output().node()) && stage.output().loadOhms().isEmpty()) {
            hint = "give the output a load, such as 'output: {node: " + node + ", load: 1M}' for a scope"
                    + " input or the next stage's input resistance";
        } else if (onlyCapacitors) {
            hint = "a node reached only through capacitors floats at DC; add a resistor from '" + node
                    + "' to ground or to a bias network";
        } else if (!transistorHint.isEmpty()) {
            hint = transistorHint;
        } else {
            hint = "add a resistor from '" + node + "' to ground or to a supply";
        }
        return new FloatingNode(node, touching, line, hint);
    }

    private static String hintFor(String transistor, String role) {
        switch (role) {
            case "base":
            case "gate":
                return "give " + transistor + "'s " + role + " a DC bias path, such as a resistor divider"
                        + " from a supply to ground";
            case "collector":
            case "drain":
                return "give " + transistor + "'s " + role + " a DC path, such as a load resistor to a supply";
            default:
                return "give " + transistor + "'s " + role + " a DC path, such as a resistor to ground or a rail";
        }
    }

    /**
     * Checks the capacitor loops. With ground, the rails and an ideally driven input node held
     * as one node (they are all fixed voltages in the small-signal network), low-band capacitors
     * that close a loop make the port reduction singular: refused. A capacitor whose two ends are
     * both held that way has no effect (a rail decoupling capacitor): a warning, and the
     * small-signal expansion leaves it out. High-band capacitors (part and device ones) that
     * close a loop once the low-band ones are shorted get a warning only, since the
     * low-frequency analysis does not need them.
     *
     * @return warnings for capacitors with no effect and for high-band loops
     */
    static List<InputWarning> checkCapacitorLoops(Stage stage, Path file) throws InputProblem {
        List<InputWarning> warnings = new ArrayList<>();
        Set<String> held = heldNodes(stage);
        Loops low = new Loops(held);
        for (Capacitor capacitor : stage.capacitors(Band.LOW)) {
            String a = capacitor.between().a();
            String b = capacitor.between().b();
            if (held.contains(a) && held.contains(b)) {
                warnings.add(new InputWarning(file, capacitor.line(), capacitor.name() + " sits between '" + a
                        + "' and '" + b + "', which are both fixed voltages in the small-signal network (ground,"
                        + " a supply rail or the driven input); it has no effect on the response and is left out"));
                continue;
            }
            List<String> loop = low.add(capacitor.name(), a, b);
            if (!loop.isEmpty()) {
                throw new InputProblem(file, capacitor.line(), capacitor.name()
                        + " closes a loop of low-band capacitors (" + String.join(", ", loop)
                        + "; ground and the supply rails count as one node)",
                        "capacitors in parallel or in a loop cannot be analysed separately: combine parallel"
                                + " ones into one part, or mark the small one 'band: high'");
            }
        }
        Loops high = new Loops(held);
        for (Capacitor capacitor : stage.capacitors(Band.LOW)) {
            high.shorted(capacitor.between().a(), capacitor.between().b());
        }
        for (HighCapacitor capacitor : highCapacitors(stage)) {
            if (high.bothHeld(capacitor.a(), capacitor.b())) {
                continue;
            }
            List<String> loop = high.add(capacitor.name(), capacitor.a(), capacitor.b());
            if (!loop.isEmpty()) {
                warnings.add(new InputWarning(file, capacitor.line(), "the high-band capacitors "
                        + String.join(", ", loop) + " form a loop once the low-band capacitors are shorted;"
                        + " the upper-corner analysis gives the one that closes the loop no pole of its own"
                        + " (it enters the capacitance matrix as a link)"));
            }
        }
        return warnings;
    }

    /** @return ground, the rails, and the input node when the stimulus holds it directly */
    static Set<String> heldNodes(Stage stage) {
        Set<String> held = new HashSet<>();
        held.add(stage.ground());
        for (Supply supply : stage.supplies()) {
            held.add(supply.node());
        }
        if (inputIsDriven(stage)) {
            held.add(stage.input().node());
        }
        return held;
    }

    /** @return true when the stimulus holds the input node itself (reference: node, or 0 Ω) */
    static boolean inputIsDriven(Stage stage) {
        return stage.input().reference() == GainReference.INPUT_NODE || stage.input().sourceOhms() == 0;
    }

    private record HighCapacitor(String name, String a, String b, int line) {
    }

    private static List<HighCapacitor> highCapacitors(Stage stage) {
        List<HighCapacitor> result = new ArrayList<>();
        Part.Cases<Void> add = new Part.Cases<>() {
            @Override
            public Void resistor(Resistor resistor) {
                return null;
            }

            @Override
            public Void capacitor(Capacitor c) {
                if (c.band() == Band.HIGH) {
                    result.add(new HighCapacitor(c.name(), c.between().a(), c.between().b(), c.line()));
                }
                return null;
            }

            @Override
            public Void bjt(Bjt bjt) {
                String innerBase = bjt.rxOhms() > 0 ? bjt.name() + ".b'" : bjt.base();
                if (bjt.cpiFarads() > 0) {
                    result.add(new HighCapacitor(bjt.name() + ".cpi", innerBase, bjt.emitter(), bjt.line()));
                }
                if (bjt.cmuFarads() > 0) {
                    result.add(new HighCapacitor(bjt.name() + ".cmu", innerBase, bjt.collector(), bjt.line()));
                }
                return null;
            }

            @Override
            public Void mosfet(Mosfet m) {
                if (m.cgsFarads() > 0) {
                    result.add(new HighCapacitor(m.name() + ".cgs", m.gate(), m.source(), m.line()));
                }
                if (m.cgdFarads() > 0) {
                    result.add(new HighCapacitor(m.name() + ".cgd", m.gate(), m.drain(), m.line()));
                }
                return null;
            }
        };
        for (Part part : stage.parts()) {
            part.match(add);
        }
        return result;
    }

    /** Union–find over node names. */
    private static final class Components {
        private final Map<String, String> parent = new HashMap<>();

        void add(String node) {
            parent.putIfAbsent(node, node);
        }

        String root(String node) {
            add(node);
            String root = node;
            while (!parent.get(root).equals(root)) {
                root = parent.get(root);
            }
            parent.put(node, root);
            return root;
        }

        void join(String a, String b) {
            parent.put(root(a), root(b));
        }

        boolean same(String a, String b) {
            return root(a).equals(root(b));
        }
    }

    /**
     * Capacitor edges on a graph of merged nodes (held nodes as one, shorted ones as one); finds
     * the loop a new edge would close.
     */
    private static final class Loops {
        private final Components merged;
        private final String heldRoot;
        private final Map<String, List<String[]>> edges = new LinkedHashMap<>();

        Loops(Set<String> held) {
            merged = new Components();
            heldRoot = "\u0000held";
            for (String node : held) {
                merged.join(node, heldRoot);
            }
        }

        /** Shorts two nodes (a low-band capacitor in the high band); call before any {@link #add}. */
        void shorted(String a, String b) {
            merged.join(a, b);
        }

        boolean bothHeld(String a, String b) {
            return merged.same(a, heldRoot) && merged.same(b, heldRoot);
        }

        /** @return the names on the loop this capacitor closes (itself last), or empty when none */
        List<String> add(String name, String a, String b) {
            String ra = merged.root(a);
            String rb = merged.root(b);
            List<String> path = path(ra, rb);
            if (ra.equals(rb) || !path.isEmpty()) {
                List<String> loop = new ArrayList<>(path);
                loop.add(name);
                return loop;
            }
            edges.computeIfAbsent(ra, k -> new ArrayList<>()).add(new String[] {name, rb});
            edges.computeIfAbsent(rb, k -> new ArrayList<>()).add(new String[] {name, ra});
            return List.of();
        }

        /** @return the capacitor names along a path between two merged nodes, empty when none */
        private List<String> path(String from, String to) {
            if (from.equals(to)) {
                return List.of();
            }
            Map<String, String[]> cameBy = new HashMap<>();
            Deque<String> queue = new ArrayDeque<>();
            queue.add(from);
            cameBy.put(from, null);
            while (!queue.isEmpty()) {
                String here = queue.poll();
                if (here.equals(to)) {
                    List<String> names = new ArrayList<>();
                    String at = to;
                    while (cameBy.get(at) != null) {
                        names.add(0, cameBy.get(at)[0]);
                        at = cameBy.get(at)[1];
                    }
                    return names;
                }
                for (String[] edge : edges.getOrDefault(here, List.of())) {
                    if (!cameBy.containsKey(edge[1])) {
                        cameBy.put(edge[1], new String[] {edge[0], here});
                        queue.add(edge[1]);
                    }
                }
            }
            return List.of();
        }
    }
}
