package dev.plumb.lang;

import java.util.List;

/** One statement (one logical line) of a plumb file. */
public sealed interface Stmt {

    Span span();

    /** An equation {@code lhs = rhs} as used by relations, boundaries, steps and claims. */
    record Equation(Expr lhs, Expr rhs, Span span) { }

    /** An optional {@code label:} in front of a statement body; {@code name} is null when absent. */
    record Label(String name, Span span) {
        public static final Label NONE = new Label(null, Span.NONE);

        public boolean present() {
            return name != null;
        }
    }

    /** A unit written in brackets, with the span of the brackets. */
    record UnitText(String text, Span span) { }

    record Title(String text, Span span) implements Stmt { }

    /**
     * {@code param M [kg] > 0} (a free parameter with an assumption) or {@code param n = 3}
     * (a fixed value); {@code unit}, {@code assumption} and {@code value} may each be null.
     */
    record Param(String name, Span nameSpan, UnitText unit, Assumption assumption, List<Bound> bounds, Expr value, Span span)
            implements Stmt {
        public Param {
            bounds = List.copyOf(bounds);
        }
    }

    /**
     * An order between a free parameter and another quantity, {@code < R} in {@code param Rc [m] > 0, < R}:
     * the parameter compared by {@code op} with {@code value}.
     */
    record Bound(Expr.CompareOp op, Expr value, Span span) {
        public String text() {
            return op.symbol + " " + ExprPrinter.print(value);
        }
    }

    /** A sign assumption on a free parameter: {@code > 0} or {@code >= 0}. */
    enum Assumption {
        POSITIVE("> 0"), NON_NEGATIVE(">= 0");
        public final String text;

        Assumption(String text) {
            this.text = text;
        }
    }

    /** {@code coord r [m] from A to B}: the independent variable and its interval. */
    record Coord(String name, Span nameSpan, UnitText unit, Expr from, Expr to, Span span) implements Stmt { }

    /** {@code let f(x, ...) = body}, or {@code let c = body} with no parameters. */
    record Let(String name, Span nameSpan, List<String> params, Expr body, Span span) implements Stmt {
        public Let {
            params = List.copyOf(params);
        }
    }

    /**
     * {@code unknown P(r) [Pa]} (a profile, optionally {@code > 0} or {@code >= 0}) or
     * {@code unknown K} (a constant fixed by the boundaries); {@code assumption} may be null.
     */
    record Unknown(String name, Span nameSpan, List<String> args, UnitText unit, Assumption assumption, Span span) implements Stmt {
        public Unknown {
            args = List.copyOf(args);
        }

        public boolean isProfile() {
            return !args.isEmpty();
        }
    }

    record Relation(Label label, Equation equation, Span span) implements Stmt { }

    record Boundary(Label label, Equation equation, Span span) implements Stmt { }

    record Step(Label label, Equation equation, Span span) implements Stmt { }

    record Claim(Label label, Equation equation, Span span) implements Stmt { }

    /** {@code scaling L: A ~ B}: A and B have the same exponent in every free parameter. */
    record Scaling(Label label, Expr lhs, Expr rhs, Span span) implements Stmt { }

    /** {@code case sun: M = 1 [Msun], R = 1 [Rsun]}. */
    record Case(Label label, List<Assignment> assignments, Span span) implements Stmt {
        public Case {
            assignments = List.copyOf(assignments);
        }
    }

    /** {@code M = 1.0 +- 0.02 [Msun]}: {@code uncertainty} (one standard deviation) may be null. */
    record Assignment(String name, Span nameSpan, Expr value, Expr uncertainty, Span span) { }

    /**
     * {@code expect L: Q at CASE = V within TOL}; {@code caseName} is null when {@code at} is left out.
     * With {@code extremum} set it is {@code expect L: max Q over SWEEP = V within TOL} (or {@code min}).
     */
    record Expect(Label label, Expr lhs, String caseName, Span caseSpan, Expr expected, Tolerance tolerance,
                  Span span, Extremum extremum) implements Stmt {
        public Expect(Label label, Expr lhs, String caseName, Span caseSpan, Expr expected, Tolerance tolerance, Span span) {
            this(label, lhs, caseName, caseSpan, expected, tolerance, span, null);
        }
    }

    /** {@code max ... over SWEEP} or {@code min ... over SWEEP} in an expectation. */
    record Extremum(boolean max, Span kindSpan, String sweep, Span sweepSpan) {
        public String word() {
            return max ? "max" : "min";
        }
    }

    /**
     * {@code sweep L: P from A to B log N} (or {@code linear N}), then optionally {@code , NAME = VALUE}
     * for the other free parameters as in a case: a sequence of N models.
     */
    record Sweep(Label label, String param, Span paramSpan, Expr from, Expr to, boolean log, int count, Span countSpan,
                 List<Assignment> others, Span span) implements Stmt {
        public Sweep {
            others = List.copyOf(others);
        }
    }

    /**
     * How close an expectation must come: a relative tolerance (from {@code 0.1%} or {@code 1e-6}),
     * or an absolute one (a quantity such as {@code 5 [Pa]}).
     */
    record Tolerance(double relative, Expr absolute, Span span) {
        public boolean isRelative() {
            return absolute == null;
        }
    }

    /**
     * {@code guess R = 3000 [km]} or {@code guess P(0) = 1e16 [Pa]}: a first guess for an unknown
     * constant (or the free end of the interval) or for a start value of an unknown profile, which
     * the numeric solve starts from instead of its own estimate.
     */
    record Guess(Expr target, Expr value, Span span) implements Stmt { }

    /**
     * {@code typeset Rstar as "R_\star"}: how reports write the name {@code name}, as TeX (checked by
     * {@link TexForm}); {@code texSpan} is the span of the quoted text, quotes included.
     */
    record Typeset(String name, Span nameSpan, String tex, Span texSpan, Span span) implements Stmt { }

    /** {@code show Q in [GPa]}; {@code unit} may be null (SI). */
    record Show(Expr expr, UnitText unit, Span span) implements Stmt { }
}
