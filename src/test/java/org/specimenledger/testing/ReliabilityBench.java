package org.specimenledger.testing;

import java.util.Map;
import org.specimenledger.testsupport.Api;

/**
 * The test-run bench of {@link TestRunFixtures}, opened to the reliability suite in another package:
 * a specimen with calibrated instruments, a registration body and a model curve for it.
 */
public final class ReliabilityBench {

    private final TestRunFixtures.Bench bench;

    private ReliabilityBench(TestRunFixtures.Bench bench) {
        this.bench = bench;
    }

    /** Registers a new specimen, heat, order and calibrated instruments for the customer given. */
    public static ReliabilityBench make(Api technician, Api manager, String customerId) {
        return new ReliabilityBench(TestRunFixtures.bench(technician, manager, customerId));
    }

    public String specimenId() {
        return bench.specimenId();
    }

    public String heatId() {
        return bench.heatId();
    }

    public String orderId() {
        return bench.orderId();
    }

    public String machineId() {
        return bench.machineId();
    }

    public String extensometerId() {
        return bench.extensometerId();
    }

    /** A valid test-run registration body for this bench. */
    public Map<String, Object> registration() {
        return TestRunFixtures.registration(bench);
    }

    /** A Ramberg–Osgood model curve for this bench's specimen (unique bytes per bench). */
    public byte[] curve() {
        return TestRunFixtures.curve(bench);
    }
}
