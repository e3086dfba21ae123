package org.specimenledger.specimens;

import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.dao.DataAccessException;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.transaction.support.TransactionTemplate;

/** The database itself refuses rows that break the register's rules, whoever writes them (V4, V5 CHECKs). */
class SchemaConstraintsTest extends IntegrationTest {

    @Autowired
    private JdbcClient jdbc;

    @Autowired
    private TransactionTemplate transactions;

    private String specimen(java.util.Map<String, Object> body) {
        return as(TestAccounts.TECHNICIAN).post("/api/v1/specimens", body).id();
    }

    private void refusedSql(String sql, Object... params) {
        assertThatThrownBy(() -> transactions.executeWithoutResult(t -> jdbc.sql(sql).params(params).update()))
                .isInstanceOf(DataAccessException.class);
    }

    @Test
    void compositionAboveHundredPercentIsRefusedAtCommit() {
        // the fixture heat has C 0.18 + Si 0.35 + Mn 1.45 = 1.98 %; adding Fe 99 % makes 100.98 %
        String heat = SpecimenFixtures.registerHeat(as(TestAccounts.TECHNICIAN));
        refusedSql("INSERT INTO heat_composition (heat_id, element, mass_percent) VALUES (?, 'Fe', 99)",
                UUID.fromString(heat));
        refusedSql("INSERT INTO heat_composition (heat_id, element, mass_percent) VALUES (?, 'FE', 1)",
                UUID.fromString(heat));
    }

    @Test
    void specimenRowsKeepTheirGeometryRules() {
        String heat = SpecimenFixtures.registerHeat(as(TestAccounts.TECHNICIAN));
        String order = SpecimenFixtures.order(as(TestAccounts.MANAGER), organisations.get(TestAccounts.CUSTOMER));
        UUID round = UUID.fromString(specimen(SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heat, order)));
        UUID tube = UUID.fromString(specimen(SpecimenFixtures.tube(SpecimenFixtures.mark(), heat, order)));
        refusedSql("UPDATE specimen SET lc_mm = 10 WHERE id = ?", round);                        // Lc ≥ L0
        refusedSql("UPDATE specimen SET mean_a_mm = 3 WHERE id = ?", round);                     // no a on a round piece
        refusedSql("UPDATE specimen SET mean_a_mm = 10 WHERE id = ?", tube);                     // a < D/2
        refusedSql("UPDATE specimen SET l0_k = 6 WHERE id = ?", round);                          // k 5.65 or 11.3
        refusedSql("UPDATE specimen SET l0_calculated_mm = 12 WHERE id = ?", round);             // 15 mm minimum
        refusedSql("UPDATE specimen SET lu_mm = 60, su_mm2 = 100, su_formula = 'x', mean_du_mm = 11.3, "
                + "fracture_recorded_at = now() WHERE id = ?", round);                            // Su ≤ S0
        refusedSql("UPDATE specimen SET lu_mm = 60 WHERE id = ?", round);                        // all or nothing
        refusedSql("INSERT INTO specimen_reading (specimen_id, position, dimension, value_mm) VALUES (?, 9, 'd', -1)",
                round);
    }
}
