package org.specimenledger.benchmarks;

import java.util.concurrent.TimeUnit;
import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.specimenledger.analysis.TensileAnalysis;
import org.specimenledger.analysis.TensileParameters;
import org.specimenledger.analysis.TensileResult;

/**
 * Full tensile analysis of a 1,000,000-point record side by side with one pass of Apache Commons
 * Math {@code SimpleRegression} over the same arrays (the yardstick: the analysis should take at most
 * 10× that pass and at most 50 ms).
 *
 * <pre>mvn -o -Pbench test-compile exec:exec -Dbench.args="AnalysisBenchmark -f 1 -wi 3 -i 5"</pre>
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class AnalysisBenchmark {

    @Param({"1000000"})
    public int points;

    @Param({"discontinuous", "continuous"})
    public String curve;

    private double[] force;
    private double[] extension;
    private double[] time;

    @Setup
    public void setUp() {
        double[][] c = AnalysisBenchmarkCurves.curve(curve, points);
        force = c[0];
        extension = c[1];
        time = c[2];
    }

    @Benchmark
    public TensileResult tensileAnalysis() {
        return TensileAnalysis.analyse(force, extension, time, AnalysisBenchmarkCurves.SPECIMEN,
                TensileParameters.defaults());
    }

    @Benchmark
    public double simpleRegressionOnePass() {
        SimpleRegression r = new SimpleRegression(true);
        for (int i = 0; i < force.length; i++) {
            r.addData(extension[i], force[i]);
        }
        return r.getSlope();
    }
}
