package org.specimenledger.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.ServerSocket;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.Test;
import org.postgresql.ds.PGSimpleDataSource;
import org.specimenledger.system.EmbeddedPostgresServer;

/**
 * Restarts PostgreSQL under load: a database server of this test's own (the embedded one the project ships,
 * on its own port and data folder; the machine's shared server is never touched) is stopped and started
 * again while technicians upload and readers list. The service must come back by itself: readers get
 * answers again without anyone restarting it, and no acknowledged write is lost. While the database is
 * away, answers are 503 with {@code Retry-After} (or, for a sign-in that cannot read the account, the same),
 * never a 500. Quick mode: one restart; full mode: {@code reliability.db-restarts}, 5 unless set.
 */
class DatabaseRestartTest {

    /**
     * Restarts, alternately a crash (an immediate shutdown, SIGQUIT to the postmaster: every server process exits at
     * once, nothing is flushed, the next start replays the write-ahead log) and a fast stop (what an operator's
     * restart does: the server finishes its writes and checkpoints), a crash first.
     */
    private static final int RESTARTS = Integer.getInteger("reliability.db-restarts", HostileInputTest.FULL ? 6 : 2);

    @Test
    void theServiceRecoversFromADatabaseRestartWithoutLosingAcknowledgedWrites() throws Exception {
        Path dir = Files.createTempDirectory("ledger-dbrestart");
        Path pgData = dir.resolve("pgdata");
        int pgPort;
        try (ServerSocket s = new ServerSocket(0)) {
            pgPort = s.getLocalPort();
        }
        EmbeddedPostgresServer pg = EmbeddedPostgresServer.start(pgData, pgPort);
        LabWorkload work = new LabWorkload();
        List<Long> recoveries = new ArrayList<>();
        int crashes = 0;
        AtomicLong reads = new AtomicLong();
        AtomicLong readFailures = new AtomicLong();
        List<String> readErrors = new java.util.concurrent.CopyOnWriteArrayList<>();
        String url = pg.jdbcUrl();
        try (ServiceProcess service = new ServiceProcess(dir.resolve("service"), url)) {
            service.start(Duration.ofMinutes(3));
            AtomicBoolean stop = new AtomicBoolean();
            List<Thread> threads = new ArrayList<>();
            for (int w = 0; w < 2; w++) {
                threads.add(new Thread(() -> work.technician(service.port(), stop, true), "technician-" + w));
            }
            Wire reader = new Wire(service.base(), LabWorkload.TECHNICIAN, LabWorkload.PASSWORD);
            for (int r = 0; r < 3; r++) {
                threads.add(new Thread(() -> {
                    while (!stop.get()) {
                        try {
                            Wire.Answer a = reader.get("/api/v1/tests");
                            reads.incrementAndGet();
                            if (a.status() != 200) {
                                readFailures.incrementAndGet();
                                if (a.status() != 503) {
                                    readErrors.add(a.toString());
                                }
                            }
                        } catch (RuntimeException e) {
                            readErrors.add(e.getMessage());
                        }
                    }
                }, "reader-" + r));
            }
            threads.forEach(Thread::start);
            for (int restart = 0; restart < RESTARTS; restart++) {
                Thread.sleep(5000);
                if (restart % 2 == 0) {
                    // the moment that tells: just after the service acknowledged a write (a commit that is
                    // acknowledged before it reaches the write-ahead log on disk would be lost here)
                    long seen = work.acknowledgedCount();
                    long until = System.nanoTime() + 10_000_000_000L;
                    while (work.acknowledgedCount() == seen && System.nanoTime() < until) {
                        Thread.sleep(1); // not a spin: on two cores it would take CPU from the service it waits on
                    }
                    crash(pgData);
                    crashes++;
                }
                pg.close(); // after a crash: releases what the launcher holds
                Thread.sleep(3000);
                pg = EmbeddedPostgresServer.start(pgData, pgPort);
                long back = System.nanoTime();
                long waited = waitForReads(reader, Duration.ofSeconds(90));
                recoveries.add(waited < 0 ? -1 : (System.nanoTime() - back) / 1_000_000);
            }
            Thread.sleep(4000);
            stop.set(true);
            for (Thread t : threads) {
                t.join(60_000);
            }
            PGSimpleDataSource ds = new PGSimpleDataSource();
            ds.setUrl(url);
            List<String> broken = Invariants.check(ds, work.acknowledged);
            System.out.printf("[reliability] database restart: %d restarts (crashes: %d), reads answered again after %s ms, %d reads "
                    + "(%d not 200), %d uploads and %d writes acknowledged, %d × 503 to technicians, %d broken "
                    + "invariants%n", RESTARTS, crashes, recoveries, reads.get(), readFailures.get(), work.uploads.get(),
                    work.acknowledgedCount(), work.unavailable.get(), broken.size());
            assertThat(recoveries).as("milliseconds until reads were answered again").allMatch(ms -> ms >= 0);
            assertThat(broken).as("invariants after the database restarts").isEmpty();
            assertThat(readErrors).as("reads answered other than 200 or 503").isEmpty();
            assertThat(work.serverErrors).as("5xx other than 503").isEmpty();
            assertThat(work.uploads.get()).isPositive();
        } finally {
            pg.close();
            deleteTree(pgData); // 40 MB of database files; the service log stays for a failed run
        }
    }

    /** Immediate shutdown of the server on {@code pgData}, as its documentation describes a crash; waits for it. */
    private static void crash(Path pgData) throws Exception {
        long pid = Long.parseLong(Files.readAllLines(pgData.resolve("postmaster.pid")).get(0).trim());
        ProcessHandle postmaster = ProcessHandle.of(pid).orElseThrow();
        new ProcessBuilder("kill", "-QUIT", Long.toString(pid)).inheritIO().start().waitFor();
        postmaster.onExit().get(30, java.util.concurrent.TimeUnit.SECONDS);
    }

    private static void deleteTree(Path root) throws java.io.IOException {
        if (!Files.exists(root)) {
            return;
        }
        try (var paths = Files.walk(root)) {
            paths.sorted(java.util.Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        }
    }

    /** Milliseconds until a list answers 200, or -1 after {@code patience}. */
    private static long waitForReads(Wire reader, Duration patience) throws InterruptedException {
        long start = System.nanoTime();
        while (System.nanoTime() - start < patience.toNanos()) {
            try {
                if (reader.get("/api/v1/tests").status() == 200) {
                    return (System.nanoTime() - start) / 1_000_000;
                }
            } catch (RuntimeException e) {
                // keep trying
            }
            Thread.sleep(200);
        }
        return -1;
    }
}
