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
 * Load on loopback against the service as its own process: {@code reliability.portal-users} customer accounts (50
 * in full mode, 10 in quick mode) of the organisation that holds the demo laboratory's certificates, each listing
 * and searching its certificates, opening one, downloading its PDF and reading its orders and heats, while two
 * technicians upload curves (each analysed on arrival) and a lab manager drafts and issues certificates. Each
 * technician waits {@code reliability.technician-pause-ms} (1,000) between two tests and the manager {@code
 * reliability.manager-pause-ms} (5,000) between two issues: one upload every half second and an issue every few
 * seconds, far more than a laboratory's machines produce, while leaving the portal some of the two cores.
 *
 * <p>The portal users together send {@code reliability.portal-rate} requests per second (250 in full mode, 50 in
 * quick mode), each user on its own fixed schedule; a request's latency is counted from the moment the schedule
 * meant to send it, so a slow answer that delays the next request is counted against the service, not hidden
 * (the correction for coordinated omission, as HdrHistogram's documentation describes it). {@code
 * reliability.portal-rate=0} drops the schedule: every user sends its next request as soon as the last one is
 * answered, which shows the capacity (throughput) rather than the latency at a given rate.
 *
 * <p>Records throughput, p50/p99 latency (HdrHistogram) and errors; the ledger must verify afterwards. Quick mode
 * runs 10 s and checks only that nothing failed; full mode ({@code -Dreliability.full=true}, {@code
 * reliability.load-seconds}, 300 unless set) also holds the targets (bcrypt at the production work factor 11;
 * {@code -Dreliability.password-memory=PT0S} runs the same load with remembered password checks off): at least
 * 200 portal requests/s answered with p99 at most 100 ms.
 */
class PortalLoadTest {

    private static final int USERS = Integer.getInteger("reliability.portal-users", HostileInputTest.FULL ? 50 : 10);
    private static final int SECONDS = Integer.getInteger("reliability.load-seconds", HostileInputTest.FULL ? 300 : 10);
    /**
     * The same load, unmeasured, before the measured window, its rate raised step by step from a fifth to the full
     * rate over the first three quarters: the service's JIT compiler needs a few minutes of traffic on two cores
     * before the code is at full speed (CPU per request falls about fourfold over the first two or three minutes), and
     * starved of CPU by a full-rate start it takes far longer. A laboratory's service runs for weeks; a cold start
     * is not its working state. The warm-up's figures are printed as well.
     */
    private static final int WARM_UP = Integer.getInteger("reliability.load-warmup-seconds", HostileInputTest.FULL ? 180 : 0);
    private static final double RATE = Double.parseDouble(System.getProperty("reliability.portal-rate",
            HostileInputTest.FULL ? "250" : "50"));

    @Test
    void portalUsersReadWhileTechniciansUploadAndAManagerIssues() throws Exception {
        Path dir = Files.createTempDirectory("ledger-load");
        try (ScratchDatabase db = new ScratchDatabase(AdminDatabase.url(), "ledger_load");
                ServiceProcess service = new ServiceProcess(dir, db.url())) {
            // the production bcrypt work factor: the point is to show what HTTP Basic costs with it
            service.hashStrength(Integer.getInteger("reliability.hash-strength", 11));
            String memory = System.getProperty("reliability.password-memory");
            if (memory != null) {
                service.env("LEDGER_PASSWORD_CHECK_MEMORY", memory); // PT0S: compare with the memory off
            }
            // as a laboratory would run it: both JIT tiers (the crash tests stop at C1 for fast restarts), a fixed heap
            service.jvmOptions(List.of(System.getProperty("reliability.load-jvm-options", "-Xms1g -Xmx1g").split(" ")));
            service.start(Duration.ofMinutes(3));
            Api manager = new Api.Signed(service.port(), LabWorkload.MANAGER, LabWorkload.PASSWORD).api();
            // the organisation whose certificates the demo laboratory issued, and their numbers
            JsonNode issued = manager.get("/api/v1/certificates?size=100").json().get("certificates");
            assertThat(issued.size()).as("demo certificates to read").isPositive();
            String organisation = issued.get(0).get("customerId").asString();
            List<String> numbers = new ArrayList<>();
            for (JsonNode c : issued) {
                if (c.get("customerId").asString().equals(organisation) && !numbers.contains(c.get("number").asString())) {
                    numbers.add(c.get("number").asString());
                }
            }
            List<String> users = new ArrayList<>();
            for (int i = 0; i < USERS; i++) {
                String name = "portal-" + i;
                Api.Response r = manager.post("/api/v1/accounts", Map.of("username", name, "displayName", "Portal " + i,
                        "password", "portal-password-" + i, "role", "CUSTOMER", "organisationId", organisation));
                assertThat(r.status()).as(r.toString()).isEqualTo(201);
                users.add(name);
            }
            LabWorkload work = new LabWorkload();
            // far busier than a laboratory's day (a tensile test takes minutes on its machine), but not a flood
            work.technicianPause = Duration.ofMillis(Long.getLong("reliability.technician-pause-ms", 1000));
            work.managerPause = Duration.ofMillis(Long.getLong("reliability.manager-pause-ms", 5000));
            AtomicBoolean stop = new AtomicBoolean();
            List<Thread> threads = new ArrayList<>();
            for (int w = 0; w < 2; w++) {
                threads.add(new Thread(() -> work.technician(service.port(), stop), "technician-" + w));
            }
            threads.add(new Thread(() -> work.manager(service.port(), stop), "manager"));
            List<Recorder> byKind = new ArrayList<>();
            for (int k = 0; k < PortalUser.KINDS.size(); k++) {
                byKind.add(new Recorder(3));
            }
            AtomicLong errors = new AtomicLong();
            AtomicLong pdfBytes = new AtomicLong();
            List<String> errorSamples = new java.util.concurrent.CopyOnWriteArrayList<>();
            AtomicBoolean measuring = new AtomicBoolean();
            SlowRequests slow = new SlowRequests();
            java.util.concurrent.atomic.AtomicInteger schedule = new java.util.concurrent.atomic.AtomicInteger();
            java.util.concurrent.CountDownLatch signedIn = new java.util.concurrent.CountDownLatch(USERS);
            long periodNanos = RATE <= 0 ? 0 : (long) (1e9 * USERS / RATE);
            // each user's current period: longer than periodNanos while the warm-up ramps the rate up
            AtomicLong period = new AtomicLong(WARM_UP > 0 ? periodNanos * 5 : periodNanos);
            for (int i = 0; i < USERS; i++) {
                Wire portal = new Wire(service.base(), users.get(i), "portal-password-" + i);
                threads.add(new Thread(() -> {
                    // warm-up: each user's first request pays the full bcrypt check once
                    while (!stop.get() && portal.get("/api/v1/heats").status() != 200) {
                        Thread.onSpinWait();
                    }
                    signedIn.countDown();
                    new PortalUser(portal, organisation, numbers, period, stop, measuring, schedule,
                            byKind, errors, pdfBytes, errorSamples, slow).run();
                }, "portal-" + i));
            }
            threads.forEach(Thread::start);
            assertThat(signedIn.await(5, java.util.concurrent.TimeUnit.MINUTES)).as("every portal user signed in").isTrue();
            Thread.sleep(3000); // pool settles
            Histogram cold = null;
            if (WARM_UP > 0) {
                byKind.forEach(Recorder::reset);
                measuring.set(true);
                long rampEnd = System.nanoTime() + WARM_UP * 750_000_000L;
                long warmEnd = System.nanoTime() + WARM_UP * 1_000_000_000L;
                while (System.nanoTime() < warmEnd) {
                    double left = Math.max(0, (rampEnd - System.nanoTime()) / (WARM_UP * 750_000_000.0));
                    period.set((long) (periodNanos / (1.0 - 0.8 * left))); // a fifth of the rate at first, then all
                    Thread.sleep(1000);
                }
                period.set(periodNanos);
                measuring.set(false);
                cold = merged(byKind.stream().map(Recorder::getIntervalHistogram).toList());
                schedule.incrementAndGet(); // each user starts its schedule anew: no backlog carried into the window
                pdfBytes.set(0);
            }
            byKind.forEach(Recorder::reset);
            long startUploads = work.uploads.get();
            long startIssues = work.issues.get();
            Duration cpuBefore = service.cpuTime();
            slow.startWindow();
            measuring.set(true);
            Instant start = Instant.now();
            Thread.sleep(SECONDS * 1000L);
            measuring.set(false);
            Duration took = Duration.between(start, Instant.now());
            Duration cpu = service.cpuTime().minus(cpuBefore);
            List<Histogram> kinds = byKind.stream().map(Recorder::getIntervalHistogram).toList();
            Histogram h = merged(kinds);
            long uploads = work.uploads.get() - startUploads;
            long issues = work.issues.get() - startIssues;
            stop.set(true);
            for (Thread t : threads) {
                t.join(60_000);
            }
            var chain = ChainVerifier.over(db.dataSource()).verify();
            double seconds = took.toMillis() / 1000.0;
            if (cold != null) {
                System.out.printf(java.util.Locale.ROOT, "[reliability] load warm-up (unmeasured window, %d s from a "
                        + "cold start): %s%n", WARM_UP, percentiles(cold));
            }
            System.out.printf(java.util.Locale.ROOT, "[reliability] load: %d portal users, %s, for %.1f s: %d portal "
                    + "requests answered (%.1f/s), p50 %.1f ms, p99 %.1f ms, max %.1f ms (from the scheduled send), %d "
                    + "errors (warm-up included), %.1f MB of PDF downloaded; %d uploads (%.2f/s) and %d certificate issues alongside; "
                    + "ledger %s (%d events)%n", USERS, RATE <= 0 ? "closed loop" : "scheduled at " + RATE + " requests/s",
                    seconds, h.getTotalCount(), h.getTotalCount() / seconds, h.getValueAtPercentile(50) / 1000.0,
                    h.getValueAtPercentile(99) / 1000.0, h.getMaxValue() / 1000.0, errors.get(), pdfBytes.get() / 1e6,
                    uploads, uploads / seconds, issues, chain.valid() ? "valid" : "BROKEN", chain.eventsChecked());
            int cores = Runtime.getRuntime().availableProcessors();
            System.out.printf(java.util.Locale.ROOT, "[reliability] load: the service used %.1f s of CPU in the window "
                    + "(%.2f of the %d cores' %.0f s)%n", cpu.toMillis() / 1000.0, cpu.toMillis() / 1000.0 / seconds,
                    cores, cores * seconds);
            for (int k = 0; k < PortalUser.KINDS.size(); k++) {
                System.out.printf(java.util.Locale.ROOT, "[reliability] load, %s: %s%n", PortalUser.KINDS.get(k),
                        percentiles(kinds.get(k)));
            }
            System.out.printf(java.util.Locale.ROOT, "[reliability] load: %s%n", slow.summary());
            assertThat(errors.get()).as("portal errors, e.g. " + errorSamples).isZero();
            assertThat(work.serverErrors).as("upload and issue errors").isEmpty();
            assertThat(chain.valid()).as("ledger after the load").isTrue();
            if (HostileInputTest.FULL) {
                assertThat(h.getTotalCount() / seconds).as("portal requests per second").isGreaterThanOrEqualTo(200);
                assertThat(h.getValueAtPercentile(99) / 1000.0).as("p99 in ms").isLessThanOrEqualTo(100);
                assertThat(uploads).as("uploads during the measured window").isPositive();
                assertThat(issues).as("certificate issues during the measured window").isPositive();
            }
        }
    }

    /**
     * The requests of the measured window that took over a second (from their scheduled send), by the second of the
     * window they were due in: tells a few stalls of everyone (one or two seconds with many users) from slowness
     * spread over the window.
     */
    static final class SlowRequests {
        static final long SLOW_MICROS = 1_000_000;
        private final java.util.concurrent.ConcurrentLinkedQueue<long[]> seen =
                new java.util.concurrent.ConcurrentLinkedQueue<>();
        private volatile long windowStart;
        private volatile Instant windowStartWall = Instant.now();

        void startWindow() {
            seen.clear();
            windowStart = System.nanoTime();
            windowStartWall = Instant.now(); // printed, to line the stalls up with the database's and system's logs
        }

        void note(long scheduledNanos, long micros) {
            if (micros > SLOW_MICROS) {
                seen.add(new long[] {(scheduledNanos - windowStart) / 1_000_000_000L, micros});
            }
        }

        String summary() {
            java.util.TreeMap<Long, long[]> bySecond = new java.util.TreeMap<>(); // second -> {count, max µs}
            for (long[] s : seen) {
                long[] c = bySecond.computeIfAbsent(s[0], k -> new long[2]);
                c[0]++;
                c[1] = Math.max(c[1], s[1]);
            }
            StringBuilder out = new StringBuilder().append(seen.size()).append(" requests over 1 s, due in ")
                    .append(bySecond.size()).append(" distinct seconds of the window begun ").append(windowStartWall);
            int shown = 0;
            for (var e : bySecond.entrySet()) {
                if (shown++ == 30) {
                    out.append("; …");
                    break;
                }
                out.append(shown == 1 ? ": " : "; ").append(String.format(java.util.Locale.ROOT, "s %d: %d (max %.1f s)",
                        e.getKey(), e.getValue()[0], e.getValue()[1] / 1e6));
            }
            return out.toString();
        }
    }

    /** All request kinds in one histogram. */
    private static Histogram merged(List<Histogram> kinds) {
        Histogram all = new Histogram(3);
        kinds.forEach(all::add);
        return all;
    }

    private static String percentiles(Histogram h) {
        return String.format(java.util.Locale.ROOT, "%d requests, p50 %.1f ms, p99 %.1f ms, max %.1f ms",
                h.getTotalCount(), h.getValueAtPercentile(50) / 1000.0, h.getValueAtPercentile(99) / 1000.0,
                h.getMaxValue() / 1000.0);
    }

    /**
     * One customer at the portal, in a fixed round: the certificate list, a search by number, one certificate, its
     * PDF, the orders, the heats. With a period, each request has its scheduled moment and its latency is counted
     * from there.
     */
    private record PortalUser(Wire portal, String organisation, List<String> numbers, AtomicLong period,
            AtomicBoolean stop, AtomicBoolean measuring, java.util.concurrent.atomic.AtomicInteger schedule,
            List<Recorder> byKind, AtomicLong errors, AtomicLong pdfBytes,
            List<String> samples, SlowRequests slow) {

        static final List<String> KINDS = List.of("certificate list", "search by number", "one certificate",
                "certificate PDF", "orders", "heats");

        void run() {
            ThreadLocalRandom random = ThreadLocalRandom.current();
            long periodNanos = period.get();
            long next = System.nanoTime() + (periodNanos == 0 ? 0 : random.nextLong(periodNanos));
            int step = random.nextInt(KINDS.size());
            int round = schedule.get();
            while (!stop.get()) {
                if (round != schedule.get()) {
                    round = schedule.get();
                    periodNanos = period.get();
                    next = System.nanoTime() + (periodNanos == 0 ? 0 : random.nextLong(periodNanos));
                }
                if (periodNanos > 0) {
                    long wait = next - System.nanoTime();
                    if (wait > 0) {
                        java.util.concurrent.locks.LockSupport.parkNanos(wait);
                        continue; // woken early or on time: check again
                    }
                }
                long scheduled = periodNanos == 0 ? System.nanoTime() : next;
                String number = numbers.get(random.nextInt(numbers.size()));
                int kind = step++ % KINDS.size();
                String path = switch (kind) {
                    case 0 -> "/api/v1/certificates?size=20";
                    case 1 -> "/api/v1/certificates?number=" + number.substring(0, number.length() - 2);
                    case 2 -> "/api/v1/certificates/" + number;
                    case 3 -> "/api/v1/certificates/" + number + "/pdf";
                    case 4 -> "/api/v1/orders";
                    default -> "/api/v1/heats";
                };
                int status;
                try {
                    if (path.endsWith("/pdf")) {
                        byte[] pdf = portal.bytes(path);
                        status = pdf != null && pdf.length > 4 && pdf[0] == '%' && pdf[1] == 'P' ? 200 : -1;
                        if (measuring.get() && pdf != null) {
                            pdfBytes.addAndGet(pdf.length);
                        }
                    } else {
                        Wire.Answer a = portal.get(path);
                        status = a.status();
                        if (status != 200 && samples.size() < 5) {
                            samples.add(path + " " + a);
                        }
                    }
                } catch (RuntimeException e) {
                    if (!stop.get()) {
                        errors.incrementAndGet();
                        samples.add(e.getMessage());
                    }
                    next += period.get();
                    continue;
                }
                long micros = (System.nanoTime() - scheduled) / 1000;
                if (measuring.get()) {
                    byKind.get(kind).recordValue(micros);
                    slow.note(scheduled, micros);
                    if (status != 200) {
                        errors.incrementAndGet();
                    }
                }
                next += period.get();
            }
        }
    }
}
