package org.specimenledger.testing;

import java.sql.ResultSet;
import java.sql.SQLException;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.Paged;
import org.specimenledger.shared.RuleViolation;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;
import tools.jackson.core.type.TypeReference;
import tools.jackson.databind.JsonNode;

/**
 * Results by specimen, heat, order and test date range: each matching test run with its current analysis.
 * The heat, order and customer are read from the specimen register as they stand now (a join on its table,
 * read only), so a result follows a specimen's corrected heat or order.
 */
@Component
class ResultQueries {

    /** What to select; every criterion is optional and they combine with AND. */
    record Criteria(UUID specimenId, UUID heatId, UUID orderId, LocalDate from, LocalDate to,
            boolean includeInvalid) {
    }

    private final JdbcClient jdbc;

    ResultQueries(JdbcClient jdbc) {
        this.jdbc = jdbc;
    }

    /** Every matching result, for the CSV export. */
    @Transactional(readOnly = true)
    List<ResultRow> find(Criteria c) {
        return query(c, -1, -1).items();
    }

    /** One page of the matching results, in the order of {@link #find}, with the total count. */
    @Transactional(readOnly = true)
    Paged<ResultRow> find(Criteria c, int page, int size) {
        Paged.check(page, size);
        return query(c, page, size);
    }

    private Paged<ResultRow> query(Criteria c, int page, int size) {
        if (c.from() != null && c.to() != null && c.from().isAfter(c.to())) {
            throw new RuleViolation("from", "the range starts on " + c.from() + ", after its end " + c.to());
        }
        StringBuilder where = new StringBuilder("""
                FROM test_run t
                JOIN specimen s ON s.id = t.specimen_id
                JOIN analysis_run a ON a.id = t.current_analysis_id
                WHERE TRUE
                """);
        List<Object> params = new ArrayList<>();
        condition(where, params, "t.specimen_id = ?", c.specimenId());
        condition(where, params, "s.heat_id = ?", c.heatId());
        condition(where, params, "s.order_id = ?", c.orderId());
        condition(where, params, "t.test_date >= ?", c.from());
        condition(where, params, "t.test_date <= ?", c.to());
        condition(where, params, "s.customer_id = ?", CurrentUser.customerOrganisation().orElse(null));
        if (!c.includeInvalid()) {
            where.append(" AND t.validity = 'VALID'");
        }
        String select = """
                SELECT t.id, t.specimen_id, s.lab_identifier, s.heat_id, s.order_id, t.tested_at, t.test_date,
                       t.standard, t.mode, t.validity, a.id, a.software_version, a.software_commit, a.method_version,
                       a.input_sha256, a.results::text, a.flags::text
                """ + where + " ORDER BY t.test_date, t.tested_at, s.lab_identifier, t.id";
        if (size < 0) {
            List<ResultRow> all = jdbc.sql(select).params(params).query(ResultQueries::row).list();
            return new Paged<>(all, 0, all.size(), all.size());
        }
        long total = jdbc.sql("SELECT count(*) " + where).params(params).query(Long.class).single();
        List<ResultRow> items = jdbc.sql(select + " LIMIT " + size + " OFFSET " + ((long) page * size)).params(params)
                .query(ResultQueries::row).list();
        return new Paged<>(items, page, size, total);
    }

    private static void condition(StringBuilder sql, List<Object> params, String clause, Object value) {
        if (value != null) {
            sql.append(" AND ").append(clause);
            params.add(value);
        }
    }

    private static ResultRow row(ResultSet rs, int n) throws SQLException {
        JsonNode results = StoredJson.parse(rs.getString(16));
        TestMode mode = TestMode.valueOf(rs.getString(9));
        Map<String, ResultRow.Value> properties = new LinkedHashMap<>();
        Integer cycles = null;
        if (mode == TestMode.TENSILE) {
            JsonNode props = results.path("properties");
            for (String symbol : props.propertyNames()) {
                JsonNode p = props.get(symbol);
                properties.put(symbol, new ResultRow.Value(number(p.get("value")), text(p.get("unit")),
                        text(p.get("reported")), text(p.get("status")), number(p.get("expandedUncertainty"))));
            }
        } else {
            cycles = results.path("cycles").size();
        }
        List<ResultFlag> flags = StoredJson.list(rs.getString(17), new TypeReference<List<ResultFlag>>() { });
        return new ResultRow(rs.getObject(1, UUID.class), rs.getObject(2, UUID.class), rs.getString(3),
                rs.getObject(4, UUID.class), rs.getObject(5, UUID.class), rs.getTimestamp(6).toInstant(),
                rs.getObject(7, LocalDate.class), TestStandard.valueOf(rs.getString(8)), mode,
                Validity.valueOf(rs.getString(10)), rs.getObject(11, UUID.class), rs.getString(12), rs.getString(13),
                rs.getString(14), rs.getString(15), properties, cycles, flags);
    }

    private static Double number(JsonNode n) {
        return n == null || n.isNull() ? null : n.doubleValue();
    }

    private static String text(JsonNode n) {
        return n == null || n.isNull() ? null : n.asString();
    }
}
