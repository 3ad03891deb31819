package dev.plumb.model;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Stmt;
import dev.plumb.units.Dimension;
import dev.plumb.units.Unit;
import dev.plumb.units.UnitParser;
import org.junit.jupiter.api.Test;

/**
 * Which unit a file works in for a value: a show's or an expectation's for its quantity, a symbol's own
 * declaration, else the first the file writes for the dimension, else SI; and how a value is written
 * in it with SI beside. Conversion factors: NIST SP 811 (2008) appendix B (1 dyn/cm^2 = 0.1 Pa,
 * 1 g/cm^3 = 1000 kg/m^3) and the SI Brochure, 9th ed. (1 bar = 1e5 Pa, 1 km = 1000 m).
 */
class FileUnitsTest {

    private static final String FILE = """
            param rho [g/cm^3] > 0
            param M [kg] > 0
            param R [km] > 0
            coord r [cm] from 0 to R
            let m(r) = 4/3*pi*r^3*rho
            unknown P(r) [dyn/cm^2]
            relation balance: P'(r) = -G*m(r)*rho/r^2
            boundary surface: P(R) = 0
            case a: rho = 5.5 [g/cm^3], M = 1 [Msun], R = 6371 [km]
            expect centre: P(0) at a = 1.7 [bar] within 1%
            show P(R/2) in [atm]
            show P(R/2)
            show m(R)
            """;

    private static Dimension dim(String unit) throws Exception {
        return UnitParser.parse(unit).dimension();
    }

    private static Expr shown(Model model, int i) {
        return model.shows().get(i).expr();
    }

    @Test
    void placesAlongTheCoordinateAreInItsDeclaredUnitAndSymbolsInTheirOwn() {
        FileUnits units = FileUnits.of(Checking.of(FILE).model);
        assertEquals("cm", units.coordinate().text());
        assertEquals("km", units.forSymbol("R").text(), "R declares km, though the coordinate is in cm");
        assertEquals("dyn/cm^2", units.forSymbol("P").text());
    }

    @Test
    void aDimensionTakesTheFirstUnitTheFileWritesForItElseSi() throws Exception {
        FileUnits units = FileUnits.of(Checking.of(FILE).model);
        assertEquals("g/cm^3", units.forDimension(dim("kg/m^3")).text());
        assertEquals("kg", units.forDimension(dim("kg")).text(), "param M [kg] comes before the case's Msun");
        assertEquals("km", units.forDimension(dim("m")).text(), "param R [km] comes before coord r [cm]");
        assertEquals("dyn/cm^2", units.forDimension(dim("Pa")).text());
        Unit energy = units.forDimension(dim("J"));
        assertEquals("J", energy.text(), "nothing in the file is an energy: SI");
        assertEquals(1.0, energy.factor());
    }

    @Test
    void aQuantityTakesTheUnitOfItsShowOrExpectation() {
        Model model = Checking.of(FILE).model;
        FileUnits units = FileUnits.of(model);
        Stmt.Expect centre = model.expects().get(0);
        assertEquals("bar", units.forQuantity(centre.lhs()).text(), "expect P(0) ... [bar]");
        assertEquals("atm", units.forQuantity(shown(model, 0)).text(), "show P(R/2) in [atm]");
        // The second show of P(R/2) names no unit: it is a row of its own, in P's declared unit, not the other show's atm.
        assertEquals("dyn/cm^2", units.forUnshown(shown(model, 1)).text());
        assertEquals("kg", units.forUnshown(shown(model, 2)).text(), "m(R) is a mass, and the file's first mass unit is kg");
    }

    @Test
    void aValueIsWrittenInTheFilesUnitWithSiBesideWhenTheNumbersDiffer() throws Exception {
        Unit dyn = UnitParser.parse("dyn/cm^2");
        assertEquals("1.716346e+12 dyn/cm^2 (1.716346e+11 Pa)", FileUnits.format(1.716346e11, dyn, "%.6e"));
        assertEquals("3.00000 Pa", FileUnits.format(3, UnitParser.parse("Pa"), "%.6g"), "no SI beside SI");
        assertEquals("0", FileUnits.format(0, dyn, "%.6g"), "zero reads the same in any unit");
        assertEquals("6371 km (6371000 m)", FileUnits.format(6.371e6, UnitParser.parse("km"), FileUnits.SHORT));
        assertEquals("2.5", FileUnits.format(2.5, Unit.ONE, "%.2g"), "a pure number goes bare");
    }
}
