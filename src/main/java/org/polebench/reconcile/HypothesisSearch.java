package org.polebench.reconcile;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.Executor;
import java.util.function.Supplier;
import org.polebench.bench.MeasuringChain;

/**
 * The hypotheses of one sweep on one stage, searched as {@link FaultRanking} describes: the
 * single faults first ({@link #singles()}), then, when asked, pairs of the most probable ones
 * ({@link #withPairs()}). Keeps every hypothesis' MAP at the stated σ, so that pairs start from
 * the single faults' estimates and the noise scales are set once more from the best of all.
 * Holds the board model's caches: one instance belongs to one thread.
 */
final class HypothesisSearch {
    private final MapSolver screen = new MapSolver(FaultRanking.SCREEN_ITERATIONS);
    private final MapSolver solver = new MapSolver(FaultRanking.MAX_ITERATIONS);
    private final BoardModel model;
    private final MeasuredResponse measured;
    private final List<ModelParameter> parameters;
    private final Prior[] tolerance;
    private final double[] mean;
    /** The parameters every hypothesis has: all but the resistors. */
    private final boolean[] baseActive;
    /** Capacitors and gain only: the first phase of a solve, with no reductions. */
    private final boolean[] networkHeld;
    /** The parameters a hypothesis may free: all but β. */
    private final List<Integer> faultable = new ArrayList<>();
    /** The channel couplings' parameters, freed only by the bench hypotheses. */
    private final List<Integer> couplingIndices = new ArrayList<>();
    private final ChannelCouplings couplings;
    /** The couplings a bench file declares: present in every hypothesis; none ranked as a fault. */
    private final DeclaredChain declared;
    /** The stage with a generator's output resistance in series, or null (see the constructor). */
    private final BoardModel generatorModel;
    private final List<Candidate> candidates = new ArrayList<>();
    private boolean pairsRanked;
    private Diagnosis last;
    /** Made at the first ranking, on the calling thread. */
    private List<BiasSetters> biasSetters;
    /** A second board model and the thread it runs on, for half the single faults; null for one thread. */
    private final Supplier<BoardModel> secondModel;
    private final Executor helper;

    /** One hypothesis: what it frees, its priors, and its MAP at the stated σ. */
    private static final class Candidate {
        final HypothesisKind kind;
        final int[] freed;
        final Prior[] priors;
        final boolean[] active;
        final double logPrior;
        final Misfit misfit;
        /** Whether its misfit belongs to the second board model (and so to the helper thread). */
        boolean second;
        /** A board model of its own (the stage with a generator resistance), or null for the search's. */
        BoardModel own;
        MapPoint stated;
        /** Its point needs no convergence run (a resistor judged by one Gauss–Newton step). */
        boolean settled;

        Candidate(HypothesisKind kind, int[] freed, Prior[] priors, boolean[] active, double logPrior, Misfit misfit) {
            this.kind = kind;
            this.freed = freed;
            this.priors = priors;
            this.active = active;
            this.logPrior = logPrior;
            this.misfit = misfit;
        }
    }

    HypothesisSearch(BoardModel model, MeasuredResponse measured, List<ModelParameter> parameters) {
        this(model, measured, parameters, null, null, DeclaredChain.NONE);
    }

    /**
     * @param secondModel makes a second board model of the same stage and sweep, for the helper
     *                    thread; null to do everything on the calling thread
     * @param helper      runs half the single faults' screens and convergence runs beside the
     *                    calling thread (each board model stays on one thread); null for none
     */
    HypothesisSearch(BoardModel model, MeasuredResponse measured, List<ModelParameter> parameters,
                     Supplier<BoardModel> secondModel, Executor helper, DeclaredChain declared) {
        this(model, measured, parameters, secondModel, helper, declared, null);
    }

    /**
     * @param generatorModel the board model of the stage with a generator's output resistance
     *                       the stage file leaves out ({@link FaultRanking#GENERATOR_OHMS} in
     *                       series with its source), for the measuring-chain hypothesis of that
     *                       generator; null for none
     */
    HypothesisSearch(BoardModel model, MeasuredResponse measured, List<ModelParameter> parameters,
                     Supplier<BoardModel> secondModel, Executor helper, DeclaredChain declared,
                     BoardModel generatorModel) {
        this.generatorModel = generatorModel;
        this.declared = declared;
        this.secondModel = helper == null ? null : secondModel;
        this.helper = secondModel == null ? null : helper;
        this.model = model;
        this.measured = measured;
        this.parameters = List.copyOf(parameters);
        int p = parameters.size();
        this.tolerance = new Prior[p];
        this.mean = new double[p];
        this.baseActive = new boolean[p];
        this.networkHeld = new boolean[p];
        for (int j = 0; j < p; j++) {
            ModelParameter parameter = parameters.get(j);
            tolerance[j] = parameter.tolerancePrior();
            mean[j] = parameter.kind() == ParameterKind.RESISTOR ? 0 : tolerance[j].mean();
            baseActive[j] = parameter.kind() != ParameterKind.RESISTOR && parameter.kind() != ParameterKind.CHANNEL_CORNER;
            // a coupling's corner needs no reduction either: it moves with the network held
            networkHeld[j] = parameter.kind() == ParameterKind.CAPACITOR || parameter.kind() == ParameterKind.GAIN
                    || parameter.kind() == ParameterKind.CHANNEL_CORNER;
            if (parameter.kind() == ParameterKind.CHANNEL_CORNER) {
                couplingIndices.add(j);
            } else if (parameter.kind() != ParameterKind.CURRENT_GAIN && !benchPart(parameter)) {
                faultable.add(j);
            }
        }
        int[] signs = new int[couplingIndices.size()];
        for (int c = 0; c < signs.length; c++) {
            // a declared coupling is part of every hypothesis' chain (held or a nuisance)
            baseActive[couplingIndices.get(c)] = declared.coupling(c).isPresent();
            signs[c] = parameters.get(couplingIndices.get(c)).label().equals(FaultRanking.CHANNELS.get(0)) ? 1 : -1;
            if (couplingIndices.get(c) != model.parameterCount() + c) {
                throw new IllegalArgumentException("the channel couplings follow the board model's parameters");
            }
        }
        this.couplings = new ChannelCouplings(model.parameterCount(), signs);
    }

    // a part a declared bench put into the stage (its loads, the generator's resistance): the
    // bench's, held at its stated value, never a fault of the board
    private static boolean benchPart(ModelParameter parameter) {
        String label = parameter.label();
        return label.startsWith(MeasuringChain.BENCH_PREFIX) || label.equals(MeasuringChain.STAGE_SOURCE_PART);
    }

    /** @return the single-fault ranking (also kept, for {@link #withPairs()}) */
    Diagnosis singles() {
        double singlePrior = Math.log(FaultRanking.SINGLE_FAULTS_PRIOR / faultable.size());
        Candidate none = new Candidate(HypothesisKind.NONE, new int[0], tolerance, baseActive,
                Math.log(FaultRanking.NO_FAULT_PRIOR), misfit(tolerance, baseActive, 1, 1));
        none.stated = solve(none.misfit, List.of(mean), networkHeld);
        if (none.stated == null) {
            throw new IllegalStateException("the stage's model is undefined at its tolerance priors' means");
        }
        candidates.add(none);
        for (int j : faultable) {
            if (parameters.get(j).kind() == ParameterKind.RESISTOR) {
                // made here, before the single faults are shared out: both threads read it
                atNoFault = QuadraticModel.at(misfit(model, tolerance, allActive(), 1, 1), none.stated.theta());
                break;
            }
        }
        List<Integer> own = new ArrayList<>();
        List<Integer> shared = new ArrayList<>();
        for (int j : faultable) {
            (helper != null && (own.size() + shared.size()) % 2 == 1 ? shared : own).add(j);
        }
        MapPoint noFault = none.stated;
        CompletableFuture<List<Candidate>> theirs = shared.isEmpty() ? null
                : CompletableFuture.supplyAsync(() -> screened(shared, secondModel.get(), noFault, singlePrior, true),
                helper);
        List<Candidate> made = new ArrayList<>(screened(own, model, noFault, singlePrior, false));
        if (theirs != null) {
            made.addAll(theirs.join());
        }
        // in parameter order, whichever thread made them: the ranking does not depend on the split
        for (int j : faultable) {
            for (Candidate candidate : made) {
                if (candidate.freed[0] == j) {
                    candidates.add(candidate);
                }
            }
        }
        bench(noFault);
        convergeNear();
        rescreenFromLeader();
        last = finish();
        return last;
    }

    /**
     * The measuring-chain hypotheses: the output channel AC-coupled at an unknown corner, and a
     * ratio of two channels AC-coupled at different corners; each screened from the no-fault
     * estimate with its corners at a few hertz apart (FaultRanking's priors).
     */
    private void bench(MapPoint noFault) {
        if (couplingIndices.size() < 2 || declared.stated()) {
            // a declared bench is the chain: it is not ranked against the parts
            return;
        }
        int output = couplingIndices.get(0);
        int input = couplingIndices.get(1);
        double[][] corners = {{1, 0}, {3.3, 0}, {10, 0}};
        double[][] pairs = {{2, 5}, {5, 2}};
        double generatorShare = generatorModel == null ? 0 : FaultRanking.GENERATOR_SHARE;
        addBench(new int[] {output}, FaultRanking.BENCH_PRIOR * FaultRanking.AC_CHANNEL_SHARE, corners, noFault);
        addBench(new int[] {output, input},
                FaultRanking.BENCH_PRIOR * (1 - FaultRanking.AC_CHANNEL_SHARE - generatorShare), pairs, noFault);
        if (generatorModel != null) {
            // the board with nothing freed, seen through a generator resistance the stage leaves out
            Candidate generator = new Candidate(HypothesisKind.BENCH, new int[0], tolerance, baseActive,
                    Math.log(FaultRanking.BENCH_PRIOR * generatorShare),
                    misfit(generatorModel, tolerance, baseActive, 1, 1));
            generator.own = generatorModel;
            // screened like the single faults, and converged with them only when near the best;
            // not ranked where the loaded stage's model is undefined at the no-fault estimate
            Optional<MapPoint> screened = screen.solve(generator.misfit, noFault.theta(), networkHeld, false);
            Optional<MapPoint> exact = screened.isPresent() ? screen.at(generator.misfit, screened.get().theta())
                    : Optional.empty();
            if (exact.isPresent()) {
                generator.stated = exact.get();
                candidates.add(generator);
            }
        }
    }

    private void addBench(int[] freed, double prior, double[][] startsHz, MapPoint noFault) {
        Prior[] priors = tolerance.clone();
        boolean[] active = baseActive.clone();
        for (int j : freed) {
            priors[j] = parameters.get(j).faultPrior();
            active[j] = true;
        }
        Candidate bench = new Candidate(HypothesisKind.BENCH, freed, priors, active, Math.log(prior),
                misfit(priors, active, 1, 1));
        // from the tolerance means, not the no-fault estimate: that one has bent the coupling
        // capacitors to mimic the channel, and a coupling added there counts it twice
        List<double[]> starts = new ArrayList<>();
        for (double[] from : List.of(mean)) {
            for (double[] hz : startsHz) {
                double[] start = from.clone();
                for (int i = 0; i < freed.length; i++) {
                    start[freed[i]] = Math.log(hz[i]);
                }
                starts.add(start);
            }
        }
        bench.stated = screen(bench.misfit, starts, networkHeld);
        candidates.add(bench);
    }

    // the single faults of these parameters screened on one board model (one thread)
    private List<Candidate> screened(List<Integer> indices, BoardModel on, MapPoint none, double singlePrior,
                                     boolean second) {
        List<Candidate> made = new ArrayList<>();
        for (int j : indices) {
            Prior[] priors = tolerance.clone();
            priors[j] = parameters.get(j).faultPrior();
            boolean[] active = baseActive.clone();
            active[j] = true;
            Candidate single = new Candidate(parameters.get(j).kind().faultKind(), new int[] {j}, priors, active,
                    singlePrior, misfit(on, priors, active, 1, 1));
            single.second = second;
            boolean[] free = networkHeld.clone();
            if (parameters.get(j).kind() != ParameterKind.CAPACITOR && parameters.get(j).kind() != ParameterKind.GAIN) {
                // screen with only the freed network parameter moving among the network ones
                free[j] = true;
            }
            if (parameters.get(j).kind() == ParameterKind.RESISTOR) {
                resistor(single, none, free);
            } else {
                single.stated = screen(single.misfit, starts(none.theta(), j), free);
            }
            made.add(single);
        }
        return made;
    }

    /**
     * Ranks pairs of single faults beside the singles (which pairs: {@link FaultRanking}), and
     * sets the noise scales again from the best of all.
     *
     * @return the ranking with pairs
     * @throws IllegalStateException before {@link #singles()}
     */
    Diagnosis withPairs() {
        if (last == null) {
            throw new IllegalStateException("pairs are ranked after the single faults");
        }
        if (pairsRanked) {
            return last;
        }
        List<Candidate> singles = new ArrayList<>();
        for (Hypothesis hypothesis : last.hypotheses()) {
            // the measuring chain is not paired with a part: a bench mistake is its own explanation
            if (hypothesis.kind() != HypothesisKind.NONE && hypothesis.kind() != HypothesisKind.DOUBLE
                    && hypothesis.kind() != HypothesisKind.BENCH) {
                singles.add(candidateOf(hypothesis));
            }
        }
        int s = faultable.size();
        double pairPrior = Math.log(FaultRanking.DOUBLE_FAULTS_PRIOR / Math.max(1, s * (s - 1) / 2.0));
        List<int[]> pairs = new ArrayList<>();
        // the most probable single with the parts that, freed beside it, promise the largest
        // drop of χ² by one Gauss–Newton step from its MAP: the second fault is what the first
        // leaves unexplained, which the single-fault ranking alone does not show
        for (int leader = 0; leader < Math.min(GN_LEADERS, singles.size()); leader++) {
            Candidate first = singles.get(leader);
            QuadraticModel data = QuadraticModel.at(misfit(tolerance, allActive(), 1, 1), first.stated.theta());
            if (data == null) {
                continue;
            }
            List<double[]> promised = new ArrayList<>();
            for (int o = 0; o < singles.size(); o++) {
                Candidate other = singles.get(o);
                if (o == leader) {
                    continue;
                }
                QuadraticModel.Step step = data.step(pairPriors(first, other), pairActive(first, other));
                if (step != null) {
                    promised.add(new double[] {o, step.drop});
                }
            }
            promised.sort((a, b) -> Double.compare(b[1], a[1]));
            for (int i = 0; i < Math.min(FaultRanking.PAIRED_SINGLES - 1, promised.size()); i++) {
                int o = (int) promised.get(i)[0];
                int a = Math.min(leader, o);
                int b = Math.max(leader, o);
                if (pairs.stream().noneMatch(pair -> pair[0] == a && pair[1] == b)) {
                    pairs.add(new int[] {a, b});
                }
            }
        }
        // every pair of capacitors and the gain calibration, the commonest faults: few enough
        // (15 for five capacitors) to rank all, and a second slipped capacitor may lie in a
        // direction the first one's MAP hides (the no-fault MAP bends the nuisances instead)
        List<Integer> common = new ArrayList<>();
        for (int o = 0; o < singles.size(); o++) {
            ParameterKind kind = parameters.get(singles.get(o).freed[0]).kind();
            if (kind == ParameterKind.CAPACITOR || kind == ParameterKind.GAIN) {
                common.add(o);
            }
        }
        if (common.size() <= COMMON_PAIRED) {
            for (int x = 0; x < common.size(); x++) {
                for (int y = x + 1; y < common.size(); y++) {
                    int a = Math.min(common.get(x), common.get(y));
                    int b = Math.max(common.get(x), common.get(y));
                    if (pairs.stream().noneMatch(pair -> pair[0] == a && pair[1] == b)) {
                        pairs.add(new int[] {a, b});
                    }
                }
            }
        }
        // and the few most probable singles with one another
        for (int a = 0; a < Math.min(PAIRED_LEADERS, singles.size()); a++) {
            for (int b = a + 1; b < Math.min(PAIRED_LEADERS, singles.size()); b++) {
                final int fa = a;
                final int fb = b;
                if (pairs.stream().noneMatch(pair -> pair[0] == fa && pair[1] == fb)) {
                    pairs.add(new int[] {a, b});
                }
            }
        }
        for (int[] indices : pairs) {
            Candidate first = singles.get(indices[0]);
            Candidate second = singles.get(indices[1]);
            int i = first.freed[0];
            int j = second.freed[0];
            Prior[] priors = pairPriors(first, second);
            boolean[] active = pairActive(first, second);
            Candidate pair = new Candidate(HypothesisKind.DOUBLE, new int[] {i, j}, priors, active, pairPrior,
                    misfit(priors, active, 1, 1));
            // from each single's MAP with the other's freed value put in, and from the first's
            // with the second a decade either side (two slips: the second single's MAP has bent
            // to make up for the first)
            double[] fromFirst = first.stated.theta();
            fromFirst[j] = second.stated.theta(j);
            double[] fromSecond = second.stated.theta();
            fromSecond[i] = first.stated.theta(i);
            List<double[]> starts = new ArrayList<>(List.of(fromFirst, fromSecond));
            ParameterKind kind = parameters.get(j).kind();
            if (kind == ParameterKind.CAPACITOR || kind == ParameterKind.RESISTOR) {
                for (double offset : new double[] {-Math.log(10), Math.log(10)}) {
                    double[] start = first.stated.theta();
                    start[j] = tolerance[j].mean() + offset;
                    starts.add(start);
                    // and from the tolerance means, the first at its own estimate: the first's
                    // MAP has bent the nuisances to make up for the second fault
                    double[] fromMeans = mean.clone();
                    fromMeans[i] = first.stated.theta(i);
                    fromMeans[j] = tolerance[j].mean() + offset;
                    starts.add(fromMeans);
                }
            }
            pair.stated = screenThenSolve(pair.misfit, starts);
            // a pair whose model is undefined from both starts (the transistors leave their
            // amplifying region) is not a board that gives this sweep: it is not ranked
            if (pair.stated != null) {
                candidates.add(pair);
            }
        }
        pairsRanked = true;
        last = finish();
        return last;
    }

    /** How many of the most probable single faults are also paired with one another. */
    static final int PAIRED_LEADERS = 3;
    /** Up to this many capacitors and gain, every pair of them is ranked. */
    static final int COMMON_PAIRED = 9;
    /** How many of the most probable single faults get their Gauss–Newton partners. */
    static final int GN_LEADERS = 4;

    // every start screened, the best run to convergence; null when the model is undefined at all
    private MapPoint screenThenSolve(Misfit misfit, List<double[]> starts) {
        MapPoint best = null;
        for (double[] start : starts) {
            Optional<MapPoint> point = screen.solve(misfit, start, null, false);
            if (point.isPresent() && (best == null || point.get().objective() < best.objective())) {
                best = point.get();
            }
        }
        return best == null ? null : solve(misfit, List.of(best.theta()), null);
    }

    private Prior[] pairPriors(Candidate first, Candidate second) {
        Prior[] priors = tolerance.clone();
        priors[first.freed[0]] = parameters.get(first.freed[0]).faultPrior();
        priors[second.freed[0]] = parameters.get(second.freed[0]).faultPrior();
        return priors;
    }

    private boolean[] pairActive(Candidate first, Candidate second) {
        boolean[] active = baseActive.clone();
        active[first.freed[0]] = true;
        active[second.freed[0]] = true;
        return active;
    }

    private Candidate candidateOf(Hypothesis hypothesis) {
        for (Candidate candidate : candidates) {
            if (candidate.kind == hypothesis.kind() && candidate.freed.length == hypothesis.faults().size()
                    && (candidate.freed.length == 0 || parameters.get(candidate.freed[0])
                    .equals(hypothesis.faults().get(0).estimate().parameter()))) {
                return candidate;
            }
        }
        throw new IllegalStateException("no candidate for " + hypothesis.label());
    }

    /**
     * A resistor hypothesis: each costs a bias solve and a reduction per step, and most
     * resistors of a stage do not explain a sweep, so each is first judged by one Gauss–Newton
     * step from the no-fault MAP over its own parameters (the data Jacobian there made once for
     * all resistors). A resistor whose step promises a χ² drop of {@value #RESISTOR_SCREEN_DROP}
     * or more is screened and converged from every start as the other parts are (a decade slip
     * shows as a large drop); the others take the quadratic model's MAP and evidence at the
     * step's end ({@link QuadraticModel#endOf}) without a further evaluation: with a drop that small
     * the objective is near quadratic there and the step lands close to the MAP.
     */
    private void resistor(Candidate single, MapPoint none, boolean[] free) {
        int j = single.freed[0];
        double[] theta = none.theta();
        QuadraticModel.Step step = atNoFault == null ? null : atNoFault.step(single.priors, single.active);
        if (step == null || step.drop >= RESISTOR_SCREEN_DROP) {
            List<double[]> starts = starts(theta, j);
            if (step != null) {
                // of the two decade starts (the last two), only the one on the side the step
                // points to: the response is monotone in one resistor's value
                starts.remove(starts.size() - (step.delta[j] > 0 ? 2 : 1));
            }
            single.stated = screen(single.misfit, starts, free);
            return;
        }
        MapPoint quadratic = atNoFault.endOf(step, single.priors, single.active);
        if (quadratic != null) {
            single.stated = quadratic;
            single.settled = true;
        } else {
            single.stated = screen(single.misfit, starts(theta, j), free);
        }
    }

    /** A resistor's promised χ² drop at or above which it is screened in full. */
    static final double RESISTOR_SCREEN_DROP = 9;

    /** The quadratic model at the no-fault MAP with every resistor active; made on first use. */
    private QuadraticModel atNoFault;

    // every board parameter, resistors included; the channels stay DC-coupled
    private boolean[] allActive() {
        boolean[] all = new boolean[parameters.size()];
        java.util.Arrays.fill(all, true);
        for (int j : couplingIndices) {
            all[j] = baseActive[j];
        }
        return all;
    }

    private Misfit misfit(Prior[] priors, boolean[] active, double magnitudeScale, double phaseScale) {
        return misfit(model, priors, active, magnitudeScale, phaseScale);
    }

    private Misfit misfit(BoardModel on, Prior[] priors, boolean[] active, double magnitudeScale, double phaseScale) {
        return new Misfit(on, measured, priors, active, magnitudeScale, phaseScale, couplings);
    }

    // a hypothesis far behind after screening keeps its screened point: its probability is below
    // e^-SKIP_NATS either way, and converging it would not change the ranking
    private void convergeNear() {
        double[] lnZ = evidence(statedPoints());
        double best = Double.NEGATIVE_INFINITY;
        for (int h = 0; h < candidates.size(); h++) {
            best = Math.max(best, candidates.get(h).logPrior + lnZ[h]);
        }
        List<Candidate> own = new ArrayList<>();
        List<Candidate> shared = new ArrayList<>();
        for (int h = 1; h < candidates.size(); h++) {
            Candidate candidate = candidates.get(h);
            if (!candidate.settled && candidate.logPrior + lnZ[h] > best - FaultRanking.SKIP_NATS) {
                (candidate.second ? shared : own).add(candidate);
            }
        }
        // each on the thread of the board model its misfit belongs to
        CompletableFuture<Void> theirs = shared.isEmpty() ? null
                : CompletableFuture.runAsync(() -> converge(shared), helper);
        converge(own);
        if (theirs != null) {
            theirs.join();
        }
    }

    /**
     * A second start for the single faults left far behind. Every single is screened from the
     * no-fault MAP; when a large fault bends that MAP (the network's β and bias currents pulled
     * far from their priors to mimic, say, a coupling capacitor a decade low), the right part's
     * hypothesis can stay in the bent basin and lose by hundreds of nats unconverged, while a
     * part that escaped it wins at p = 1.000: a drawn geophone board with C2 at a tenth, swept to
     * 2 MHz, was named "C1" so. Each capacitor, bias or gain single more than
     * {@link FaultRanking#SKIP_NATS} behind the leader is therefore screened again from the
     * leader's MAP (the leader's own freed parameters put back to their tolerance means, this
     * one's at its mean and a decade either side), kept where that lowers its objective, and
     * converged when that brings it near. Boards whose singles are all near pay nothing.
     */
    private void rescreenFromLeader() {
        double[] lnZ = evidence(statedPoints());
        int leaderIndex = argMax(lnZ);
        Candidate leader = candidates.get(leaderIndex);
        double lead = leader.logPrior + lnZ[leaderIndex];
        if (leader.kind == HypothesisKind.NONE || leader.own != null) {
            return;
        }
        double[] base = leader.stated.theta().clone();
        for (int f : leader.freed) {
            base[f] = mean[f];
        }
        boolean moved = false;
        for (int h = 0; h < candidates.size(); h++) {
            Candidate candidate = candidates.get(h);
            if (h == leaderIndex || candidate.freed.length != 1 || candidate.own != null || candidate.settled
                    || candidate.logPrior + lnZ[h] > lead - FaultRanking.SKIP_NATS) {
                continue;
            }
            int j = candidate.freed[0];
            ParameterKind kind = parameters.get(j).kind();
            if (kind != ParameterKind.CAPACITOR && kind != ParameterKind.BIAS && kind != ParameterKind.GAIN) {
                continue;
            }
            boolean[] free = networkHeld.clone();
            free[j] = true;
            double[] offsets = kind == ParameterKind.CAPACITOR ? new double[] {0, -Math.log(10), Math.log(10)}
                    : new double[] {0};
            List<double[]> starts = new ArrayList<>();
            for (double offset : offsets) {
                double[] start = base.clone();
                start[j] = tolerance[j].mean() + offset;
                starts.add(start);
            }
            MapPoint again = screen(candidate.misfit, starts, free);
            if (again.objective() < candidate.stated.objective()) {
                candidate.stated = again;
                moved = true;
            }
        }
        if (moved) {
            convergeNear();
        }
    }

    private void converge(List<Candidate> near) {
        for (Candidate candidate : near) {
            MapPoint converged = solve(candidate.misfit, List.of(candidate.stated.theta()), networkHeld);
            if (converged != null) {
                candidate.stated = converged;
            }
        }
    }

    private List<MapPoint> statedPoints() {
        List<MapPoint> points = new ArrayList<>();
        for (Candidate candidate : candidates) {
            points.add(candidate.stated);
        }
        return points;
    }

    // the noise scales from the best hypothesis at the stated σ, every hypothesis rescaled, the
    // near ones solved again when the gain-to-phase weighting changed, and the probabilities
    private Diagnosis finish() {
        List<MapPoint> stated = statedPoints();
        double[] lnZ = evidence(stated);
        int best = argMax(lnZ);
        Candidate top = candidates.get(best);
        double effective = top.stated.effectiveParameters(top.priors);
        int n = measured.size();
        double magnitudeScale;
        double phaseScale;
        if (measured.stated()) {
            double nu = Math.max(1, measured.rows() - effective);
            magnitudeScale = Math.sqrt(Math.max(1, top.stated.dataChiSquared() / nu));
            phaseScale = magnitudeScale;
        } else if (measured.withPhase()) {
            double nu = Math.max(1, n - effective / 2);
            magnitudeScale = Math.sqrt(Math.max(1, top.stated.magnitudeChiSquared() / nu));
            phaseScale = Math.sqrt(Math.max(1, top.stated.phaseChiSquared() / nu));
        } else {
            magnitudeScale = Math.sqrt(Math.max(1, top.stated.dataChiSquared() / Math.max(1, n - effective)));
            phaseScale = magnitudeScale;
        }
        List<MapPoint> points = new ArrayList<>();
        for (Candidate candidate : candidates) {
            points.add(magnitudeScale > 1 || phaseScale > 1
                    ? candidate.stated.withNoiseScales(magnitudeScale, phaseScale) : candidate.stated);
        }
        List<Misfit> scaled = new ArrayList<>();
        for (Candidate candidate : candidates) {
            scaled.add(magnitudeScale > 1 || phaseScale > 1
                    ? misfit(candidate.own != null ? candidate.own : model, candidate.priors, candidate.active,
                    magnitudeScale, phaseScale) : candidate.misfit);
        }
        if (Math.abs(Math.log(magnitudeScale / phaseScale)) > Math.log(REWEIGHT_RATIO)) {
            // the weighting of gain against phase changed: the MAPs move, not only the widths
            lnZ = evidence(points);
            double bestScaled = Double.NEGATIVE_INFINITY;
            for (int h = 0; h < candidates.size(); h++) {
                bestScaled = Math.max(bestScaled, candidates.get(h).logPrior + lnZ[h]);
            }
            for (int h = 0; h < candidates.size(); h++) {
                if (candidates.get(h).logPrior + lnZ[h] > bestScaled - FaultRanking.SKIP_NATS) {
                    MapPoint again = solve(scaled.get(h), List.of(points.get(h).theta()), null);
                    if (again != null) {
                        points.set(h, again);
                    }
                }
            }
        }
        lnZ = evidence(points);
        double[] logPosterior = new double[lnZ.length];
        double max = Double.NEGATIVE_INFINITY;
        for (int h = 0; h < lnZ.length; h++) {
            logPosterior[h] = candidates.get(h).logPrior + lnZ[h];
            max = Math.max(max, logPosterior[h]);
        }
        double sum = 0;
        for (double v : logPosterior) {
            sum += Math.exp(v - max);
        }
        List<Hypothesis> hypotheses = new ArrayList<>();
        int topIndex = 0;
        for (int h = 0; h < lnZ.length; h++) {
            if (logPosterior[h] > logPosterior[topIndex]) {
                topIndex = h;
            }
            Candidate candidate = candidates.get(h);
            double probability = Math.exp(logPosterior[h] - max) / sum;
            BackSolve backSolve = backSolve(points.get(h), candidate, candidate.stated.dataChiSquared());
            hypotheses.add(hypothesis(candidate, lnZ[h], probability, backSolve));
        }
        hypotheses.sort(Comparator.comparingDouble(Hypothesis::probability).reversed());
        BestResiduals residuals = residuals(scaled.get(topIndex), points.get(topIndex), candidates.get(topIndex));
        NoiseBasis noise = new NoiseBasis(measured.stated(), FaultRanking.DEFAULT_GAIN_SIGMA_DB,
                FaultRanking.DEFAULT_PHASE_SIGMA_DEG, magnitudeScale, phaseScale);
        if (biasSetters == null) {
            biasSetters = model.board().biasSetters();
        }
        return new Diagnosis(hypotheses, noise, measured.withPhase(), pairsRanked, residuals, biasSetters);
    }

    /** Gain and phase scales further apart than this ratio: the near hypotheses are solved again. */
    static final double REWEIGHT_RATIO = 1.5;

    private BestResiduals residuals(Misfit misfit, MapPoint point, Candidate candidate) {
        double[] r = new double[misfit.rows()];
        if (!misfit.evaluate(point.theta(), r, null, true, null)) {
            throw new IllegalStateException("the stage's model is undefined at the best hypothesis' MAP");
        }
        int n = measured.size();
        List<Double> frequencies = new ArrayList<>(n);
        List<Double> magnitude = new ArrayList<>(n);
        List<Double> phase = new ArrayList<>(n);
        List<Double> magnitudeSigma = new ArrayList<>(n);
        List<Double> phaseSigma = new ArrayList<>(n);
        double[] hz = measured.frequenciesHz();
        for (int k = 0; k < n; k++) {
            frequencies.add(hz[k]);
            magnitude.add(r[k]);
            magnitudeSigma.add(measured.sigmaMagnitude(k) * misfit.magnitudeScale());
            if (measured.withPhase()) {
                phase.add(r[n + k]);
                phaseSigma.add(measured.sigmaPhase(k) * misfit.phaseScale());
            }
        }
        return new BestResiduals(frequencies, magnitude, phase, magnitudeSigma, phaseSigma,
                candidate.stated.dataChiSquared(), candidate.stated.effectiveParameters(candidate.priors));
    }

    // From the no-fault MAP, and from the tolerance means with the freed parameter at its mean
    // (and a decade either side for a capacitor or a resistor): when one part is far off, the
    // no-fault MAP has bent the others to compensate, and the means are the better place to
    // start them. The means start is left out when the no-fault MAP lies within one prior σ of
    // the means in every parameter: the two starts are then the same basin.
    private List<double[]> starts(double[] noFault, int j) {
        List<double[]> starts = new ArrayList<>();
        starts.add(noFault.clone());
        boolean bent = false;
        for (int i = 0; i < mean.length; i++) {
            bent |= baseActive[i] && Math.abs(noFault[i] - mean[i]) > tolerance[i].standardDeviation();
        }
        ParameterKind kind = parameters.get(j).kind();
        boolean valued = kind == ParameterKind.CAPACITOR || kind == ParameterKind.RESISTOR;
        boolean fromMeans = bent;
        double[] offsets = valued
                ? (fromMeans ? new double[] {0, -Math.log(10), Math.log(10)} : new double[] {-Math.log(10), Math.log(10)})
                : (fromMeans ? new double[] {0} : new double[0]);
        for (double offset : offsets) {
            double[] start = mean.clone();
            start[j] = tolerance[j].mean() + offset;
            starts.add(start);
        }
        if (kind == ParameterKind.RESISTOR && !bent) {
            // the resistor's own nominal value, from the no-fault MAP
            double[] start = noFault.clone();
            start[j] = tolerance[j].mean();
            starts.set(0, start);
        }
        return starts;
    }

    // every start with the network held but the freed parameter, the best one kept
    private MapPoint screen(Misfit misfit, List<double[]> starts, boolean[] free) {
        MapPoint best = null;
        for (double[] start : starts) {
            Optional<MapPoint> point = screen.solve(misfit, start, free, false);
            if (point.isPresent() && (best == null || point.get().objective() < best.objective())) {
                best = point.get();
            }
        }
        if (best == null) {
            // every start leaves the amplifying region or the model undefined: the hypothesis is
            // held at the no-fault estimate, where the model is defined
            return screen.at(misfit, starts.get(0)).orElseThrow(
                    () -> new IllegalStateException("the stage's model is undefined at the no-fault estimate"));
        }
        // the best start's Hessian exact, for the evidence of a hypothesis that stops here
        return screen.at(misfit, best.theta()).orElse(best);
    }

    // network held first (no reductions while the capacitors move), then everything free: the
    // network moves little under its priors, so the second phase takes a few iterations; null
    // when the model is undefined from every start
    private MapPoint solve(Misfit misfit, List<double[]> starts, boolean[] held) {
        MapPoint best = null;
        for (double[] start : starts) {
            double[] from = start;
            if (held != null) {
                // only a start for the next phase: its Hessian is not wanted
                Optional<MapPoint> first = solver.solve(misfit, start, held, false);
                if (first.isPresent()) {
                    from = first.get().theta();
                }
            }
            Optional<MapPoint> point = solver.solve(misfit, from);
            if (point.isPresent() && (best == null || point.get().objective() < best.objective())) {
                best = point.get();
            }
        }
        return best;
    }

    private double[] evidence(List<MapPoint> points) {
        double[] lnZ = new double[points.size()];
        for (int h = 0; h < points.size(); h++) {
            MapPoint point = points.get(h);
            Candidate candidate = candidates.get(h);
            double lnSigma = 0;
            for (int j = 0; j < candidate.priors.length; j++) {
                if (candidate.active[j]) {
                    lnSigma += Math.log(candidate.priors[j].standardDeviation());
                }
            }
            // ln det(Σp·H) = ln det H + 2·Σ ln σ_j over the hypothesis' own parameters (an
            // inactive one has a unit row in H and no prior)
            lnZ[h] = -0.5 * point.objective() - 0.5 * point.lnDetHessian() - lnSigma;
        }
        return lnZ;
    }

    private int argMax(double[] lnZ) {
        int best = 0;
        for (int h = 1; h < lnZ.length; h++) {
            if (candidates.get(h).logPrior + lnZ[h] > candidates.get(best).logPrior + lnZ[best]) {
                best = h;
            }
        }
        return best;
    }

    private BackSolve backSolve(MapPoint point, Candidate candidate, double chiSquaredAtStated) {
        int p = parameters.size();
        Prior[] priors = candidate.priors;
        // identifiability at this MAP: this hypothesis' prior rows swapped for the tolerance ones
        double[] toleranceSigma = new double[p];
        for (int i = 0; i < p; i++) {
            toleranceSigma[i] = tolerance[i].standardDeviation();
        }
        double[][] toleranceCovariance = point.covarianceWithPriors(toleranceSigma);
        List<ParameterEstimate> estimates = new ArrayList<>();
        List<Integer> kept = new ArrayList<>();
        for (int i = 0; i < p; i++) {
            if (!candidate.active[i]) {
                continue;
            }
            kept.add(i);
            double u = Math.sqrt(point.covariance(i, i));
            double reference = tolerance[i].standardDeviation();
            if (parameters.get(i).kind() == ParameterKind.RESISTOR) {
                reference = Math.max(reference, FaultRanking.RESISTOR_REFERENCE_SIGMA);
            }
            boolean identifiable = toleranceCovariance != null
                    && Math.sqrt(toleranceCovariance[i][i]) < FaultRanking.IDENTIFIABLE_RATIO * reference;
            estimates.add(new ParameterEstimate(parameters.get(i), point.theta(i), u, priors[i].standardDeviation(),
                    identifiable));
        }
        List<List<Double>> correlation = new ArrayList<>();
        for (int i : kept) {
            List<Double> row = new ArrayList<>(kept.size());
            for (int j : kept) {
                row.add(point.covariance(i, j) / Math.sqrt(point.covariance(i, i) * point.covariance(j, j)));
            }
            correlation.add(row);
        }
        return new BackSolve(estimates, correlation, chiSquaredAtStated, measured.rows(), point.converged());
    }

    private Hypothesis hypothesis(Candidate candidate, double logEvidence, double probability, BackSolve backSolve) {
        List<PartReading> faults = new ArrayList<>();
        boolean identifiable = true;
        for (int j : candidate.freed) {
            ParameterEstimate estimate = backSolve.of(parameters.get(j));
            faults.add(PartReading.of(estimate));
            identifiable &= estimate.identifiable();
        }
        double prior = Math.exp(candidate.logPrior);
        return new Hypothesis(candidate.kind, faults, prior, logEvidence, probability,
                candidate.kind == HypothesisKind.NONE || identifiable, backSolve);
    }
}
