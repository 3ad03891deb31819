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
        IExpr limit = symja.eval(F.Limit(f, F.Rule(x, point)));
        return limit.isAST(S.Limit) ? direct : limit;
    }

    static boolean isSingular(IExpr e) {
        return e.has(x -> x.isIndeterminate() || x.isDirectedInfinity() || x == S.ComplexInfinity || x == S.Indeterminate, true);
    }
}
