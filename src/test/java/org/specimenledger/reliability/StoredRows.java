package org.specimenledger.reliability;

import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import javax.sql.DataSource;

/**
 * Exact row counts of every table in the schema, in one query, to show that a refused request left nothing
 * behind. {@code ledger_checkpoint} is left out: the scheduler may add a signed checkpoint at any moment
 * (it writes no audit event), which says nothing about the request under test.
 */
final class StoredRows {

    private static final List<String> NOT_COUNTED = List.of("ledger_checkpoint", "flyway_schema_history");

    private final DataSource dataSource;
    private final String query;

    StoredRows(DataSource dataSource) {
        this.dataSource = dataSource;
        List<String> parts = new ArrayList<>();
        for (String table : tables()) {
            parts.add("select '" + table + "' as t, count(*) as n from \"" + table + "\"");
        }
        this.query = String.join(" union all ", parts);
    }

    private List<String> tables() {
        List<String> out = new ArrayList<>();
        try (Connection c = dataSource.getConnection(); Statement s = c.createStatement();
                ResultSet r = s.executeQuery("select table_name from information_schema.tables "
                        + "where table_schema = current_schema() and table_type = 'BASE TABLE' order by 1")) {
            while (r.next()) {
                if (!NOT_COUNTED.contains(r.getString(1))) {
                    out.add(r.getString(1));
                }
            }
        } catch (SQLException e) {
            throw new IllegalStateException(e);
        }
        return out;
    }

    /** {table → rows}, in table order. */
    Map<String, Long> count() {
        Map<String, Long> out = new LinkedHashMap<>();
        try (Connection c = dataSource.getConnection(); Statement s = c.createStatement();
                ResultSet r = s.executeQuery(query)) {
            while (r.next()) {
                out.put(r.getString(1), r.getLong(2));
            }
        } catch (SQLException e) {
            throw new IllegalStateException(e);
        }
        return out;
    }

    /** The tables whose counts differ, as "table: before → after". */
    static List<String> changed(Map<String, Long> before, Map<String, Long> after) {
        List<String> out = new ArrayList<>();
        for (Map.Entry<String, Long> e : after.entrySet()) {
            Long was = before.get(e.getKey());
            if (!e.getValue().equals(was)) {
                out.add(e.getKey() + ": " + was + " → " + e.getValue());
            }
        }
        return out;
    }
}
