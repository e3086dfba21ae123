package org.specimenledger.reliability;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.util.concurrent.ThreadLocalRandom;
import org.postgresql.ds.PGSimpleDataSource;

/**
 * A fresh database for one reliability run on a PostgreSQL server given by an admin JDBC URL (the machine's
 * server named by {@code LEDGER_TEST_DB_URL}, or an embedded one), dropped at the end.
 */
final class ScratchDatabase implements AutoCloseable {

    private final String adminUrl;
    private final String name;
    private final String url;

    ScratchDatabase(String adminUrl, String prefix) {
        this.adminUrl = adminUrl;
        this.name = prefix + "_" + Long.toHexString(System.currentTimeMillis()) + "_"
                + Integer.toHexString(ThreadLocalRandom.current().nextInt(0x1000, 0xFFFF));
        execute(adminUrl, "CREATE DATABASE " + name + " ENCODING 'UTF8'");
        this.url = withDatabase(adminUrl, name);
    }

    String url() {
        return url;
    }

    PGSimpleDataSource dataSource() {
        PGSimpleDataSource ds = new PGSimpleDataSource();
        ds.setUrl(url);
        return ds;
    }

    @Override
    public void close() {
        try {
            execute(adminUrl, "DROP DATABASE IF EXISTS " + name + " WITH (FORCE)");
        } catch (RuntimeException e) {
            // the server may be gone already; nothing is left to clean then
        }
    }

    static String withDatabase(String jdbcUrl, String database) {
        int query = jdbcUrl.indexOf('?');
        String base = query < 0 ? jdbcUrl : jdbcUrl.substring(0, query);
        String params = query < 0 ? "" : jdbcUrl.substring(query);
        int slash = base.indexOf('/', "jdbc:postgresql://".length());
        return (slash < 0 ? base : base.substring(0, slash)) + "/" + database + params;
    }

    private static void execute(String jdbcUrl, String sql) {
        try (Connection c = DriverManager.getConnection(jdbcUrl); var s = c.createStatement()) {
            s.execute(sql);
        } catch (SQLException e) {
            throw new IllegalStateException("could not run '" + sql + "'", e);
        }
    }
}
