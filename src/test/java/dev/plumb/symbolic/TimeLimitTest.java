package dev.plumb.symbolic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.model.Status;
import org.junit.jupiter.api.Test;

/** A relation Symja cannot integrate in time leaves its profile to the numeric side; the rest of the run goes on. */
class TimeLimitTest {

    @Test
    void aHardIntegralIsGivenUpAndTheClaimsStillRun() {
        String file = """
                param a > 0
                coord x from 0 to 1
                unknown P(x)
                relation hard: P'(x) = (sin(x) + sqrt(x) + log(x + cos(x)))^(-1/2)
                boundary start: P(0) = 0
                claim algebra: (a + 1)^2 = a^2 + 2*a + 1
                claim profile: P(1) = 1
                """;
        SymbolicResult r = SymbolicEngine.analyze(Fixtures.model("hard.plumb", file), new SymbolicOptions(1));
        assertTrue(r.profiles().isEmpty());
        assertTrue(r.notes().stream().anyMatch(n -> n.contains("ran out of its") || n.contains("no antiderivative")
                || n.contains("gave up")), r.notes().toString());
        assertEquals(Status.HOLDS, Fixtures.check(r, "algebra").status());
        assertEquals(Status.UNDECIDED, Fixtures.check(r, "profile").status());
    }
}
