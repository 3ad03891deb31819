package dev.plumb.cli;

import static dev.plumb.cli.Codata2018.C;
import static dev.plumb.cli.Codata2018.G;
import static dev.plumb.cli.Codata2018.MSUN;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.HashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * General-relativistic hydrostatic balance (Tolman–Oppenheimer–Volkoff) of a Gamma = 2 polytrope,
 * K = 100 in units G = c = Msun = 1, central density q in the same units, surface free. Written two
 * ways: P = K rho^2 with rho the total mass-energy density over c^2; and P = K rho0^2 with rho0 the
 * rest-mass density, the total being rho0 + P/((Gamma - 1) c^2). Each against the test's own solve in
 * units G = c = K = 1 with the density itself, not the pressure, as the dependent variable.
 */
class TolmanOppenheimerVolkoffTest {

    static final String HEAD = """
            param q > 0                                    # central density in units G = c = Msun = 1
            let K = 100*G^3*(1 [Msun])^2/c^4               # K = 100 in the same units
            let rho_c = q*c^6/(G^3*(1 [Msun])^2)
            unknown R [m]
            coord r [m] from 0 to R
            unknown P(r) [Pa]
            unknown m(r) [kg]
            """;

    static final String BALANCE = """
            relation tov: P'(r) = -G*(rho(r) + P(r)/c^2)*(m(r) + 4*pi*r^3*P(r)/c^2)/(r^2*(1 - 2*G*m(r)/(r*c^2)))
            relation mass: m'(r) = 4*pi*r^2*rho(r)
            boundary centre: P(0) = K*rho_c^2
            boundary m(0) = 0
            boundary surface: P(R) = 0
            case low: q = 5e-4
            case mid: q = 1.28e-3
            case high: q = 3e-3
            show m(R) in [Msun]
            show R in [km]
            """;

    static final String TOTAL = "title \"TOV, P = K rho^2, rho the total mass-energy density over c^2\"\n" + HEAD + """
            let rho(r) = sqrt(P(r)/K)
            """ + BALANCE;

    static final String REST = "title \"TOV, P = K rho0^2, rho0 the rest-mass density\"\n" + HEAD + """
            let rho0(r) = sqrt(P(r)/K)
            let rho(r) = rho0(r) + P(r)/c^2              # rest mass plus internal energy P/(Gamma - 1)
            """ + BALANCE;

    private static final Map<String, CheckedText> RUNS = new HashMap<>();

    static synchronized CheckedText run(String density) {
        return RUNS.computeIfAbsent(density, d -> CheckedText.of("tov-" + d, d.equals("total") ? TOTAL : REST));
    }

    record Star(double mass, double radius) {
    }

    /**
     * The test's own solve in units G = c = K = 1 (length a = sqrt(K/G) = 10 G Msun/c^2), with y the
     * density that P = y^2 is written in and e = y + beta y^2 the total (beta = 0 or 1):
     * dy/dx = -(1 + (1 + beta) y)(m + 4 pi x^3 y^2) / (2 x^2 (1 - 2m/x)), dm/dx = 4 pi x^2 e.
     */
    static Star ownSolve(double q, double beta, double h) {
        double yc = 100 * q, ec = yc + beta * yc * yc, pc = yc * yc;
        Rk4.Field f = (x, s, ds) -> {
            double y = s[0], m = s[1];
            ds[0] = -(1 + (1 + beta) * y) * (m + 4 * Math.PI * x * x * x * y * y) / (2 * x * x * (1 - 2 * m / x));
            ds[1] = 4 * Math.PI * x * x * (y + beta * y * y);
        };
        double x0 = 1e-4;   // series at the centre, next terms O(x0^4)
        double[] start = {yc - (1 + (1 + beta) * yc) * (4.0 / 3 * Math.PI * ec + 4 * Math.PI * pc) * x0 * x0 / 4,
                4.0 / 3 * Math.PI * x0 * x0 * x0 * ec};
        Rk4.State s = Rk4.toSurface(f, x0, start, h, y -> y[0], 100);
        double a = Math.sqrt(100 * G * G * G * MSUN * MSUN / Math.pow(C, 4) / G);
        return new Star(s.y()[1] * a * C * C / G, s.t() * a);
    }

    static Star reference(double q, double beta) {
        Star coarse = ownSolve(q, beta, 2e-5), fine = ownSolve(q, beta, 1e-5);
        assertEquals(fine.mass(), coarse.mass(), 1e-11 * fine.mass(), "the test's own Runge-Kutta mass is not converged");
        assertEquals(fine.radius(), coarse.radius(), 1e-11 * fine.radius(), "the test's own Runge-Kutta radius is not converged");
        return fine;
    }

    @ParameterizedTest(name = "rho {0}, q = {2}")
    @CsvSource({"total, low, 5e-4", "total, mid, 1.28e-3", "total, high, 3e-3",
            "rest, low, 5e-4", "rest, mid, 1.28e-3", "rest, high, 3e-3"})
    void massAndRadiusAgreeWithAnIndependentSolve(String density, String label, double q) {
        Star ref = reference(q, density.equals("total") ? 0 : 1);
        CheckedText r = run(density);
        double m = r.numeric(label, "m(R)"), radius = r.numeric(label, "R");
        assertEquals(ref.mass(), m, 1e-8 * ref.mass(), () -> "m(R), rho " + density + ", q = " + q + ": plumb " + m / MSUN
                + " Msun, the test's own solve " + ref.mass() / MSUN + " Msun");
        assertEquals(ref.radius(), radius, 1e-8 * ref.radius(), () -> "R, rho " + density + ", q = " + q + ": plumb "
                + radius / 1e3 + " km, the test's own solve " + ref.radius() / 1e3 + " km");
    }

    @Test
    void restMassStarIsTheCommonTestStar() {
        // From memory, not from a checked source: K = 100, Gamma = 2, rho0_c = 1.28e-3 (G = c = Msun = 1) is the
        // usual test star of numerical relativity, M = 1.400 Msun and R = 9.586 in those units (about 14.15 km).
        // The test's own solve gives 1.400160 Msun and 9.585624.
        CheckedText r = run("rest");
        double m = r.numeric("mid", "m(R)") / MSUN;
        double radius = r.numeric("mid", "R") / (G * MSUN / (C * C));
        assertEquals(1.400, m, 5e-4, "m(R) in Msun");
        assertEquals(9.586, radius, 5e-4, "R in units of G Msun/c^2");
    }
}
