package dev.plumb.symbolic;

import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Span;
import dev.plumb.lang.Stmt;
import dev.plumb.model.Check;
import dev.plumb.model.Status;
import dev.plumb.model.Symbol;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.matheclipse.core.expression.F;
import org.matheclipse.core.interfaces.IExpr;

/**
 * Checks claims and the steps of a hand derivation. The truth is the derived closed form where
 * there is one; otherwise a step is checked against the relations it should follow from and the
 * profiles stated by the steps above it that hold. A step that states a profile is also put into
 * every relation (residual) and boundary, so a failure says which part fails. A failing step
 * does not feed later steps, which are checked on their own merits.
 */
final class Verification {

    private final Symja symja;
    private final SymbolTable table;
    private final IExpr assumptions;
    private final Map<String, IExpr> truth;
    private final Map<String, IExpr> constants;
    private final Map<String, IExpr> fromSteps = new LinkedHashMap<>();
    private final PlumbForm form;

    Verification(Symja symja, SymbolTable table, IExpr assumptions, Map<String, IExpr> truth, Map<String, IExpr> constants) {
        this.symja = symja;
        this.table = table;
        this.assumptions = assumptions;
        this.truth = truth;
        this.constants = constants;
        this.form = new PlumbForm(table);
    }

    private Translation translation(Map<String, IExpr> profiles) {
        return new Translation(table, symja, profiles, constants);
    }

    private Comparison comparison(Translation t, long seed) {
        return new Comparison(symja, t, new Sampler(symja, table, seed), assumptions);
    }

    private static String label(Stmt.Label label, Span span) {
        return label.present() ? label.name() : "line " + span.line();
    }

    Check claim(Stmt.Claim c) {
        String label = label(c.label(), c.span());
        try {
            Translation t = translation(truth);
            IExpr quantity = symja.eval(t.plain(c.equation().lhs()));
            IExpr claimed = symja.eval(t.plain(c.equation().rhs()));
            String missing = missing(t, quantity, claimed);
            if (missing != null) return Check.of("claim", label, c.span(), Status.UNDECIDED, missing);
            Comparison.Verdict v = comparison(t, c.span().line()).compare(claimed, quantity);
            String derived = print(quantity);
            // A claim about a quantity with no closed form behind it (R_gas*T) has no derived value worth repeating.
            String msg = v.holds() ? "holds: " + v.message()
                    : v.status() == Status.FAILS && !derived.equals(ExprPrinter.print(c.equation().lhs()))
                    ? v.message() + "; the derived value is " + ExprPrinter.print(c.equation().lhs()) + " = " + derived : v.message();
            return routed(withFactor(Check.of("claim", label, c.span(), v.status(), msg), v.factor()), "symbolic");
        } catch (Translation.Untranslatable u) {
            return Check.of("claim", label, c.span(), Status.UNDECIDED, u.getMessage());
        } catch (Symja.Failure f) {
            return Check.of("claim", label, c.span(), Status.UNDECIDED, f.getMessage());
        }
    }

    private String missing(Translation t, IExpr... sides) {
        for (IExpr s : sides) {
            List<String> p = t.unknownProfilesIn(s);
            if (!p.isEmpty()) return "no closed form of " + String.join(", ", p) + " is known, so this is left to the numeric comparison";
            List<String> k = t.unknownConstantsIn(s);
            if (!k.isEmpty()) return "no closed form of " + String.join(", ", k) + " is known, so this is left to the numeric comparison";
        }
        return null;
    }

    Check step(Stmt.Step s, List<Check> unitChecks) {
        String label = label(s.label(), s.span());
        Check unitFailure = unitChecks.stream().filter(u -> u.span().equals(s.span()) && u.status() == Status.FAILS).findFirst().orElse(null);
        try {
            Check c = stepAgainstKnowledge(s, label);
            if (unitFailure != null) {
                // The unit check's own words (different units on the two sides, or a unit error inside one), then the comparison's.
                c = new Check("step", label, s.span(), Status.FAILS, "units: " + unitFailure.message() + "; compared with what the relations give: "
                        + c.message(), c.factor(), c.extra());
            }
            if (c.status() == Status.HOLDS) recordProfile(s);
            return routed(c, "symbolic");
        } catch (Translation.Untranslatable u) {
            return Check.of("step", label, s.span(), Status.UNDECIDED, u.getMessage());
        } catch (Symja.Failure f) {
            return Check.of("step", label, s.span(), Status.UNDECIDED, f.getMessage());
        }
    }

    private void recordProfile(Stmt.Step s) {
        String p = profileStated(s);
        if (p == null || truth.containsKey(p)) return;
        try {
            fromSteps.put(p, symja.eval(translation(Map.of()).plain(s.equation().rhs())));
        } catch (Translation.Untranslatable | Symja.Failure ignored) {
            // A step that cannot be reused only makes later steps harder to decide.
        }
    }

    /** The profile a step states, {@code P(r) = ...}, or null. */
    private String profileStated(Stmt.Step s) {
        if (s.equation().lhs() instanceof Expr.Call c && c.order() == 0 && c.args().size() == 1
                && c.args().get(0) instanceof Expr.Name n && table.model().coordinate().map(x -> x.name().equals(n.id())).orElse(false)
                && table.model().symbols().get(c.callee()) instanceof Symbol.Profile) {
            return c.callee();
        }
        return null;
    }

    private Check stepAgainstKnowledge(Stmt.Step s, String label) throws Translation.Untranslatable {
        Map<String, IExpr> known = new LinkedHashMap<>(fromSteps);
        known.putAll(truth);
        Translation t = translation(known);
        IExpr lhs = symja.eval(t.plain(s.equation().lhs()));
        IExpr rhs = symja.eval(t.plain(s.equation().rhs()));
        String profile = profileStated(s);
        if (missing(t, lhs, rhs) == null) {
            Comparison.Verdict v = comparison(t, s.span().line()).compare(rhs, lhs);
            String basis = truth.isEmpty() ? "the steps above" : "the derived closed form" + (truth.size() > 1 ? "s" : "");
            if (v.holds()) return Check.of("step", label, s.span(), Status.HOLDS, "follows from " + basis + ": " + v.message());
            if (v.status() == Status.UNDECIDED) return Check.of("step", label, s.span(), Status.UNDECIDED, v.message());
            List<String> parts = new ArrayList<>();
            parts.add(v.message());
            List<String> substituted = profile != null ? parts(profile, s) : List.of();
            parts.addAll(substituted);
            parts.add("from " + basis + ", " + ExprPrinter.print(s.equation().lhs()) + " = " + print(lhs));
            Check failed = withFactor(Check.of("step", label, s.span(), Status.FAILS, String.join("; ", parts)), v.factor());
            // Where putting the stated profile into the relations and boundaries shows what is not met, that says how.
            return substituted.stream().anyMatch(m -> m.contains("not met")) ? routed(failed, "substitution") : failed;
        }
        IExpr fromRelation = relationFor(s.equation().lhs(), known);
        if (fromRelation != null) {
            Comparison.Verdict v = comparison(t, s.span().line()).compare(rhs, fromRelation);
            String msg = v.holds() ? "follows from the relation: " + v.message()
                    : v.message() + "; the relation gives " + ExprPrinter.print(s.equation().lhs()) + " = " + print(fromRelation);
            return withFactor(Check.of("step", label, s.span(), v.status(), msg), v.factor());
        }
        if (profile != null) {
            List<String> failing = parts(profile, s);
            boolean ok = failing.stream().noneMatch(m -> m.contains("not met") || m.contains("undecided"));
            return routed(Check.of("step", label, s.span(), ok ? Status.HOLDS : Status.FAILS, String.join("; ", failing)), "substitution");
        }
        return Check.of("step", label, s.span(), Status.UNDECIDED, missing(t, lhs, rhs));
    }

    /** The right side of a relation whose left side is the same profile derivative, e.g. {@code P'(r)}, translated. */
    private IExpr relationFor(Expr lhs, Map<String, IExpr> known) throws Translation.Untranslatable {
        for (Stmt.Relation r : table.model().relations()) {
            if (ClosedForms.unitsFail(table.model(), r)) continue;
            if (ExprPrinter.print(r.equation().lhs()).equals(ExprPrinter.print(lhs))) {
                Translation t = translation(known);
                IExpr rhs = symja.eval(t.plain(r.equation().rhs()));
                if (missing(t, rhs) == null) return rhs;
            }
        }
        return null;
    }

    /** Puts the stated profile into every relation and boundary that mentions it, and says which are met. */
    private List<String> parts(String profile, Stmt.Step s) throws Translation.Untranslatable {
        Map<String, IExpr> known = new LinkedHashMap<>(truth);
        known.putAll(fromSteps);
        known.put(profile, symja.eval(translation(Map.of()).plain(s.equation().rhs())));
        Translation t = translation(known);
        List<String> out = new ArrayList<>();
        for (Stmt.Relation r : table.model().relations()) {
            if (!mentions(r.equation(), profile)) continue;
            String name = "relation " + (r.label().present() ? "'" + r.label().name() + "'" : "on line " + r.span().line());
            IExpr l = symja.eval(t.plain(r.equation().lhs()));
            IExpr rr = symja.eval(t.plain(r.equation().rhs()));
            if (missing(t, l, rr) != null) continue;
            Comparison.Verdict v = comparison(t, r.span().line()).compare(l, rr);
            out.add(v.holds() ? "meets " + name : v.status() == Status.FAILS ? name + " is not met: a residual "
                    + ExprPrinter.print(r.equation().lhs()) + " - (" + ExprPrinter.print(r.equation().rhs()) + ") = "
                    + print(symja.eval(F.Simplify(F.Subtract(l, rr), assumptions))) + " is left over" : name + " is undecided");
        }
        for (Stmt.Boundary b : table.model().boundaries()) {
            if (!mentions(b.equation(), profile)) continue;
            String name = "boundary " + (b.label().present() ? "'" + b.label().name() + "'" : "on line " + b.span().line());
            IExpr l = symja.eval(t.plain(b.equation().lhs()));
            IExpr rr = symja.eval(t.plain(b.equation().rhs()));
            if (missing(t, l, rr) != null) continue;
            Comparison.Verdict v = comparison(t, b.span().line()).compare(l, rr);
            out.add(v.holds() ? "meets " + name : v.status() == Status.FAILS ? name + " is not met: "
                    + ExprPrinter.print(b.equation().lhs()) + " = " + print(symja.eval(F.Simplify(l, assumptions))) + " instead of "
                    + ExprPrinter.print(b.equation().rhs()) : name + " is undecided");
        }
        return out;
    }

    private static boolean mentions(Stmt.Equation eq, String name) {
        return dev.plumb.model.References.names(eq.lhs()).contains(name) || dev.plumb.model.References.names(eq.rhs()).contains(name);
    }

    /** Names how a decided verdict was reached (JSON {@code route}), unless a more specific route already did. */
    private static Check routed(Check c, String route) {
        return c.status() == Status.UNDECIDED || c.extra().containsKey("route") ? c : c.with("route", route);
    }

    private static Check withFactor(Check c, String factor) {
        return factor == null ? c : c.withFactor(factor);
    }

    private String print(IExpr e) {
        try {
            return form.print(e);
        } catch (Translation.Untranslatable u) {
            return "(not printable)";
        }
    }
}
