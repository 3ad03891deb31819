package dev.plumb.model;

import dev.plumb.lang.Diagnostic;
import dev.plumb.lang.Expr;
import dev.plumb.lang.Program;
import dev.plumb.lang.SourceFile;
import dev.plumb.lang.Stmt;
import dev.plumb.units.Dimension;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * A file after name resolution and unit checking: every symbol with its dimension, the
 * statements grouped by kind, the concrete cases with their values in SI, the unit checks and
 * the diagnostics. Later stages read it and never change it.
 *
 * @param symbols     user symbols in declaration order, then the built-in constants that are used
 * @param dimensions  the dimension of every expression node (identity keys)
 */
public record Model(
        Program program,
        String title,
        Map<String, Symbol> symbols,
        Optional<Symbol.Coordinate> coordinate,
        List<Stmt.Relation> relations,
        List<Stmt.Boundary> boundaries,
        List<Stmt.Step> steps,
        List<Stmt.Claim> claims,
        List<Stmt.Scaling> scalings,
        List<CaseValues> cases,
        List<Stmt.Expect> expects,
        List<Stmt.Show> shows,
        List<Stmt.Guess> guesses,
        List<SweepSpec> sweeps,
        Map<Expr, Dimension> dimensions,
        List<Check> unitChecks,
        List<Diagnostic> diagnostics) {

    public SourceFile source() {
        return program.source();
    }

    public boolean hasErrors() {
        return diagnostics.stream().anyMatch(d -> d.severity() == dev.plumb.lang.Severity.ERROR);
    }

    public Optional<Symbol> symbol(String name) {
        return Optional.ofNullable(symbols.get(name));
    }

    public <T extends Symbol> List<T> symbols(Class<T> kind) {
        return symbols.values().stream().filter(kind::isInstance).map(kind::cast).toList();
    }

    public List<Symbol.FreeParam> freeParams() {
        return symbols(Symbol.FreeParam.class);
    }

    public List<Symbol.Profile> profiles() {
        return symbols(Symbol.Profile.class);
    }

    public List<Symbol.UnknownConstant> unknownConstants() {
        return symbols(Symbol.UnknownConstant.class);
    }

    public Optional<SweepSpec> sweepNamed(String label) {
        return sweeps.stream().filter(s -> s.label().equals(label)).findFirst();
    }

    /** The expectations about one case (not about the extremum of a sweep). */
    public List<Stmt.Expect> caseExpects() {
        return expects.stream().filter(e -> e.extremum() == null).toList();
    }

    public Optional<CaseValues> caseNamed(String label) {
        return cases.stream().filter(c -> c.label().equals(label)).findFirst();
    }

    /** The dimension of an expression node of this model's program. */
    public Dimension dimensionOf(Expr e) {
        Dimension d = dimensions.get(e);
        return d != null ? d : Dimension.NONE;
    }
}
