package org.specimenledger.testsupport;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.time.LocalDateTime;
import java.time.format.DateTimeFormatter;
import java.util.concurrent.ThreadLocalRandom;
import org.specimenledger.system.EmbeddedPostgresServer;

/**
 * A fresh PostgreSQL database for this test run, so that runs never see each other's rows: on the
 * server named by {@code LEDGER_TEST_DB_URL} (CI, a developer's machine), otherwise on an embedded
 * server started for the run. Dropped when the JVM ends.
 */
public final class TestDatabase {

    private static String url;

    private TestDatabase() {
    }

    public static synchronized String url() {
        if (url == null) {
            url = create();
        }
        return url;
    }

    private static String create() {
        String name = "ledger_test_" + LocalDateTime.now().format(DateTimeFormatter.ofPattern("yyyyMMddHHmmss"))
                + "_" + Integer.toHexString(ThreadLocalRandom.current().nextInt(0x100000, 0xFFFFFF));
        String admin = System.getenv("LEDGER_TEST_DB_URL");
        if (admin == null || admin.isBlank()) {
            admin = startEmbedded();
        }
        String adminUrl = admin;
        execute(adminUrl, "CREATE DATABASE " + name + " ENCODING 'UTF8'");
        Runtime.getRuntime().addShutdownHook(new Thread(() -> {
            try {
                execute(adminUrl, "DROP DATABASE IF EXISTS " + name + " WITH (FORCE)");
            } catch (RuntimeException ignored) {
                // the server may already be gone (embedded) — nothing is left to clean then
            }
        }));
        return withDatabase(adminUrl, name);
    }

    private static String startEmbedded() {
        try {
            Path dir = Files.createTempDirectory("ledger-test-pg");
            EmbeddedPostgresServer server = EmbeddedPostgresServer.start(dir.resolve("data"), 0);
            Runtime.getRuntime().addShutdownHook(new Thread(server::close));
            return server.jdbcUrl("postgres");
        } catch (IOException e) {
            throw new IllegalStateException("could not make a folder for the embedded test database", e);
        }
    }

    /** Replaces the database name in a JDBC URL, keeping host, port and query parameters. */
    static String withDatabase(String jdbcUrl, String database) {
        int query = jdbcUrl.indexOf('?');
        String base = query < 0 ? jdbcUrl : jdbcUrl.substring(0, query);
        String params = query < 0 ? "" : jdbcUrl.substring(query);
        int slash = base.indexOf('/', "jdbc:postgresql://".length());
        String hostPart = slash < 0 ? base : base.substring(0, slash);
        return hostPart + "/" + database + params;
    }

    private static void execute(String jdbcUrl, String sql) {
        try (Connection c = DriverManager.getConnection(jdbcUrl); var s = c.createStatement()) {
            s.execute(sql);
        } catch (SQLException e) {
            throw new IllegalStateException("could not run '" + sql + "' on " + jdbcUrl, e);
        }
    }
}
