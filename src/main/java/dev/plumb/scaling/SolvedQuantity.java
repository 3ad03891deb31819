package dev.plumb.scaling;

import dev.plumb.lang.Expr;
import dev.plumb.model.ConstantEvaluator;
import dev.plumb.model.Model;
import dev.plumb.numeric.NumericEngine;
import dev.plumb.numeric.NumericOptions;
import java.util.Map;

/**
 * A quantity of the free parameters obtained by solving the model's relations numerically (or
 * evaluating it directly when there is nothing to solve), with an error estimate from a second
 * solve a hundred times tighter: the tighter value is returned and the difference bounds its error
 * from above, which is what a sweep needs to tell a curved log–log line from solver noise.
 */
public final class SolvedQuantity implements ParameterSensitivity.Quantity {
    private final Model model;
    private final Expr quantity;
    private final NumericOptions options;

    /** @param options the tolerance of the first solve; the second is {@link NumericOptions#tighter()} */
    public SolvedQuantity(Model model, Expr quantity, NumericOptions options) {
        this.model = model;
        this.quantity = quantity;
        this.options = options.withoutErrorEstimate();
    }

    private boolean direct() {
        return model.profiles().isEmpty() && model.unknownConstants().isEmpty();
    }

    @Override
    public double at(Map<String, Double> parameters) throws Exception {
        if (direct()) return new ConstantEvaluator(n -> model.symbols().get(n), parameters).evaluate(quantity);
        return NumericEngine.solve(model, parameters, options).evaluate(quantity);
    }

    @Override
    public ParameterSensitivity.Estimate estimate(Map<String, Double> parameters) throws Exception {
        if (direct()) return ParameterSensitivity.Quantity.super.estimate(parameters);
        double coarse = at(parameters);
        double fine = NumericEngine.solve(model, parameters, options.tighter()).evaluate(quantity);
        return new ParameterSensitivity.Estimate(fine, Math.abs(fine - coarse));
    }
}
