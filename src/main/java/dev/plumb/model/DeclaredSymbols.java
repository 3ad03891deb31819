package dev.plumb.model;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Expr;
import dev.plumb.lang.Program;
import dev.plumb.lang.Stmt;
import dev.plumb.units.Constants;
import dev.plumb.units.Dimension;
import dev.plumb.units.UnitCatalog;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.function.Function;

/**
 * The symbols of a checked file: one per declaration, with the dimension inferred for it, and the
 * built-in constants the file uses without declaring them; notes the units inferred for unknowns.
 */
final class DeclaredSymbols {

    private final Program program;
    private final Map<String, Stmt> declarations;
    private final UnitInference inference;
    private final Diagnostics diagnostics;
    private final Stmt.Coord coord;
    private final Function<Stmt.Param, Symbol.FixedParam> fixedParam;

    DeclaredSymbols(Program program, Map<String, Stmt> declarations, UnitInference inference, Diagnostics diagnostics,
                    Stmt.Coord coord, Function<Stmt.Param, Symbol.FixedParam> fixedParam) {
        this.program = program;
        this.declarations = declarations;
        this.inference = inference;
        this.diagnostics = diagnostics;
        this.coord = coord;
        this.fixedParam = fixedParam;
    }

    Map<String, Symbol> symbols() {
        Map<String, Symbol> out = new LinkedHashMap<>();
        for (Stmt s : declarations.values()) {
            Symbol sym = null;
            if (s instanceof Stmt.Param p) {
                sym = p.value() != null ? fixedParam.apply(p) : new Symbol.FreeParam(p.name(), p.nameSpan(), dim(p.name()), p.assumption(), p.bounds());
            } else if (s instanceof Stmt.Coord c) {
                sym = new Symbol.Coordinate(c.name(), c.nameSpan(), dim(c.name()), c.from(), c.to());
            } else if (s instanceof Stmt.Let l) {
                sym = new Symbol.Definition(l.name(), l.nameSpan(), dim(l.name()), l.params(),
                        inference.letParams(l).stream().map(f -> inference.solver.known(f).orElse(Dimension.NONE)).toList(), l.body());
            } else if (s instanceof Stmt.Unknown u && u.isProfile()) {
                sym = new Symbol.Profile(u.name(), u.nameSpan(), dim(u.name()), u.unit() == null, u.assumption());
            } else if (s instanceof Stmt.Unknown u) {
                sym = new Symbol.UnknownConstant(u.name(), u.nameSpan(), dim(u.name()), u.unit() == null,
                        coord != null && (isName(coord.to(), u.name()) || isName(coord.from(), u.name())));
            }
            if (sym != null) out.put(sym.name(), sym);
        }
        Set<String> used = new HashSet<>();
        for (Stmt s : program.statements()) used.addAll(References.names(s));
        for (String name : Constants.all().keySet()) {
            if (used.contains(name) && !out.containsKey(name)) out.put(name, new Symbol.Builtin(Constants.lookup(name).get()));
        }
        return out;
    }

    Set<String> unknownNames() {
        Set<String> out = new HashSet<>();
        for (Stmt s : declarations.values()) if (s instanceof Stmt.Unknown u) out.add(u.name());
        return out;
    }

    private static boolean isName(Expr e, String name) {
        return e instanceof Expr.Name n && n.id().equals(name);
    }

    private Dimension dim(String name) {
        return inference.solver.known(inference.symbolForm(name)).orElse(Dimension.NONE);
    }

    void reportInferredUnits(Map<String, Symbol> symbols) {
        for (Stmt s : declarations.values()) {
            if (!(s instanceof Stmt.Unknown u) || u.unit() != null) continue;
            Optional<Dimension> d = inference.solver.known(inference.symbolForm(u.name()));
            if (d.isPresent()) {
                String what = d.get().isNone() ? "dimensionless" : UnitCatalog.siName(d.get())
                        + (UnitCatalog.siName(d.get()).equals(d.get().toString()) ? "" : " = " + d.get());
                diagnostics.note(u.nameSpan(), "the unit of '" + u.name() + "' is inferred: " + what);
            } else {
                diagnostics.warning(u.nameSpan(), "the unit of '" + u.name() + "' cannot be inferred from the relations",
                        "give it explicitly, e.g. unknown " + u.name() + " [Pa]");
            }
        }
    }
}
