package org.specimenledger.specimens;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.specimenledger.audit.LedgerEvent;
import org.specimenledger.audit.LedgerQueries;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import tools.jackson.databind.JsonNode;

/** Importing an order's specimens from one CSV sheet, over real HTTP on a real PostgreSQL. */
class SpecimenImportApiTest extends IntegrationTest {

    private static final String HEADER = "mark,heat,orientation,shape,position,diameter,thickness,width,"
            + "outer_diameter,k,l0,le,lc\n";

    @Autowired
    private LedgerQueries ledger;

    private String heatNumber;
    private String heatId;
    private String order;

    @BeforeEach
    void heatAndOrder() {
        heatNumber = "IMP-" + UUID.randomUUID();
        Api.Response h = technician().post("/api/v1/heats",
                SpecimenFixtures.heat("Eastfold Forge " + UUID.randomUUID(), heatNumber));
        assertThat(h.status()).as(h.toString()).isEqualTo(201);
        heatId = h.id();
        order = SpecimenFixtures.order(as(TestAccounts.MANAGER), organisations.get(TestAccounts.CUSTOMER));
    }

    private Api technician() {
        return as(TestAccounts.TECHNICIAN);
    }

    private Api.Response send(String sheet) {
        return technician().postBytes("/api/v1/orders/" + order + "/specimens/import", "text/csv",
                sheet.getBytes(StandardCharsets.UTF_8));
    }

    private int specimensOfOrder() {
        return technician().get("/api/v1/specimens?orderId=" + order).json().size();
    }

    private static List<String> pointers(Api.Response r) {
        List<String> out = new ArrayList<>();
        for (JsonNode e : r.json().get("errors")) {
            out.add(e.get("pointer").asString());
        }
        return out;
    }

    @Test
    void sheetWithErrorsOnSeveralRowsReportsAllOfThemAndStoresNothing() {
        String a = "IMP-" + UUID.randomUUID();
        String sheet = HEADER
                + a + "-1," + heatNumber + ",longitudinal,ROUND,,10.00 10.01 10.00,,,,5.65,,50,60\n" // valid
                + a + "-2," + heatNumber + ",LONGITUDINAL,FLAT,,,3.0x,12.5,,5.65,,25,45\n"          // thickness
                + a + "-3," + heatNumber + ",LONGITUDINAL,HEXAGON,,,,,,5.65,,50,60\n"               // shape
                + a + "-1," + heatNumber + ",LONGITUDINAL,ROUND,,10.0,,,,5.65,,50,60\n"             // mark repeated
                + a + "-5,NO-SUCH-HEAT,LONGITUDINAL,ROUND,,10.0,,,,7,,50,60\n"                      // heat and k
                + a + "-6," + heatNumber + ",LONGITUDINAL,ROUND,,10.0,,,,5.65,,50,\n";              // lc missing
        long events = ledger.count();
        Api.Response r = send(sheet);
        assertThat(r.status()).as(r.toString()).isEqualTo(422);
        assertThat(r.contentType()).startsWith("application/problem+json");
        assertThat(pointers(r)).contains("/rows/2/thickness", "/rows/3/shape", "/rows/4/mark", "/rows/5/heat",
                "/rows/5/k", "/rows/6/lc");
        assertThat(pointers(r)).noneMatch(p -> p.startsWith("/rows/1/"));
        assertThat(r.body()).contains("row 4 (line 5)").contains("already on row 1");
        assertThat(ledger.count()).as("nothing is ledgered").isEqualTo(events);
        assertThat(specimensOfOrder()).as("nothing is stored").isZero();
    }

    @Test
    void validSheetRegistersEverySpecimenWithOneLedgerEventEachAndAgreesWithSingleRegistration() {
        String a = "IMP-" + UUID.randomUUID();
        String sheet = "\uFEFF" + HEADER
                + a + "-R," + heatNumber + ",LONGITUDINAL,ROUND,\"mid-radius, bar end A\",10.00 10.01 10.00,,,,5.65,,50,60\n"
                + "\n"
                + a + "-F," + heatId + ",TRANSVERSE,FLAT,,,3.00 3.00,12.50,,5.65,,25,45\n"
                + a + "-T," + heatNumber + ",LONGITUDINAL,TUBE,,,2.0,,20.0,,100,50,110\n";
        long events = ledger.count();
        Api.Response r = send(sheet);
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        assertThat(r.json().get("registered").asInt()).isEqualTo(3);
        assertThat(specimensOfOrder()).isEqualTo(3);
        List<LedgerEvent> added = ledger.page(events, 100, null, null);
        assertThat(added).hasSize(3).allMatch(e -> e.action().equals("specimen.registered"));

        // the same round piece registered on its own gets the same S0, L0 and formula
        Map<String, Object> single = SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heatId, order);
        JsonNode alone = technician().post("/api/v1/specimens", single).json();
        JsonNode imported = r.json().get("specimens").get(0);
        assertThat(imported.get("labIdentifier").asString()).isEqualTo(a + "-R");
        assertThat(imported.get("samplingPosition").asString()).isEqualTo("mid-radius, bar end A");
        assertThat(imported.get("s0Mm2").asDouble()).isEqualTo(alone.get("s0Mm2").asDouble());
        assertThat(imported.get("l0Mm").asDouble()).isEqualTo(alone.get("l0Mm").asDouble());
        assertThat(imported.get("s0Formula").asString()).isEqualTo(alone.get("s0Formula").asString());
        assertThat(r.json().get("specimens").get(1).get("heatId").asString()).isEqualTo(heatId);
        assertThat(r.json().get("specimens").get(2).get("l0Mm").asDouble()).isEqualTo(100.0);
    }

    @Test
    void unknownAndMissingColumnsAreNamedInTheHeader() {
        Api.Response r = send("mark,heat,orientation,colour,le\nX,Y,LONGITUDINAL,red,50\n");
        assertThat(r.status()).as(r.toString()).isEqualTo(422);
        assertThat(pointers(r)).contains("/header/colour", "/header/shape", "/header/lc");
    }

    @Test
    void importIntoAnUnknownOrderIs404AndACustomerMayNotImport() {
        Api.Response unknown = technician().postBytes("/api/v1/orders/" + UUID.randomUUID() + "/specimens/import",
                "text/csv", HEADER.getBytes(StandardCharsets.UTF_8));
        assertThat(unknown.status()).as(unknown.toString()).isEqualTo(404);
        Api.Response customer = as(TestAccounts.CUSTOMER).postBytes("/api/v1/orders/" + order + "/specimens/import",
                "text/csv", HEADER.getBytes(StandardCharsets.UTF_8));
        assertThat(customer.status()).isEqualTo(403);
        Api.Response json = technician().postBytes("/api/v1/orders/" + order + "/specimens/import", "application/json",
                "{}".getBytes(StandardCharsets.UTF_8));
        assertThat(json.status()).as(json.toString()).isEqualTo(415);
    }
}
