package dev.plumb.model;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Expr;
import dev.plumb.lang.ExprPrinter;
import dev.plumb.lang.Program;
import dev.plumb.lang.Stmt;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Function;

/**
 * Checks each {@code case} (it sets free parameters only, each once and all of them, with values of
 * their units that are finite fixed numbers), gives its values in SI, checks that they keep the
 * signs and orders the declarations assume, and that every expectation names a case or sweep that
 * exists.
 */
final class CaseChecker {

    private final Program program;
    private final Map<String, Stmt> declarations;
    private final UnitInference inference;
    private final Diagnostics diagnostics;
    private final Function<String, Symbol> constants;

    CaseChecker(Program program, Map<String, Stmt> declarations, UnitInference inference, Diagnostics diagnostics,
                Function<String, Symbol> constants) {
        this.program = program;
        this.declarations = declarations;
        this.inference = inference;
        this.diagnostics = diagnostics;
        this.constants = constants;
    }

    List<CaseValues> cases() {
        List<String> free = declarations.values().stream()
                .filter(s -> s instanceof Stmt.Param p && p.value() == null).map(s -> ((Stmt.Param) s).name()).toList();
        List<CaseValues> out = new ArrayList<>();
        ConstantEvaluator evaluator = new ConstantEvaluator(constants, Map.of());
        for (Stmt.Case c : program.all(Stmt.Case.class)) {
            Map<String, Double> values = new LinkedHashMap<>();
            Map<String, Double> sigmas = new LinkedHashMap<>();
            boolean ok = true;
            for (Stmt.Assignment a : c.assignments()) {
                Stmt decl = declarations.get(a.name());
                if (!(decl instanceof Stmt.Param p) || p.value() != null) {
                    String why = decl instanceof Stmt.Param ? "is fixed by its declaration" : decl == null ? "is not declared" : "is not a parameter";
                    diagnostics.error(a.nameSpan(), "case '" + c.label().name() + "' sets '" + a.name() + "', which " + why,
                            "a case gives values to free parameters (" + String.join(", ", free) + ")");
                    ok = false;
                    continue;
                }
                if (values.containsKey(a.name())) {
                    diagnostics.error(a.nameSpan(), "case '" + c.label().name() + "' sets '" + a.name() + "' twice");
                    ok = false;
                    continue;
                }
                DimForm want = inference.symbolForm(a.name());
                ok &= !inference.mismatch(inference.infer(a.value()), want, a.value().span(),
                        "the value of '" + a.name() + "' does not have its unit", a.value(), null, true);
                ok &= value(evaluator, a.value(), a.name(), values);
                if (a.uncertainty() != null) {
                    ok &= !inference.mismatch(inference.infer(a.uncertainty()), want, a.uncertainty().span(),
                            "the uncertainty of '" + a.name() + "' does not have its unit", a.uncertainty(), null, true);
                    ok &= value(evaluator, a.uncertainty(), a.name(), sigmas);
                }
            }
            List<String> missing = free.stream().filter(n -> !values.containsKey(n)).toList();
            if (!missing.isEmpty() && ok) {
                diagnostics.error(c.label().span(), "case '" + c.label().name() + "' gives no value for " + String.join(", ", missing));
                ok = false;
            }
            if (ok) out.add(new CaseValues(c.label().name(), c.span(), values, sigmas));
        }
        return out;
    }

    private boolean value(ConstantEvaluator evaluator, Expr e, String name, Map<String, Double> into) {
        try {
            double v = evaluator.evaluate(e);
            if (!Double.isFinite(v)) {
                diagnostics.error(e.span(), "the value of '" + name + "' is not a finite number in SI units (it overflows, or divides by zero)");
                return false;
            }
            into.put(name, v);
            return true;
        } catch (ConstantEvaluator.NotConstant ex) {
            diagnostics.error(ex.where.span(), "a case value must be a fixed number: " + ex.getMessage());
            return false;
        }
    }

    void checkExpectCases() {
        boolean hasFree = declarations.values().stream().anyMatch(s -> s instanceof Stmt.Param p && p.value() == null);
        Set<String> caseNames = new HashSet<>();
        program.all(Stmt.Case.class).forEach(c -> caseNames.add(c.label().name()));
        Set<String> sweepNames = new HashSet<>();
        program.all(Stmt.Sweep.class).forEach(s -> sweepNames.add(s.label().name()));
        for (Stmt.Expect e : program.all(Stmt.Expect.class)) {
            if (e.extremum() != null) {
                if (!sweepNames.contains(e.extremum().sweep())) {
                    diagnostics.error(e.extremum().sweepSpan(), "there is no sweep named '" + e.extremum().sweep() + "'"
                            + dev.plumb.lang.Names.closest(e.extremum().sweep(), sweepNames).map(s -> "; did you mean '" + s + "'?")
                            .orElse(sweepNames.isEmpty() ? "; declare one, e.g. sweep " + e.extremum().sweep() + ": M from 1 [Msun] to 2 [Msun] log 20" : ""));
                }
                continue;
            }
            if (e.caseName() == null && hasFree) {
                diagnostics.error(e.lhs().span(), "this expectation needs 'at CASE': the file has free parameters",
                        "e.g. expect " + Checker.labelOf(e.label(), e.span()) + ": " + ExprPrinter.print(e.lhs()) + " at "
                                + (caseNames.isEmpty() ? "sun" : caseNames.iterator().next()) + " = ...");
            } else if (e.caseName() != null && !caseNames.contains(e.caseName())
                    && !(e.caseName().equals(CaseValues.IMPLICIT) && !hasFree && caseNames.isEmpty())) {
                if (!hasFree && caseNames.isEmpty()) {
                    diagnostics.error(e.caseSpan(), "there is no case named '" + e.caseName() + "': the file has no free parameters, "
                            + "so its one case is '" + CaseValues.IMPLICIT + "'", "write 'at " + CaseValues.IMPLICIT + "', or leave 'at' out");
                    continue;
                }
                diagnostics.error(e.caseSpan(), "there is no case named '" + e.caseName() + "'"
                        + dev.plumb.lang.Names.closest(e.caseName(), caseNames).map(s -> "; did you mean '" + s + "'?").orElse(""));
            }
        }
    }

    /** Each case's values keep the sign and order the declarations assume (M = -1 for M > 0 is an error). */
    void checkCaseAssumptions(List<CaseValues> cases) {
        for (CaseValues c : cases) {
            ConstantEvaluator values = new ConstantEvaluator(constants, c.values());
            Stmt.Case statement = program.all(Stmt.Case.class).stream().filter(k -> k.label().name().equals(c.label())).findFirst().orElse(null);
            if (statement == null) continue;
            for (Stmt.Assignment a : statement.assignments()) {
                if (!(declarations.get(a.name()) instanceof Stmt.Param p) || p.value() != null) continue;
                double v = c.values().get(a.name());
                if (p.assumption() == Stmt.Assumption.POSITIVE && !(v > 0) || p.assumption() == Stmt.Assumption.NON_NEGATIVE && !(v >= 0)) {
                    diagnostics.error(a.value().span(), "case '" + c.label() + "' gives " + a.name() + " = " + ExprPrinter.print(a.value())
                            + ", but '" + a.name() + "' is declared " + p.assumption().text);
                }
                for (Stmt.Bound b : p.bounds()) {
                    try {
                        double other = values.evaluate(b.value());
                        if (!b.op().test(v, other)) {
                            diagnostics.error(a.value().span(), "case '" + c.label() + "' gives " + a.name() + " = " + ExprPrinter.print(a.value())
                                    + ", which breaks '" + a.name() + " " + b.text() + "' (" + ExprPrinter.print(b.value()) + " = "
                                    + String.format("%.6g", other) + " in SI)");
                        }
                    } catch (ConstantEvaluator.NotConstant unknownHere) {
                        // Reported with the declaration.
                    }
                }
            }
        }
    }
}
