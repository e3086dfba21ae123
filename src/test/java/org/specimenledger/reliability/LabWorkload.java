package org.specimenledger.reliability;

import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicLong;
import org.specimenledger.certificates.CertificateBench;
import org.specimenledger.testing.ReliabilityBench;
import org.specimenledger.testsupport.Api;

/**
 * What technicians do all day, against a running service: on one bench (specimen with calibrated
 * instruments), register a run, upload its curve (analysed at once), now and then re-analyse it, and
 * register a retest. Every write the service acknowledges is noted by table and id, for {@link Invariants}.
 * A request that fails (the service was killed) ends the worker quietly. A lab manager meanwhile sets up an
 * order with one tested specimen, drafts its certificate and issues it, over and over, so that kills also fall
 * inside certificate issues.
 */
final class LabWorkload {

    static final String TECHNICIAN = "demo-technician";
    static final String MANAGER = "demo-manager";
    static final String PASSWORD = "demo-password";

    final Map<String, List<UUID>> acknowledged = new ConcurrentHashMap<>(Map.of(
            "test_run", new CopyOnWriteArrayList<>(), "raw_curve", new CopyOnWriteArrayList<>(),
            "analysis_run", new CopyOnWriteArrayList<>(), "certificate", new CopyOnWriteArrayList<>()));
    final AtomicLong uploads = new AtomicLong();
    final AtomicLong issues = new AtomicLong();
    /** Set while an issue request is out: a kill at that moment fell inside a certificate issue. */
    final AtomicBoolean issueInFlight = new AtomicBoolean();
    final AtomicLong refusals = new AtomicLong();
    final List<String> serverErrors = new CopyOnWriteArrayList<>();
    /** 503 answers: the database was away; allowed while it is, and nothing may be stored by them. */
    final AtomicLong unavailable = new AtomicLong();
    /** A technician's wait between two tests and the manager's between two issues; none unless set. */
    volatile Duration technicianPause = Duration.ZERO;
    volatile Duration managerPause = Duration.ZERO;

    /** One technician's loop until {@code stop} is set or the service stops answering. */
    void technician(int port, AtomicBoolean stop) {
        technician(port, stop, false);
    }

    /** With {@code retryable}, a failed set-up is tried again (the database restarts, the service stays). */
    void technician(int port, AtomicBoolean stop, boolean retryable) {
        Api tech = new Api.Signed(port, TECHNICIAN, PASSWORD).api();
        Api manager = new Api.Signed(port, MANAGER, PASSWORD).api();
        try {
            ReliabilityBench bench = null;
            while (bench == null && !stop.get()) {
                try {
                    String customer = manager.get("/api/v1/customers").json().get(0).get("id").asString();
                    bench = ReliabilityBench.make(tech, manager, customer);
                } catch (RuntimeException e) {
                    if (!retryable) {
                        throw e;
                    }
                    Thread.sleep(500); // the database is away; the bench is set up again when it is back
                }
            }
            boolean first = true;
            while (!stop.get()) {
                if (!first) {
                    pause(technicianPause, stop);
                }
                Map<String, Object> registration = new java.util.HashMap<>(bench.registration());
                if (!first) {
                    registration.put("retestReason", "repeat under the reliability workload");
                }
                Api.Response run = tech.post("/api/v1/tests", registration);
                if (!note(run, "test_run", run.json() == null ? null : run.id())) {
                    continue;
                }
                first = false;
                byte[] curve = withLabel(bench.curve(), run.id());
                Api.Response up = tech.putBytes("/api/v1/tests/" + run.id() + "/curve", "text/csv", curve);
                if (up.status() == 201) {
                    uploads.incrementAndGet();
                    acknowledged.get("raw_curve").add(UUID.fromString(up.json().get("curve").get("id").asString()));
                    acknowledged.get("analysis_run").add(UUID.fromString(up.json().get("analysis").get("id").asString()));
                    if (uploads.get() % 3 == 0) {
                        Api.Response again = tech.post("/api/v1/tests/" + run.id() + "/analyses", Map.of("parameters",
                                Map.of("proofOffsetsPercent", List.of(0.2, 1.0)), "reason", "Rp1 asked for as well"));
                        note(again, "analysis_run", again.json() == null ? null : again.id());
                    }
                } else {
                    note(up, null, null);
                }
            }
        } catch (RuntimeException e) {
            // the service went away under us: that is the point of the exercise
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    /** The lab manager's loop: order, specimen and analysis set up, certificate drafted, issued; again. */
    void manager(int port, AtomicBoolean stop) {
        Api tech = new Api.Signed(port, TECHNICIAN, PASSWORD).api();
        Api manager = new Api.Signed(port, MANAGER, PASSWORD).api();
        try {
            String customer = manager.get("/api/v1/customers").json().get(0).get("id").asString();
            CertificateBench bench = new CertificateBench(tech, manager);
            boolean first = true;
            while (!stop.get()) {
                if (!first) {
                    pause(managerPause, stop);
                }
                first = false;
                CertificateBench.Order order = bench.order(customer,
                        List.of(CertificateBench.requirement("Rm", "380", null, "MPa")), 1);
                Api.Response draft = manager.post("/api/v1/certificates/drafts", Map.of("orderId", order.orderId(),
                        "specimenIds", order.specimenIds(), "productDescription", "Hot-rolled plate 12 mm"));
                if (draft.status() != 201) {
                    note(draft, null, null);
                    continue;
                }
                Map<String, Object> issue = new java.util.HashMap<>();
                issue.put("password", PASSWORD);
                issue.put("nonConformityStatement", "issued under the reliability workload; see the lines");
                issueInFlight.set(true);
                Api.Response issued = manager.post("/api/v1/certificates/drafts/" + draft.id() + "/issue", issue);
                issueInFlight.set(false);
                if (note(issued, "certificate", issued.json() == null ? null : issued.id())) {
                    issues.incrementAndGet();
                }
            }
        } catch (RuntimeException e) {
            // the service went away under us
        }
    }

    private static void pause(Duration pause, AtomicBoolean stop) {
        long until = System.nanoTime() + pause.toNanos();
        while (!stop.get() && System.nanoTime() < until) {
            java.util.concurrent.locks.LockSupport.parkNanos(Math.min(until - System.nanoTime(), 50_000_000L));
        }
    }

    private boolean note(Api.Response r, String table, String id) {
        if (r.status() == 503) {
            unavailable.incrementAndGet();
        } else if (r.status() >= 500) {
            serverErrors.add(r.toString());
        }
        if (r.status() / 100 == 2 && table != null && id != null) {
            acknowledged.get(table).add(UUID.fromString(id));
            return true;
        }
        if (r.status() >= 400) {
            refusals.incrementAndGet();
        }
        return false;
    }

    /** The same curve with one more metadata line, so that no two uploads carry the same bytes. */
    static byte[] withLabel(byte[] curve, String runId) {
        byte[] head = ("# run: " + runId + "\n").getBytes(StandardCharsets.UTF_8);
        byte[] out = java.util.Arrays.copyOf(head, head.length + curve.length);
        System.arraycopy(curve, 0, out, head.length, curve.length);
        return out;
    }

    long acknowledgedCount() {
        return acknowledged.values().stream().mapToLong(List::size).sum();
    }
}
