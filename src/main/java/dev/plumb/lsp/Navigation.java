package dev.plumb.lsp;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Lexer;
import dev.plumb.lang.SourceFile;
import dev.plumb.lang.Span;
import dev.plumb.lang.Stmt;
import dev.plumb.lang.Token;
import dev.plumb.lang.TokenType;
import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import dev.plumb.units.Dimension;
import dev.plumb.units.Rational;
import dev.plumb.units.UnitCatalog;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * What a name under the cursor refers to, in one checked document: a declared symbol (parameter,
 * coordinate, definition, unknown), a parameter of the definition it stands in, a built-in
 * constant, or the case or sweep a label after {@code at} or {@code over} names. Works on the
 * fast stages' model, so it answers while the file is being typed, syntax errors and all.
 */
final class Navigation {

    /**
     * What a name refers to: its declaration's span ({@link Span#NONE} for a built-in) and the text
     * a hover shows, in Markdown.
     */
    record Target(String name, Span declaration, String hover) { }

    private final Model model;
    private final SourceFile source;
    private final List<Token> tokens;

    Navigation(Model model) {
        this.model = model;
        this.source = model.source();
        this.tokens = new Lexer(source.text(), new Diagnostics()).tokens();
    }

    /** The target of the name at 1-based {@code line} and {@code column}, if a name is there and refers to something. */
    Optional<Target> at(int line, int column) {
        Optional<Token> word = wordAt(line, column);
        if (word.isEmpty()) return Optional.empty();
        Token t = word.get();
        for (Stmt s : model.program().statements()) {
            if (s instanceof Stmt.Expect e) {
                if (e.caseName() != null && covers(e.caseSpan(), t.span())) return caseNamed(e.caseName());
                if (e.extremum() != null && covers(e.extremum().sweepSpan(), t.span())) return sweepNamed(e.extremum().sweep());
            }
            if (s instanceof Stmt.Let l && covers(l.span(), t.span()) && l.params().contains(t.text())) {
                Optional<Target> p = letParameter(l, t);
                if (p.isPresent()) return p;
            }
            if (label(s).filter(l -> covers(l.span(), t.span())).isPresent()) return Optional.empty();
        }
        return model.symbol(t.text()).map(this::describe);
    }

    /** The identifier under the cursor; a cursor just past a name's last character still counts. */
    private Optional<Token> wordAt(int line, int column) {
        Token best = null;
        for (Token t : tokens) {
            if (!t.is(TokenType.IDENT) || t.span().line() != line) continue;
            if (t.span().column() <= column && column < t.span().endColumn()) return Optional.of(t);
            if (column == t.span().endColumn()) best = t;
        }
        return Optional.ofNullable(best);
    }

    private static boolean covers(Span outer, Span inner) {
        if (outer == null || outer.line() < 1) return false;
        boolean startsInside = inner.line() > outer.line() || inner.line() == outer.line() && inner.column() >= outer.column();
        boolean endsInside = inner.endLine() < outer.endLine() || inner.endLine() == outer.endLine() && inner.endColumn() <= outer.endColumn();
        return startsInside && endsInside;
    }

    /** The label of a statement that can have one, when it has one. */
    static Optional<Stmt.Label> label(Stmt s) {
        Stmt.Label l = Stmt.Label.NONE;
        if (s instanceof Stmt.Relation r) l = r.label();
        else if (s instanceof Stmt.Boundary b) l = b.label();
        else if (s instanceof Stmt.Step st) l = st.label();
        else if (s instanceof Stmt.Claim c) l = c.label();
        else if (s instanceof Stmt.Scaling sc) l = sc.label();
        else if (s instanceof Stmt.Case c) l = c.label();
        else if (s instanceof Stmt.Expect e) l = e.label();
        else if (s instanceof Stmt.Sweep sw) l = sw.label();
        return l.present() ? Optional.of(l) : Optional.empty();
    }

    private Optional<Target> caseNamed(String name) {
        return model.program().all(Stmt.Case.class).stream().filter(c -> name.equals(c.label().name())).findFirst()
                .map(c -> new Target(name, c.label().span(), "**" + name + "** · case\n\n" + declaredOn(c.span())));
    }

    private Optional<Target> sweepNamed(String name) {
        return model.program().all(Stmt.Sweep.class).stream().filter(s -> name.equals(s.label().name())).findFirst()
                .map(s -> new Target(name, s.label().span(), "**" + name + "** · sweep of " + s.param() + ", " + s.count()
                        + " models\n\n" + declaredOn(s.span())));
    }

    /** {@code r} in {@code let m(r) = ...}: declared in the definition's own parentheses. */
    private Optional<Target> letParameter(Stmt.Let l, Token at) {
        Span declared = null;
        for (Token t : tokens) {
            if (!covers(l.span(), t.span()) || t.span().line() < l.nameSpan().line()) continue;
            if (t.is(TokenType.EQUALS)) break;
            if (t.is(TokenType.IDENT) && t.text().equals(at.text()) && !t.span().equals(l.nameSpan())) {
                declared = t.span();
                break;
            }
        }
        if (declared == null) return Optional.empty();
        StringBuilder hover = new StringBuilder("**" + at.text() + "** · parameter of the definition " + l.name() + "\n\n");
        if (model.symbol(l.name()).orElse(null) instanceof Symbol.Definition d && d.paramDimensions().size() == d.params().size()) {
            Dimension dim = d.paramDimensions().get(d.params().indexOf(at.text()));
            hover.append(unitLines("`" + UnitCatalog.siName(dim) + "`", dim));
        }
        hover.append(declaredOn(declared));
        return Optional.of(new Target(at.text(), declared, hover.toString()));
    }

    private Target describe(Symbol s) {
        StringBuilder hover = new StringBuilder("**").append(s.name()).append("** · ").append(kind(s)).append("\n\n");
        hover.append(unitLines(unit(s), s.dimension()));
        if (s instanceof Symbol.Builtin b) {
            hover.append(String.format(Locale.ROOT, "value: %s %s  \n", b.constant().value(), b.constant().unit().text()));
            hover.append("built-in constant: ").append(b.constant().description());
            if (b.constant().source() != null && !b.constant().source().isBlank()) hover.append(" (").append(b.constant().source()).append(')');
            hover.append('\n');
        } else {
            hover.append(declaredOn(s.span()));
        }
        return new Target(s.name(), s.span(), hover.toString());
    }

    private static String kind(Symbol s) {
        if (s instanceof Symbol.FreeParam p) return "free parameter" + (p.assumption() != null ? " (" + p.assumption().text + ")" : "");
        if (s instanceof Symbol.FixedParam) return "parameter with a fixed value";
        if (s instanceof Symbol.Coordinate) return "coordinate";
        if (s instanceof Symbol.Definition d) return d.params().isEmpty() ? "definition" : "definition of " + String.join(", ", d.params());
        if (s instanceof Symbol.Profile) return "unknown profile";
        if (s instanceof Symbol.UnknownConstant u) return u.endOfInterval() ? "unknown constant (the end of the interval)" : "unknown constant";
        return "built-in constant";
    }

    /** The unit (as Markdown code) as the file wrote it where it did, else the SI name of the dimension, saying where it came from. */
    private String unit(Symbol s) {
        for (Stmt st : model.program().statements()) {
            Stmt.UnitText written = null;
            if (st instanceof Stmt.Param p && p.nameSpan().equals(s.span())) written = p.unit();
            else if (st instanceof Stmt.Coord c && c.nameSpan().equals(s.span())) written = c.unit();
            else if (st instanceof Stmt.Unknown u && u.nameSpan().equals(s.span())) written = u.unit();
            if (written != null) return "`" + written.text() + "`";
        }
        String si = "`" + UnitCatalog.siName(s.dimension()) + "`";
        if (s instanceof Symbol.Builtin b) return "`" + b.constant().unit().text() + "`";
        if (s instanceof Symbol.Definition) return si + " (from its definition)";
        if (s instanceof Symbol.Profile p && p.unitInferred() || s instanceof Symbol.UnknownConstant u && u.unitInferred()) {
            return si + " (inferred)";
        }
        return si;
    }

    private static String unitLines(String unit, Dimension d) {
        return "unit: " + unit + "  \ndimension: " + dimension(d) + " (SI base units: `" + d + "`)  \n";
    }

    /** The dimension in the usual symbols: a pressure is M L^-1 T^-2. */
    static String dimension(Dimension d) {
        StringBuilder out = new StringBuilder();
        Object[][] order = {{Dimension.Base.MASS, "M"}, {Dimension.Base.LENGTH, "L"}, {Dimension.Base.TIME, "T"},
                {Dimension.Base.CURRENT, "I"}, {Dimension.Base.TEMPERATURE, "Θ"}, {Dimension.Base.AMOUNT, "N"},
                {Dimension.Base.LUMINOUS, "J"}};
        for (Object[] b : order) {
            Rational e = d.exponent((Dimension.Base) b[0]);
            if (e.signum() == 0) continue;
            if (out.length() > 0) out.append(' ');
            out.append(b[1]);
            if (!e.equals(Rational.ONE)) out.append(e.isInteger() ? "^" + e : "^(" + e + ")");
        }
        return out.length() == 0 ? "dimensionless" : out.toString();
    }

    private String declaredOn(Span span) {
        return "declared on line " + span.line() + ": `" + withoutComment(source.line(span.line())) + "`\n";
    }

    /** The statement of a line, without its comment ({@code #} outside a string). */
    private static String withoutComment(String line) {
        boolean inString = false;
        for (int i = 0; i < line.length(); i++) {
            char c = line.charAt(i);
            if (c == '"') inString = !inString;
            if (c == '#' && !inString) return line.substring(0, i).strip();
        }
        return line.strip();
    }
}
