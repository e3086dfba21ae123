package org.specimenledger.certificates;

import java.sql.Array;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.UUID;
import java.util.stream.Collectors;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Repository;
import tools.jackson.core.type.TypeReference;
import tools.jackson.databind.json.JsonMapper;

/**
 * Plain SQL over the certificate tables. Issued rows are only ever inserted (the database refuses anything else);
 * the draft row is the one thing updated, and only while open. SQL rather than JPA because almost every table
 * here is write-once and read in a few fixed shapes, and the locks the issue depends on ({@code FOR UPDATE} on the
 * draft and on the year's counter) are clearer written out.
 */
@Repository
class CertificateStore {

    private static final TypeReference<List<CertificateLine>> LINES = new TypeReference<>() { };

    private final JdbcClient jdbc;
    private final JsonMapper json;

    CertificateStore(JdbcClient jdbc, JsonMapper json) {
        this.jdbc = jdbc;
        this.json = json;
    }

    // ---- drafts ----

    /** A draft row as stored. */
    record Draft(UUID id, UUID orderId, UUID customerId, List<UUID> specimenIds, DecisionRuleChoice decisionRule,
            String productDescription, String deviations, String nonConformityStatement, boolean includeCurves,
            List<CertificateLine> lines, UUID revisesCertificateId, String revisionReason, String state,
            UUID issuedCertificateId, Instant createdAt, String createdBy, Instant changedAt, long version) {
    }

    void insertDraft(Draft d) {
        jdbc.sql("""
                INSERT INTO certificate_draft (id, order_id, customer_id, specimen_ids, decision_rule, product_description,
                    deviations, non_conformity_statement, include_curves, lines, revises_certificate_id, revision_reason,
                    state, issued_certificate_id, created_at, created_by, changed_at, version)
                VALUES (?, ?, ?, ?::uuid[], ?, ?, ?, ?, ?, ?::jsonb, ?, ?, ?, ?, ?, ?, ?, 0)""")
                .params(d.id(), d.orderId(), d.customerId(), uuidArray(d.specimenIds()), d.decisionRule().name(),
                        d.productDescription(), d.deviations(), d.nonConformityStatement(), d.includeCurves(),
                        json.writeValueAsString(d.lines()), d.revisesCertificateId(), d.revisionReason(), d.state(),
                        d.issuedCertificateId(), Timestamp.from(d.createdAt()), d.createdBy(),
                        Timestamp.from(d.changedAt()))
                .update();
    }

    void updateDraft(Draft d) {
        jdbc.sql("""
                UPDATE certificate_draft SET specimen_ids = ?::uuid[], decision_rule = ?, product_description = ?,
                    deviations = ?, non_conformity_statement = ?, include_curves = ?, lines = ?::jsonb, state = ?,
                    issued_certificate_id = ?, changed_at = ?, version = version + 1
                WHERE id = ?""")
                .params(uuidArray(d.specimenIds()), d.decisionRule().name(), d.productDescription(), d.deviations(),
                        d.nonConformityStatement(), d.includeCurves(), json.writeValueAsString(d.lines()), d.state(),
                        d.issuedCertificateId(), Timestamp.from(d.changedAt()), d.id())
                .update();
    }

    Optional<Draft> draft(UUID id) {
        return jdbc.sql(DRAFT + " WHERE id = ?").param(id).query(this::draftRow).optional();
    }

    /** The draft, locked until the transaction ends: concurrent issues and changes of one draft queue here. */
    Optional<Draft> lockDraft(UUID id) {
        return jdbc.sql(DRAFT + " WHERE id = ? FOR UPDATE").param(id).query(this::draftRow).optional();
    }

    List<Draft> drafts(UUID customerId, String state) {
        return jdbc.sql(DRAFT + " WHERE (?::uuid IS NULL OR customer_id = ?) AND (?::text IS NULL OR state = ?)"
                        + " ORDER BY created_at DESC LIMIT 500")
                .params(customerId, customerId, state, state).query(this::draftRow).list();
    }

    private static final String DRAFT = """
            SELECT id, order_id, customer_id, specimen_ids, decision_rule, product_description, deviations,
                non_conformity_statement, include_curves, lines::text, revises_certificate_id, revision_reason, state,
                issued_certificate_id, created_at, created_by, changed_at, version FROM certificate_draft""";

    private Draft draftRow(ResultSet rs, int n) throws SQLException {
        return new Draft(rs.getObject(1, UUID.class), rs.getObject(2, UUID.class), rs.getObject(3, UUID.class),
                uuids(rs.getArray(4)), DecisionRuleChoice.valueOf(rs.getString(5)), rs.getString(6), rs.getString(7),
                rs.getString(8), rs.getBoolean(9), json.readValue(rs.getString(10), LINES),
                rs.getObject(11, UUID.class), rs.getString(12), rs.getString(13), rs.getObject(14, UUID.class),
                rs.getTimestamp(15).toInstant(), rs.getString(16), rs.getTimestamp(17).toInstant(), rs.getLong(18));
    }

    // ---- numbering ----

    /**
     * The next serial of {@code year}, taken under a row lock held until the transaction ends: concurrent issues
     * queue, and a rolled-back issue releases its number, so numbers are consecutive with no gaps.
     */
    int nextSerial(int year) {
        jdbc.sql("INSERT INTO certificate_counter (year, last_serial) VALUES (?, 0) ON CONFLICT (year) DO NOTHING")
                .param(year).update();
        int last = jdbc.sql("SELECT last_serial FROM certificate_counter WHERE year = ? FOR UPDATE").param(year)
                .query(Integer.class).single();
        jdbc.sql("UPDATE certificate_counter SET last_serial = ? WHERE year = ?").params(last + 1, year).update();
        return last + 1;
    }

    // ---- issued certificates ----

    /** An issued certificate row as stored (status comes from the status rows). */
    record Issued(UUID id, String number, int revision, int numberYear, int numberSerial, UUID draftId, UUID orderId,
            UUID customerId, UUID replacesId, String revisionReason, DecisionRuleChoice decisionRule,
            String decisionRuleStatement, String productDescription, String deviations, String nonConformityStatement,
            boolean allLinesPass, Instant issuedAt, LocalDate issueDate, String issuedBy, String signatoryName,
            String signatoryFunction, String signatureMeaning, String verificationCode, long ledgerSeq,
            String ledgerHash, long checkpointId, String checkpointRoot, String pdfSha256, int pdfBytes) {
    }

    void insertIssued(Issued c, List<CertificateLine> lines, byte[] pdf) {
        jdbc.sql("""
                INSERT INTO certificate (id, number, revision, number_year, number_serial, draft_id, order_id, customer_id,
                    replaces_id, revision_reason, decision_rule, decision_rule_statement, product_description, deviations,
                    non_conformity_statement, all_lines_pass, issued_at, issue_date, issued_by, signatory_name,
                    signatory_function, signature_meaning, verification_code, ledger_seq, ledger_hash, checkpoint_id,
                    checkpoint_root, pdf_sha256, pdf_bytes)
                VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)""")
                .params(c.id(), c.number(), c.revision(), c.numberYear(), c.numberSerial(), c.draftId(), c.orderId(),
                        c.customerId(), c.replacesId(), c.revisionReason(), c.decisionRule().name(),
                        c.decisionRuleStatement(), c.productDescription(), c.deviations(), c.nonConformityStatement(),
                        c.allLinesPass(), Timestamp.from(c.issuedAt()), c.issueDate(), c.issuedBy(), c.signatoryName(),
                        c.signatoryFunction(), c.signatureMeaning(), c.verificationCode(), c.ledgerSeq(),
                        c.ledgerHash(), c.checkpointId(), c.checkpointRoot(), c.pdfSha256(), c.pdfBytes())
                .update();
        for (CertificateLine l : lines) {
            jdbc.sql("""
                    INSERT INTO certificate_line (certificate_id, position, specimen_id, specimen_label, heat_id,
                        heat_number, test_run_id, analysis_run_id, property, status, value, unit, reported, rounding,
                        expanded_uncertainty, requirement_min, requirement_max, requirement_unit, thickness_min_mm,
                        thickness_max_mm, verdict, verdict_reason, flags)
                    VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?::text[])""")
                    .params(c.id(), l.position(), l.specimenId(), l.specimenLabel(), l.heatId(), l.heatNumber(),
                            l.testRunId(), l.analysisRunId(), l.property(), l.status(), l.value(), l.unit(),
                            l.reported(), l.rounding(), l.expandedUncertainty(), l.requirementMin(),
                            l.requirementMax(), l.requirementUnit(), l.thicknessMinMm(), l.thicknessMaxMm(),
                            l.verdict(), l.verdictReason(), textArray(l.flags()))
                    .update();
        }
        jdbc.sql("INSERT INTO certificate_pdf (certificate_id, content, sha256) VALUES (?, ?, ?)")
                .params(c.id(), pdf, c.pdfSha256()).update();
    }

    private static final String ISSUED = """
            SELECT id, number, revision, number_year, number_serial, draft_id, order_id, customer_id, replaces_id,
                revision_reason, decision_rule, decision_rule_statement, product_description, deviations,
                non_conformity_statement, all_lines_pass, issued_at, issue_date, issued_by, signatory_name,
                signatory_function, signature_meaning, verification_code, ledger_seq, ledger_hash, checkpoint_id,
                checkpoint_root, pdf_sha256, pdf_bytes FROM certificate c""";

    private static Issued issuedRow(ResultSet rs, int n) throws SQLException {
        return new Issued(rs.getObject(1, UUID.class), rs.getString(2), rs.getInt(3), rs.getInt(4), rs.getInt(5),
                rs.getObject(6, UUID.class), rs.getObject(7, UUID.class), rs.getObject(8, UUID.class),
                rs.getObject(9, UUID.class), rs.getString(10), DecisionRuleChoice.valueOf(rs.getString(11)),
                rs.getString(12), rs.getString(13), rs.getString(14), rs.getString(15), rs.getBoolean(16),
                rs.getTimestamp(17).toInstant(), rs.getObject(18, LocalDate.class), rs.getString(19),
                rs.getString(20), rs.getString(21), rs.getString(22), rs.getString(23), rs.getLong(24),
                rs.getString(25), rs.getLong(26), rs.getString(27), rs.getString(28), rs.getInt(29));
    }

    Optional<Issued> issued(UUID id) {
        return jdbc.sql(ISSUED + " WHERE id = ?").param(id).query(CertificateStore::issuedRow).optional();
    }

    /** One revision of a number; the latest revision when {@code revision} is null. */
    Optional<Issued> issued(String number, Integer revision) {
        return jdbc.sql(ISSUED + " WHERE number = ? AND (?::int IS NULL OR revision = ?) ORDER BY revision DESC LIMIT 1")
                .params(number, revision, revision).query(CertificateStore::issuedRow).optional();
    }

    Optional<Issued> byVerificationCode(String code) {
        return jdbc.sql(ISSUED + " WHERE verification_code = ?").param(code).query(CertificateStore::issuedRow)
                .optional();
    }

    Optional<Issued> byPdfSha256(String sha256) {
        return jdbc.sql(ISSUED + " WHERE pdf_sha256 = ? ORDER BY issued_at LIMIT 1").param(sha256)
                .query(CertificateStore::issuedRow).optional();
    }

    /** Every revision of a number, oldest first. */
    List<Issued> revisions(String number) {
        return jdbc.sql(ISSUED + " WHERE number = ? ORDER BY revision").param(number)
                .query(CertificateStore::issuedRow).list();
    }

    /**
     * A page of certificates matching the filters, newest first; the slice is the database's ({@code OFFSET} and
     * {@code LIMIT}), in an order that is total (number and revision break ties), so pages never overlap.
     */
    List<Issued> search(Filter f, long offset, int limit) {
        return jdbc.sql(ISSUED + " " + WHERE + " ORDER BY issued_at DESC, number DESC, revision DESC OFFSET ? LIMIT ?")
                .params(filterParams(f, offset, limit)).query(CertificateStore::issuedRow).list();
    }

    /** How many certificates match the filters, counted by the database with the same condition. */
    long count(Filter f) {
        return jdbc.sql("SELECT count(*) FROM certificate c " + WHERE).params(filterParams(f)).query(Long.class)
                .single();
    }

    /**
     * List filters. Each is off when null; {@code orderIds} and {@code heatIds} match any of theirs, and an empty
     * list matches nothing (a search that names nothing finds nothing, never everything). {@code heatIds} matches a
     * certificate with a line on one of those heats; dates are issue dates.
     */
    record Filter(UUID customerId, String number, List<UUID> orderIds, List<UUID> heatIds, LocalDate from,
            LocalDate to) {
    }

    private static final String WHERE = """
             WHERE (?::uuid IS NULL OR c.customer_id = ?)
               AND (?::text IS NULL OR c.number = ?)
               AND (?::uuid[] IS NULL OR c.order_id = ANY (?::uuid[]))
               AND (?::uuid[] IS NULL OR EXISTS (SELECT 1 FROM certificate_line l
                                                 WHERE l.certificate_id = c.id AND l.heat_id = ANY (?::uuid[])))
               AND (?::date IS NULL OR c.issue_date >= ?)
               AND (?::date IS NULL OR c.issue_date <= ?)""";

    private static List<Object> filterParams(Filter f, Object... more) {
        String orders = f.orderIds() == null ? null : uuidArray(f.orderIds());
        String heats = f.heatIds() == null ? null : uuidArray(f.heatIds());
        List<Object> p = new ArrayList<>(Arrays.asList(f.customerId(), f.customerId(), f.number(), f.number(),
                orders, orders, heats, heats, f.from(), f.from(), f.to(), f.to()));
        p.addAll(Arrays.asList(more));
        return p;
    }

    List<CertificateLine> lines(UUID certificateId) {
        return jdbc.sql("""
                SELECT position, specimen_id, specimen_label, heat_id, heat_number, test_run_id, analysis_run_id,
                    property, status, value, unit, reported, rounding, expanded_uncertainty, requirement_min,
                    requirement_max, requirement_unit, thickness_min_mm, thickness_max_mm, verdict, verdict_reason, flags
                FROM certificate_line WHERE certificate_id = ? ORDER BY position""")
                .param(certificateId)
                .query((rs, n) -> new CertificateLine(rs.getInt(1), rs.getObject(2, UUID.class), rs.getString(3),
                        rs.getObject(4, UUID.class), rs.getString(5), rs.getObject(6, UUID.class),
                        rs.getObject(7, UUID.class), rs.getString(8), rs.getString(9), doubleOrNull(rs, 10),
                        rs.getString(11), rs.getString(12), rs.getString(13), doubleOrNull(rs, 14),
                        rs.getBigDecimal(15), rs.getBigDecimal(16), rs.getString(17), rs.getBigDecimal(18),
                        rs.getBigDecimal(19), rs.getString(20), rs.getString(21), texts(rs.getArray(22))))
                .list();
    }

    Optional<byte[]> pdf(UUID certificateId) {
        return jdbc.sql("SELECT content FROM certificate_pdf WHERE certificate_id = ?").param(certificateId)
                .query((rs, n) -> rs.getBytes(1)).optional();
    }

    // ---- status ----

    /** A status change after issue. */
    record StatusChange(UUID certificateId, String status, UUID supersededBy, String reason, Instant changedAt,
            String changedBy) {
    }

    void insertStatusChange(StatusChange s) {
        jdbc.sql("""
                INSERT INTO certificate_status_change (certificate_id, status, superseded_by, reason, changed_at, changed_by)
                VALUES (?, ?, ?, ?, ?, ?)""")
                .params(s.certificateId(), s.status(), s.supersededBy(), s.reason(), Timestamp.from(s.changedAt()),
                        s.changedBy())
                .update();
    }

    Optional<StatusChange> statusChange(UUID certificateId) {
        return jdbc.sql("""
                SELECT certificate_id, status, superseded_by, reason, changed_at, changed_by
                FROM certificate_status_change WHERE certificate_id = ?""")
                .param(certificateId)
                .query((rs, n) -> new StatusChange(rs.getObject(1, UUID.class), rs.getString(2),
                        rs.getObject(3, UUID.class), rs.getString(4), rs.getTimestamp(5).toInstant(), rs.getString(6)))
                .optional();
    }

    /**
     * Locks the certificate's number for a status change until the transaction ends (a transaction-level advisory
     * lock), so a withdrawal and the issue of a revision of the same certificate queue instead of both succeeding.
     */
    void lockNumber(String number) {
        jdbc.sql("SELECT 1 FROM (SELECT pg_advisory_xact_lock(hashtext('certificate:' || ?))) AS locked")
                .param(number).query(Integer.class).single();
    }

    // ---- helpers ----

    private static String uuidArray(List<UUID> ids) {
        return ids.stream().map(UUID::toString).collect(Collectors.joining(",", "{", "}"));
    }

    private static String textArray(List<String> values) {
        return values.stream().map(v -> '"' + v.replace("\\", "\\\\").replace("\"", "\\\"") + '"')
                .collect(Collectors.joining(",", "{", "}"));
    }

    private static List<UUID> uuids(Array array) throws SQLException {
        Object[] values = (Object[]) array.getArray();
        List<UUID> out = new ArrayList<>(values.length);
        for (Object v : values) {
            out.add(v instanceof UUID u ? u : UUID.fromString(v.toString()));
        }
        return out;
    }

    private static List<String> texts(Array array) throws SQLException {
        Object[] values = (Object[]) array.getArray();
        List<String> out = new ArrayList<>(values.length);
        for (Object v : values) {
            out.add((String) v);
        }
        return out;
    }

    private static Double doubleOrNull(ResultSet rs, int column) throws SQLException {
        double v = rs.getDouble(column);
        return rs.wasNull() ? null : v;
    }
}
