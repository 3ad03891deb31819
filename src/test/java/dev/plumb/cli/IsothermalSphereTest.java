package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/**
 * The isothermal self-gravitating sphere in Emden's variable psi = ln(rho_c/rho): its density
 * contrast at the critical radius, rho_c/rho = 14.04 at xi = 6.451 (Bonnor 1956, Ebert 1955),
 * from the relation alone, started at the singular centre by the series start.
 */
class IsothermalSphereTest {

    @Test
    void theCriticalDensityContrastIs14point04() {
        CheckedText t = CheckedText.of("isothermal-sphere", """
                coord xi from 0 to 10
                unknown psi(xi)
                relation emden: psi''(xi) = exp(-psi(xi)) - 2/xi*psi'(xi)
                boundary centre: psi(0) = 0
                boundary regular: psi'(0) = 0
                show exp(psi(6.451))
                """);
        // Bonnor (1956) and Ebert (1955) give 14.04 to four figures (the value recalled from memory of their tables).
        assertEquals(14.04, t.numeric("fixed", "exp(psi(6.451))"), 0.005);
    }
}
