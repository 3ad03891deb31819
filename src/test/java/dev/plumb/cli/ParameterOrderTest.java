package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * An order between parameters, {@code param Rc [m] > 0, < R}, lets a layered body be decided, and
 * a case that breaks it (or a sign assumption) is an error at the value.
 */
class ParameterOrderTest {

    /**
     * A core of density rho_1 inside Rc and a mantle of rho_2 out to R. Central pressure by hand, layer by
     * layer: the core gives (2/3) pi G rho_1^2 Rc^2; the mantle, where m = (4/3) pi ((rho_1 - rho_2) Rc^3 + rho_2 r^3),
     * gives (4/3) pi G rho_2 (rho_1 - rho_2) Rc^3 (1/Rc - 1/R) + (2/3) pi G rho_2^2 (R^2 - Rc^2).
     */
    private static final String TWO_LAYERS = """
            param rho_1 [kg/m^3] > 0
            param rho_2 [kg/m^3] > 0
            param R [m] > 0
            param Rc [m] > 0, < R
            coord r [m] from 0 to R
            let rho(r) = if r < Rc then rho_1 else rho_2
            unknown m(r) [kg]
            unknown P(r) [Pa]
            relation mass: m'(r) = 4*pi*r^2*rho(r)
            relation balance: P'(r) = -G*m(r)*rho(r)/r^2
            boundary centre: m(0) = 0
            boundary surface: P(R) = 0
            claim central: P(0) = 2/3*pi*G*rho_1^2*Rc^2 + 4/3*pi*G*rho_2*(rho_1 - rho_2)*Rc^3*(1/Rc - 1/R) + 2/3*pi*G*rho_2^2*(R^2 - Rc^2)
            claim core_boundary: P(Rc) = 4/3*pi*G*rho_2*(rho_1 - rho_2)*Rc^3*(1/Rc - 1/R) + 2/3*pi*G*rho_2^2*(R^2 - Rc^2)
            case rocky: rho_1 = 11000 [kg/m^3], rho_2 = 4400 [kg/m^3], R = 6371 [km], Rc = 3480 [km]
            """;

    @Test
    void aTwoLayerPlanetsPressuresAreDecided() {
        CheckedText t = CheckedText.of("two-layers", TWO_LAYERS);
        for (String label : new String[]{"central", "core_boundary"}) {
            Map<String, Object> c = t.list("checks").stream().filter(k -> "claim".equals(k.get("kind")) && label.equals(k.get("label")))
                    .findFirst().orElseThrow();
            assertEquals("holds", c.get("status"), c.toString());
        }
    }

    @Test
    void aWrongLayerTermFails() {
        CheckedText t = CheckedText.of("two-layers-wrong", TWO_LAYERS.replace("claim central: P(0) = 2/3*pi", "claim central: P(0) = 4/3*pi"));
        Map<String, Object> c = t.list("checks").stream().filter(k -> "claim".equals(k.get("kind")) && "central".equals(k.get("label")))
                .findFirst().orElseThrow();
        assertEquals("fails", c.get("status"), c.toString());
    }

    @Test
    void aCaseThatBreaksTheOrderIsAnErrorAtItsValue() throws IOException {
        Path dir = Files.createTempDirectory("plumb-order");
        Path file = dir.resolve("order.plumb");
        Files.writeString(file, TWO_LAYERS.replace("Rc = 3480 [km]", "Rc = 7000 [km]"));
        try {
            Run run = Run.of("check", "--no-color", file.toString());
            assertTrue(run.all().contains("order.plumb:15:80: error: case 'rocky' gives Rc = 7000 [km], which breaks 'Rc < R'"), run.all());
            assertEquals(2, run.status(), run.all());
        } finally {
            Files.deleteIfExists(file);
            Files.deleteIfExists(dir);
        }
    }

    @Test
    void aCaseThatBreaksASignIsAnError() throws IOException {
        Path dir = Files.createTempDirectory("plumb-order");
        Path file = dir.resolve("sign.plumb");
        Files.writeString(file, TWO_LAYERS.replace("rho_2 = 4400 [kg/m^3]", "rho_2 = -4400 [kg/m^3]"));
        try {
            Run run = Run.of("check", "--no-color", file.toString());
            assertTrue(run.all().contains("error: case 'rocky' gives rho_2 = -4400 [kg/m^3], but 'rho_2' is declared > 0"), run.all());
            assertEquals(2, run.status(), run.all());
        } finally {
            Files.deleteIfExists(file);
            Files.deleteIfExists(dir);
        }
    }
}
