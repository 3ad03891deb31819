package dev.plumb.scaling;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Span;
import dev.plumb.lang.Stmt;
import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import dev.plumb.units.Rational;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The characteristic length of a first-order relation {@code y'(x) = F}: when y/F is a power law
 * in parameters and constants alone (no coordinate, no profile), it is the e-folding scale of y,
 * e.g. the isothermal scale height k_B T / (mu m_u g).
 *
 * @param relation the relation's label
 * @param profile  the profile y
 * @param scale    the scale as a product of powers (name → exponent)
 * @param matches  the name of a parameter-free definition with exactly this scale, if any
 */
public record ScaleLength(String relation, String profile, Map<String, Rational> scale, Optional<String> matches) {

    public String printed() {
        return DimensionalAnalysis.monomial(scale);
    }

    public static List<ScaleLength> find(Model model) {
        List<ScaleLength> out = new ArrayList<>();
        String coord = model.coordinate().map(Symbol.Coordinate::name).orElse(null);
        if (coord == null) return out;
        Monomial monomial = new Monomial(name -> model.symbol(name).orElse(null), true);
        for (Stmt.Relation r : model.relations()) {
            if (!(r.equation().lhs() instanceof Expr.Call d) || d.order() != 1) continue;
            // y / F as a product: y^1 * F^-1, with profile values as atoms and definitions expanded.
            Expr y = new Expr.Call(d.callee(), d.calleeSpan(), 0, d.args(), d.span());
            Expr ratio = new Expr.Binary(Expr.BinaryOp.DIV, y, r.equation().rhs(), Span.NONE);
            Optional<Map<String, Rational>> e = monomial.exponents(ratio);
            if (e.isEmpty() || e.get().isEmpty()) continue;
            boolean pure = e.get().keySet().stream().allMatch(n -> {
                Symbol s = model.symbol(n).orElse(null);
                return s instanceof Symbol.FreeParam || s instanceof Symbol.FixedParam || s instanceof Symbol.Builtin;
            });
            if (!pure) continue;
            String label = r.label().present() ? r.label().name() : "line " + r.span().line();
            out.add(new ScaleLength(label, d.callee(), e.get(), matching(model, monomial, e.get())));
        }
        return out;
    }

    private static Optional<String> matching(Model model, Monomial monomial, Map<String, Rational> scale) {
        for (Symbol.Definition d : model.symbols(Symbol.Definition.class)) {
            if (!d.params().isEmpty()) continue;
            Optional<Map<String, Rational>> e = monomial.exponents(new Expr.Name(d.name(), Span.NONE));
            if (e.isPresent() && e.get().equals(scale)) return Optional.of(d.name());
        }
        return Optional.empty();
    }

    /** Printed as a plumb expression, for messages. */
    public String describe() {
        return "scale length of " + profile + " in relation '" + relation + "': " + printed()
                + matches.map(m -> " (= " + m + ")").orElse("");
    }
}
