package dev.plumb.model;

import dev.plumb.lang.Expr;
import dev.plumb.lang.Span;
import dev.plumb.lang.Stmt;
import dev.plumb.units.Constant;
import dev.plumb.units.Dimension;
import java.util.List;

/** A name a plumb file can refer to, after resolution, with its dimension. */
public sealed interface Symbol {

    String name();

    /** Where it was declared ({@link Span#NONE} for built-ins). */
    Span span();

    Dimension dimension();

    /**
     * A free symbolic parameter such as {@code param M [kg] > 0}; {@code assumption} may be null, and
     * {@code bounds} orders it against other quantities ({@code param Rc [m] > 0, < R}).
     */
    record FreeParam(String name, Span span, Dimension dimension, Stmt.Assumption assumption, List<Stmt.Bound> bounds)
            implements Symbol {
        public FreeParam {
            bounds = List.copyOf(bounds);
        }

        public FreeParam(String name, Span span, Dimension dimension, Stmt.Assumption assumption) {
            this(name, span, dimension, assumption, List.of());
        }
    }

    /** A parameter with a fixed value, {@code param n = 3}; {@code value} is in SI base units. */
    record FixedParam(String name, Span span, Dimension dimension, double value, Expr expr) implements Symbol { }

    /** The independent variable and its interval. */
    record Coordinate(String name, Span span, Dimension dimension, Expr from, Expr to) implements Symbol { }

    /** A definition {@code let f(x) = body}; {@code params} is empty for a plain value. */
    record Definition(String name, Span span, Dimension dimension, List<String> params,
                      List<Dimension> paramDimensions, Expr body) implements Symbol {
        public Definition {
            params = List.copyOf(params);
            paramDimensions = List.copyOf(paramDimensions);
        }
    }

    /**
     * An unknown profile {@code unknown P(r)}: a function of the coordinate to be found;
     * {@code assumption} ({@code > 0} or {@code >= 0}) may be null.
     */
    record Profile(String name, Span span, Dimension dimension, boolean unitInferred, Stmt.Assumption assumption) implements Symbol {
        public Profile(String name, Span span, Dimension dimension, boolean unitInferred) {
            this(name, span, dimension, unitInferred, null);
        }
    }

    /**
     * An unknown constant fixed by the boundaries, such as a polytropic constant, or the end of
     * the coordinate interval when {@code endOfInterval} is set.
     */
    record UnknownConstant(String name, Span span, Dimension dimension, boolean unitInferred,
                           boolean endOfInterval) implements Symbol { }

    /** A built-in physical constant. */
    record Builtin(Constant constant) implements Symbol {
        public String name() {
            return constant.name();
        }

        public Span span() {
            return Span.NONE;
        }

        public Dimension dimension() {
            return constant.unit().dimension();
        }
    }
}
