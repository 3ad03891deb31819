package dev.plumb.scaling;

import dev.plumb.units.Dimension;
import dev.plumb.units.Rational;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Buckingham-π analysis of one quantity against the dimensional inputs it depends on: the
 * dimension matrix, its rank, the dimensionless groups, and whether the quantity's exponents in
 * the inputs are fixed by dimensions alone.
 *
 * @param inputs      each input's name and dimension, in the order given
 * @param rank        rank of the dimension matrix of the inputs
 * @param exponents   one solution of "product of inputs^a has the quantity's dimension" (inputs
 *                    not needed get 0); empty when no product of the inputs has that dimension
 * @param unique      whether that solution is the only one (no dimensionless group among the inputs)
 * @param groups      a basis of the dimensionless products of the inputs (each a map name → exponent,
 *                    integer exponents where possible); the quantity depends on these freely
 */
public record DimensionalAnalysis(Map<String, Dimension> inputs, int rank, Optional<Map<String, Rational>> exponents,
                                  boolean unique, List<Map<String, Rational>> groups) {

    /** Analyses a quantity of dimension {@code target} against {@code inputs}. */
    public static DimensionalAnalysis of(Dimension target, Map<String, Dimension> inputs) {
        List<String> names = new ArrayList<>(inputs.keySet());
        int rows = Dimension.Base.values().length;
        int cols = names.size();
        // Augmented matrix [A | target], one row per base dimension.
        Rational[][] m = new Rational[rows][cols + 1];
        for (int i = 0; i < rows; i++) {
            Dimension.Base b = Dimension.Base.values()[i];
            for (int j = 0; j < cols; j++) m[i][j] = inputs.get(names.get(j)).exponent(b);
            m[i][cols] = target.exponent(b);
        }
        int[] pivotCol = new int[rows];
        int rank = reduce(m, rows, cols, pivotCol);
        boolean consistent = true;
        for (int i = rank; i < rows; i++) {
            if (!m[i][cols].isZero()) consistent = false;
        }
        boolean[] isPivot = new boolean[cols];
        for (int i = 0; i < rank; i++) isPivot[pivotCol[i]] = true;

        Optional<Map<String, Rational>> exponents = Optional.empty();
        if (consistent) {
            Map<String, Rational> e = new LinkedHashMap<>();
            for (String n : names) e.put(n, Rational.ZERO);
            for (int i = 0; i < rank; i++) e.put(names.get(pivotCol[i]), m[i][cols]);
            exponents = Optional.of(e);
        }
        List<Map<String, Rational>> groups = new ArrayList<>();
        for (int free = 0; free < cols; free++) {
            if (isPivot[free]) continue;
            Rational[] v = new Rational[cols];
            java.util.Arrays.fill(v, Rational.ZERO);
            v[free] = Rational.ONE;
            for (int i = 0; i < rank; i++) v[pivotCol[i]] = m[i][free].neg();
            groups.add(integral(names, v));
        }
        return new DimensionalAnalysis(java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(inputs)), rank, exponents, consistent && groups.isEmpty(), List.copyOf(groups));
    }

    /** Reduced row echelon form in place; returns the rank and fills the pivot columns. */
    private static int reduce(Rational[][] m, int rows, int cols, int[] pivotCol) {
        int r = 0;
        for (int c = 0; c < cols && r < rows; c++) {
            int p = -1;
            for (int i = r; i < rows; i++) {
                if (!m[i][c].isZero()) {
                    p = i;
                    break;
                }
            }
            if (p < 0) continue;
            Rational[] t = m[p];
            m[p] = m[r];
            m[r] = t;
            Rational lead = m[r][c];
            for (int j = 0; j <= cols; j++) m[r][j] = m[r][j].div(lead);
            for (int i = 0; i < rows; i++) {
                if (i == r || m[i][c].isZero()) continue;
                Rational f = m[i][c];
                for (int j = 0; j <= cols; j++) m[i][j] = m[i][j].sub(f.mul(m[r][j]));
            }
            pivotCol[r] = c;
            r++;
        }
        return r;
    }

    /** Scales a rational vector to the smallest integer one with the same direction. */
    private static Map<String, Rational> integral(List<String> names, Rational[] v) {
        long lcm = 1;
        for (Rational x : v) lcm = lcm / gcd(lcm, x.den()) * x.den();
        Map<String, Rational> out = new LinkedHashMap<>();
        for (int j = 0; j < v.length; j++) {
            if (!v[j].isZero()) out.put(names.get(j), v[j].mul(Rational.of(lcm)));
        }
        return out;
    }

    private static long gcd(long a, long b) {
        return b == 0 ? Math.abs(a) : gcd(b, a % b);
    }

    /**
     * Whether dimensions alone fix the quantity's exponents in {@code free}: some product of the
     * inputs has its dimension, and no dimensionless group holds any of {@code free} (a group of
     * constants and fixed parameters alone does not vary, so it cannot bend a scaling).
     */
    public boolean fixesExponentsOf(java.util.Collection<String> free) {
        if (exponents.isEmpty()) return false;
        return groups.stream().noneMatch(g -> free.stream().anyMatch(p -> !g.getOrDefault(p, Rational.ZERO).isZero()));
    }

    /** The dimensionless groups that hold at least one of {@code free}: the ones a scaling can depend on. */
    public List<Map<String, Rational>> groupsHolding(java.util.Collection<String> free) {
        return groups.stream().filter(g -> free.stream().anyMatch(p -> !g.getOrDefault(p, Rational.ZERO).isZero())).toList();
    }

    /** The number of dimensionless groups including the quantity itself (Buckingham's k + 1 − rank). */
    public int groupCountWithQuantity() {
        return exponents.isPresent() ? groups.size() + 1 : groups.size();
    }

    /** A product such as {@code G*M^2*R^-4} for a map of exponents, skipping zero exponents. */
    public static String monomial(Map<String, Rational> exponents) {
        StringBuilder out = new StringBuilder();
        exponents.forEach((name, p) -> {
            if (p.isZero()) return;
            if (out.length() > 0) out.append('*');
            out.append(name);
            if (!p.equals(Rational.ONE)) out.append('^').append(p.isInteger() && p.num() >= 0 ? p.toString() : "(" + p + ")");
        });
        return out.length() == 0 ? "1" : out.toString();
    }

    /** One sentence for reports: the form the quantity must take. */
    public String describe(String quantity) {
        if (exponents.isEmpty()) {
            return "no product of " + String.join(", ", inputs.keySet()) + " has the unit of " + quantity
                    + ": it depends on something else as well";
        }
        String base = quantity + " = " + monomial(exponents.get());
        if (unique) return base + " times a pure number: the exponents are fixed by dimensions alone";
        List<String> gs = groups.stream().map(DimensionalAnalysis::monomial).toList();
        return base + " times a function of " + String.join(", ", gs)
                + ": dimensions alone leave " + gs.size() + " free group" + (gs.size() == 1 ? "" : "s");
    }
}
