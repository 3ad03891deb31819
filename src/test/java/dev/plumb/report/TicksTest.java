package dev.plumb.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Tick marks at round values. Every expectation here was worked out by hand with Heckbert's
 * nice-number rule (Graphics Gems, 1990): the range rounded up to 1, 2, 5 or 10 times a power of
 * ten, divided by one less than the wanted count, and that step rounded to the nearest of 1, 2, 5, 10
 * times a power of ten (below 1.5 → 1, below 3 → 2, below 7 → 5).
 */
class TicksTest {

    private static List<String> labels(Ticks t) {
        return t.labels().stream().map(Ticks.Label::plain).toList();
    }

    @Test
    void aSolarRadiusInMetresIsTickedEveryTwoHundredMillionMetresWithTheCommonPowerOfTenTakenOut() {
        // 6.957e8 m: IAU 2015 Resolution B3 nominal solar radius. Range 6.957e8 → 1e9; 1e9/5 = 2e8 → 2e8.
        // Tight (a coordinate): ticks inside [0, 6.957e8] only, at 0, 2, 4, 6 × 10^8.
        Ticks t = Ticks.linear(0, 6.957e8, 6, false);
        assertEquals(List.of(0.0, 2e8, 4e8, 6e8), t.ticks());
        assertEquals(List.of("0", "2", "4", "6"), labels(t));
        assertEquals(8, t.power());
        assertEquals(0, t.min());
        assertEquals(6.957e8, t.max());
        assertFalse(t.log());
    }

    @Test
    void aLooseAxisEndsAtTheTicksJustOutsideTheData() {
        // 5474.9 Pa to 101325 Pa (the 1976 standard atmosphere from 20 km to sea level): range 95850 → 1e5;
        // 1e5/5 = 2e4 → 2e4; loose from floor(0.27) = 0 to ceil(5.07) = 6 steps: 0 .. 1.2e5, labels in 10^5 Pa.
        Ticks t = Ticks.linear(5474.9, 101325, 6, true);
        assertEquals(List.of(0.0, 2e4, 4e4, 6e4, 8e4, 1e5, 1.2e5), t.ticks());
        assertEquals(List.of("0.0", "0.2", "0.4", "0.6", "0.8", "1.0", "1.2"), labels(t));
        assertEquals(5, t.power());
        assertEquals(0, t.min());
        assertEquals(1.2e5, t.max());
    }

    @Test
    void ticksAreExactDecimalsNotSumsOfRoundedSteps() {
        // 8e23: 4 × 2e23 in binary floating point is 7.999999999999999E23; made in decimal it is 8e23 itself.
        Ticks big = Ticks.linear(0, 8e23, 5, true);
        assertEquals(List.of(0.0, 2e23, 4e23, 6e23, 8e23), big.ticks());
        assertEquals(List.of("0", "2", "4", "6", "8"), labels(big));
        assertEquals(23, big.power());
        // 0.037: range → 0.05; 0.05/4 = 0.0125 → 0.01; ticks 0 .. 0.04 (3 × 0.01 is 0.030000000000000002 in binary).
        Ticks small = Ticks.linear(0, 0.037, 5, true);
        assertEquals(List.of(0.0, 0.01, 0.02, 0.03, 0.04), small.ticks());
        assertEquals(List.of("0.00", "0.01", "0.02", "0.03", "0.04"), labels(small));
        assertEquals(0, small.power());
    }

    @Test
    void aResidualAcrossZeroIsLabelledInItsOwnPowerOfTen() {
        // -3e-13 .. 2e-13, three ticks wanted: range 5e-13 → 5e-13; 2.5e-13 → 2e-13; loose -4e-13 .. 2e-13.
        Ticks t = Ticks.linear(-3e-13, 2e-13, 3, true);
        assertEquals(List.of(-4e-13, -2e-13, 0.0, 2e-13), t.ticks());
        assertEquals(List.of("-4", "-2", "0", "2"), labels(t));
        assertEquals(-13, t.power());
    }

    @Test
    void aRangeOfOneValueIsWidenedAroundIt() {
        Ticks zero = Ticks.linear(0, 0, 3, true);
        assertEquals(List.of(-1.0, 0.0, 1.0), zero.ticks());
        assertEquals(List.of("-1", "0", "1"), labels(zero));
        // 50 widened by a tenth each way: 45 .. 55, range 10 → 10; 10/2 = 5 → 5; loose 45 .. 55.
        Ticks fifty = Ticks.linear(50, 50, 3, true);
        assertEquals(List.of(45.0, 50.0, 55.0), fifty.ticks());
    }

    @Test
    void logarithmicAxesTickWholeDecadesAndThinThemWhenThereAreMany() {
        Ticks t = Ticks.logarithmic(1e17, 1e20, false);
        assertEquals(List.of(1e17, 1e18, 1e19, 1e20), t.ticks());
        assertEquals(List.of("10^17", "10^18", "10^19", "10^20"), labels(t));
        assertTrue(t.log());
        // 3e-5 .. 2e11 loose: decades -5 .. 12, seventeen of them; every third, at multiples of 3, and the
        // loose ends moved out to ticks: 1e-6 .. 1e12.
        Ticks wide = Ticks.logarithmic(3e-5, 2e11, true);
        assertEquals(List.of(1e-6, 1e-3, 1e0, 1e3, 1e6, 1e9, 1e12), wide.ticks());
        assertEquals(1e-6, wide.min());
        assertEquals(1e12, wide.max());
        // Tight (a coordinate): the axis ends at the data, ticks inside only.
        Ticks tight = Ticks.logarithmic(3e-5, 2e11, false);
        assertEquals(List.of(1e-3, 1e0, 1e3, 1e6, 1e9), tight.ticks());
        assertEquals(3e-5, tight.min());
    }

    @Test
    void theAxisIsLogarithmicOnlyWhenMostOfTheDataWouldBeSqueezedAtTheBottom() {
        int n = 101;
        double[] atmosphere = new double[n], sphere = new double[n], sweep = new double[n];
        for (int i = 0; i < n; i++) {
            double z = 100e3 * i / (n - 1);
            atmosphere[i] = 101325 * Math.exp(-z / 8.4e3); // isothermal, scale height 8.4 km: 5 decades, mostly near 0
            double x = (double) i / (n - 1);
            sphere[i] = 1 - x * x + 1e-9;                   // a pressure falling to (nearly) 0 at a surface: 9 decades, mostly high
            sweep[i] = Math.pow(10, 17 + 4.0 * i / (n - 1)); // a sweep spaced evenly in the logarithm
        }
        assertTrue(Ticks.forData(atmosphere, 6, true, true).log());
        assertFalse(Ticks.forData(sphere, 6, true, true).log());
        assertTrue(Ticks.forData(sweep, 6, false, true).log());
        assertFalse(Ticks.forData(sweep, 6, false, false).log(), "not when the caller rules it out");
        assertFalse(Ticks.forData(new double[] {Double.NaN, 1, 2}, 6, true, true).log());
    }
}
