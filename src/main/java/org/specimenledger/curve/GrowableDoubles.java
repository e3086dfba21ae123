package org.specimenledger.curve;

import java.util.ArrayList;
import java.util.List;

/**
 * A primitive double list filled in fixed blocks of 8192 values (64 KiB), so a million points cost
 * no boxing, no re-copying while growing and no spare capacity at the end: the blocks are copied
 * once into an array of exactly {@link #size()} values.
 */
final class GrowableDoubles {

    private static final int BLOCK = 8192;

    private final List<double[]> fullBlocks = new ArrayList<>();
    private double[] current = new double[BLOCK];
    private int used;
    private int size;

    void add(double value) {
        if (used == BLOCK) {
            fullBlocks.add(current);
            current = new double[BLOCK];
            used = 0;
        }
        current[used++] = value;
        size++;
    }

    /** The value added last; only valid when {@link #size()} is positive. */
    double last() {
        return current[used - 1];
    }

    int size() {
        return size;
    }

    /** A new array of exactly {@link #size()} values, in the order they were added. */
    double[] toTrimmedArray() {
        double[] all = new double[size];
        int at = 0;
        for (double[] block : fullBlocks) {
            System.arraycopy(block, 0, all, at, BLOCK);
            at += BLOCK;
        }
        System.arraycopy(current, 0, all, at, used);
        return all;
    }
}
