package dev.plumb.numeric;

/**
 * One line of a case's comparison table, values in SI: {@code unit} is the SI unit name,
 * {@code closedForm} and {@code relDiff} are null when no closed form is known,
 * {@code errorEstimate} is the estimated absolute error of {@code numeric} (NaN when not
 * estimated), and {@code shownFactor} is the SI value of one {@code shownUnit}
 * ({@code shownUnit} null and factor 1 when shown in SI). {@code comparedWith} says where the
 * closed form came from: "derived" (the symbolic engine) or "claim" (the right side of a claim).
 */
public record QuantityRow(String expr, String unit, Double closedForm, double numeric, Double relDiff,
                          double errorEstimate, String shownUnit, double shownFactor, String comparedWith) {

    public QuantityRow(String expr, String unit, Double closedForm, double numeric, Double relDiff,
                       double errorEstimate, String shownUnit, double shownFactor) {
        this(expr, unit, closedForm, numeric, relDiff, errorEstimate, shownUnit, shownFactor,
                closedForm == null ? null : "derived");
    }
}
