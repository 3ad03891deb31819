package dev.plumb.cli;

import dev.plumb.lang.Diagnostic;
import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Expr;
import dev.plumb.lang.Lexer;
import dev.plumb.lang.Parser;
import dev.plumb.lang.Program;
import dev.plumb.lang.SourceFile;
import dev.plumb.lang.Stmt;
import dev.plumb.lang.Token;
import dev.plumb.lang.TokenType;
import dev.plumb.model.Checker;
import dev.plumb.model.ConstantEvaluator;
import dev.plumb.model.Model;
import dev.plumb.model.Symbol;
import dev.plumb.report.DiagnosticPrinter;
import dev.plumb.report.Style;
import dev.plumb.units.Dimension;
import dev.plumb.units.Unit;
import dev.plumb.units.UnitCatalog;
import dev.plumb.units.UnitException;
import dev.plumb.units.UnitParser;
import java.io.PrintWriter;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code plumb units EXPR [--in UNIT]}: a unit-aware calculator with the built-in constants. */
@Command(name = "units", mixinStandardHelpOptions = true, versionProvider = Version.class,
        description = {"Evaluate a quantity expression with units and constants.",
                "Example: plumb units \"3/(8*pi)*G*(1 [Msun])^2/(1 [Rsun])^4\" --in GPa"})
public final class UnitsCommand implements Callable<Integer> {

    @Parameters(index = "0", paramLabel = "EXPR", description = "expression, e.g. \"1 [atm] + 2 [bar]\"")
    String expression;

    @Option(names = "--in", paramLabel = "UNIT", description = "also print the value in this unit, e.g. GPa or \"kg/m^3\"")
    String target;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        SourceFile source = new SourceFile("<expression>", expression);
        Diagnostics diagnostics = new Diagnostics();
        List<Token> tokens = new Lexer(expression, diagnostics).tokens();
        Expr expr = null;
        if (!diagnostics.hasErrors()) {
            Parser parser = new Parser(tokens, diagnostics);
            expr = parser.expressionOnly();
        }
        if (expr == null || diagnostics.hasErrors()) return fail(err, source, diagnostics.sorted());
        Program program = new Program(source, List.of(new Stmt.Show(expr, null, expr.span())));
        Model model = Checker.check(program, diagnostics);
        if (model.hasErrors()) return fail(err, source, model.diagnostics());
        Dimension dim = model.dimensionOf(expr);
        double value;
        try {
            value = new ConstantEvaluator(name -> model.symbol(name).orElse(null), Map.of()).evaluate(expr);
        } catch (ConstantEvaluator.NotConstant e) {
            diagnostics.error(e.where.span(), e.getMessage());
            return fail(err, source, diagnostics.sorted());
        }
        String si = UnitCatalog.siName(dim);
        out.printf(Locale.ROOT, "%s %s%s%n", format(value), si, si.equals(dim.toString()) ? "" : "   (" + dim + ")");
        if (target != null) {
            String text = target.startsWith("[") && target.endsWith("]") ? target.substring(1, target.length() - 1) : target;
            Unit unit;
            try {
                unit = UnitParser.parse(text);
            } catch (UnitException e) {
                err.println("plumb: --in " + target + ": " + e.getMessage());
                return 2;
            }
            if (!unit.dimension().equals(dim)) {
                err.printf(Locale.ROOT, "plumb: cannot express %s in %s: the value is %s, %s is %s%n",
                        expression, text, dim, text, unit.dimension());
                return 1;
            }
            out.printf(Locale.ROOT, "= %s %s%n", format(value / unit.factor()), text);
        }
        for (Symbol.Builtin b : model.symbols(Symbol.Builtin.class)) {
            out.printf(Locale.ROOT, "  %s = %s %s  (%s)%n", b.name(), format(b.constant().value()),
                    UnitCatalog.siName(b.dimension()), b.constant().source());
        }
        return 0;
    }

    private static String format(double v) {
        return String.format(Locale.ROOT, "%.6g", v);
    }

    private static int fail(PrintWriter err, SourceFile source, List<Diagnostic> diagnostics) {
        DiagnosticPrinter printer = new DiagnosticPrinter(Style.detect());
        diagnostics.forEach(d -> err.print(printer.print(source, d)));
        err.flush();
        return diagnostics.stream().anyMatch(Diagnostic::isInputError) ? 2 : 1;
    }
}
