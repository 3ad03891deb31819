package dev.plumb.units;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import si.uom.NonSI;
import systems.uom.common.USCustomary;
import systems.uom.common.historic.CGS;
import tech.units.indriya.unit.Units;

/**
 * The unit symbols plumb knows before any SI prefix is applied, each defined through an
 * Indriya unit and carrying the published source of its value.
 */
final class NamedUnits {
  /** One catalog entry: the symbol, its JSR 385 definition, whether SI prefixes apply, its source. */
  record NamedUnit(String symbol, javax.measure.Unit<?> jsr, boolean prefixable, String source) {
    Unit unit() {
      return IndriyaUnits.toUnit(symbol, jsr);
    }
  }

  private static final String SI = "SI Brochure, 9th ed. (2019)";
  private static final String SI_ACCEPTED = "SI Brochure, 9th ed. (2019), Table 8";
  private static final String NIST = "NIST SP 811 (2008), Appendix B";
  private static final String IAU_B3 = "IAU 2015 Resolution B3 (nominal value)";
  private static final String CODATA_G = "; G = 6.67430e-11 m^3 kg^-1 s^-2 (CODATA 2018)";

  /** CODATA 2018 Newtonian constant of gravitation, which turns nominal GM values into masses. */
  static final double G = 6.67430e-11;

  static final Map<String, NamedUnit> ALL = build();

  private NamedUnits() {}

  private static Map<String, NamedUnit> build() {
    Map<String, NamedUnit> m = new LinkedHashMap<>();
    // SI base units; the kilogram enters as the gram so that prefixes apply to "g" (mg, kg).
    prefixed(m, "m", Units.METRE, SI);
    prefixed(m, "g", Units.GRAM, SI);
    prefixed(m, "s", Units.SECOND, SI);
    prefixed(m, "A", Units.AMPERE, SI);
    prefixed(m, "K", Units.KELVIN, SI);
    prefixed(m, "mol", Units.MOLE, SI);
    prefixed(m, "cd", Units.CANDELA, SI);
    // SI derived units with special names.
    prefixed(m, "Hz", Units.HERTZ, SI);
    prefixed(m, "N", Units.NEWTON, SI);
    prefixed(m, "Pa", Units.PASCAL, SI);
    prefixed(m, "J", Units.JOULE, SI);
    prefixed(m, "W", Units.WATT, SI);
    prefixed(m, "C", Units.COULOMB, SI);
    prefixed(m, "V", Units.VOLT, SI);
    prefixed(m, "rad", Units.RADIAN, SI);
    prefixed(m, "sr", Units.STERADIAN, SI);
    // Non-SI units accepted for use with the SI.
    prefixed(m, "L", Units.LITRE, SI_ACCEPTED);
    plain(m, "min", Units.MINUTE, SI_ACCEPTED);
    plain(m, "h", Units.HOUR, SI_ACCEPTED);
    plain(m, "d", Units.DAY, SI_ACCEPTED);
    plain(m, "t", Units.KILOGRAM.multiply(1000), SI_ACCEPTED);
    // si-units carries the electronvolt at its CODATA 2006 value; the 2019 SI fixed e exactly.
    prefixed(m, "eV", Units.JOULE.multiply(1.602176634e-19), SI_ACCEPTED + ", e exact since 2019");
    // Julian year as the IAU uses it (365.25 d); Units.YEAR is a different (Gregorian) year.
    prefixed(m, "yr", NonSI.YEAR_JULIEN, "IAU Style Manual (1989): Julian year = 365.25 d");

    // cgs mechanical units.
    plain(m, "dyn", CGS.DYNE, NIST + ": 1 dyn = 1e-5 N");
    plain(m, "erg", CGS.ERG, NIST + ": 1 erg = 1e-7 J");

    // Pressure. si-units has no standard atmosphere and no torr, so those are defined here.
    prefixed(m, "bar", NonSI.BAR, SI_ACCEPTED + "; " + NIST + ": 1 bar = 1e5 Pa");
    plain(m, "atm", Units.PASCAL.multiply(101325), NIST + ": 1 atm = 101325 Pa (exact)");
    prefixed(m, "Torr", Units.PASCAL.multiply(101325).divide(760), NIST + ": 1 Torr = 101325/760 Pa (exact)");
    plain(m, "mmHg", NonSI.MILLIMETRE_OF_MERCURY,
        NIST + ": conventional millimetre of mercury = 133.322387415 Pa");
    // psi = lbf/in^2 from the exact pound (0.45359237 kg), g_n and inch (0.0254 m).
    plain(m, "psi", USCustomary.POUND.multiply(NonSI.STANDARD_GRAVITY).divide(USCustomary.INCH.pow(2)),
        NIST + ": 1 psi = 6894.757 Pa");

    // Astronomy. si-units' ASTRONOMICAL_UNIT (1.49597871e11 m), PARSEC (3.085677e16 m) and
    // LIGHT_YEAR (9.460528405e15 m) are rounded or older values, so these follow the IAU directly.
    javax.measure.Unit<?> au = Units.METRE.multiply(149597870700L);
    plain(m, "au", au, "IAU 2012 Resolution B2: 1 au = 149597870700 m (exact)");
    prefixed(m, "pc", au.multiply(648000).divide(Math.PI), "IAU 2015 Resolution B2: 1 pc = 648000/pi au");
    plain(m, "ly", Units.METRE_PER_SECOND.multiply(299792458L).multiply(NonSI.YEAR_JULIEN),
        "IAU: light-year = c x Julian year = 9460730472580800 m");
    plain(m, "Msun", Units.KILOGRAM.multiply(1.3271244e20 / G), IAU_B3 + ": GM_sun = 1.3271244e20 m^3 s^-2" + CODATA_G);
    plain(m, "Rsun", Units.METRE.multiply(6.957e8), IAU_B3 + ": R_sun = 6.957e8 m");
    plain(m, "Lsun", Units.WATT.multiply(3.828e26), IAU_B3 + ": L_sun = 3.828e26 W");
    plain(m, "Mearth", Units.KILOGRAM.multiply(3.986004e14 / G), IAU_B3 + ": GM_earth = 3.986004e14 m^3 s^-2" + CODATA_G);
    plain(m, "Rearth", Units.METRE.multiply(6.3781e6), IAU_B3 + ": equatorial R_earth = 6.3781e6 m");
    plain(m, "Mjup", Units.KILOGRAM.multiply(1.2668653e17 / G), IAU_B3 + ": GM_jup = 1.2668653e17 m^3 s^-2" + CODATA_G);
    plain(m, "Rjup", Units.METRE.multiply(7.1492e7), IAU_B3 + ": equatorial R_jup = 7.1492e7 m");
    return Collections.unmodifiableMap(m);
  }

  private static void prefixed(Map<String, NamedUnit> m, String symbol, javax.measure.Unit<?> jsr, String source) {
    m.put(symbol, new NamedUnit(symbol, jsr, true, source));
  }

  private static void plain(Map<String, NamedUnit> m, String symbol, javax.measure.Unit<?> jsr, String source) {
    m.put(symbol, new NamedUnit(symbol, jsr, false, source));
  }
}
