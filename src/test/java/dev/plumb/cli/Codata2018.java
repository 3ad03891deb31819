package dev.plumb.cli;

/**
 * The constants the tests compute their expectations with, typed from their sources so that a
 * constant plumb gets wrong shows up as a disagreement: CODATA 2018 recommended values (h, c exact
 * in the SI since 2019) and the IAU 2015 Resolution B3 nominal solar mass parameter.
 */
final class Codata2018 {
    private Codata2018() {
    }

    static final double G = 6.67430e-11;               // m^3 kg^-1 s^-2, CODATA 2018
    static final double C = 299792458.0;               // m/s, exact
    static final double H = 6.62607015e-34;            // J s, exact
    static final double HBAR = H / (2 * Math.PI);
    static final double M_U = 1.66053906660e-27;       // kg, CODATA 2018
    static final double M_E = 9.1093837015e-31;        // kg, CODATA 2018
    static final double K_B = 1.380649e-23;            // J/K, exact
    static final double MSUN = 1.3271244e20 / G;       // kg: IAU 2015 B3 nominal GM_sun over G, as plumb defines Msun
}
