package dev.plumb.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** The benchmark's hand-written yardstick solves the problem it claims to. */
class HandLaneEmdenTest {

    @Test
    void centralPressureOfTheIndexThreeStarMeetsTheTable() {
        // IAU 2015 Resolution B3 nominal solar GM and radius; CODATA 2018 G.
        double m = 1.3271244e20 / HandLaneEmden.G, r = 6.957e8;
        // Chandrasekhar (1939), table of polytropes, n = 3: xi1 = 6.89685, -xi1^2 theta'(xi1) = 2.01824, so
        // P_c = G M^2 / R^4 / (4 pi (n + 1) theta'(xi1)^2), good to the table's six figures.
        double slope = 2.01824 / (6.89685 * 6.89685);
        double pc = HandLaneEmden.G * m * m / Math.pow(r, 4) / (4 * Math.PI * 4 * slope * slope);
        assertEquals(pc, HandLaneEmden.centralPressure(3, m, r, 1e-12), 2e-5 * pc);
    }

    @Test
    void indexOneMatchesTheAnalyticCentralPressure() {
        // Analytic, n = 1: P_c = (pi/8) G M^2 / R^4.
        double m = 2e30, r = 7e8;
        double pc = Math.PI / 8 * HandLaneEmden.G * m * m / Math.pow(r, 4);
        assertEquals(pc, HandLaneEmden.centralPressure(1, m, r, 1e-12), 1e-10 * pc);
    }
}
