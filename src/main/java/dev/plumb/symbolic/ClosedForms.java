package dev.plumb.symbolic;

import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Stmt;
import dev.plumb.model.Symbol;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.expression.S;
import org.matheclipse.core.interfaces.IAST;
import org.matheclipse.core.interfaces.IExpr;
import org.matheclipse.core.interfaces.ISymbol;

/**
 * Derives closed forms of the unknown profiles: a relation that integrates directly once the
 * definitions are substituted, a linear first-order relation (isothermal and constant-lapse-rate
 * atmospheres), a relation that is algebraic in one profile, and — for systems that do not
 * separate, such as the Lane–Emden equation — the known solutions, each verified by putting it
 * into every relation and boundary. The boundary that fixes a constant of integration is applied
 * at its own point. Every transformation is recorded in a trail.
 */
final class ClosedForms {

    /** The derived profiles and how each was found. */
    record Found(Map<String, IExpr> profiles, Map<String, List<TrailStep>> trails, Set<Stmt.Boundary> usedBoundaries) { }

    private final Symja symja;
    private final SymbolTable table;
    private final IExpr assumptions;
    private final List<String> notes;
    private final Map<String, IExpr> constants;
    private final PlumbForm form;
    private final Map<String, IExpr> profiles = new LinkedHashMap<>();
    private final Map<String, List<TrailStep>> trails = new LinkedHashMap<>();
    private final Set<Stmt.Relation> usedRelations = new HashSet<>();
    private final Set<Stmt.Relation> unitFailures = new HashSet<>();
    private final Set<Stmt.Boundary> usedBoundaries = new HashSet<>();

    ClosedForms(Symja symja, SymbolTable table, IExpr assumptions, Map<String, IExpr> constants, List<String> notes) {
        this.symja = symja;
        this.table = table;
        this.assumptions = assumptions;
        this.constants = constants;
        this.notes = notes;
        this.form = new PlumbForm(table);
    }

    Found derive() {
        if (table.model().coordinate().isEmpty()) return new Found(profiles, trails, usedBoundaries);
        for (Stmt.Relation r : table.model().relations()) {
            // A closed form from a relation whose sides differ in unit would be printed as if it were a result.
            if (unitsFail(table.model(), r)) {
                usedRelations.add(r);
                unitFailures.add(r);
                notes.add("relation " + name(r) + " has inconsistent units; no closed form is derived from it");
            }
        }
        boolean progress = true;
        while (progress && profiles.size() < table.model().profiles().size()) {
            progress = false;
            for (Stmt.Relation r : table.model().relations()) {
                if (usedRelations.contains(r)) continue;
                try {
                    if (solveSingle(r)) {
                        progress = true;
                    }
                } catch (Symja.Failure f) {
                    notes.add("relation " + name(r) + ": " + f.getMessage() + "; the numeric answer does not depend on it");
                } catch (Translation.Untranslatable u) {
                    notes.add("relation " + name(r) + " cannot be translated: " + u.getMessage());
                }
            }
            if (!progress) progress = tryKnownSolutions();
        }
        for (Symbol.Profile p : table.model().profiles()) {
            // After a unit error the note on that relation says why; "the numeric answer is used" would not hold.
            if (!profiles.containsKey(p.name()) && unitFailures.isEmpty()) {
                notes.add("no closed form was found for " + p.name() + "(" + table.name(table.coordinate) + "); the numeric answer is used");
            }
        }
        return new Found(profiles, trails, usedBoundaries);
    }

    /** Whether the unit check of the relation failed. */
    static boolean unitsFail(dev.plumb.model.Model model, Stmt.Relation r) {
        return model.unitChecks().stream().anyMatch(u -> u.span().equals(r.span()) && u.status() == dev.plumb.model.Status.FAILS);
    }

    private Translation translation() {
        return new Translation(table, symja, profiles, constants);
    }

    private static String name(Stmt.Relation r) {
        return r.label().present() ? "'" + r.label().name() + "'" : "on line " + r.span().line();
    }

    private IExpr difference(Translation t, Stmt.Equation eq) throws Translation.Untranslatable {
        return symja.eval(F.Subtract(t.plain(eq.lhs()), t.plain(eq.rhs())));
    }

    /** A relation in exactly one unknown profile: algebraic, directly integrable or linear of first order. */
    private boolean solveSingle(Stmt.Relation r) throws Translation.Untranslatable {
        Translation t = translation();
        IExpr eq = difference(t, r.equation());
        List<String> unknown = t.unknownProfilesIn(eq);
        if (unknown.size() != 1) return false;
        String p = unknown.get(0);
        ISymbol head = t.head(p);
        ISymbol x = table.coordinate;
        ISymbol y = Symja.symbol("plumby");
        ISymbol yp = Symja.symbol("plumbyp");
        IExpr replaced = symja.eval(F.ReplaceAll(eq, F.list(
                F.Rule(F.unaryAST1(F.unaryAST1(F.Derivative(F.C1), head), x), yp), F.Rule(F.unaryAST1(head, x), y))));
        if (replaced.has(head, true)) return false; // a higher derivative, or the profile at another point
        List<TrailStep> trail = new ArrayList<>();
        String px = p + "(" + table.name(x) + ")";
        try {
            trail.add(new TrailStep("substitute definitions into relation " + name(r),
                    ExprPrinter.print(r.equation().lhs()) + " = " + form.print(symja.eval(t.plain(r.equation().rhs())))));
        } catch (Translation.Untranslatable notPrintable) {
            trail.add(new TrailStep("substitute definitions into relation " + name(r), ExprPrinter.print(r.equation().lhs())
                    + " = " + ExprPrinter.print(r.equation().rhs())));
        }
        IExpr closed;
        if (!replaced.has(yp, true)) {
            IExpr sol = unique(symja.eval(F.Solve(F.Equal(replaced, F.C0), y)), y);
            if (sol == null) return false;
            closed = sol;
            trail.add(new TrailStep("solve for " + px, px + " = " + print(closed)));
        } else {
            String dpx = p + "'(" + table.name(x) + ")";
            Boundary b = boundaryFor(p);
            if (b == null) {
                notes.add("no boundary condition fixes the constant of integration of " + px);
                return false;
            }
            FirstOrder firstOrder = new FirstOrder(symja, table, assumptions, this);
            FirstOrder.Relation rel = new FirstOrder.Relation(replaced, y, yp, F.unaryAST1(head, x), px, dpx);
            FirstOrder.Start start = new FirstOrder.Start(b.label, b.point, b.value);
            Layers layers = new Layers(symja, table, this, firstOrder);
            FirstOrder.Solution solution;
            if (layers.isLayered(replaced)) {
                var c = table.model().coordinate().get();
                solution = layers.solve(rel, start, t, symja.eval(t.plain(c.from())), symja.eval(t.plain(c.to())));
            } else {
                solution = firstOrder.solve(rel, start, t);
            }
            if (solution == null) return false;
            closed = solution.closed();
            trail.addAll(solution.trail());
            usedBoundaries.add(b.statement);
        }
        boolean layered = closed.has(S.Piecewise, true);
        // Each layer of a piecewise form was simplified on its own; Simplify on the whole can undo the layering.
        if (!layered) {
            closed = simplify(closed);
            trail.add(new TrailStep("simplify", px + " = " + print(closed)));
        }
        profiles.put(p, closed);
        trails.put(p, trail);
        usedRelations.add(r);
        return true;
    }

    /** The simplest of a few equivalent forms, by how it reads: short, and with few nested fractions. */
    IExpr simplify(IExpr e) {
        IExpr simplified = symja.eval(F.Simplify(e, assumptions));
        Simplest choice = new Simplest(simplified);
        IExpr together = symja.eval(F.Together(simplified));
        // FactorTerms pulls the common constant out of a polynomial numerator.
        IExpr factoredTerms = F.Times(F.FactorTerms(F.Numerator(together)), F.Power(F.Denominator(together), F.CN1));
        for (IExpr candidate : List.of(together, F.Factor(simplified), F.Simplify(F.PowerExpand(simplified), assumptions),
                F.Together(F.PowerExpand(simplified)), factoredTerms)) {
            choice.consider(candidate, true);
        }
        return choice.best;
    }

    /**
     * The best-reading of several forms of one expression. PowerExpand and the rewrites of
     * {@link Tidy} hold only for positive bases, so a form that reads better must also agree with
     * the reference at random points before it is kept.
     */
    private final class Simplest {
        final IExpr reference;
        IExpr best;
        int bestScore;

        Simplest(IExpr reference) {
            this.reference = reference;
            this.best = reference;
            this.bestScore = score(reference);
        }

        /** Considers a candidate, evaluated by Symja first when {@code evaluate} is set. */
        void consider(IExpr candidate, boolean evaluate) {
            try {
                IExpr c = evaluate ? symja.eval(candidate) : candidate;
                int sc = score(c);
                if (sc < bestScore && equalAtSamples(c, reference)) {
                    best = c;
                    bestScore = sc;
                }
            } catch (Symja.Failure ignored) {
                // The form found so far stands.
            }
        }
    }

    /**
     * The form to print, which is not used for further algebra: the simplest form with the
     * rewrites of {@link Tidy} tried on top, each layer of a piecewise form on its own. A rewrite
     * is kept as built when Symja's evaluation would undo it (it pulls numbers out of a root).
     */
    IExpr neat(IExpr e) {
        if (e.isAST(S.Piecewise) && e.first().isList()) {
            IAST cases = (IAST) e.first();
            List<IExpr> out = new ArrayList<>();
            for (IExpr c : cases) out.add(c.isList() && ((IAST) c).argSize() == 2 ? F.list(neat(((IAST) c).arg1()), ((IAST) c).arg2()) : c);
            return ((IAST) e).argSize() > 1 ? F.Piecewise(F.ListAlloc(out), neat(((IAST) e).arg2())) : F.Piecewise(F.ListAlloc(out));
        }
        IExpr best;
        try {
            best = simplify(e);
        } catch (Symja.Failure f) {
            return e;
        }
        Simplest choice = new Simplest(best);
        Tidy tidy = new Tidy(symja, table.coordinate);
        List<IExpr> candidates = new ArrayList<>(tidy.candidates(best));
        try {
            candidates.addAll(tidy.candidates(symja.eval(F.PowerExpand(best))));
        } catch (Symja.Failure ignored) {
            // Fewer candidates.
        }
        for (IExpr raw : candidates) {
            choice.consider(raw, true);
            choice.consider(raw, false);
        }
        return choice.best;
    }

    private static final java.math.BigDecimal SAME = new java.math.BigDecimal("1e-30");

    /** Whether the two agree at random points where the original is real (at least two of them). */
    private boolean equalAtSamples(IExpr candidate, IExpr original) {
        Sampler sampler = new Sampler(symja, table, 17);
        Translation t = translation();
        int real = 0;
        for (int i = 0; i < 40 && real < 4; i++) {
            Map<ISymbol, IExpr> p = sampler.point(t);
            java.math.BigDecimal o = sampler.value(original, p);
            if (o == null) continue;
            java.math.BigDecimal c = sampler.value(candidate, p);
            if (c == null || !Comparison.same(o, c, SAME)) return false;
            real++;
        }
        return real >= 2;
    }

    private int score(IExpr e) {
        try {
            String s = form.print(e);
            int divisions = s.length() - s.replace("/", "").length();
            return s.length() + 12 * Math.max(0, divisions - 1);
        } catch (Translation.Untranslatable u) {
            return Integer.MAX_VALUE / 2 + (int) Math.min(1_000_000, e.leafCount());
        }
    }

    private static IExpr unique(IExpr solutions, ISymbol v) {
        if (!solutions.isList() || ((IAST) solutions).argSize() != 1) return null;
        IExpr rules = ((IAST) solutions).arg1();
        if (!rules.isList() || ((IAST) rules).argSize() != 1) return null;
        IExpr rule = ((IAST) rules).arg1();
        if (!rule.isRuleAST() || !rule.first().equals(v)) return null;
        return rule.second();
    }

    /** A boundary that gives the profile's value at a point that is known. */
    private record Boundary(String label, Stmt.Boundary statement, IExpr point, IExpr value) { }

    /**
     * Prefers a point that is known; failing that, a point that is an unknown constant still to be
     * fixed by another boundary (the surface {@code P(R) = 0} of a planet whose R follows from
     * {@code m(R) = M}): the closed form then holds that constant until it is known.
     */
    private Boundary boundaryFor(String p) {
        for (boolean atUnknownPoint : new boolean[] {false, true}) {
            for (Stmt.Boundary b : table.model().boundaries()) {
                if (usedBoundaries.contains(b)) continue;
                if (!(b.equation().lhs() instanceof dev.plumb.lang.Expr.Call c) || !c.callee().equals(p) || c.order() != 0) continue;
                try {
                    Translation t = translation();
                    IExpr point = symja.eval(t.plain(c.args().get(0)));
                    IExpr value = symja.eval(t.plain(b.equation().rhs()));
                    if (t.unknownConstantsIn(point).isEmpty() == atUnknownPoint || !t.unknownConstantsIn(value).isEmpty()) continue;
                    if (t.mentionsUnknownProfile(value) || point.has(table.coordinate, true)) continue;
                    String label = b.label().present() ? b.label().name() : "on line " + b.span().line();
                    return new Boundary(label, b, point, value);
                } catch (Translation.Untranslatable | Symja.Failure e) {
                    continue;
                }
            }
        }
        return null;
    }

    /**
     * Systems that do not separate: tries the known closed solutions (Lane–Emden n = 0, 1, 5 in a
     * dimensionless coordinate) for one profile, derives the others from relations algebraic in
     * them, and keeps the guess only if every relation and every boundary at a known point holds.
     */
    private boolean tryKnownSolutions() {
        ISymbol x = table.coordinate;
        if (!table.model().coordinate().get().dimension().isNone() || !unitFailures.isEmpty()) return false;
        List<IExpr[]> library = List.of(
                new IExpr[] {F.Subtract(F.C1, F.Times(F.QQ(1, 6), F.Sqr(x))), F.$str("Lane–Emden n = 0")},
                new IExpr[] {F.Divide(F.Sin(x), x), F.$str("Lane–Emden n = 1")},
                new IExpr[] {F.Power(F.Plus(F.C1, F.Times(F.QQ(1, 3), F.Sqr(x))), F.CN1D2), F.$str("Lane–Emden n = 5")});
        for (Symbol.Profile p : table.model().profiles()) {
            if (profiles.containsKey(p.name()) || !p.dimension().isNone()) continue;
            for (IExpr[] candidate : library) {
                Map<String, IExpr> savedProfiles = new LinkedHashMap<>(profiles);
                Map<String, List<TrailStep>> savedTrails = new LinkedHashMap<>(trails);
                Set<Stmt.Relation> savedRelations = new HashSet<>(usedRelations);
                Set<Stmt.Boundary> savedBoundaries = new HashSet<>(usedBoundaries);
                IExpr guess = symja.eval(candidate[0]);
                String px = p.name() + "(" + table.name(x) + ")";
                profiles.put(p.name(), guess);
                List<TrailStep> trail = new ArrayList<>();
                trail.add(new TrailStep("recognise " + candidate[1].toString().replace("\"", ""), px + " = " + print(guess)));
                trails.put(p.name(), trail);
                try {
                    boolean more = true;
                    while (more) {
                        more = false;
                        for (Stmt.Relation r : table.model().relations()) {
                            if (!usedRelations.contains(r) && solveSingle(r)) more = true;
                        }
                    }
                    if (verifies(trail)) return true;
                } catch (Translation.Untranslatable | Symja.Failure e) {
                    // Not this one.
                }
                profiles.clear();
                profiles.putAll(savedProfiles);
                trails.clear();
                trails.putAll(savedTrails);
                usedRelations.clear();
                usedRelations.addAll(savedRelations);
                usedBoundaries.clear();
                usedBoundaries.addAll(savedBoundaries);
            }
        }
        return false;
    }

    private boolean verifies(List<TrailStep> trail) throws Translation.Untranslatable {
        Translation t = translation();
        for (Stmt.Relation r : table.model().relations()) {
            IExpr eq = difference(t, r.equation());
            if (t.mentionsUnknownProfile(eq)) return false;
            if (!simplify(eq).isZero()) return false;
            usedRelations.add(r);
        }
        trail.add(new TrailStep("verify", "every relation holds identically"));
        for (Stmt.Boundary b : table.model().boundaries()) {
            IExpr eq = difference(t, b.equation());
            if (t.mentionsUnknownProfile(eq) || !t.unknownConstantsIn(eq).isEmpty()) continue;
            if (!simplify(eq).isZero()) return false;
            usedBoundaries.add(b);
            trail.add(new TrailStep("verify boundary " + (b.label().present() ? b.label().name() : "on line " + b.span().line()),
                    ExprPrinter.print(b.equation().lhs()) + " = " + ExprPrinter.print(b.equation().rhs())));
        }
        return true;
    }

    String print(IExpr e) {
        try {
            return form.print(e);
        } catch (Translation.Untranslatable u) {
            return "(not printable in plumb syntax)";
        }
    }
}
