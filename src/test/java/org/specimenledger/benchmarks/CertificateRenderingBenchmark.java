package org.specimenledger.benchmarks;

import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.specimenledger.certificates.document.CertificateDocument;
import org.specimenledger.certificates.document.CertificateFixtures;
import org.specimenledger.certificates.document.CertificateRenderer;

/**
 * Rendering an invented 20-specimen certificate (120 result rows) with a stress–strain curve appendix
 * for every specimen to PDF/A-2b bytes: fill, export, CIDSet repair. The templates are compiled once
 * in {@code @Setup}, as in the service.
 *
 * <pre>
 * mvn -Pbench test-compile exec:exec -Dbench.args="CertificateRenderingBenchmark.render -f 1 -wi 3 -i 5"
 * mvn -Pbench test-compile exec:exec -Dbench.args="CertificateRenderingBenchmark.renderInARow -f 1 -wi 10 -i 100"
 * </pre>
 * The first gives the sample distribution (median = p0.50); the second times 100 single renders in a
 * row after 10 warm-up renders, one per iteration, to show whether the time grows.
 */
@State(Scope.Benchmark)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class CertificateRenderingBenchmark {

    private CertificateRenderer renderer;
    private CertificateDocument document;

    @Setup
    public void setUp() {
        renderer = new CertificateRenderer();
        document = CertificateFixtures.sample(20, true);
    }

    @Benchmark
    @BenchmarkMode(Mode.SampleTime)
    public byte[] render() {
        return renderer.render(document);
    }

    @Benchmark
    @BenchmarkMode(Mode.SingleShotTime)
    public byte[] renderInARow() {
        return renderer.render(document);
    }
}
