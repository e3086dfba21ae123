package org.specimenledger.reliability;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import javax.sql.DataSource;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.specimenledger.audit.ChainVerification;
import org.specimenledger.audit.ChainVerifier;

/**
 * What must hold after any crash: the ledger verifies; no raw curve without its bytes or its
 * {@code curve.received} event; no analysis without its raw curve or its {@code analysis.recorded} event;
 * every write the service acknowledged (a 2xx answer) is stored. Certificates: the numbers of each year run
 * 00001, 00002, ... without a gap and none is used twice (by revision 0); every issued certificate has its
 * {@code certificate.issued} and {@code certificate.pdf-stored} events and its PDF, whose SHA-256 equals the
 * stored one and which PDFBox loads as a complete document (at least one page, ends with {@code %%EOF}).
 * Issuing is one transaction (number, PDF, both events: {@code CertificateService.issue}), so a kill during
 * it leaves either all of it or none of it; "no half-written PDF" means no certificate row without a PDF
 * row, and no PDF that does not load.
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
                    + "where e.entity_type = 'test-run' and e.entity_id = t.id::text)",
            "issued certificate without its certificate.issued event",
            "select count(*) from certificate c where not exists (select 1 from audit_event e "
                    + "where e.action = 'certificate.issued' and e.entity_id = c.id::text)",
            "issued certificate without its certificate.pdf-stored event",
            "select count(*) from certificate c where not exists (select 1 from audit_event e "
                    + "where e.action = 'certificate.pdf-stored' and e.entity_id = c.id::text)",
            "issued certificate without its PDF",
            "select count(*) from certificate c where not exists (select 1 from certificate_pdf p "
                    + "where p.certificate_id = c.id)",
            "certificate number used twice (revision 0)",
            "select count(*) - count(distinct (number_year, number_serial)) from certificate where revision = 0",
            "certificate year whose numbers are not 00001 to its count",
            "select count(*) from (select number_year from certificate where revision = 0 group by number_year "
                    + "having min(number_serial) <> 1 or max(number_serial) <> count(*)) gaps");

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
            out.addAll(pdfProblems(c));
        } catch (SQLException e) {
            out.add("could not check: " + e.getMessage());
        }
        return out;
    }

    /** Each stored PDF against its certificate's hash, and read back as a document (Apache PDFBox). */
    private static List<String> pdfProblems(Connection c) throws SQLException {
        List<String> out = new ArrayList<>();
        try (PreparedStatement s = c.prepareStatement("select c.number, c.revision, c.pdf_sha256, c.pdf_bytes, "
                + "p.content from certificate c join certificate_pdf p on p.certificate_id = c.id");
                ResultSet r = s.executeQuery()) {
            while (r.next()) {
                String name = r.getString(1) + " revision " + r.getInt(2);
                byte[] pdf = r.getBytes(5);
                if (!sha256(pdf).equals(r.getString(3)) || pdf.length != r.getInt(4)) {
                    out.add("certificate " + name + ": stored PDF does not match its SHA-256 or size");
                }
                String tail = new String(pdf, Math.max(0, pdf.length - 16), Math.min(16, pdf.length),
                        StandardCharsets.ISO_8859_1).stripTrailing();
                if (!tail.endsWith("%%EOF")) {
                    out.add("certificate " + name + ": PDF does not end with %%EOF");
                }
                try (PDDocument doc = Loader.loadPDF(pdf)) {
                    if (doc.getNumberOfPages() < 1) {
                        out.add("certificate " + name + ": PDF has no page");
                    }
                } catch (IOException e) {
                    out.add("certificate " + name + ": PDF does not load: " + e.getMessage());
                }
            }
        }
        return out;
    }

    private static String sha256(byte[] bytes) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    /** Issued certificates (all revisions), for the report. */
    static long certificates(DataSource ds) {
        try (Connection c = ds.getConnection()) {
            return count(c, "select count(*) from certificate", null);
        } catch (SQLException e) {
            return -1;
        }
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
