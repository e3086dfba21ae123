package org.specimenledger.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.concurrent.atomic.AtomicBoolean;
import org.junit.jupiter.api.Test;
import org.postgresql.ds.PGSimpleDataSource;

/**
 * Kills the service with SIGKILL at random moments while technicians register runs, upload curves and
 * re-analyse them; after every restart the {@link Invariants} must hold: the ledger verifies, nothing is
 * half-stored, and every acknowledged write is there. A lab manager drafts and issues certificates alongside; one
 * kill in four comes only after an issue was acknowledged. Quick mode: 3 kills. Full mode
 * ({@code -Dreliability.full=true}): {@code reliability.kills} kills, 50 unless set.
 */
class CrashRestartTest {

    private static final int KILLS = Integer.getInteger("reliability.kills", HostileInputTest.FULL ? 50 : 3);
    private static final long SEED = Long.getLong("reliability.seed", 20261202L);

    @Test
    void nothingAcknowledgedIsLostAndNothingIsHalfStoredAfterSigkill() throws Exception {
        Path dir = Files.createTempDirectory("ledger-crash");
        Random random = new Random(SEED);
        List<String> broken = new ArrayList<>();
        LabWorkload work = new LabWorkload();
        try (ScratchDatabase db = new ScratchDatabase(AdminDatabase.url(), "ledger_crash");
                ServiceProcess service = new ServiceProcess(dir, db.url())) {
            PGSimpleDataSource ds = db.dataSource();
            int killsDuringIssue = 0;
            for (int kill = 0; kill <= KILLS; kill++) {
                service.start(Duration.ofMinutes(3));
                for (String p : Invariants.check(ds, work.acknowledged)) {
                    broken.add("after restart " + kill + ": " + p);
                }
                if (kill == KILLS) {
                    break;
                }
                AtomicBoolean stop = new AtomicBoolean();
                List<Thread> workers = new ArrayList<>();
                for (int w = 0; w < 2; w++) {
                    Thread t = new Thread(() -> work.technician(service.port(), stop), "technician-" + w);
                    t.start();
                    workers.add(t);
                }
                Thread m = new Thread(() -> work.manager(service.port(), stop), "manager");
                m.start();
                workers.add(m);
                if (kill % 4 == 1) {
                    // one kill in four waits for an issue and an upload to be acknowledged first, so that issued
                    // certificates and stored curves (not only interrupted requests) must survive the restarts, on
                    // a slow machine too, and the certificate numbers must stay contiguous
                    long before = work.issues.get();
                    long uploadsBefore = work.uploads.get();
                    long giveUp = System.nanoTime() + Duration.ofSeconds(90).toNanos();
                    while ((work.issues.get() == before || work.uploads.get() == uploadsBefore)
                            && System.nanoTime() < giveUp) {
                        Thread.sleep(50);
                    }
                    Thread.sleep(random.nextInt(3000));
                } else {
                    // a random moment: while benches are set up, during uploads, or deep into the run
                    Thread.sleep(1500 + random.nextInt(6000));
                }
                if (work.issueInFlight.get()) {
                    killsDuringIssue++;
                }
                service.kill();
                work.issueInFlight.set(false);
                stop.set(true);
                for (Thread t : workers) {
                    t.join(30_000);
                }
            }
            System.out.printf("[reliability] crash and restart: %d SIGKILLs, %d uploads acknowledged, %d writes "
                    + "acknowledged in all, %d certificate issues acknowledged (%d certificates stored, %d kills during an issue request), %d ledger events, "
                    + "%d server errors, %d broken invariants%n", KILLS,
                    work.uploads.get(), work.acknowledgedCount(), work.issues.get(), Invariants.certificates(ds), killsDuringIssue,
                    Invariants.events(ds), work.serverErrors.size(),
                    broken.size());
        }
        assertThat(broken).as("invariants after SIGKILL and restart").isEmpty();
        assertThat(work.serverErrors).as("5xx answers while running").isEmpty();
        assertThat(work.uploads.get()).as("uploads acknowledged between kills").isPositive();
        if (KILLS >= 2) {
            assertThat(work.issues.get()).as("certificate issues acknowledged between kills").isPositive();
        }
    }
}
