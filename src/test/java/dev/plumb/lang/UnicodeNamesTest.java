package dev.plumb.lang;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/** Names in any script: Greek letters, accented letters, letters outside the 16-bit range, combining marks; π is pi. */
class UnicodeNamesTest {

    private static String name(Expr e) {
        return assertInstanceOf(Expr.Name.class, e).id();
    }

    @Test
    void greekLettersAreNames() {
        Expr.Binary b = assertInstanceOf(Expr.Binary.class, Parsing.expr("ρ_c*λ/Γ"));
        Expr.Binary product = assertInstanceOf(Expr.Binary.class, b.left());
        assertEquals("ρ_c", name(product.left()));
        assertEquals("λ", name(product.right()));
        assertEquals("Γ", name(b.right()));
        assertEquals("σ2", name(Parsing.expr("σ2")));
        assertEquals("Teff_é", name(Parsing.expr("Teff_é")));
    }

    @Test
    void piWrittenAsTheLetterIsTheConstantPi() {
        Expr.Binary b = assertInstanceOf(Expr.Binary.class, Parsing.expr("4/3*π*R^3"));
        Expr.Binary left = assertInstanceOf(Expr.Binary.class, b.left());
        assertEquals("pi", name(left.right()));
        // Only π alone: πr is a name of its own.
        assertEquals("πr", name(Parsing.expr("πr")));
    }

    @Test
    void lettersBeyondTheBasicPlaneAndCombiningMarks() {
        // U+1D70C MATHEMATICAL ITALIC SMALL RHO is two chars in Java; U+0304 is a combining macron (ρ̄).
        assertEquals("\uD835\uDF0C", name(Parsing.expr("\uD835\uDF0C")));
        assertEquals("ρ\u0304", name(Parsing.expr("ρ\u0304")));
        List<Stmt> s = Parsing.clean("let \uD835\uDF0C = 2\nlet y = \uD835\uDF0C + 1\n");
        assertEquals(2, s.size());
        Expr.Binary sum = assertInstanceOf(Expr.Binary.class, ((Stmt.Let) s.get(1)).body());
        Span span = sum.right().span();
        // The span of the 1 follows the two chars of the rho.
        assertEquals(14, span.column());
    }

    @Test
    void aCharacterThatIsNoLetterIsReportedAsOneCharacter() {
        Parsing p = Parsing.of("show x \u2192 y\n");
        assertEquals(1, p.errors().size(), p.errors()::toString);
        Diagnostic d = p.errors().get(0);
        assertTrue(d.message().contains("unexpected character '\u2192'"), d.message());
        assertEquals(8, d.span().column());
        Parsing emoji = Parsing.of("show \uD83D\uDE00\n");
        assertTrue(emoji.errors().get(0).message().contains("unexpected character '\uD83D\uDE00'"), emoji.errors().toString());
    }
}
