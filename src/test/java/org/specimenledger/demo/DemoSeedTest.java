package org.specimenledger.demo;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.IntegrationTest;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.authority.SimpleGrantedAuthority;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * The demo laboratory seeds through the real services, test runs and analyses included. Run inside one
 * transaction that is rolled back, as the seeding itself runs in one, so no other test sees demo records.
 */
class DemoSeedTest extends IntegrationTest {

    @Autowired
    private DemoRecords records;

    @Autowired
    private TransactionTemplate transactions;

    @Autowired
    private JdbcClient jdbc;

    private long count(String sql) {
        return jdbc.sql(sql).query(Long.class).single();
    }

    @Test
    void seedsTestRunsOfEachKindWithComputedResults() {
        SecurityContextHolder.getContext().setAuthentication(UsernamePasswordAuthenticationToken.authenticated(
                DemoLaboratory.ACTOR, null, List.of(new SimpleGrantedAuthority("ROLE_SYSTEM"))));
        try {
            transactions.executeWithoutResult(status -> {
                long runsBefore = count("SELECT count(*) FROM test_run");
                long analysesBefore = count("SELECT count(*) FROM analysis_run");
                records.seed();
                assertThat(count("SELECT count(*) FROM test_run") - runsBefore).isEqualTo(6);
                assertThat(count("SELECT count(*) FROM analysis_run") - analysesBefore).isEqualTo(5);
                assertThat(count("SELECT count(*) FROM test_run t JOIN specimen s ON s.id = t.specimen_id "
                        + "WHERE s.lab_identifier LIKE 'DL-26-%' AND t.validity = 'INVALID'")).isEqualTo(1);
                // the structural steel yields discontinuously, the cast piece breaks before Rp0.2, the strip cycles
                assertThat(jdbc.sql("SELECT a.results->>'yielding' FROM analysis_run a JOIN test_run t ON t.id = a.test_run_id "
                        + "JOIN specimen s ON s.id = t.specimen_id WHERE s.lab_identifier = 'DL-26-0112-A'")
                        .query(String.class).single()).isEqualTo("DISCONTINUOUS");
                assertThat(jdbc.sql("SELECT a.results->'properties'->'Rp0.2'->>'status' FROM analysis_run a "
                        + "JOIN test_run t ON t.id = a.test_run_id JOIN specimen s ON s.id = t.specimen_id "
                        + "WHERE s.lab_identifier = 'DL-26-0124-A'").query(String.class).single())
                        .isEqualTo("NOT_DETERMINABLE");
                assertThat(count("SELECT jsonb_array_length(a.results->'cycles') FROM analysis_run a "
                        + "JOIN test_run t ON t.id = a.test_run_id JOIN specimen s ON s.id = t.specimen_id "
                        + "WHERE s.lab_identifier = 'DL-26-0126-A'")).isEqualTo(3);
                // the tube broke outside the middle third; the pins have no Lu, so A is from the extensometer
                assertThat(jdbc.sql("SELECT a.flags::text FROM analysis_run a JOIN test_run t ON t.id = a.test_run_id "
                        + "JOIN specimen s ON s.id = t.specimen_id WHERE s.lab_identifier = 'DL-26-0121-A'")
                        .query(String.class).single()).contains("FRACTURE_OUTSIDE_VALID_ZONE");
                assertThat(jdbc.sql("SELECT a.flags::text FROM analysis_run a JOIN test_run t ON t.id = a.test_run_id "
                        + "JOIN specimen s ON s.id = t.specimen_id WHERE s.lab_identifier = 'DL-26-0118-A'")
                        .query(String.class).single()).contains("ELONGATION_FROM_EXTENSOMETER")
                        .doesNotContain("STRAIN_RATE_OUTSIDE_RANGE");
                // demo certificates: four issued, the plate's revised (rev 0 superseded), one with a non-conformity
                String demoCertificates = "SELECT count(*) FROM certificate c WHERE EXISTS (SELECT 1 FROM certificate_line l"
                        + " JOIN specimen s ON s.id = l.specimen_id WHERE l.certificate_id = c.id"
                        + " AND s.lab_identifier LIKE 'DL-26-%')";
                assertThat(count(demoCertificates)).isEqualTo(5);
                assertThat(count(demoCertificates + " AND c.revision = 1")).isEqualTo(1);
                assertThat(count(demoCertificates + " AND EXISTS (SELECT 1 FROM certificate_status_change x"
                        + " WHERE x.certificate_id = c.id AND x.status = 'SUPERSEDED')")).isEqualTo(1);
                assertThat(count(demoCertificates + " AND NOT c.all_lines_pass")).isGreaterThanOrEqualTo(1);
                status.setRollbackOnly();
            });
        } finally {
            SecurityContextHolder.clearContext();
        }
        assertThat(count("SELECT count(*) FROM specimen WHERE lab_identifier LIKE 'DL-26-%'")).isZero();
    }
}
