package dev.plumb.model;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Program;
import dev.plumb.lang.Span;
import dev.plumb.lang.Stmt;
import dev.plumb.units.Constants;
import dev.plumb.units.Dimension;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.HashSet;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Turns a parsed program into a checked {@link Model}: resolves every name, finds duplicate
 * declarations and labels and definition cycles, infers and checks the units of every line,
 * and evaluates fixed parameters and case values in SI. Cases are checked by {@link CaseChecker},
 * sweeps by {@link SweepChecker}, and the symbols are made by {@link DeclaredSymbols}.
 */
public final class Checker {

    private final Program program;
    private final Diagnostics diagnostics;
    private final Map<String, Stmt> declarations = new LinkedHashMap<>();
    private final Map<String, Stmt.Typeset> typesets = new LinkedHashMap<>();
    private final Map<String, Symbol.FixedParam> fixed = new HashMap<>();
    private final Set<String> evaluating = new HashSet<>();
    private final List<Check> unitChecks = new ArrayList<>();
    /** The unit of each check that holds, by its index in unitChecks: described once all lines are inferred. */
    private final Map<Integer, DimForm> heldUnits = new HashMap<>();
    private Stmt.Coord coord;
    private UnitInference inference;

    private Checker(Program program, Diagnostics diagnostics) {
        this.program = program;
        this.diagnostics = diagnostics;
    }

    public static Model check(Program program, Diagnostics diagnostics) {
        return new Checker(program, diagnostics).run();
    }

    private Model run() {
        if (program.statements().isEmpty() && !diagnostics.hasErrors()) {
            diagnostics.error(new Span(1, 1, 1, 2), "the file has no statements: there is nothing to check",
                    "a derivation starts with declarations such as: param M [kg] > 0");
        }
        declare();
        checkLabels();
        checkDefinitionCycles();
        ConstantEvaluator constants = new ConstantEvaluator(this::constantSymbol, Map.of());
        inference = new UnitInference(declarations, coord == null ? null : coord.name(), constants, diagnostics);
        checkDeclarations();
        for (Stmt s : program.statements()) statement(s);
        describeHeldUnits();
        CaseChecker caseChecker = new CaseChecker(program, declarations, inference, diagnostics, this::constantSymbol);
        List<CaseValues> cases = caseChecker.cases();
        if (!diagnostics.hasErrors()) caseChecker.checkCaseAssumptions(cases);
        List<SweepSpec> sweeps = new SweepChecker(program, declarations, inference, diagnostics, this::constantSymbol).sweeps();
        caseChecker.checkExpectCases();
        DeclaredSymbols declared = new DeclaredSymbols(program, declarations, inference, diagnostics, coord, this::fixedParam);
        Map<String, Symbol> symbols = declared.symbols();
        declared.reportInferredUnits(symbols);
        Map<Expr, Dimension> dims = new IdentityHashMap<>();
        inference.forms.forEach((e, f) -> dims.put(e, inference.solver.known(f).orElse(Dimension.NONE)));
        Optional<Symbol.Coordinate> coordinate = coord == null ? Optional.empty()
                : Optional.of((Symbol.Coordinate) symbols.get(coord.name()));
        if (!diagnostics.hasErrors()) {
            boolean hasFree = declarations.values().stream().anyMatch(s -> s instanceof Stmt.Param p && p.value() == null);
            IntervalPoints.check(symbols, coordinate.orElse(null), cases, program.statements(), hasFree, diagnostics);
        }
        String title = program.all(Stmt.Title.class).stream().map(Stmt.Title::text).findFirst().orElse(program.source().path());
        Orientation sides = new Orientation(declared.unknownNames());
        return new Model(program, title, Collections.unmodifiableMap(symbols), coordinate,
                program.all(Stmt.Relation.class), sides.boundaries(program.all(Stmt.Boundary.class)),
                sides.steps(program.all(Stmt.Step.class)), sides.claims(program.all(Stmt.Claim.class)),
                sides.scalings(program.all(Stmt.Scaling.class)), cases, program.all(Stmt.Expect.class),
                program.all(Stmt.Show.class), program.all(Stmt.Guess.class), sweeps, Collections.unmodifiableMap(dims), List.copyOf(unitChecks), diagnostics.sorted());
    }

    // ---- declarations ----------------------------------------------------------------------

    private void declare() {
        for (Stmt s : program.statements()) {
            String name;
            Span span;
            if (s instanceof Stmt.Param p) {
                name = p.name();
                span = p.nameSpan();
            } else if (s instanceof Stmt.Coord c) {
                name = c.name();
                span = c.nameSpan();
                if (coord != null) {
                    diagnostics.error(span, "only one coordinate is supported; '" + coord.name() + "' was declared at line "
                            + coord.span().line());
                    continue;
                }
            } else if (s instanceof Stmt.Let l) {
                name = l.name();
                span = l.nameSpan();
            } else if (s instanceof Stmt.Unknown u) {
                name = u.name();
                span = u.nameSpan();
            } else {
                continue;
            }
            Stmt previous = declarations.get(name);
            if (previous != null) {
                diagnostics.error(span, "'" + name + "' is declared twice; the first declaration is at line " + previous.span().line());
                continue;
            }
            // Only a coordinate whose name is free becomes the coordinate (a clash with a parameter is the error above).
            if (s instanceof Stmt.Coord c) coord = c;
            if (Constants.lookup(name).isPresent()) {
                diagnostics.warning(span, "'" + name + "' shadows the built-in constant " + name + " ("
                        + Constants.lookup(name).get().description() + ")", "in this file '" + name + "' means your declaration");
            }
            if (BuiltinFunction.lookup(name).isPresent()) {
                diagnostics.warning(span, "'" + name + "' shadows the built-in function " + name + " ("
                        + BuiltinFunction.lookup(name).get().description + ")", "in this file '" + name + "' means your declaration");
            }
            declarations.put(name, s);
        }
    }

    /**
     * Labels must be unique within a family of statements that a reader refers to together: the
     * equations (relations, boundaries), the derivation (steps, claims), scaling claims,
     * expectations and cases. A boundary and an expectation may share a label such as "centre".
     */
    private void checkLabels() {
        Map<String, Map<String, Span>> families = new HashMap<>();
        for (Stmt s : program.statements()) {
            Stmt.Label label = labelOf(s);
            if (!label.present()) continue;
            String family = s instanceof Stmt.Relation || s instanceof Stmt.Boundary ? "equation"
                    : s instanceof Stmt.Step || s instanceof Stmt.Claim ? "derivation" : s.getClass().getSimpleName();
            Map<String, Span> space = families.computeIfAbsent(family, k -> new HashMap<>());
            Span first = space.putIfAbsent(label.name(), label.span());
            if (first != null) {
                diagnostics.error(label.span(), "the label '" + label.name() + "' is used twice; the first use is at line " + first.line());
            }
        }
    }

    /** The label of a statement that can carry one, else {@link Stmt.Label#NONE}. */
    public static Stmt.Label labelOf(Stmt s) {
        if (s instanceof Stmt.Relation r) return r.label();
        if (s instanceof Stmt.Boundary b) return b.label();
        if (s instanceof Stmt.Step st) return st.label();
        if (s instanceof Stmt.Claim c) return c.label();
        if (s instanceof Stmt.Scaling sc) return sc.label();
        if (s instanceof Stmt.Expect e) return e.label();
        if (s instanceof Stmt.Case c) return c.label();
        return Stmt.Label.NONE;
    }

    private void checkDefinitionCycles() {
        Map<String, Integer> state = new HashMap<>();
        for (Stmt s : declarations.values()) {
            if (s instanceof Stmt.Let l) visit(l, state, new ArrayList<>());
        }
    }

    private void visit(Stmt.Let l, Map<String, Integer> state, List<String> path) {
        Integer st = state.get(l.name());
        if (st != null && st == 2) return;
        if (st != null && st == 1) {
            List<String> cycle = new ArrayList<>(path.subList(path.indexOf(l.name()), path.size()));
            cycle.add(l.name());
            diagnostics.error(l.nameSpan(), "definitions refer to each other in a cycle: " + String.join(" -> ", cycle));
            return;
        }
        state.put(l.name(), 1);
        path.add(l.name());
        for (String ref : References.names(l.body())) {
            if (l.params().contains(ref)) continue;
            if (declarations.get(ref) instanceof Stmt.Let next) visit(next, state, path);
        }
        path.remove(path.size() - 1);
        state.put(l.name(), 2);
    }

    /** Looks a name up for constant evaluation, evaluating a fixed parameter on first use. */
    private Symbol constantSymbol(String name) {
        Stmt decl = declarations.get(name);
        if (decl instanceof Stmt.Param p && p.value() != null) return fixedParam(p);
        if (decl instanceof Stmt.Let l) {
            return new Symbol.Definition(l.name(), l.nameSpan(), Dimension.NONE, l.params(), List.of(), l.body());
        }
        if (decl != null) return new Symbol.FreeParam(name, decl.span(), Dimension.NONE, null);
        return Constants.lookup(name).<Symbol>map(Symbol.Builtin::new).orElse(null);
    }

    private Symbol.FixedParam fixedParam(Stmt.Param p) {
        Symbol.FixedParam done = fixed.get(p.name());
        if (done != null) return done;
        double value = Double.NaN;
        if (evaluating.add(p.name())) {
            try {
                value = new ConstantEvaluator(this::constantSymbol, Map.of()).evaluate(p.value());
                if (!Double.isFinite(value)) {
                    diagnostics.error(p.value().span(), "the value of parameter '" + p.name() + "' is not a finite number in SI units "
                            + "(it overflows, or divides by zero)");
                }
            } catch (ConstantEvaluator.NotConstant e) {
                diagnostics.error(e.where.span(), "the value of parameter '" + p.name() + "' must be a fixed number: " + e.getMessage(),
                        "a fixed parameter may use numbers, units, built-in constants and other fixed parameters");
            } finally {
                evaluating.remove(p.name());
            }
        } else {
            diagnostics.error(p.nameSpan(), "the value of parameter '" + p.name() + "' depends on itself");
        }
        Dimension d = inference == null ? Dimension.NONE
                : inference.solver.known(inference.symbolForm(p.name())).orElse(Dimension.NONE);
        Symbol.FixedParam f = new Symbol.FixedParam(p.name(), p.nameSpan(), d, value, p.value());
        if (inference != null) fixed.put(p.name(), f);
        return f;
    }

    private void checkDeclarations() {
        for (Stmt s : declarations.values()) {
            if (s instanceof Stmt.Param p && p.value() != null) {
                DimForm value = inference.infer(p.value());
                if (p.unit() != null) {
                    inference.mismatch(value, inference.unit(p.unit().text(), p.unit().span()), p.value().span(),
                            "the value of '" + p.name() + "' does not have its declared unit [" + p.unit().text() + "]", p.value(), null, true);
                }
            } else if (s instanceof Stmt.Param p && !p.bounds().isEmpty()) {
                for (Stmt.Bound b : p.bounds()) bound(p, b);
            } else if (s instanceof Stmt.Coord c) {
                DimForm cf = inference.symbolForm(c.name());
                inference.mismatch(inference.infer(c.from()), cf, c.from().span(),
                        "the start of the interval does not have the unit of '" + c.name() + "'", c.from(), null, true);
                inference.mismatch(inference.infer(c.to()), cf, c.to().span(),
                        "the end of the interval does not have the unit of '" + c.name() + "'", c.to(), null, true);
            } else if (s instanceof Stmt.Unknown u && u.isProfile()) {
                if (coord == null) {
                    diagnostics.error(u.span(), "the profile '" + u.name() + "' needs a coordinate: declare one, e.g. coord "
                            + u.args().get(0) + " [m] from 0 to R");
                } else if (u.args().size() != 1 || !u.args().get(0).equals(coord.name())) {
                    diagnostics.error(u.span(), "a profile is a function of the coordinate '" + coord.name() + "': write "
                            + u.name() + "(" + coord.name() + ")");
                }
            } else if (s instanceof Stmt.Let l) {
                inference.symbolForm(l.name());
            }
        }
    }

    /** An order such as {@code Rc < R}: the other side has the parameter's unit and a fixed value in each case. */
    private void bound(Stmt.Param p, Stmt.Bound b) {
        for (String name : References.names(b.value())) {
            Stmt decl = declarations.get(name);
            if (decl instanceof Stmt.Unknown || decl instanceof Stmt.Coord || name.equals(p.name())) {
                diagnostics.error(b.value().span(), "'" + p.name() + " " + b.text() + "' must compare with a fixed value in each case, "
                        + "but it uses '" + name + "'");
                return;
            }
        }
        inference.mismatch(inference.infer(b.value()), inference.symbolForm(p.name()), b.value().span(),
                "'" + p.name() + " " + b.text() + "' compares quantities of different units", b.value(), null, true);
    }

    // ---- statements --------------------------------------------------------------------------

    private void statement(Stmt s) {
        if (s instanceof Stmt.Relation r) {
            sides("relation", r.label(), r.span(), r.equation());
        } else if (s instanceof Stmt.Boundary b) {
            sides("boundary", b.label(), b.span(), b.equation());
        } else if (s instanceof Stmt.Step st) {
            sides("step", st.label(), st.span(), st.equation());
        } else if (s instanceof Stmt.Claim c) {
            sides("claim", c.label(), c.span(), c.equation());
        } else if (s instanceof Stmt.Scaling sc) {
            inference.infer(sc.lhs());
            inference.infer(sc.rhs());
        } else if (s instanceof Stmt.Expect e) {
            expect(e);
        } else if (s instanceof Stmt.Guess g) {
            guess(g);
        } else if (s instanceof Stmt.Typeset t) {
            typeset(t);
        } else if (s instanceof Stmt.Show sh) {
            DimForm f = inference.infer(sh.expr());
            if (sh.unit() != null) {
                inference.mismatch(f, inference.unit(sh.unit().text(), sh.unit().span()), sh.unit().span(),
                        "cannot show " + ExprPrinter.print(sh.expr()) + " in [" + sh.unit().text() + "]: the units differ", sh.expr(), null, true);
            }
        }
    }

    /** A typeset form names something declared (or built in), once, and is TeX every report can show. */
    private void typeset(Stmt.Typeset t) {
        if (!declarations.containsKey(t.name()) && Constants.lookup(t.name()).isEmpty()) {
            inference.undefined(t.name(), t.nameSpan());
        }
        Stmt.Typeset first = typesets.putIfAbsent(t.name(), t);
        if (first != null) {
            diagnostics.error(t.nameSpan(), "'" + t.name() + "' is given a typeset form twice; the first is at line " + first.span().line());
        }
        dev.plumb.lang.TexForm.Problem p = dev.plumb.lang.TexForm.check(t.tex());
        if (p != null) {
            // The text starts one column after the opening quote.
            Span at = Span.at(t.texSpan().line(), t.texSpan().column() + 1 + p.offset(), 1);
            diagnostics.error(at, "the typeset form of '" + t.name() + "' is not TeX plumb can use: " + p.message(),
                    "write it as TeX math, e.g. typeset Rstar as \"R_\\star\" or typeset rho_c as \"\\rho_{\\mathrm{c}}\"");
        }
    }

    private void sides(String what, Stmt.Label label, Span span, Stmt.Equation eq) {
        int errorsBefore = diagnostics.errorCount();
        DimForm l = inference.infer(eq.lhs());
        DimForm r = inference.infer(eq.rhs());
        String name = label.present() ? what + " '" + label.name() + "'" : "the " + what + " on line " + span.line();
        Expr blamed = isPlainUnknown(eq.rhs()) && !isPlainUnknown(eq.lhs()) ? eq.lhs() : eq.rhs();
        boolean differ = inference.mismatch(l, r, blamed.span(), "the two sides of " + name + " have different units",
                eq.lhs(), eq.rhs());
        Status status = diagnostics.errorCount() > errorsBefore ? Status.FAILS : Status.HOLDS;
        String message = status == Status.HOLDS
                ? "both sides in " + inference.solver.describe(l)
                : differ ? "left side " + inference.solver.describe(l) + ", right side " + inference.solver.describe(r)
                : "a unit error inside the " + what;
        if (status == Status.HOLDS) heldUnits.put(unitChecks.size(), l);
        unitChecks.add(Check.of("units", label.present() ? label.name() : "line " + span.line(), span, status, message)
                .with("statement", what));
    }

    /** A line checked early may mention a unit that only a later line infers (theta from theta(0) = 1). */
    private void describeHeldUnits() {
        heldUnits.forEach((i, form) -> {
            Check c = unitChecks.get(i);
            unitChecks.set(i, new Check(c.kind(), c.label(), c.span(), c.status(), "both sides in " + inference.solver.describe(form),
                    c.factor(), c.extra()));
        });
    }

    private static boolean isPlainUnknown(Expr e) {
        return e instanceof Expr.Call c && c.args().size() == 1;
    }

    private void expect(Stmt.Expect e) {
        DimForm l = inference.infer(e.lhs());
        DimForm r = inference.infer(e.expected());
        boolean differ = inference.mismatch(l, r, e.expected().span(), "the expected value of '" + labelOf(e.label(), e.span())
                + "' does not have the unit of " + ExprPrinter.print(e.lhs()), e.lhs(), e.expected());
        if (!e.tolerance().isRelative()) {
            differ |= inference.mismatch(inference.infer(e.tolerance().absolute()), l, e.tolerance().span(),
                    "the tolerance does not have the unit of " + ExprPrinter.print(e.lhs()), e.tolerance().absolute(), null);
        } else if (!(e.tolerance().relative() >= 0)) {
            diagnostics.error(e.tolerance().span(), "a tolerance must not be negative");
        }
        if (!differ) heldUnits.put(unitChecks.size(), l);
        unitChecks.add(Check.of("units", labelOf(e.label(), e.span()), e.span(), differ ? Status.FAILS : Status.HOLDS,
                differ ? "the expected value has another unit" : "both sides in " + inference.solver.describe(l)).with("statement", "expect"));
    }

    /** A guess names an unknown constant or a start value of a profile, with a fixed value of the same unit. */
    private void guess(Stmt.Guess g) {
        boolean target = g.target() instanceof Expr.Name n && declarations.get(n.id()) instanceof Stmt.Unknown constant
                && !constant.isProfile()
                || g.target() instanceof Expr.Call c && c.args().size() == 1 && declarations.get(c.callee()) instanceof Stmt.Unknown profile
                && profile.isProfile();
        if (!target) {
            diagnostics.error(g.target().span(), "a guess is for an unknown constant or the start value of an unknown profile, not "
                    + ExprPrinter.print(g.target()), "e.g. guess R = 3000 [km], or guess P(0) = 1e16 [Pa]");
            return;
        }
        for (String name : References.names(g.value())) {
            if (declarations.get(name) instanceof Stmt.Unknown || coord != null && name.equals(coord.name())) {
                diagnostics.error(g.value().span(), "a guess must be a fixed value in each case, but it uses '" + name + "'");
                return;
            }
        }
        sides("guess", Stmt.Label.NONE, g.span(), new Stmt.Equation(g.target(), g.value(), g.span()));
    }

    static String labelOf(Stmt.Label l, Span span) {
        return l.present() ? l.name() : "line " + span.line();
    }
}
