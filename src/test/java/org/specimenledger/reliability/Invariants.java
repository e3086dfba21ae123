package org.specimenledger.reliability;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import javax.sql.DataSource;
import org.specimenledger.audit.ChainVerification;
import org.specimenledger.audit.ChainVerifier;

/**
 * What must hold after any crash: the ledger verifies; no raw curve without its bytes or its
 * {@code curve.received} event; no analysis without its raw curve or its {@code analysis.recorded} event;
 * every write the service acknowledged (a 2xx answer) is stored. Hook: the certificates add "no certificate
 * number skipped or used twice, no certificate without its PDF and its issue event" as one more query here.
 */
final class Invariants {

    /** Queries that must each count zero rows, with what a non-zero count means. */
    private static final Map<String, String> ORPHANS = Map.of(
            "raw curve without its bytes",
            "select count(*) from raw_curve r where not exists (select 1 from raw_curve_content c where c.raw_curve_id = r.id)",
            "raw curve without its curve.received event",
            "select count(*) from raw_curve r where not exists (select 1 from audit_event e "
                    + "where e.action = 'curve.received' and e.entity_id = r.id::text)",
            "analysis without its raw curve",
            "select count(*) from analysis_run a where not exists (select 1 from raw_curve r where r.id = a.raw_curve_id)",
            "analysis without its analysis.recorded event",
            "select count(*) from analysis_run a where not exists (select 1 from audit_event e "
                    + "where e.action = 'analysis.recorded' and e.entity_id = a.id::text)",
            "test run without its registration event",
            "select count(*) from test_run t where not exists (select 1 from audit_event e "
                    + "where e.entity_type = 'test-run' and e.entity_id = t.id::text)");

    private Invariants() {
    }

    /** Every broken invariant, empty when all hold. {@code acknowledged} maps table → ids answered with 2xx. */
    static List<String> check(DataSource ds, Map<String, List<UUID>> acknowledged) {
        List<String> out = new ArrayList<>();
        ChainVerification chain = ChainVerifier.over(ds).verify();
        if (!chain.valid()) {
            out.add("ledger broken at " + chain.firstBrokenSeq() + ": " + chain.problem() + " " + chain.detail());
        }
        try (Connection c = ds.getConnection()) {
            for (Map.Entry<String, String> orphan : ORPHANS.entrySet()) {
                long n = count(c, orphan.getValue(), null);
                if (n > 0) {
                    out.add(n + " × " + orphan.getKey());
                }
            }
            for (Map.Entry<String, List<UUID>> e : acknowledged.entrySet()) {
                List<UUID> ids = List.copyOf(e.getValue());
                if (ids.isEmpty()) {
                    continue;
                }
                long present = count(c, "select count(*) from " + e.getKey() + " where id = any(?)", ids);
                if (present != ids.size()) {
                    out.add((ids.size() - present) + " acknowledged " + e.getKey() + " rows lost (of " + ids.size() + ")");
                }
            }
        } catch (SQLException e) {
            out.add("could not check: " + e.getMessage());
        }
        return out;
    }

    private static long count(Connection c, String sql, List<UUID> ids) throws SQLException {
        try (PreparedStatement s = c.prepareStatement(sql)) {
            if (ids != null) {
                s.setArray(1, c.createArrayOf("uuid", ids.toArray()));
            }
            try (ResultSet r = s.executeQuery()) {
                r.next();
                return r.getLong(1);
            }
        }
    }

    /** Number of ledger events, for the report. */
    static long events(DataSource ds) {
        try (Connection c = ds.getConnection()) {
            return count(c, "select count(*) from audit_event", null);
        } catch (SQLException e) {
            return -1;
        }
    }
}
