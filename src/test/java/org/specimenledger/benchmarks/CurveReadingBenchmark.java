package org.specimenledger.benchmarks;

import ch.randelshofer.fastdoubleparser.JavaDoubleParser;
import java.io.ByteArrayInputStream;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import org.specimenledger.curve.CurveReader;
import org.specimenledger.curve.RawCurve;

/**
 * Reading a 1,000,000-point three-channel curve (about 30 MB) with {@link CurveReader}, against a
 * bare loop that only finds the cells and parses them with fastdoubleparser's
 * {@link JavaDoubleParser#parseDouble(byte[], int, int)}, the lower bound for any reader built on it.
 *
 * <p>Run: {@code mvn -o -Pbench test-compile exec:exec -Dbench.args="CurveReadingBenchmark -f 1 -wi 3 -i 5"}.
 * Throughput in MB/s is {@code bytes / score}; the file size and the retained heap of one read curve
 * ({@link CurveReadingHeap}) are printed at setup.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(value = 1, jvmArgsAppend = {"-Xms1g", "-Xmx1g"})
public class CurveReadingBenchmark {

    @Param("1000000")
    public int points;

    private byte[] file;
    private final CurveReader reader = new CurveReader();

    @Setup(Level.Trial)
    public void generate() {
        file = CurveReadingSample.threeChannelCsv(points);
        System.out.println();
        System.out.println("curve file: " + points + " points, " + file.length + " bytes");
        CurveReadingHeap.report(reader, file, points);
    }

    /** The reader under test: streaming from memory, digest, validation, unit handling, arrays. */
    @Benchmark
    public RawCurve readCurve() {
        return reader.read(new ByteArrayInputStream(file));
    }

    /**
     * The baseline: skip the header, split on comma and LF, parse every cell from the byte slice.
     * No digest, no validation, no storage; the sum keeps the parser from being optimised away.
     */
    @Benchmark
    public double parseNumbersOnly() {
        byte[] b = file;
        int i = 0;
        while (b[i] != '\n') {
            i++;
        }
        int cellStart = ++i;
        double sum = 0;
        for (int n = b.length; i < n; i++) {
            byte c = b[i];
            if (c == ',' || c == '\n') {
                sum += JavaDoubleParser.parseDouble(b, cellStart, i - cellStart);
                cellStart = i + 1;
            }
        }
        return sum;
    }

    /**
     * Context for the figures: SHA-256 of the same bytes in 64 KiB updates, work every reader must do
     * on top of parsing (the fingerprint is part of the contract).
     */
    @Benchmark
    public byte[] digestOnly() throws java.security.NoSuchAlgorithmException {
        java.security.MessageDigest digest = java.security.MessageDigest.getInstance("SHA-256");
        for (int at = 0; at < file.length; at += 65536) {
            digest.update(file, at, Math.min(65536, file.length - at));
        }
        return digest.digest();
    }
}
