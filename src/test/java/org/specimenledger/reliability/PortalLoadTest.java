package org.specimenledger.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ThreadLocalRandom;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicLong;
import org.HdrHistogram.Recorder;
import org.HdrHistogram.Histogram;
import org.junit.jupiter.api.Test;
import org.postgresql.ds.PGSimpleDataSource;
import org.specimenledger.audit.ChainVerifier;
import org.specimenledger.testsupport.Api;
import tools.jackson.databind.JsonNode;

/**
 * Load on loopback against the service as its own process: {@code reliability.portal-users} customer
 * accounts (50 in full mode, 10 in quick mode) each reading their organisation's orders, test runs and results in a closed loop, while two
 * technicians upload curves (each analysed on arrival). Records portal throughput, p50/p99 latency
 * (HdrHistogram) and errors; the ledger must verify afterwards. Quick mode runs 10 s and checks only that
 * nothing failed; full mode ({@code -Dreliability.full=true}, {@code reliability.load-seconds}, 300 unless
 * set) also holds the targets (bcrypt at the production work factor 11;
 * {@code -Dreliability.password-memory=PT0S} runs the same load with remembered password checks off): at least 200 portal requests/s with p99 at most 100 ms. Hook: once
 * certificates exist, the portal loop adds a certificate PDF download and a manager thread issues them.
 */
class PortalLoadTest {

    private static final int USERS = Integer.getInteger("reliability.portal-users", HostileInputTest.FULL ? 50 : 10);
    private static final int SECONDS = Integer.getInteger("reliability.load-seconds", HostileInputTest.FULL ? 300 : 10);

    @Test
    void portalUsersReadWhileTechniciansUpload() throws Exception {
        Path dir = Files.createTempDirectory("ledger-load");
        try (ScratchDatabase db = new ScratchDatabase(AdminDatabase.url(), "ledger_load");
                ServiceProcess service = new ServiceProcess(dir, db.url())) {
            // the production bcrypt work factor: the point is to show what HTTP Basic costs with it
            service.hashStrength(Integer.getInteger("reliability.hash-strength", 11));
            String memory = System.getProperty("reliability.password-memory");
            if (memory != null) {
                service.env("LEDGER_PASSWORD_CHECK_MEMORY", memory); // PT0S: compare with the memory off
            }
            service.start(Duration.ofMinutes(3));
            Api manager = new Api.Signed(service.port(), LabWorkload.MANAGER, LabWorkload.PASSWORD).api();
            JsonNode customers = manager.get("/api/v1/customers").json();
            String organisation = customers.get(0).get("id").asString();
            List<String> users = new ArrayList<>();
            for (int i = 0; i < USERS; i++) {
                String name = "portal-" + i;
                Api.Response r = manager.post("/api/v1/accounts", Map.of("username", name, "displayName", "Portal " + i,
                        "password", "portal-password-" + i, "role", "CUSTOMER", "organisationId", organisation));
                assertThat(r.status()).as(r.toString()).isEqualTo(201);
                users.add(name);
            }
            LabWorkload work = new LabWorkload();
            AtomicBoolean stop = new AtomicBoolean();
            List<Thread> threads = new ArrayList<>();
            for (int w = 0; w < 2; w++) {
                threads.add(new Thread(() -> work.technician(service.port(), stop), "technician-" + w));
            }
            Recorder latencies = new Recorder(3);
            AtomicLong requests = new AtomicLong();
            AtomicLong errors = new AtomicLong();
            List<String> errorSamples = new java.util.concurrent.CopyOnWriteArrayList<>();
            AtomicBoolean measuring = new AtomicBoolean();
            java.util.concurrent.CountDownLatch signedIn = new java.util.concurrent.CountDownLatch(USERS);
            for (int i = 0; i < USERS; i++) {
                Wire portal = new Wire(service.base(), users.get(i), "portal-password-" + i);
                threads.add(new Thread(() -> {
                    // warm-up: each user's first request pays the full bcrypt check once
                    while (!stop.get() && portal.get("/api/v1/heats").status() != 200) {
                        Thread.onSpinWait();
                    }
                    signedIn.countDown();
                    portalLoop(portal, organisation, stop, measuring, latencies, requests, errors, errorSamples);
                }, "portal-" + i));
            }
            threads.forEach(Thread::start);
            assertThat(signedIn.await(5, java.util.concurrent.TimeUnit.MINUTES)).as("every portal user signed in").isTrue();
            Thread.sleep(3000); // JIT and pool settle
            latencies.reset();
            long startUploads = work.uploads.get();
            measuring.set(true);
            Instant start = Instant.now();
            Thread.sleep(SECONDS * 1000L);
            measuring.set(false);
            Duration took = Duration.between(start, Instant.now());
            Histogram h = latencies.getIntervalHistogram();
            long uploads = work.uploads.get() - startUploads;
            stop.set(true);
            for (Thread t : threads) {
                t.join(60_000);
            }
            var chain = ChainVerifier.over(db.dataSource()).verify();
            double seconds = took.toMillis() / 1000.0;
            System.out.printf("[reliability] load: %d portal users for %.1f s: %d portal requests (%.1f/s), "
                    + "p50 %.1f ms, p99 %.1f ms, max %.1f ms, %d errors; %d uploads (%.2f/s) alongside; ledger %s "
                    + "(%d events)%n", USERS, seconds, h.getTotalCount(), h.getTotalCount() / seconds,
                    h.getValueAtPercentile(50) / 1000.0, h.getValueAtPercentile(99) / 1000.0, h.getMaxValue() / 1000.0,
                    errors.get(), uploads, uploads / seconds, chain.valid() ? "valid" : "BROKEN", chain.eventsChecked());
            assertThat(errors.get()).as("portal errors, e.g. " + errorSamples).isZero();
            assertThat(work.serverErrors).as("upload errors").isEmpty();
            assertThat(chain.valid()).as("ledger after the load").isTrue();
            if (HostileInputTest.FULL) {
                assertThat(h.getTotalCount() / seconds).as("portal requests per second").isGreaterThanOrEqualTo(200);
                assertThat(h.getValueAtPercentile(99) / 1000.0).as("p99 in ms").isLessThanOrEqualTo(100);
                assertThat(uploads).as("uploads during the measured window").isPositive();
            }
        }
    }

    private static void portalLoop(Wire portal, String organisation, AtomicBoolean stop, AtomicBoolean measuring,
            Recorder latencies, AtomicLong requests, AtomicLong errors, List<String> samples) {
        List<String> runIds = new ArrayList<>();
        int step = 0;
        while (!stop.get()) {
            String path = switch (step++ % 4) {
                case 0 -> "/api/v1/customers/" + organisation;
                case 1 -> "/api/v1/orders";
                case 2 -> runIds.isEmpty() ? "/api/v1/specimens"
                        : "/api/v1/tests/" + runIds.get(ThreadLocalRandom.current().nextInt(runIds.size()));
                default -> "/api/v1/heats";
            };
            long t0 = System.nanoTime();
            Wire.Answer a;
            try {
                a = portal.get(path);
            } catch (RuntimeException e) {
                if (!stop.get()) {
                    errors.incrementAndGet();
                    samples.add(e.getMessage());
                }
                continue;
            }
            long micros = (System.nanoTime() - t0) / 1000;
            if (measuring.get()) {
                latencies.recordValue(micros);
                requests.incrementAndGet();
                if (a.status() != 200) {
                    errors.incrementAndGet();
                    if (samples.size() < 5) {
                        samples.add(path + " " + a);
                    }
                }
            }
            if (step % 40 == 1 && a.status() == 200 && runIds.size() < 20) {
                Wire.Answer runs = portal.get("/api/v1/tests");
                if (runs.status() == 200 && runs.json().isArray()) {
                    for (JsonNode run : runs.json()) {
                        if (runIds.size() < 20) {
                            runIds.add(run.get("id").asString());
                        }
                    }
                }
            }
        }
    }
}
