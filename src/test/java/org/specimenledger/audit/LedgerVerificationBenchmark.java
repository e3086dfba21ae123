package org.specimenledger.audit;

import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.flywaydb.core.Flyway;
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
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;
import org.postgresql.ds.PGSimpleDataSource;

/**
 * The ledger at a million events, in a real PostgreSQL: the full chain verification
 * ({@link ChainVerifier#verify()}: SHA-256 of every canonical text, links, Merkle leaves and the
 * column-by-column JSON comparison), a root and an inclusion proof from the stored subtrees
 * ({@link LedgerTree}), and, for comparison, a root computed by streaming every leaf.
 *
 * <p>The events are written once per trial by {@link GeneratedChain} (COPY, correct canonical texts,
 * hashes and tree nodes) into the database {@code ledger_bench_<events>} on the server named by
 * {@code LEDGER_BENCH_DB_URL} or else {@code LEDGER_TEST_DB_URL}, kept for the next trial and run. Run:
 * {@code mvn -o -Pbench test-compile exec:exec -Dbench.args="LedgerVerificationBenchmark -f 1"}.
 * The heap is capped at 128 MB; after each iteration the sum of the heap pools' peak usage is printed
 * (an upper bound of the peak heap, as the pools peak at different moments).
 */
@State(Scope.Benchmark)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(value = 1, jvmArgsAppend = {"-Xms128m", "-Xmx128m"})
public class LedgerVerificationBenchmark {

    @Param("1000000")
    public int events;

    private String adminUrl;
    private String database;
    private PGSimpleDataSource dataSource;
    private LedgerTree tree;
    private final SplittableRandom random = new SplittableRandom(9162);

    @Setup(Level.Trial)
    public void writeLedger() throws SQLException {
        adminUrl = System.getenv().getOrDefault("LEDGER_BENCH_DB_URL", System.getenv("LEDGER_TEST_DB_URL"));
        if (adminUrl == null || adminUrl.isBlank()) {
            throw new IllegalStateException("set LEDGER_BENCH_DB_URL (or LEDGER_TEST_DB_URL) to a PostgreSQL JDBC URL");
        }
        // JMH runs a trial per benchmark method: a complete ledger left by an earlier trial is reused
        database = "ledger_bench_" + events;
        dataSource = new PGSimpleDataSource();
        dataSource.setURL(adminUrl.replaceFirst("/[^/?]+(\\?|$)", "/" + database + "$1"));
        if (!complete()) {
            execute(adminUrl, "DROP DATABASE IF EXISTS " + database + " WITH (FORCE)");
            execute(adminUrl, "CREATE DATABASE " + database + " ENCODING 'UTF8'");
            Flyway.configure().dataSource(dataSource).locations("classpath:db/migration").load().migrate();
            long start = System.nanoTime();
            GeneratedChain.write(dataSource, events, true);
            execute(dataSource.getURL(), "VACUUM ANALYZE");
            System.out.printf("%nwrote %d events in %.1f s", events, (System.nanoTime() - start) / 1e9);
        }
        long bytes;
        try (Connection c = dataSource.getConnection(); var s = c.createStatement();
                var rs = s.executeQuery("SELECT pg_total_relation_size('audit_event')")) {
            rs.next();
            bytes = rs.getLong(1);
        }
        System.out.printf("%nledger of %d events in database %s (audit_event: %d MB on disk; drop it with"
                + " DROP DATABASE %s when done)%n", events, database, bytes >> 20, database);
        tree = LedgerTree.over(dataSource);
    }

    private boolean complete() {
        try (Connection c = dataSource.getConnection(); var s = c.createStatement();
                var rs = s.executeQuery("SELECT last_seq FROM audit_chain_head")) {
            return rs.next() && rs.getLong(1) == events;
        } catch (SQLException e) {
            return false;
        }
    }

    @Setup(Level.Iteration)
    public void resetPeaks() {
        System.gc();
        heapPools().forEach(MemoryPoolMXBean::resetPeakUsage);
    }

    @TearDown(Level.Iteration)
    public void printPeaks() {
        long peak = heapPools().stream().mapToLong(p -> p.getPeakUsage().getUsed()).sum();
        System.out.printf(" [peak heap <= %d MB of %d MB max]", peak >> 20, Runtime.getRuntime().maxMemory() >> 20);
    }

    /** The whole chain, as {@code GET /api/v1/audit/verify} runs it. */
    @Benchmark
    @BenchmarkMode(Mode.SingleShotTime)
    @Warmup(iterations = 1)
    @Measurement(iterations = 3)
    public ChainVerification verifyChain() {
        ChainVerification v = ChainVerifier.over(dataSource).verify();
        if (!v.valid() || v.eventsChecked() != events) {
            throw new IllegalStateException("the generated chain did not verify: " + v);
        }
        return v;
    }

    /** Root of all events from the stored perfect subtrees, as each checkpoint computes it. */
    @Benchmark
    @BenchmarkMode(Mode.AverageTime)
    @Warmup(iterations = 2, time = 2)
    @Measurement(iterations = 3, time = 2)
    public byte[] rootFromStoredSubtrees() {
        return tree.root(events);
    }

    /** Audit path of a random event in the tree of all events. */
    @Benchmark
    @BenchmarkMode(Mode.AverageTime)
    @Warmup(iterations = 2, time = 2)
    @Measurement(iterations = 3, time = 2)
    public List<byte[]> inclusionProofFromStoredSubtrees() {
        return tree.inclusionPath(random.nextLong(events), events);
    }

    /** The alternative not taken: read every leaf in order and fold it, O(n) per root. */
    @Benchmark
    @BenchmarkMode(Mode.SingleShotTime)
    @Warmup(iterations = 1)
    @Measurement(iterations = 3)
    public byte[] rootByStreamingEveryLeaf() throws SQLException {
        MerkleTree.Frontier frontier = new MerkleTree.Frontier();
        try (Connection c = dataSource.getConnection()) {
            c.setAutoCommit(false);
            try (var ps = c.prepareStatement("SELECT hash FROM ledger_tree_node WHERE level = 0 ORDER BY position")) {
                ps.setFetchSize(10_000);
                try (var rs = ps.executeQuery()) {
                    while (rs.next()) {
                        frontier.append(rs.getBytes(1));
                    }
                }
            }
            c.rollback();
        }
        return frontier.root();
    }

    private static List<MemoryPoolMXBean> heapPools() {
        return ManagementFactory.getMemoryPoolMXBeans().stream().filter(p -> p.getType() == MemoryType.HEAP).toList();
    }

    private static void execute(String url, String sql) throws SQLException {
        try (Connection c = DriverManager.getConnection(url); var s = c.createStatement()) {
            s.execute(sql);
        }
    }
}
