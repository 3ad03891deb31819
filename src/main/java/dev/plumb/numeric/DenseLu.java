package dev.plumb.numeric;

/**
 * An LU factorisation with partial pivoting of a small dense matrix, factored in place and reused
 * for many right-hand sides: the collocation Newton systems of a series start (a few dozen rows)
 * are solved several times per integration, where Commons Math's general matrices cost more in
 * allocation than in arithmetic.
 */
final class DenseLu {

    private final double[][] lu;
    private final int[] pivot;

    private DenseLu(double[][] lu, int[] pivot) {
        this.lu = lu;
        this.pivot = pivot;
    }

    /** Factors {@code a} (overwritten); null when a pivot vanishes or is not finite. */
    static DenseLu factor(double[][] a) {
        int n = a.length;
        int[] pivot = new int[n];
        for (int k = 0; k < n; k++) {
            int p = k;
            double big = Math.abs(a[k][k]);
            for (int i = k + 1; i < n; i++) {
                double v = Math.abs(a[i][k]);
                if (v > big) {
                    big = v;
                    p = i;
                }
            }
            if (!(big > 0) || !Double.isFinite(big)) return null;
            pivot[k] = p;
            if (p != k) {
                double[] t = a[p];
                a[p] = a[k];
                a[k] = t;
            }
            double[] rowK = a[k];
            double inv = 1.0 / rowK[k];
            for (int i = k + 1; i < n; i++) {
                double[] row = a[i];
                double m = row[k] * inv;
                row[k] = m;
                if (m != 0) for (int j = k + 1; j < n; j++) row[j] -= m * rowK[j];
            }
        }
        return new DenseLu(a, pivot);
    }

    /** Solves A x = b in place ({@code b} becomes x). */
    void solve(double[] b) {
        int n = lu.length;
        for (int k = 0; k < n; k++) {
            int p = pivot[k];
            if (p != k) {
                double t = b[p];
                b[p] = b[k];
                b[k] = t;
            }
        }
        for (int i = 1; i < n; i++) {
            double s = b[i];
            double[] row = lu[i];
            for (int j = 0; j < i; j++) s -= row[j] * b[j];
            b[i] = s;
        }
        for (int i = n - 1; i >= 0; i--) {
            double s = b[i];
            double[] row = lu[i];
            for (int j = i + 1; j < n; j++) s -= row[j] * b[j];
            b[i] = s / row[i];
        }
    }
}
