package org.specimenledger.benchmarks;

import org.specimenledger.curve.CurveReader;
import org.specimenledger.curve.RawCurve;

/**
 * Retained heap of one read curve against the raw primitive arrays (8 bytes per value), measured two
 * ways because no object-layout tool is on the class path: the array lengths the curve holds
 * ({@link RawCurve#arrayHeapBytes()}, exact for the arrays, proves they are trimmed), and the growth of
 * used heap across the read with the curve kept reachable ({@link Runtime}, after requested
 * collections; an estimate, since {@code System.gc()} is only a request).
 */
final class CurveReadingHeap {

    private CurveReadingHeap() {
    }

    static void report(CurveReader reader, byte[] file, int points) {
        long raw = 3L * 8 * points;
        long before = usedAfterGc();
        RawCurve curve = reader.read(file);
        long after = usedAfterGc();
        System.out.printf("raw arrays: %d bytes; curve arrays (lengths x 8 + headers): %d bytes = %.4f x raw;"
                + " used-heap growth with the curve reachable: %d bytes = %.3f x raw (%d points)%n", raw,
                curve.arrayHeapBytes(), curve.arrayHeapBytes() / (double) raw, after - before,
                (after - before) / (double) raw, curve.size());
    }

    private static long usedAfterGc() {
        Runtime runtime = Runtime.getRuntime();
        for (int i = 0; i < 3; i++) {
            System.gc();
        }
        return runtime.totalMemory() - runtime.freeMemory();
    }
}
