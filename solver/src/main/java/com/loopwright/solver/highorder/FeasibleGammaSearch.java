package com.loopwright.solver.highorder;

import com.loopwright.solver.design.GammaCondition;
import com.loopwright.solver.design.GammaInterval;
import com.loopwright.solver.design.PoleMatchedSolution;
import com.loopwright.solver.design.RiccatiSolution;
import com.loopwright.solver.norm.HInfinityNormCalculator;
import com.loopwright.solver.plant.CompanionPlant;
import com.loopwright.solver.riccati.HamiltonianRiccatiSolver;
import com.loopwright.solver.verify.DesignVerifier;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.ejml.dense.row.NormOps_DDRM;
import org.hipparchus.analysis.solvers.AllowedSolution;
import org.hipparchus.analysis.solvers.BracketingNthOrderBrentSolver;
import org.hipparchus.exception.MathRuntimeException;

/**
 * The set of gamma at which the pole-matched design exists, found in mu = 1/gamma^2 without assuming any
 * requirement to be monotone in gamma.
 *
 * <p>Method. mu is capped by the bounded real lemma: a design at gamma certifies ||T_wz|| &lt; gamma, and u is
 * part of z, so gamma &gt; ||T_wu|| = ||K (sI - A + B2 K)^-1 B1|| (Hamiltonian norm test), i.e.
 * mu &lt; mu_cap = 1/||T_wu||^2. At mu = 0 the system is linear and its solution unique (when nonsingular). That
 * solution branch is followed by continuation in log mu up to mu_cap (secant predictor, Newton corrector from the
 * prediction, step halved when Newton fails or the corrector moves far, which also stops the branch at a turning
 * point). The requirement margins (rho_i^2, the smallest eigenvalue of P, minus the spectral abscissa of
 * A + RP) are evaluated at every point; each sign change between neighbouring points is refined by a bracketing
 * Brent solver to the side where the requirement holds. The intervals where all hold are then checked
 * independently: just inside both ends and in the middle the Hamiltonian Riccati solver must find the stabilizing
 * solution for Q = diag(rho^2), equal to the pole-matched P and reproducing K; an interval that fails is dropped.
 *
 * <p>Guaranteed: every gamma at a checked point of a reported interval is feasible (checked by construction), and
 * no gamma at or below ||T_wu|| is feasible. Not guaranteed: the set between checked points (continuation steps
 * are small but an even number of sign changes inside one step would go unseen), and other real solution branches
 * of the quadratic system; {@link #seek} tries a few other Newton starts at one requested gamma and follows any
 * feasible branch it finds.
 */
public final class FeasibleGammaSearch {

    /** Cap on continuation attempts (accepted steps and halvings) along one direction of one branch. */
    public static final int MAX_CONTINUATION_ATTEMPTS = 1500;
    /**
     * Cap on Newton solves for continuation and refinement in one search; past it the branch ends and interval
     * ends stay at the continuation points where the requirement holds (the set only shrinks).
     */
    public static final int MAX_SOLVES = 20_000;
    /** Without a w-to-u gain (K = 0), mu is searched up to (b/|B1|)^2 times this. */
    static final double FALLBACK_CAP_FACTOR = 1e12;
    /** Cap on margin evaluations of one refined interval end. */
    public static final int MAX_REFINEMENT_EVALUATIONS = 80;
    /** Interval ends are refined to this relative accuracy in mu (half of it in gamma). */
    static final double REFINEMENT_RELATIVE_ACCURACY = 1e-13;
    /** Cap on the intervals reported (the lowest ones and the last, highest one are kept). */
    public static final int MAX_INTERVALS = 64;
    /** Cap on branches followed (the one from gamma = infinity plus those found by {@link #seek}). */
    public static final int MAX_BRANCHES = 4;
    /** The scan starts at mu_cap / 10^this (gamma 10^6 above ||T_wu||); below it the next point is mu = 0. */
    static final double SCAN_DECADES = 12;
    /** Longest continuation step in ln mu (at least 6 points a decade). */
    static final double MAX_LOG_STEP = Math.log(10) / 6;
    /** A branch ends when the step in ln mu falls below this. */
    static final double MIN_LOG_STEP = 1e-9;
    /** Step growth after an accepted step. */
    static final double STEP_GROWTH = 1.5;
    /** Largest relative distance of the Newton solution from the prediction (stays on the branch). */
    static final double MAX_CORRECTOR_DISTANCE = 0.05;
    /** Largest relative change of the solution in one step (keeps the margins finely sampled). */
    static final double MAX_STEP_CHANGE = 0.2;
    /** Checked points lie this fraction of the interval's width in ln gamma inside each end. */
    static final double INSIDE_FRACTION = 0.01;
    /** For an unbounded interval: the checks just inside the lower end, at 10^3 and 10^6 times it. */
    static final double[] UNBOUNDED_CHECK_FACTORS = {1.01, 1e3, 1e6};
    /** Relative slack on ||T_wu|| (the norm test's own accuracy). */
    static final double INPUT_GAIN_SLACK = 1e-6;
    /** Two solutions closer than this (relative) are the same branch. */
    static final double SAME_BRANCH_DISTANCE = 1e-6;

    private final PoleMatchedRiccati riccati = new PoleMatchedRiccati();
    private final HamiltonianRiccatiSolver hamiltonian = new HamiltonianRiccatiSolver();
    private final HInfinityNormCalculator normCalculator = new HInfinityNormCalculator();

    /** One point of a branch with its requirement margins (entries as in {@link #margins}). */
    record Point(double mu, PoleMatchedSolution solution, double[] margins) {
        Point {
            margins = margins.clone();
        }

        @Override
        public double[] margins() {
            return margins.clone();
        }
    }

    /**
     * A followed branch, points in increasing mu.
     *
     * @param lowEnd  what ends it at the smallest mu: null when it reaches mu = 0
     * @param highEnd what ends it at the largest mu
     */
    record Branch(List<Point> points, GammaCondition lowEnd, GammaCondition highEnd) {
        Branch {
            points = List.copyOf(points);
        }
    }

    /** An interval with the branch it lies on. */
    record Claim(GammaInterval interval, Branch branch) {}

    /**
     * The feasible set found.
     *
     * @param intervals   the checked intervals, disjoint, increasing (their union over all branches)
     * @param claims      each interval with its branch (before the union)
     * @param inputGain   ||T_wu||, a strict lower bound on every feasible gamma (0 when K = 0 or not computed)
     * @param muCap       the largest 1/gamma^2 searched
     * @param evaluations Newton solves spent (continuation, refinement, checks)
     * @param notes       what was dropped or found on another branch, in words
     * @param lowestHolding per requirement (order as in {@link #margins}): the smallest gamma at which it holds
     *                      on a followed branch; infinity when it holds at no finite gamma there
     */
    public record FeasibleGammaSet(
            List<GammaInterval> intervals,
            List<Claim> claims,
            double inputGain,
            double muCap,
            int evaluations,
            List<String> notes,
            double[] lowestHolding) {
        public FeasibleGammaSet {
            intervals = List.copyOf(intervals);
            claims = List.copyOf(claims);
            notes = List.copyOf(notes);
            lowestHolding = lowestHolding.clone();
        }

        @Override
        public double[] lowestHolding() {
            return lowestHolding.clone();
        }

        public boolean isEmpty() {
            return intervals.isEmpty();
        }

        /** The infimum of the set (NaN when empty). */
        public double gammaMin() {
            return intervals.isEmpty() ? Double.NaN : intervals.get(0).lowerGamma();
        }

        public boolean contains(double gamma) {
            return intervals.stream().anyMatch(i -> i.contains(gamma));
        }
    }

    /** Counts Newton solves. */
    private static final class Counter {
        int value;
    }

    /** The feasible set along the branch continued from gamma = infinity. */
    public FeasibleGammaSet search(CompanionPlant plant, double[] desired) {
        Counter counter = new Counter();
        List<String> notes = new ArrayList<>();
        double inputGain;
        try {
            inputGain = inputGain(plant, desired);
        } catch (RuntimeException e) {
            inputGain = 0;
            notes.add("the closed-loop gain from w to u could not be computed (" + e.getMessage() + "); gamma was"
                    + " searched down to |B1|/b x 10^-6");
        }
        double muCap = inputGain > 0
                ? muCap(inputGain)
                : FALLBACK_CAP_FACTOR * Math.pow(plant.b() / HighOrderDesigner.norm(plant.disturbance()), 2);
        List<Claim> claims = new ArrayList<>();
        PoleMatchedSolution atInfinity;
        try {
            atInfinity = riccati.solve(plant, desired, 0);
            counter.value++;
        } catch (PoleMatchedRiccati.SystemFailure e) {
            notes.add("the pole-matched Riccati system at gamma = infinity is singular: " + e.getMessage());
            return new FeasibleGammaSet(
                    List.of(), List.of(), inputGain, muCap, counter.value, notes, infinities(plant.order() + 2));
        }
        Point origin = point(plant, 0, atInfinity);
        Branch principal = follow(plant, desired, origin, muCap, counter);
        double[] lowestHolding = infinities(plant.order() + 2);
        claims.addAll(checkedClaims(plant, desired, principal, counter, notes, lowestHolding));
        return assemble(claims, inputGain, muCap, counter.value, notes, lowestHolding);
    }

    /**
     * Looks for another feasible solution branch through the given gamma (not in the set): Newton from a few
     * starts (the zero leading block, the solution at gamma = infinity, the branch points nearest in mu); a start
     * that lands on a feasible solution away from the known branches is followed both ways and its checked
     * intervals are added.
     *
     * @return the set with the new intervals, or the same set when none was found
     */
    public FeasibleGammaSet seek(CompanionPlant plant, double[] desired, FeasibleGammaSet set, double gamma) {
        if (set.contains(gamma) || set.claims().size() >= MAX_BRANCHES) {
            return set;
        }
        double mu = 1 / (gamma * gamma);
        Counter counter = new Counter();
        counter.value = set.evaluations();
        List<PoleMatchedSolution> starts = new ArrayList<>();
        int n = plant.order();
        starts.add(new PoleMatchedSolution(new DMatrixRMaj(n, n), new double[n], 0, Double.NaN, 0));
        for (Claim claim : set.claims()) {
            List<Point> points = claim.branch().points();
            starts.add(points.get(0).solution());
            points.stream()
                    .min(Comparator.comparingDouble(p -> Math.abs(Math.log(p.mu() / mu))))
                    .ifPresent(p -> starts.add(p.solution()));
        }
        for (PoleMatchedSolution start : starts) {
            PoleMatchedSolution candidate;
            try {
                counter.value++;
                candidate = riccati.solveFrom(plant, desired, mu, start);
            } catch (PoleMatchedRiccati.SystemFailure | IllegalArgumentException e) {
                continue;
            }
            Point seed = point(plant, mu, candidate);
            if (!allHold(seed.margins()) || onKnownBranch(plant, desired, set, seed, counter)) {
                continue;
            }
            Branch branch = followBothWays(plant, desired, seed, set.muCap(), counter);
            List<String> notes = new ArrayList<>(set.notes());
            double[] lowestHolding = set.lowestHolding();
            List<Claim> found = checkedClaims(plant, desired, branch, counter, notes, lowestHolding);
            if (found.stream().anyMatch(c -> c.interval().contains(gamma))) {
                notes.add(String.format(
                        "gamma %.6g lies on a second solution branch of the pole-matched Riccati"
                                + " system (other weights rho_i for the same gain), found by Newton from another start;"
                                + " its intervals are part of the feasible set",
                        gamma));
                List<Claim> claims = new ArrayList<>(set.claims());
                claims.addAll(found);
                return assemble(claims, set.inputGain(), set.muCap(), counter.value, notes, lowestHolding);
            }
        }
        return set;
    }

    /** P and the weights at gamma, on the branch of an interval that contains it. */
    public PoleMatchedSolution solutionAt(CompanionPlant plant, double[] desired, FeasibleGammaSet set, double gamma) {
        double mu = 1 / (gamma * gamma);
        for (Claim claim : set.claims()) {
            if (claim.interval().contains(gamma)) {
                return riccati.solveFromWithCondition(plant, desired, mu, interpolated(claim.branch(), mu));
            }
        }
        throw new PoleMatchedRiccati.SystemFailure("gamma " + gamma + " is not inside a feasible interval");
    }

    /**
     * The requirement margins at mu: entries 0..n-1 are rho_i^2 (holds when &gt;= 0), n is the smallest
     * eigenvalue of P over ||P||_F, n + 1 is minus the spectral abscissa of A + RP over ||A + RP||_F (both hold
     * when &gt; 0). NaN (an eigenvalue routine that failed) never holds.
     */
    static double[] margins(CompanionPlant plant, double mu, PoleMatchedSolution solution) {
        int n = plant.order();
        double[] m = new double[n + 2];
        System.arraycopy(solution.weightsSquared(), 0, m, 0, n);
        DMatrixRMaj p = solution.p();
        m[n] = HighOrderDesigner.smallestSymmetricEigenvalue(p) / NormOps_DDRM.normF(p);
        DMatrixRMaj worstCase = plant.stateMatrix();
        CommonOps_DDRM.multAdd(PoleMatchedRiccati.quadraticTerm(plant, mu), p, worstCase);
        m[n + 1] = -HighOrderDesigner.largestRealPart(worstCase) / NormOps_DDRM.normF(worstCase);
        return m;
    }

    static boolean holds(int condition, double margin, int order) {
        return condition < order ? margin >= 0 : margin > 0;
    }

    private static boolean allHold(double[] margins) {
        int n = margins.length - 2;
        for (int c = 0; c < margins.length; c++) {
            if (!holds(c, margins[c], n)) {
                return false;
            }
        }
        return true;
    }

    /** ||K (sI - A + B2 K)^-1 B1||_inf with K = b (row n of P), P from pole matching. */
    double inputGain(CompanionPlant plant, double[] desired) {
        int n = plant.order();
        double[] column = PoleMatchedRiccati.matchedColumn(plant, desired);
        DMatrixRMaj closed = plant.stateMatrix();
        DMatrixRMaj k = new DMatrixRMaj(1, n);
        for (int j = 0; j < n; j++) {
            k.set(0, j, plant.b() * column[j]);
            closed.add(n - 1, j, -plant.b() * plant.b() * column[j]);
        }
        return normCalculator.compute(closed, plant.disturbanceInput(), k).value();
    }

    private static double muCap(double inputGain) {
        double g = inputGain * (1 - INPUT_GAIN_SLACK);
        return g > 0 ? 1 / (g * g) : Double.POSITIVE_INFINITY;
    }

    private Point point(CompanionPlant plant, double mu, PoleMatchedSolution solution) {
        return new Point(mu, solution, margins(plant, mu, solution));
    }

    /** From the solution at mu = 0 up to mu_cap. */
    private Branch follow(CompanionPlant plant, double[] desired, Point origin, double cap, Counter counter) {
        List<Point> points = new ArrayList<>();
        points.add(origin);
        if (!Double.isFinite(cap)) {
            return new Branch(points, null, GammaCondition.SOLUTION_BRANCH_END);
        }
        Point first = step(plant, desired, origin, null, cap * Math.pow(10, -SCAN_DECADES), counter);
        if (first == null) {
            return new Branch(points, null, GammaCondition.SOLUTION_BRANCH_END);
        }
        points.add(first);
        boolean reached = trace(plant, desired, first, origin, cap, points, counter);
        return new Branch(points, null, reached ? GammaCondition.INPUT_GAIN : GammaCondition.SOLUTION_BRANCH_END);
    }

    /** From a seed at mu &gt; 0 down to mu = 0 and up to mu_cap. */
    private Branch followBothWays(CompanionPlant plant, double[] desired, Point seed, double cap, Counter counter) {
        List<Point> down = new ArrayList<>();
        double floor = cap * Math.pow(10, -SCAN_DECADES);
        boolean reachedFloor =
                seed.mu() <= floor || trace(plant, desired, seed, null, Math.min(floor, seed.mu()), down, counter);
        boolean reachedZero = false;
        if (reachedFloor) {
            Point last = down.isEmpty() ? seed : down.get(down.size() - 1);
            Point zero = step(plant, desired, last, null, 0, counter);
            if (zero != null) {
                down.add(zero);
                reachedZero = true;
            }
        }
        List<Point> up = new ArrayList<>();
        boolean reachedCap = seed.mu() >= cap || trace(plant, desired, seed, null, cap, up, counter);
        List<Point> points = new ArrayList<>(down.size() + up.size() + 1);
        for (int i = down.size() - 1; i >= 0; i--) {
            points.add(down.get(i));
        }
        points.add(seed);
        points.addAll(up);
        return new Branch(
                points,
                reachedZero ? null : GammaCondition.SOLUTION_BRANCH_END,
                reachedCap ? GammaCondition.INPUT_GAIN : GammaCondition.SOLUTION_BRANCH_END);
    }

    /**
     * Continuation in ln mu from start (previous: the point before it, for the secant predictor, or null) to
     * target; appends the accepted points to out.
     *
     * @return true when target was reached, false at a turning point or the attempt cap
     */
    private boolean trace(
            CompanionPlant plant,
            double[] desired,
            Point start,
            Point previous,
            double target,
            List<Point> out,
            Counter counter) {
        double logTarget = Math.log(target);
        double h = MAX_LOG_STEP / 4;
        Point last = start;
        Point before = previous;
        for (int attempt = 0; attempt < MAX_CONTINUATION_ATTEMPTS; attempt++) {
            double logLast = Math.log(last.mu());
            double remaining = Math.abs(logTarget - logLast);
            if (remaining == 0) {
                return true;
            }
            double length = Math.min(h, remaining);
            double mu = length == remaining ? target : Math.exp(logLast + Math.signum(logTarget - logLast) * length);
            Point next = step(plant, desired, last, before, mu, counter);
            if (next == null) {
                h = length / 2;
                if (h < MIN_LOG_STEP) {
                    return false;
                }
                continue;
            }
            out.add(next);
            before = last;
            last = next;
            h = Math.min(length * STEP_GROWTH, MAX_LOG_STEP);
        }
        return false;
    }

    /** One predictor-corrector step to mu, or null when Newton fails or leaves the neighbourhood. */
    private Point step(CompanionPlant plant, double[] desired, Point last, Point before, double mu, Counter counter) {
        PoleMatchedSolution prediction = before == null
                ? last.solution()
                : blend(before.solution(), last.solution(), (mu - before.mu()) / (last.mu() - before.mu()));
        if (counter.value >= MAX_SOLVES) {
            return null;
        }
        PoleMatchedSolution next;
        try {
            counter.value++;
            next = riccati.solveFrom(plant, desired, mu, prediction);
        } catch (PoleMatchedRiccati.SystemFailure | IllegalArgumentException e) {
            return null;
        }
        if (!(distance(next, prediction) <= MAX_CORRECTOR_DISTANCE)
                || !(distance(next, last.solution()) <= MAX_STEP_CHANGE)) {
            return null;
        }
        return point(plant, mu, next);
    }

    /** x0 + s (x1 - x0) for P and the weights. */
    private static PoleMatchedSolution blend(PoleMatchedSolution x0, PoleMatchedSolution x1, double s) {
        DMatrixRMaj p = x0.p();
        DMatrixRMaj p1 = x1.p();
        for (int i = 0; i < p.getNumElements(); i++) {
            p.data[i] += s * (p1.data[i] - p.data[i]);
        }
        double[] w = x0.weightsSquared();
        double[] w1 = x1.weightsSquared();
        for (int i = 0; i < w.length; i++) {
            w[i] += s * (w1[i] - w[i]);
        }
        return new PoleMatchedSolution(p, w, Double.NaN, Double.NaN, 0);
    }

    /** ||P - P0||_F/||P0||_F + |w - w0|/|w0|. */
    static double distance(PoleMatchedSolution x, PoleMatchedSolution reference) {
        DMatrixRMaj dp = x.p();
        CommonOps_DDRM.subtractEquals(dp, reference.p());
        double[] w = x.weightsSquared();
        double[] w0 = reference.weightsSquared();
        double dw = 0;
        double w0Norm = 0;
        for (int i = 0; i < w.length; i++) {
            dw = Math.hypot(dw, w[i] - w0[i]);
            w0Norm = Math.hypot(w0Norm, w0[i]);
        }
        return NormOps_DDRM.normF(dp) / Math.max(NormOps_DDRM.normF(reference.p()), Double.MIN_NORMAL)
                + dw / Math.max(w0Norm, Double.MIN_NORMAL);
    }

    /** The solution on the branch at mu, from the blend of its neighbouring points. */
    private static PoleMatchedSolution interpolated(Branch branch, double mu) {
        List<Point> points = branch.points();
        for (int k = 0; k + 1 < points.size(); k++) {
            Point a = points.get(k);
            Point b = points.get(k + 1);
            if (mu >= a.mu() && mu <= b.mu()) {
                return blend(a.solution(), b.solution(), (mu - a.mu()) / (b.mu() - a.mu()));
            }
        }
        return points.stream()
                .min(Comparator.comparingDouble(p -> Math.abs(p.mu() - mu)))
                .orElseThrow()
                .solution();
    }

    private boolean onKnownBranch(
            CompanionPlant plant, double[] desired, FeasibleGammaSet set, Point seed, Counter counter) {
        for (Claim claim : set.claims()) {
            List<Point> points = claim.branch().points();
            if (seed.mu() < points.get(0).mu()
                    || seed.mu() > points.get(points.size() - 1).mu()) {
                continue;
            }
            try {
                counter.value++;
                PoleMatchedSolution known =
                        riccati.solveFrom(plant, desired, seed.mu(), interpolated(claim.branch(), seed.mu()));
                if (distance(seed.solution(), known) <= SAME_BRANCH_DISTANCE) {
                    return true;
                }
            } catch (PoleMatchedRiccati.SystemFailure e) {
                // the known branch does not reach here: not the same
            }
        }
        return false;
    }

    /** One sign change of one requirement, refined; holdsAbove: the requirement holds at larger mu. */
    private record Event(double mu, int condition, boolean holdsAbove) {}

    /** The intervals of one branch where every requirement holds, each checked independently. */
    private List<Claim> checkedClaims(
            CompanionPlant plant,
            double[] desired,
            Branch branch,
            Counter counter,
            List<String> notes,
            double[] lowestHolding) {
        List<Point> points = branch.points();
        int n = plant.order();
        int conditions = n + 2;
        List<Event> events = new ArrayList<>();
        for (int k = 0; k + 1 < points.size(); k++) {
            Point a = points.get(k);
            Point b = points.get(k + 1);
            for (int c = 0; c < conditions; c++) {
                boolean ha = holds(c, a.margins()[c], n);
                boolean hb = holds(c, b.margins()[c], n);
                if (ha != hb) {
                    Event e = new Event(refine(plant, desired, a, b, c, ha, counter), c, hb);
                    events.add(e);
                    lowestHolding[c] = Math.min(lowestHolding[c], 1 / Math.sqrt(e.mu()));
                }
            }
        }
        for (Point p : points) {
            for (int c = 0; c < conditions; c++) {
                if (holds(c, p.margins()[c], n)) {
                    lowestHolding[c] = Math.min(lowestHolding[c], 1 / Math.sqrt(p.mu()));
                }
            }
        }
        events.sort(Comparator.comparingDouble(Event::mu));
        boolean[] status = new boolean[conditions];
        double[] first = points.get(0).margins();
        for (int c = 0; c < conditions; c++) {
            status[c] = holds(c, first[c], n);
        }
        List<double[]> muIntervals = new ArrayList<>();
        List<GammaInterval.GammaEnd[]> ends = new ArrayList<>();
        boolean open = all(status);
        double openMu = points.get(0).mu();
        GammaInterval.GammaEnd openEnd =
                branch.lowEnd() == null ? null : new GammaInterval.GammaEnd(branch.lowEnd(), 0);
        for (Event e : events) {
            status[e.condition()] = e.holdsAbove();
            boolean now = all(status);
            GammaInterval.GammaEnd end = end(e.condition(), n);
            if (open && !now) {
                muIntervals.add(new double[] {openMu, e.mu()});
                ends.add(new GammaInterval.GammaEnd[] {openEnd, end});
            } else if (!open && now) {
                openMu = e.mu();
                openEnd = end;
            }
            open = now;
        }
        if (open) {
            muIntervals.add(new double[] {openMu, points.get(points.size() - 1).mu()});
            ends.add(new GammaInterval.GammaEnd[] {openEnd, new GammaInterval.GammaEnd(branch.highEnd(), 0)});
        }
        List<Claim> claims = new ArrayList<>();
        for (int i = 0; i < muIntervals.size(); i++) {
            double muLow = muIntervals.get(i)[0];
            double muHigh = muIntervals.get(i)[1];
            if (!(muHigh > muLow)) {
                continue;
            }
            double lower = 1 / Math.sqrt(muHigh);
            double upper = muLow == 0 ? Double.POSITIVE_INFINITY : 1 / Math.sqrt(muLow);
            GammaInterval.GammaEnd upperEnd = muLow == 0 ? null : ends.get(i)[0];
            if (upperEnd == null && muLow > 0) {
                upperEnd = new GammaInterval.GammaEnd(GammaCondition.SOLUTION_BRANCH_END, 0);
            }
            if (!(upper > lower)) {
                continue;
            }
            GammaInterval interval = new GammaInterval(lower, upper, ends.get(i)[1], upperEnd);
            String failure = check(plant, desired, branch, interval, counter);
            if (failure == null) {
                claims.add(new Claim(interval, branch));
            } else {
                notes.add(String.format(
                        "the gamma interval (%.6g, %s) found along a solution branch failed the"
                                + " independent Riccati check (%s) and is left out",
                        lower, interval.unbounded() ? "infinity" : String.format("%.6g", upper), failure));
            }
        }
        return claims;
    }

    private static boolean all(boolean[] status) {
        for (boolean s : status) {
            if (!s) {
                return false;
            }
        }
        return true;
    }

    private static GammaInterval.GammaEnd end(int condition, int order) {
        if (condition < order) {
            return new GammaInterval.GammaEnd(GammaCondition.WEIGHT_REAL, condition + 1);
        }
        return new GammaInterval.GammaEnd(
                condition == order ? GammaCondition.P_POSITIVE_DEFINITE : GammaCondition.STABILIZING, 0);
    }

    /**
     * The mu in [a.mu, b.mu] where requirement c changes, on the side where it holds (Brent on its margin, the
     * solution at each trial mu by Newton from the blend of a and b). If the solver fails, the neighbouring point
     * where the requirement holds is returned (the interval only shrinks).
     */
    private double refine(
            CompanionPlant plant, double[] desired, Point a, Point b, int c, boolean holdsAtA, Counter counter) {
        double fallback = holdsAtA ? a.mu() : b.mu();
        if (counter.value >= MAX_SOLVES) {
            return fallback;
        }
        BracketingNthOrderBrentSolver brent =
                new BracketingNthOrderBrentSolver(REFINEMENT_RELATIVE_ACCURACY, Double.MIN_NORMAL, 0, 5);
        try {
            return brent.solve(
                    MAX_REFINEMENT_EVALUATIONS,
                    mu -> {
                        counter.value++;
                        PoleMatchedSolution s = riccati.solveFrom(
                                plant,
                                desired,
                                mu,
                                blend(a.solution(), b.solution(), (mu - a.mu()) / (b.mu() - a.mu())));
                        double m = margins(plant, mu, s)[c];
                        if (Double.isNaN(m)) {
                            throw new PoleMatchedRiccati.SystemFailure("margin not computable");
                        }
                        // strict requirements: a zero margin fails, so shift it to the failing sign
                        return c < plant.order() || m != 0 ? m : -Double.MIN_VALUE;
                    },
                    a.mu(),
                    b.mu(),
                    holdsAtA ? AllowedSolution.LEFT_SIDE : AllowedSolution.RIGHT_SIDE);
        } catch (MathRuntimeException | PoleMatchedRiccati.SystemFailure | IllegalArgumentException e) {
            return fallback;
        }
    }

    /**
     * Checks an interval: just inside both ends and in its middle (for an unbounded one: just above the lower
     * end and far above it) the requirements hold and the Hamiltonian solver's stabilizing solution for
     * Q = diag(rho^2) equals the pole-matched P and reproduces K.
     *
     * @return null when every check passes, else what failed
     */
    private String check(
            CompanionPlant plant, double[] desired, Branch branch, GammaInterval interval, Counter counter) {
        double[] gammas;
        if (interval.unbounded()) {
            gammas = new double[UNBOUNDED_CHECK_FACTORS.length];
            for (int i = 0; i < gammas.length; i++) {
                gammas[i] = interval.lowerGamma() * UNBOUNDED_CHECK_FACTORS[i];
            }
        } else {
            double logWidth = Math.log(interval.upperGamma() / interval.lowerGamma());
            gammas = new double[] {
                interval.lowerGamma() * Math.exp(INSIDE_FRACTION * logWidth),
                interval.lowerGamma() * Math.exp(0.5 * logWidth),
                interval.lowerGamma() * Math.exp((1 - INSIDE_FRACTION) * logWidth)
            };
        }
        for (double gamma : gammas) {
            double mu = 1 / (gamma * gamma);
            try {
                counter.value++;
                PoleMatchedSolution s = riccati.solveFrom(plant, desired, mu, interpolated(branch, mu));
                String failure = independentCheck(plant, mu, s);
                if (failure != null) {
                    return failure + String.format(" at gamma %.6g", gamma);
                }
            } catch (RuntimeException e) {
                return e.getMessage() + String.format(" at gamma %.6g", gamma);
            }
        }
        return null;
    }

    /**
     * The requirements hold for this solution at mu, and the Hamiltonian solver's stabilizing solution of the same
     * equation equals P and reproduces K = b (row n of P) within {@link DesignVerifier#AGREEMENT_TOLERANCE}.
     *
     * @return null when it passes, else what failed
     */
    public String independentCheck(CompanionPlant plant, double mu, PoleMatchedSolution solution) {
        if (!allHold(margins(plant, mu, solution))) {
            return "a requirement fails";
        }
        RiccatiSolution numeric;
        try {
            numeric = hamiltonian.solve(
                    plant.stateMatrix(),
                    PoleMatchedRiccati.quadraticTerm(plant, mu),
                    PoleMatchedRiccati.weightMatrix(solution.weightsSquared()));
        } catch (RuntimeException e) {
            return "no stabilizing solution: " + e.getMessage();
        }
        DMatrixRMaj p = solution.p();
        DMatrixRMaj difference = numeric.p();
        CommonOps_DDRM.subtractEquals(difference, p);
        double relative = NormOps_DDRM.normF(difference) / NormOps_DDRM.normF(numeric.p());
        int n = plant.order();
        double dk = 0;
        double k = 0;
        for (int j = 0; j < n; j++) {
            dk = Math.hypot(dk, difference.get(n - 1, j));
            k = Math.hypot(k, p.get(n - 1, j));
        }
        if (!(relative <= DesignVerifier.AGREEMENT_TOLERANCE) || !(dk <= DesignVerifier.AGREEMENT_TOLERANCE * k)) {
            return String.format(
                    "the stabilizing solution differs from P by %.3g (relative), K by %.3g", relative, dk / k);
        }
        return null;
    }

    /** The union of the claimed intervals, disjoint and increasing; a merged end keeps the outer binding. */
    private static double[] infinities(int length) {
        double[] values = new double[length];
        java.util.Arrays.fill(values, Double.POSITIVE_INFINITY);
        return values;
    }

    private static FeasibleGammaSet assemble(
            List<Claim> claims,
            double inputGain,
            double muCap,
            int evaluations,
            List<String> notes,
            double[] lowestHolding) {
        List<GammaInterval> sorted = claims.stream()
                .map(Claim::interval)
                .sorted(Comparator.comparingDouble(GammaInterval::lowerGamma))
                .toList();
        List<GammaInterval> union = new ArrayList<>();
        for (GammaInterval next : sorted) {
            if (!union.isEmpty()
                    && next.lowerGamma() < union.get(union.size() - 1).upperGamma()) {
                GammaInterval last = union.remove(union.size() - 1);
                union.add(
                        next.upperGamma() > last.upperGamma()
                                ? new GammaInterval(
                                        last.lowerGamma(), next.upperGamma(), last.lowerBinding(), next.upperBinding())
                                : last);
            } else {
                union.add(next);
            }
        }
        if (union.size() > MAX_INTERVALS) {
            List<GammaInterval> kept = new ArrayList<>(union.subList(0, MAX_INTERVALS - 1));
            kept.add(union.get(union.size() - 1));
            List<String> more = new ArrayList<>(notes);
            more.add((union.size() - MAX_INTERVALS) + " feasible gamma intervals between "
                    + String.format("%.6g", kept.get(MAX_INTERVALS - 2).upperGamma()) + " and "
                    + String.format("%.6g", kept.get(MAX_INTERVALS - 1).lowerGamma()) + " are left out (cap "
                    + MAX_INTERVALS + ")");
            return new FeasibleGammaSet(kept, claims, inputGain, muCap, evaluations, more, lowestHolding);
        }
        return new FeasibleGammaSet(union, claims, inputGain, muCap, evaluations, notes, lowestHolding);
    }
}
