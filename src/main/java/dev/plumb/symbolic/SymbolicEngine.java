package dev.plumb.symbolic;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Stmt;
import dev.plumb.model.Check;
import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import dev.plumb.units.Dimension;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.interfaces.IExpr;

/**
 * The symbolic stage: from a checked model to closed forms, claim verdicts and step verdicts.
 * Each computer-algebra call has a time limit; what runs out of time is reported as undecided
 * with the reason, and the rest of the run goes on.
 */
public final class SymbolicEngine {

    private SymbolicEngine() {
    }

    public static SymbolicResult analyze(Model model, SymbolicOptions options) {
        Symja symja = new Symja(options.timeoutSeconds());
        try {
            return analyze(model, symja);
        } finally {
            symja.close();
        }
    }

    private static SymbolicResult analyze(Model model, Symja symja) {
        SymbolTable table = new SymbolTable(model);
        Translation plain = new Translation(table, symja, Map.of(), Map.of());
        IExpr assumptions = table.assumptions(plain);
        List<String> notes = new ArrayList<>();

        ClosedForms closedForms = new ClosedForms(symja, table, assumptions, Map.of(), notes);
        ClosedForms.Found found = closedForms.derive();
        Map<String, List<TrailStep>> trails = new LinkedHashMap<>(found.trails());
        Map<String, IExpr> constants = new BoundaryConstants(symja, table, closedForms)
                .solve(found.profiles(), found.usedBoundaries(), trails, notes);
        Map<String, IExpr> settled = settle(symja, table, closedForms, found.profiles(), constants, trails);

        PlumbForm form = new PlumbForm(table);
        List<Derived> derived = new ArrayList<>();
        Map<String, Expr> profiles = new LinkedHashMap<>();
        Map<String, Expr> constantForms = new LinkedHashMap<>();
        String x = model.coordinate().map(Symbol::name).orElse("x");
        Map<String, IExpr> neatConstants = new LinkedHashMap<>();
        constants.forEach((name, closed) -> neatConstants.put(name, closedForms.neat(closed)));
        settled.forEach((name, closed) -> {
            // Printed as derived, 2/3*pi*G*rho^2*(R^2 - r^2), with the neat form of R put in as it stands.
            IExpr raw = found.profiles().get(name);
            IExpr shown = raw == closed ? closedForms.neat(closed) : closedForms.neat(raw).replaceAll(v -> {
                IExpr k = neatConstant(table, neatConstants, v);
                if (k != null) return k;
                // R^2 with R = (3*M/(4*pi*rho))^(1/3) reads (3*M/(4*pi*rho))^(2/3); R is positive, so this is exact.
                if (!v.isPower() || !v.exponent().isRational()) return F.NIL;
                IExpr b = neatConstant(table, neatConstants, v.base());
                if (b == null) return F.NIL;
                return b.isPower() && b.exponent().isRational()
                        ? F.Power(b.base(), symja.eval(F.Times(b.exponent(), v.exponent()))) : F.Power(b, v.exponent());
            }).orElse(closedForms.neat(closed));
            Expr e = plumb(form, shown, notes, name);
            if (e == null) return;
            profiles.put(name, e);
            derived.add(new Derived(name + "(" + x + ")", e, ExprPrinter.print(e), model.symbols().get(name).dimension(), trails.get(name)));
        });
        neatConstants.forEach((name, closed) -> {
            Expr e = plumb(form, closed, notes, name);
            if (e == null) return;
            constantForms.put(name, e);
            derived.add(new Derived(name, e, ExprPrinter.print(e), model.symbols().get(name).dimension(), trails.get(name)));
        });
        derived.addAll(pointValues(model, symja, table, closedForms, settled, profiles, constants, form, notes));

        Verification verification = new Verification(symja, table, assumptions, settled, constants);
        List<Check> checks = new ArrayList<>();
        // In file order, but as the model has them: with the unknown side on the left.
        Iterator<Stmt.Step> steps = model.steps().iterator();
        Iterator<Stmt.Claim> claims = model.claims().iterator();
        for (Stmt s : model.program().statements()) {
            if (s instanceof Stmt.Step) checks.add(verification.step(steps.next(), model.unitChecks()));
            if (s instanceof Stmt.Claim) checks.add(verification.claim(claims.next()));
        }
        return new SymbolicResult(checks, derived, profiles, constantForms, notes);
    }

    /**
     * The profiles with the unknown constants they still hold (a surface radius fixed by a later
     * boundary) replaced by their closed forms, so that a closed form is in the parameters alone.
     */
    private static Map<String, IExpr> settle(Symja symja, SymbolTable table, ClosedForms closedForms, Map<String, IExpr> profiles,
                                             Map<String, IExpr> constants, Map<String, List<TrailStep>> trails) {
        Map<String, IExpr> out = new LinkedHashMap<>();
        profiles.forEach((name, closed) -> {
            List<String> held = new Translation(table, symja, profiles, Map.of()).unknownConstantsIn(closed).stream()
                    .filter(constants::containsKey).toList();
            if (held.isEmpty()) {
                out.put(name, closed);
                return;
            }
            List<IExpr> rules = new ArrayList<>();
            held.forEach(k -> rules.add(F.Rule(table.symbol(k), constants.get(k))));
            IExpr value = symja.eval(F.ReplaceAll(closed, F.ListAlloc(rules)));
            out.put(name, value);
            List<TrailStep> trail = new ArrayList<>(trails.getOrDefault(name, List.of()));
            trail.add(new TrailStep("substitute " + String.join(", ", held.stream().map(k -> k + " = " + closedForms.print(constants.get(k))).toList()),
                    name + "(" + table.name(table.coordinate) + ") = " + closedForms.print(value)));
            trails.put(name, trail);
        });
        return out;
    }

    private static IExpr neatConstant(SymbolTable table, Map<String, IExpr> neatConstants, IExpr v) {
        String k = v.isSymbol() ? table.name((org.matheclipse.core.interfaces.ISymbol) v) : null;
        return k == null ? null : neatConstants.get(k);
    }

    private static Expr plumb(PlumbForm form, IExpr closed, List<String> notes, String what) {
        try {
            return form.readable(closed);
        } catch (Translation.Untranslatable u) {
            notes.add("the closed form of " + what + " has no plumb form (" + u.getMessage() + ")");
            return null;
        }
    }

    /** Every point value ({@code P(0)}, {@code m(R)}) that a claim, expectation, show or scaling asks for. */
    /**
     * A profile's value at a point the file wrote as a quantity in a unit other than SI ({@code P(11 [km])}),
     * printed with that quantity in place ({@code P0*(1 - L*(11 [km])/T0)^...}) rather than its SI number
     * (11000): the profile's closed form as already printed, with the coordinate replaced by the quantity. Empty for
     * any other call, and for a piecewise profile (whose printed value is the branch the point picks).
     */
    private static java.util.Optional<Expr> inFileUnits(Expr.Call c, Map<String, IExpr> profiles, Map<String, Expr> printed,
                                                        SymbolTable table) {
        IExpr known = profiles.get(c.callee());
        Expr shown = printed.get(c.callee());
        if (known == null || shown == null || c.order() != 0 || c.args().size() != 1 || !(c.args().get(0) instanceof Expr.Quantity q)) {
            return java.util.Optional.empty();
        }
        try {
            if (dev.plumb.units.UnitParser.parse(q.unit()).factor() == 1.0 || known.has(org.matheclipse.core.expression.S.Piecewise, true)) {
                return java.util.Optional.empty();
            }
        } catch (dev.plumb.units.UnitException ex) {
            return java.util.Optional.empty();
        }
        return java.util.Optional.of(substitute(shown, table.name(table.coordinate), q));
    }

    /** {@code e} with every occurrence of the name {@code x} replaced by {@code by}. */
    private static Expr substitute(Expr e, String x, Expr by) {
        if (e instanceof Expr.Name n) return n.id().equals(x) ? by : n;
        if (e instanceof Expr.Neg n) return new Expr.Neg(substitute(n.operand(), x, by), n.span());
        if (e instanceof Expr.Binary b) return new Expr.Binary(b.op(), substitute(b.left(), x, by), substitute(b.right(), x, by), b.span());
        if (e instanceof Expr.Call c) {
            return new Expr.Call(c.callee(), c.calleeSpan(), c.order(), c.args().stream().map(a -> substitute(a, x, by)).toList(), c.span());
        }
        if (e instanceof Expr.If i) {
            Expr.Condition k = i.condition();
            return new Expr.If(new Expr.Condition(k.op(), substitute(k.left(), x, by), substitute(k.right(), x, by), k.span()),
                    substitute(i.then(), x, by), substitute(i.otherwise(), x, by), i.span());
        }
        return e;
    }

    private static List<Derived> pointValues(Model model, Symja symja, SymbolTable table, ClosedForms closedForms,
                                             Map<String, IExpr> profiles, Map<String, Expr> printed, Map<String, IExpr> constants,
                                             PlumbForm form, List<String> notes) {
        Set<String> seen = new LinkedHashSet<>();
        List<Expr.Call> calls = new ArrayList<>();
        List<Expr> roots = new ArrayList<>();
        model.claims().forEach(c -> {
            roots.add(c.equation().lhs());
            roots.add(c.equation().rhs());
        });
        model.expects().forEach(e -> roots.add(e.lhs()));
        model.shows().forEach(s -> roots.add(s.expr()));
        model.scalings().forEach(s -> roots.add(s.lhs()));
        for (Expr r : roots) collectPointCalls(r, model, calls);
        List<Derived> out = new ArrayList<>();
        Translation t = new Translation(table, symja, profiles, constants);
        for (Expr.Call c : calls) {
            String text = ExprPrinter.print(c);
            if (!seen.add(text)) continue;
            try {
                IExpr value = symja.eval(t.plain(c));
                if (t.mentionsUnknownProfile(value) || !t.unknownConstantsIn(value).isEmpty()) continue;
                java.util.Optional<Expr> inPlace = inFileUnits(c, profiles, printed, table);
                Expr e = inPlace.isPresent() ? inPlace.get() : form.readable(closedForms.neat(value));
                Dimension d = model.dimensionOf(c);
                List<TrailStep> trail = List.of(
                        new TrailStep(profiles.containsKey(c.callee()) ? "substitute the closed form of " + c.callee()
                                : (c.order() > 0 ? "differentiate" : "substitute") + " the definition of " + c.callee(),
                                text + " = " + closedForms.print(value)),
                        new TrailStep("simplify", text + " = " + ExprPrinter.print(e)));
                out.add(new Derived(text, e, ExprPrinter.print(e), d, trail));
            } catch (Translation.Untranslatable | Symja.Failure ex) {
                notes.add(text + ": " + ex.getMessage());
            }
        }
        return out;
    }

    private static void collectPointCalls(Expr e, Model model, List<Expr.Call> out) {
        if (e instanceof Expr.Call c) {
            Symbol s = model.symbols().get(c.callee());
            boolean atCoordinate = c.args().size() == 1 && c.args().get(0) instanceof Expr.Name n
                    && model.coordinate().map(x -> x.name().equals(n.id())).orElse(false);
            if ((s instanceof Symbol.Profile || (s instanceof Symbol.Definition d && !d.params().isEmpty())) && !atCoordinate) {
                out.add(c);
            }
            c.args().forEach(a -> collectPointCalls(a, model, out));
        } else if (e instanceof Expr.Neg n) {
            collectPointCalls(n.operand(), model, out);
        } else if (e instanceof Expr.Binary b) {
            collectPointCalls(b.left(), model, out);
            collectPointCalls(b.right(), model, out);
        } else if (e instanceof Expr.If i) {
            collectPointCalls(i.then(), model, out);
            collectPointCalls(i.otherwise(), model, out);
        }
    }
}
