package dev.plumb.cli;

import static dev.plumb.cli.Codata2018.C;
import static dev.plumb.cli.Codata2018.G;
import static dev.plumb.cli.Codata2018.H;
import static dev.plumb.cli.Codata2018.HBAR;
import static dev.plumb.cli.Codata2018.MSUN;
import static dev.plumb.cli.Codata2018.M_E;
import static dev.plumb.cli.Codata2018.M_U;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * White dwarfs of the full zero-temperature electron gas (Chandrasekhar 1935; 1939, ch. XI):
 * P = A f(x), rho = B x^3, x the Fermi momentum over m_e c. Written twice, in u = sqrt(1 + x^2)
 * (the surface is u = 1, where u' stays finite) and in x itself (the surface is x = 0, where x' is
 * infinite). Both are checked against the test's own solve of Chandrasekhar's dimensionless
 * equation (1/eta^2) (eta^2 phi')' = -(phi^2 - 1/y0^2)^(3/2), phi = u/y0, y0^2 = 1 + x_c^2, by
 * fixed-step Runge–Kutta, scaled back to SI with CODATA 2018 constants.
 */
class ElectronGasDwarfTest {

    static final double MU_E = 2;
    static final double A = Math.PI * Math.pow(M_E, 4) * Math.pow(C, 5) / (3 * Math.pow(H, 3));
    static final double B = 8 * Math.PI * Math.pow(M_E, 3) * Math.pow(C, 3) * MU_E * M_U / (3 * Math.pow(H, 3));

    static final String CASES = """
            case one: x_c = 1
            case five: x_c = 5
            case twenty: x_c = 20
            case thousand: x_c = 1000
            show m(R) in [Msun]
            show R in [km]
            """;

    static final String IN_U = """
            title "Zero-temperature electron gas, written in u = sqrt(1 + x^2)"
            param x_c > 0
            param mu_e = 2
            let A = pi*m_e^4*c^5/(3*h^3)
            let B = 8*pi*m_e^3*c^3*mu_e*m_u/(3*h^3)
            unknown R [m]
            coord r [m] from 0 to R
            unknown u(r)
            unknown m(r) [kg]
            relation balance: u'(r) = -G*m(r)*B/(8*A*r^2)
            relation mass: m'(r) = 4*pi*r^2*B*(u(r)^2 - 1)^(3/2)
            boundary u(0) = sqrt(1 + x_c^2)
            boundary m(0) = 0
            boundary u(R) = 1
            """ + CASES;

    // dP/dx = A f'(x) = 8 A x^4 / sqrt(1 + x^2) and rho = B x^3 turn dP/dr = -G m rho / r^2 into this.
    static final String IN_X = """
            title "Zero-temperature electron gas, written in x"
            param x_c > 0
            param mu_e = 2
            let A = pi*m_e^4*c^5/(3*h^3)
            let B = 8*pi*m_e^3*c^3*mu_e*m_u/(3*h^3)
            unknown R [m]
            coord r [m] from 0 to R
            unknown x(r)
            unknown m(r) [kg]
            relation balance: x'(r) = -G*m(r)*B*sqrt(1 + x(r)^2)/(8*A*x(r)*r^2)
            relation mass: m'(r) = 4*pi*r^2*B*x(r)^3
            boundary x(0) = x_c
            boundary m(0) = 0
            boundary x(R) = 0
            """ + CASES;

    private static final Map<String, CheckedText> RUNS = new HashMap<>();

    static synchronized CheckedText run(String form) {
        return RUNS.computeIfAbsent(form, f -> CheckedText.of("electron-gas-in-" + f, f.equals("u") ? IN_U : IN_X));
    }

    /** Mass [kg] and radius [m] from the test's own solve at Runge–Kutta step h in eta. */
    record Dwarf(double mass, double radius) {
    }

    static Dwarf emden(double xc, double h) {
        double y0 = Math.sqrt(1 + xc * xc), a2 = 1 / (y0 * y0);
        Rk4.Field f = (eta, y, dy) -> {
            double q = Math.max(y[0] * y[0] - a2, 0);   // zero beyond the surface, where the bisection may look
            dy[0] = y[1];
            dy[1] = -q * Math.sqrt(q) - 2 * y[1] / eta;
        };
        // Series at the regular centre: phi = 1 - q0 eta^2/6 + q0 q0' eta^4/120, q0 = (1 - a^2)^(3/2), q0' = 3 (1 - a^2)^(1/2).
        double e0 = 1e-3, q0 = Math.pow(1 - a2, 1.5), dq0 = 3 * Math.sqrt(1 - a2);
        double[] start = {1 - q0 * e0 * e0 / 6 + q0 * dq0 * Math.pow(e0, 4) / 120, -q0 * e0 / 3 + q0 * dq0 * Math.pow(e0, 3) / 30};
        Rk4.State s = Rk4.toSurface(f, e0, start, h, y -> y[0] - Math.sqrt(a2), 100);
        // r = alpha eta with alpha = sqrt(2A/(pi G)) / (B y0); M = 4 pi (2A/(pi G))^(3/2) / B^2 * (-eta1^2 phi'(eta1)).
        double scale = Math.sqrt(2 * A / (Math.PI * G));
        return new Dwarf(4 * Math.PI * Math.pow(scale, 3) / (B * B) * (-s.t() * s.t() * s.y()[1]), scale / (B * y0) * s.t());
    }

    /** The test's own answer, its step error checked to be far below the tolerance used against plumb. */
    static Dwarf reference(double xc) {
        Dwarf coarse = emden(xc, 2e-4), fine = emden(xc, 1e-4);
        assertEquals(fine.mass(), coarse.mass(), 1e-11 * fine.mass(), "the test's own Runge-Kutta mass is not converged");
        assertEquals(fine.radius(), coarse.radius(), 1e-11 * fine.radius(), "the test's own Runge-Kutta radius is not converged");
        return fine;
    }

    @ParameterizedTest(name = "written in {0}, x_c = {2}")
    @CsvSource({"u, one, 1", "u, five, 5", "u, twenty, 20", "u, thousand, 1000",
            "x, one, 1", "x, five, 5", "x, twenty, 20", "x, thousand, 1000"})
    void massAndRadiusAgreeWithAnIndependentSolve(String form, String label, double xc) {
        Dwarf ref = reference(xc);
        CheckedText r = run(form);
        double m = r.numeric(label, "m(R)"), radius = r.numeric(label, "R");
        assertEquals(ref.mass(), m, 1e-8 * ref.mass(), () -> "m(R) written in " + form + " at x_c = " + xc + ": plumb "
                + m / MSUN + " Msun, the test's own solve " + ref.mass() / MSUN + " Msun");
        assertEquals(ref.radius(), radius, 1e-8 * ref.radius(), () -> "R written in " + form + " at x_c = " + xc + ": plumb "
                + radius / 1e3 + " km, the test's own solve " + ref.radius() / 1e3 + " km");
    }

    @Test
    void massRisesTowardChandrasekharsLimit() {
        // Limiting mass (sqrt(3 pi)/2) omega_3 (hbar c/G)^(3/2)/(mu_e m_u)^2, omega_3 = 2.01824 (Chandrasekhar 1939,
        // table of polytropes): 1.456300 Msun. The test's own solve gives M/M_lim = 0.35034, 0.87400, 0.98768 and
        // 0.9999925 at x_c = 1, 5, 20, 1000 (the last gap is 5.5e-6 once omega_3's rounding, 2e-6, is allowed for).
        double limit = Math.sqrt(3 * Math.PI) / 2 * 2.01824 * Math.pow(HBAR * C / G, 1.5) / Math.pow(MU_E * M_U, 2);
        CheckedText r = run("u");
        double previous = 0;
        for (String label : new String[] {"one", "five", "twenty", "thousand"}) {
            double m = r.numeric(label, "m(R)");
            double p = previous;
            assertTrue(m > p && m < limit, () -> "case " + label + ": m(R) = " + m / MSUN + " Msun should exceed the previous "
                    + p / MSUN + " Msun and stay below the limit " + limit / MSUN + " Msun");
            previous = m;
        }
        double gap = 1 - previous / limit;
        assertTrue(gap > 0 && gap < 1.5e-5, "at x_c = 1000 the mass should be within 1.5e-5 below the limiting mass; gap " + gap);
        double twenty = r.numeric("twenty", "m(R)") / limit;
        assertEquals(reference(20).mass() / limit, twenty, 1e-8, "M/M_lim at x_c = 20");
    }
}
