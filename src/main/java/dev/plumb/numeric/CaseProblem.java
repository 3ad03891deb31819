package dev.plumb.numeric;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Span;
import dev.plumb.lang.Stmt;
import dev.plumb.model.ConstantEvaluator;
import dev.plumb.model.Symbol;
import dev.plumb.units.Dimension;
import dev.plumb.units.Rational;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;

/**
 * One case made concrete: the relations compiled with the case's SI values, the boundaries sorted
 * into start values, a surface and conditions, the unknowns a shooting must find with their
 * starting guesses, and the integration that turns a vector of unknowns into a {@link Trajectory}.
 */
final class CaseProblem {

    /** A value the shooting adjusts: a start value of the state or an unknown constant. */
    record Unknown(String name, int component, int constant, double guess, boolean log, String guessSource, Span span) { }

    /** How a condition's mismatch is measured: as a log ratio, or as a difference over a scale; target NaN when not fixed. */
    record Condition(Stmt.Boundary boundary, boolean log, double scale, double target) { }

    /**
     * How far past a fixed end b a trial may run looking for the surface, in units of the interval: far
     * enough for Newton's log-radius mismatch to see where it lies, but bounded, so that a trial whose
     * profile never reaches zero fails in one interval's worth of steps rather than ten thousand.
     */
    static final double FIXED_SURFACE_REACH = 4.0;

    final Formulation form;
    final Map<String, Double> values;
    final NumericOptions options;
    final double a, b, scaleX, limit;
    final double[] frame;
    final RelationSystem system;
    final Integration integration;
    final Evaluator[] startValue;
    final Integration.Surface surface;
    final boolean fixedSurface;
    final Stmt.Boundary surfaceBoundary;
    final List<Condition> conditions = new ArrayList<>();
    final List<Unknown> unknowns = new ArrayList<>();
    final double[] scale;
    final boolean surfaceEvents;
    final Map<String, Expr> closedForms;
    private final double[] start;
    private final ConstantEvaluator constants;
    private final ScalingGuess guesses;

    CaseProblem(Formulation form, Map<String, Double> values, NumericOptions options, Map<String, Expr> closedForms)
            throws SolveException {
        this(form, values, options, closedForms, true, null);
    }

    /**
     * @param surfaceEvents whether a condition P(b) = 0 at the fixed end b may be read as "the surface
     *                      lies at b" (found as an event) when the relations depend on P; false keeps it a
     *                      plain condition at b
     * @param start         the shooting unknowns to start from (a previous solve's), or null for the guesses
     */
    CaseProblem(Formulation form, Map<String, Double> values, NumericOptions options, Map<String, Expr> closedForms,
                boolean surfaceEvents, double[] start) throws SolveException {
        this.form = form;
        this.surfaceEvents = surfaceEvents;
        this.closedForms = closedForms;
        this.start = start == null ? null : start.clone();
        this.values = values;
        this.options = options;
        this.constants = new ConstantEvaluator(n -> form.model.symbols().get(n), values);
        Symbol.Coordinate coord = form.coordinate;
        a = constant(coord.from(), "the start of the interval");
        b = form.freeEnd != null ? Double.NaN : constant(coord.to(), "the end of the interval");
        if (b == a) throw new SolveException(coord.span(), "the interval of '" + coord.name() + "' is empty");
        int[] locks = {0};
        ExprCompiler compiler = new ExprCompiler(form.model, values, new ExprCompiler.Slots() {
            @Override public int profile(Symbol.Profile p, int order, Expr.Call call) throws SolveException {
                int j = form.profileIndex(p.name());
                if (order > form.order[j]) throw new SolveException(call.span(), "derivative beyond the order of the relations");
                return order == form.order[j] ? form.derivativeSlot(j) : 1 + form.base[j] + order;
            }

            @Override public int constant(Symbol.UnknownConstant u, Expr.Name at) throws SolveException {
                if (u.equals(form.freeEnd)) {
                    throw new SolveException(at.span(), "the relations use '" + u.name() + "', the free end of the interval: "
                            + "the numeric engine needs relations that do not depend on where the surface is");
                }
                return form.constantSlot(form.constants.indexOf(u));
            }

            @Override public int newLock() {
                return form.firstLockSlot() + 1 + locks[0]++;
            }

            @Override public int newShared() {
                int base = form.firstLockSlot() + 1 + locks[0];
                locks[0] += 2;
                return base;
            }

            @Override public int epoch() {
                return form.firstLockSlot();
            }

            @Override public boolean shareable(java.util.BitSet reads) {
                return reads.nextSetBit(form.derivativeSlot(0)) < 0 || reads.nextSetBit(form.derivativeSlot(0)) >= form.constantSlot(0);
            }
        });
        RelationSystem.Parts parts = RelationCache.find(form, values);
        if (parts == null) {
            parts = RelationSystem.compile(form, compiler, () -> locks[0]);
            RelationCache.keep(form, values, compiler.parametersRead(), parts);
        } else {
            // The start values below take their lock and shared slots after the relations', as when compiled here.
            locks[0] = parts.locks();
        }
        int relationConditions = compiler.conditions().size();
        startValue = new Evaluator[form.stateSize];
        Map<String, Double> givenConstants = new java.util.LinkedHashMap<>();
        Map<Integer, Double> givenStarts = new java.util.LinkedHashMap<>();
        Map<Object, Stmt.Guess> givenBy = new java.util.HashMap<>();
        for (Stmt.Guess g : form.model.guesses()) {
            double v = constant(g.value(), "a guess");
            if (g.target() instanceof Expr.Name n) {
                givenConstants.put(n.id(), v);
                givenBy.put(n.id(), g);
            } else if (g.target() instanceof Expr.Call c) {
                int comp = component(c);
                if (comp < 0 || point(c.args().get(0)) != a) {
                    throw new SolveException(g.target().span(), "a guess for a profile gives a start value, at "
                            + coord.name() + " = " + ExprPrinter.print(coord.from()) + ", of a value or a derivative below the relations' "
                            + "highest: " + ExprPrinter.print(c) + " is not one");
                }
                givenStarts.put(comp, v);
                givenBy.put(comp, g);
            }
        }
        guesses = new ScalingGuess(form.model, values, givenConstants);
        double xScale = Double.isNaN(b) ? givenConstants.getOrDefault(form.freeEnd.name(), guesses.guess(coord.dimension()))
                : Math.abs(b - a);
        scaleX = Double.isFinite(xScale) && xScale > 0 ? xScale : 1.0;

        Integration.Surface surf = null;
        Stmt.Boundary surfB = null;
        boolean fixedSurf = false;
        List<Stmt.Boundary> rest = new ArrayList<>();
        for (Stmt.Boundary bd : form.model.boundaries()) {
            Expr lhs = bd.equation().lhs(), rhs = bd.equation().rhs();
            int comp = component(lhs);
            Expr other = rhs;
            if (comp < 0) {
                comp = component(rhs);
                other = lhs;
            }
            boolean otherKnown = comp >= 0 && !Formulation.mentionsUnknown(form.model, other);
            Expr arg = comp >= 0 ? ((Expr.Call) (other == rhs ? lhs : rhs)).args().get(0) : null;
            if (comp >= 0 && !Formulation.mentionsUnknown(form.model, arg) && !isFreeEnd(arg) && point(arg) == a
                    && startValue[comp] == null && !mentionsProfile(other)) {
                startValue[comp] = compiler.compile(other);
            } else if (surf == null && otherKnown && arg != null && isFreeEnd(arg)) {
                surf = new Integration.Surface(comp, constant(other, "the surface value"), ExprPrinter.print(lhs));
                surfB = bd;
            } else if (surfaceEvents && surf == null && otherKnown && arg != null && form.freeEnd == null
                    && comp == form.base[componentProfile(comp)] && RelationSystem.dependsOnComponent(form, parts.reads(), comp)
                    && !Formulation.mentionsUnknown(form.model, arg) && point(arg) == b && constant(other, "the boundary value") == 0.0) {
                // Only when the relations depend on the component can they be undefined past its zero (a
                // polytrope's P^(n/(n+1))), so that a plain condition at b could not be integrated to; otherwise
                // P(b) is the start value plus a fixed integral, and the plain condition is well posed even
                // where P only touches zero at b (a density falling linearly to zero gives P ~ (b - r)^2).
                surf = new Integration.Surface(comp, 0.0, ExprPrinter.print(lhs));
                surfB = bd;
                fixedSurf = true;
            } else {
                rest.add(bd);
            }
        }
        // The frame is sized after the start values are compiled: they may take shared slots of their own.
        // Slot firstLockSlot counts evaluations; locks start free (NaN) and shared values unstamped (NaN).
        double[] newFrame = new double[form.firstLockSlot() + 1 + locks[0]];
        Arrays.fill(newFrame, form.firstLockSlot(), newFrame.length, Double.NaN);
        newFrame[form.firstLockSlot()] = 0.0;
        system = new RelationSystem(form, newFrame, parts);
        frame = system.frame;
        if (form.freeEnd != null && surf == null) {
            throw new SolveException(form.freeEnd.span(), "the end of the interval '" + form.freeEnd.name()
                    + "' is unknown, but no boundary says where it is: add one such as boundary "
                    + form.profiles.get(0).name() + "(" + form.freeEnd.name() + ") = 0");
        }
        surface = surf;
        surfaceBoundary = surfB;
        fixedSurface = fixedSurf;
        limit = Double.isNaN(b) ? a + 1e4 * scaleX : fixedSurf ? a + FIXED_SURFACE_REACH * (b - a) : b;

        scale = new double[form.stateSize];
        String from = ExprPrinter.print(coord.from());
        for (int i = 0; i < form.stateSize; i++) {
            if (startValue[i] != null) continue;
            String name = form.componentName(i) + "(" + from + ")";
            double guess = Double.NaN;
            String source = null;
            Expr closed = closedForms.get(name);
            if (givenStarts.containsKey(i)) {
                guess = givenStarts.get(i);
                source = "the guess on line " + givenBy.get(i).span().line();
            } else if (closed != null) {
                guess = tryConstant(closed);
                source = "closed form";
            }
            if (!(Math.abs(guess) > 0) || !Double.isFinite(guess)) {
                guess = guesses.guess(componentDimension(i));
                source = "from the balance's scales";
            }
            if (!(guess > 0) || !Double.isFinite(guess)) {
                // No estimate from the inputs: start from one SI unit and let the rescue scan widen the search.
                guess = 1.0;
                source = "one SI unit: the balance gives no scale for it";
            }
            unknowns.add(new Unknown(name, i, -1, guess, guess > 0, source, coord.span()));
        }
        for (int k = 0; k < form.constants.size(); k++) {
            Symbol.UnknownConstant u = form.constants.get(k);
            double guess = Double.NaN;
            String source = null;
            Expr closed = closedForms.get(u.name());
            if (givenConstants.containsKey(u.name())) {
                guess = givenConstants.get(u.name());
                source = "the guess on line " + givenBy.get(u.name()).span().line();
            } else if (closed != null) {
                guess = tryConstant(closed);
                source = "closed form";
            }
            if (!(Math.abs(guess) > 0) || !Double.isFinite(guess)) {
                guess = guesses.guess(u.dimension());
                source = "from the balance's scales";
            }
            if (!(guess > 0)) {
                guess = 1.0;
                source = "one SI unit: the balance gives no scale for it";
            }
            unknowns.add(new Unknown(u.name(), -1, k, guess, guess > 0, source, u.span()));
        }
        int count = rest.size() + (fixedSurf ? 1 : 0);
        if (count != unknowns.size()) {
            List<String> un = unknowns.stream().map(Unknown::name).toList();
            List<String> cond = new ArrayList<>(rest.stream().map(CaseProblem::describe).toList());
            if (fixedSurf) cond.add(0, describe(surfB) + " (the surface)");
            Span where = count > unknowns.size() ? rest.get(rest.size() - 1).span() : coord.span();
            throw new SolveException(where, "the boundary problem is " + (count > unknowns.size() ? "over" : "under")
                    + "-determined: " + un.size() + " unknown(s) " + (un.isEmpty() ? "" : "(" + String.join(", ", un) + ") ")
                    + "but " + count + " condition(s)" + (cond.isEmpty() ? "" : " (" + String.join(", ", cond) + ")")
                    + (count < unknowns.size() ? "; add a boundary for each unknown" : "; remove a boundary or add an unknown"));
        }
        for (int i = 0; i < form.stateSize; i++) {
            scale[i] = startScale(i, rest);
        }
        for (Stmt.Boundary bd : rest) conditions.add(condition(bd));
        double[] absTol = new double[form.stateSize], relTol = new double[form.stateSize];
        for (int i = 0; i < form.stateSize; i++) {
            absTol[i] = options.absTolScale() * scale[i];
            relTol[i] = options.relTol();
        }
        // Near a free surface the surface component falls far below any absolute tolerance (P ~ s^(n+1)),
        // and only relative control keeps its zero, and so the radius, accurate.
        if (surf != null) absTol[surf.index()] = 1e-40 * options.absTolScale() * scale[surf.index()];
        List<ExprCompiler.CoordinateCondition> conds = new ArrayList<>(parts.conditions());
        conds.addAll(compiler.conditions().subList(relationConditions, compiler.conditions().size()));
        integration = new Integration(system, absTol, relTol, 1e-13 * scaleX,
                PiecewiseBreaks.find(conds, frame, form.firstLockSlot(), a, limit), conds, scale);
    }

    /** The series start's length found by the last integration, reused as the next one's first try; NaN before. */
    double seriesLength = Double.NaN;

    /** The first length the series start tries: the last one found, else a hundredth of the length scale. */
    double seriesFirstLength() {
        if (!Double.isNaN(seriesLength)) return seriesLength;
        double h = 1e-2 * scaleX;
        if (!Double.isNaN(b) && !fixedSurface) h = Math.min(h, 1e-2 * Math.abs(b - a));
        return (forward() ? 1 : -1) * h;
    }

    /**
     * The longest series start allowed: the last length found (no search again once one is known),
     * else a twentieth of a fixed interval, and never past half the way to a break of a piecewise relation.
     */
    double seriesLongestLength() {
        if (!Double.isNaN(seriesLength)) return seriesLength;
        double longest = Double.isNaN(b) ? Double.POSITIVE_INFINITY : 0.05 * Math.abs(b - a);
        for (double x : integration.breaks) if ((x - a) * (forward() ? 1 : -1) > 0) longest = Math.min(longest, 0.5 * Math.abs(x - a));
        return (forward() ? 1 : -1) * longest;
    }

    boolean forward() {
        return (Double.isNaN(b) ? limit : b) > a;
    }

    static String describe(Stmt.Boundary bd) {
        return bd.label().present() ? "'" + bd.label().name() + "'" : ExprPrinter.print(bd.equation().lhs()) + " = "
                + ExprPrinter.print(bd.equation().rhs());
    }

    private double startScale(int i, List<Stmt.Boundary> rest) {
        if (startValue[i] != null) {
            Arrays.fill(frame, form.constantSlot(0), form.firstLockSlot(), 1.0);
            Evaluator.newEvaluation(frame, form.firstLockSlot());
            double v = Math.abs(startValue[i].at(frame));
            if (v > 0 && Double.isFinite(v)) return v;
        }
        for (Unknown u : unknowns) if (u.component() == i && u.guess() > 0) return u.guess();
        for (Stmt.Boundary bd : rest) {
            if (component(bd.equation().lhs()) == i && !Formulation.mentionsUnknown(form.model, bd.equation().rhs())) {
                double v = Math.abs(tryConstant(bd.equation().rhs()));
                if (v > 0 && Double.isFinite(v)) return v;
            }
        }
        double g = guesses.guess(componentDimension(i));
        return g > 0 && Double.isFinite(g) ? g : 1.0;
    }

    private Condition condition(Stmt.Boundary bd) {
        Expr rhs = bd.equation().rhs();
        double target = Formulation.mentionsUnknown(form.model, rhs) ? Double.NaN : tryConstant(rhs);
        int comp = component(bd.equation().lhs());
        if (target > 0 && Double.isFinite(target)) return new Condition(bd, true, target, target);
        double s = Math.abs(target) > 0 && Double.isFinite(target) ? Math.abs(target) : comp >= 0 ? scale[comp] : 1.0;
        return new Condition(bd, false, s, target);
    }

    Dimension componentDimension(int i) {
        int j = componentProfile(i);
        return form.profiles.get(j).dimension().div(form.coordinate.dimension().pow(Rational.of(i - form.base[j])));
    }

    int componentProfile(int i) {
        for (int j = form.profiles.size() - 1; j >= 0; j--) if (i >= form.base[j]) return j;
        return 0;
    }

    /** The state component a plain call {@code P(x)} or {@code P'(x)} reads, or -1. */
    private int component(Expr e) {
        if (!(e instanceof Expr.Call c) || c.args().size() != 1) return -1;
        int j = form.profileIndex(c.callee());
        if (j < 0 || c.order() >= form.order[j]) return -1;
        return form.base[j] + c.order();
    }

    private boolean mentionsProfile(Expr e) {
        var orders = new java.util.LinkedHashMap<String, Integer>();
        Formulation.collectOrders(form.model, e, orders, new java.util.HashSet<>());
        return !orders.isEmpty();
    }

    private boolean isFreeEnd(Expr arg) {
        return form.freeEnd != null && arg instanceof Expr.Name n && n.id().equals(form.freeEnd.name());
    }

    /** Whether a boundary is measured as a mismatch (a condition, or the surface of a fixed interval). */
    boolean conditionsInclude(Stmt.Boundary bd) {
        if (bd == surfaceBoundary) return fixedSurface || surface.value() == 0.0;
        for (Condition c : conditions) if (c.boundary() == bd) return true;
        return false;
    }

    /** A fixed point of the interval, or NaN when the expression is not a fixed number. */
    double pointOrNaN(Expr arg) {
        return tryConstant(arg);
    }

    private double point(Expr arg) throws SolveException {
        return constant(arg, "the point " + ExprPrinter.print(arg));
    }

    private double constant(Expr e, String what) throws SolveException {
        try {
            return constants.evaluate(e);
        } catch (ConstantEvaluator.NotConstant ex) {
            throw new SolveException(ex.where.span(), what + " must be a fixed number in each case: " + ex.getMessage());
        }
    }

    private double tryConstant(Expr e) {
        try {
            return constants.evaluate(e);
        } catch (ConstantEvaluator.NotConstant ex) {
            return Double.NaN;
        }
    }

    /** Writes the unknown constants into the frame. */
    void load(double[] constantValues) {
        System.arraycopy(constantValues, 0, frame, form.constantSlot(0), constantValues.length);
    }

    /** The constants and start state for a vector of shooting unknowns (log or linear coordinates). */
    double[][] decode(double[] z) {
        double[] consts = new double[form.constants.size()];
        double[] y0 = new double[form.stateSize];
        for (int k = 0; k < unknowns.size(); k++) {
            Unknown u = unknowns.get(k);
            double v = u.log() ? Math.exp(z[k]) : z[k] * (u.component() >= 0 ? scale[u.component()] : 1.0);
            if (u.component() >= 0) y0[u.component()] = v;
            else consts[u.constant()] = v;
        }
        load(consts);
        Evaluator.newEvaluation(frame, form.firstLockSlot());
        for (int i = 0; i < form.stateSize; i++) if (startValue[i] != null) y0[i] = startValue[i].at(frame);
        return new double[][]{consts, y0};
    }

    double[] initialVector() {
        if (start != null && start.length == unknowns.size()) return start.clone();
        double[] z = new double[unknowns.size()];
        for (int k = 0; k < z.length; k++) {
            Unknown u = unknowns.get(k);
            z[k] = u.log() ? Math.log(u.guess()) : u.guess() / (u.component() >= 0 ? scale[u.component()] : 1.0);
        }
        return z;
    }

    /** Integrates from the start to the end of the interval (or to the surface) for the unknowns {@code z}. */
    Trajectory integrate(double[] z) throws SolveException {
        return Trajectory.integrate(this, z);
    }

    String describeUnknowns(double[] z) {
        if (unknowns.isEmpty()) return "no unknowns";
        double[][] d = decode(z);
        List<String> parts = new ArrayList<>();
        for (Unknown u : unknowns) {
            double v = u.component() >= 0 ? d[1][u.component()] : d[0][u.constant()];
            parts.add(u.name() + " = " + inUserUnits(u, v));
        }
        return String.join(", ", parts);
    }

    /** The first guesses and where each came from, in the file's units. */
    String describeGuesses() {
        List<String> parts = new ArrayList<>();
        boolean oneSource = unknowns.stream().map(Unknown::guessSource).distinct().count() == 1;
        for (Unknown u : unknowns) parts.add(u.name() + " = " + inUserUnits(u, u.guess()) + (oneSource ? "" : " (" + u.guessSource() + ")"));
        return String.join(", ", parts) + (oneSource && !unknowns.isEmpty() ? ", " + unknowns.get(0).guessSource() : "");
    }

    /** A value of an unknown in the file's unit for it (its declared unit, else the file's for its dimension), SI beside. */
    String inUserUnits(Unknown u, double v) {
        if (u.component() >= 0) return form.componentValue(u.component(), v, "%.6g");
        return form.units.symbolValue(v, form.constants.get(u.constant()).name(), "%.6g");
    }
}
