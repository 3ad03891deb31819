package dev.plumb.symbolic;

import dev.plumb.lang.Expr;
import dev.plumb.model.ConstantEvaluator;
import dev.plumb.model.Model;
import java.util.Map;

/** Evaluates a derived closed form in SI, as the numeric stage will. */
final class ConstantEvaluatorSupport {
    private ConstantEvaluatorSupport() {
    }

    static double evaluate(Model model, Expr e, Map<String, Double> bindings) {
        try {
            return new ConstantEvaluator(n -> model.symbols().get(n), bindings).evaluate(e);
        } catch (ConstantEvaluator.NotConstant ex) {
            throw new AssertionError(ex.getMessage());
        }
    }
}
