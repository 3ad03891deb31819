package dev.plumb.bench;

import dev.plumb.lang.Diagnostics;
import dev.plumb.lang.Parser;
import dev.plumb.lang.SourceFile;
import dev.plumb.model.Checker;
import dev.plumb.model.Model;
import dev.plumb.numeric.CompiledRelations;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * The compiled right-hand side of the shipped polytrope (balance and mass relations, rho(r)
 * inlined) against the same formulas written by hand in Java, per evaluation of both derivatives.
 */
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
@State(Scope.Thread)
public class EvaluatorBench {

    static final double G = 6.67430e-11;

    CompiledRelations compiled;
    double n = 3, k = 3.84e9, exponent = n / (n + 1);
    double[] y = {1.0e15, 1.0e30};
    double[] yDot = new double[2];
    double r = 2.0e8;

    @Setup
    public void setup() throws Exception {
        compiled = CompiledRelations.of(load("derivations/polytrope.plumb"), Map.of("M", 1.989e30, "R", 6.957e8));
        compiled.setConstants(k);
    }

    static Model load(String path) throws Exception {
        Diagnostics d = new Diagnostics();
        return Checker.check(Parser.parse(new SourceFile(path, Files.readString(Path.of(path))), d), d);
    }

    @Benchmark
    public double compiledRelations() {
        r += 1.0;
        compiled.derivatives(r, y, yDot);
        return yDot[0] + yDot[1];
    }

    @Benchmark
    public double handWritten() {
        r += 1.0;
        double rho = Math.pow(y[0] / k, exponent);
        yDot[0] = -G * y[1] * rho / (r * r);
        yDot[1] = 4 * Math.PI * r * r * rho;
        return yDot[0] + yDot[1];
    }
}
