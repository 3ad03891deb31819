package dev.plumb.symbolic;

import org.matheclipse.core.expression.F;
import org.matheclipse.core.expression.S;
import org.matheclipse.core.interfaces.IExpr;
import org.matheclipse.core.interfaces.ISymbol;

/** The value of an expression in the coordinate at one point, taking the limit where the formula is 0/0 there (sin ξ/ξ at 0). */
final class Points {
    private Points() {
    }

    static IExpr at(Symja symja, IExpr f, ISymbol x, IExpr point) {
        IExpr direct = symja.eval(F.ReplaceAll(f, F.Rule(x, point)));
        if (!isSingular(direct)) return direct;
        IExpr limit = limit(symja, f, x, point);
        if (limit != null) return limit;
        // Symja's Limit answers Indeterminate for cos(x)/x - sin(x)/x^2 at 0 (the slope of sin(x)/x),
        // but finds the limit of the same function over one denominator.
        limit = limit(symja, F.Together(f), x, point);
        return limit != null ? limit : direct;
    }

    private static IExpr limit(Symja symja, IExpr f, ISymbol x, IExpr point) {
        try {
            IExpr limit = symja.eval(F.Limit(f, F.Rule(x, point)));
            return limit.isAST(S.Limit) || isSingular(limit) ? null : limit;
        } catch (Symja.Failure failure) {
            return null;
        }
    }

    /**
     * As {@link #at(Symja, IExpr, ISymbol, IExpr)} for a form that may be piecewise in x: the
     * branch is chosen first, deciding each condition at the point under the assumptions, so
     * that an infinite value in a branch that does not apply (1/r in an outer layer at r = 0)
     * never enters. A condition that cannot be decided leaves the form as it is.
     */
    static IExpr at(Symja symja, IExpr f, ISymbol x, IExpr point, IExpr assumptions) {
        IExpr branch = f;
        while (branch.isAST(S.Piecewise) && branch.first().isList()) {
            IExpr next = null;
            for (IExpr c : (org.matheclipse.core.interfaces.IAST) branch.first()) {
                if (!c.isList() || c.argSize() != 2) return at(symja, f, x, point);
                IExpr truth = symja.eval(F.Simplify(F.ReplaceAll(c.second(), F.Rule(x, point)), assumptions));
                if (truth.isTrue()) {
                    next = c.first();
                    break;
                }
                if (!truth.isFalse()) {
                    // Simplify decides some conditions only inside the Piecewise (R < R/2 for R > 0).
                    IExpr whole = symja.eval(F.Simplify(F.ReplaceAll(branch, F.Rule(x, point)), assumptions));
                    return whole.has(S.Piecewise, true) ? at(symja, f, x, point) : whole;
                }
            }
            if (next == null) next = branch.argSize() > 1 ? branch.second() : F.C0;
            branch = next;
        }
        return at(symja, branch, x, point);
    }

    static boolean isSingular(IExpr e) {
        return e.has(x -> x.isIndeterminate() || x.isDirectedInfinity() || x == S.ComplexInfinity || x == S.Indeterminate, true);
    }
}
