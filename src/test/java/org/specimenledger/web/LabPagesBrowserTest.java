package org.specimenledger.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.support.ui.Select;
import org.specimenledger.specimens.SpecimenFixtures;
import org.specimenledger.testing.SyntheticCurves;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;

/**
 * The pages in a real headless Chromium against the whole service on a random port and a real
 * PostgreSQL: each role signs in to its start page; a technician registers a specimen (S0 and L0 shown
 * as the readings are typed), registers a test, uploads a curve and sees the diagram and the property
 * table, re-analyses and compares; the equipment page marks calibration status; the calibration check
 * refuses an expired extensometer and a lab manager accepts the test with a reason. Every page is read
 * for console errors, and a screenshot of each is kept under {@code target/screenshots/}.
 */
class LabPagesBrowserTest extends IntegrationTest {

    private static final LocalDate TODAY = LocalDate.now(ZoneOffset.UTC);
    private static Browser browser;

    private Api manager;
    private Api technician;

    @BeforeAll
    static void startBrowser() {
        Assumptions.assumeTrue(Browser.available(), "chromium and chromium-driver are installed by .ci/run");
    }

    @BeforeEach
    void openBrowser() {
        manager = as(TestAccounts.MANAGER);
        technician = as(TestAccounts.TECHNICIAN);
        if (browser == null) {
            browser = new Browser(port);
        }
        browser.driver.manage().deleteAllCookies();
        browser.width(1280);
    }

    @AfterAll
    static void stopBrowser() {
        if (browser != null) {
            browser.close();
            browser = null;
        }
    }

    @Test
    void eachRoleSignsInToItsStartPage() {
        Map<String, String> starts = Map.of(TestAccounts.TECHNICIAN, "/lab", TestAccounts.MANAGER, "/lab",
                TestAccounts.AUDITOR, "/audit-desk", TestAccounts.CUSTOMER, "/portal");
        browser.open("/sign-in");
        browser.screenshot("sign-in");
        assertThat(browser.consoleErrors()).isEmpty();
        for (Map.Entry<String, String> e : starts.entrySet()) {
            browser.signIn(e.getKey(), TestAccounts.PASSWORD);
            assertThat(browser.path()).as(e.getKey()).isEqualTo(e.getValue());
            assertThat(browser.find("h1").getText()).isNotBlank();
            assertThat(browser.find(".who").getText()).contains(e.getKey());
            browser.screenshot("start-" + e.getKey());
            assertThat(browser.consoleErrors()).as(e.getValue()).isEmpty();
            browser.signOut();
        }
        browser.signIn(TestAccounts.TECHNICIAN, "not-the-password");
        assertThat(browser.find(".notice.bad").getText()).contains("not right");
    }

    @Test
    void technicianRegistersSpecimenAndTestUploadsCurveAndSeesDiagramAndTable() throws Exception {
        Bench bench = bench(TODAY.minusDays(60), TODAY.plusDays(300));
        String mark = SpecimenFixtures.mark();
        browser.signIn(TestAccounts.TECHNICIAN, TestAccounts.PASSWORD);

        browser.open("/lab/specimens/new");
        browser.find("#labIdentifier").sendKeys(mark);
        new Select(browser.find("#heatId")).selectByValue(bench.heat());
        new Select(browser.find("#orderId")).selectByValue(bench.order());
        browser.find("#d").sendKeys("10.00 10.01 10.02");
        browser.find("#leMm").sendKeys("50");
        browser.find("#lcMm").sendKeys("60");
        // S0 = π·d²/4 with d the mean of the readings, 10.01 mm: π·100.2001/4 = 78.697 mm² (arithmetic);
        // k = 5.65 gives L0 = 5.65·√78.697 = 50.12 mm, rounded to 50 mm (ISO 6892-1 proportional test piece)
        browser.waiting().until(d -> browser.find("#s0-preview").getText().contains("mm²"));
        browser.waiting().until(d -> browser.find("#l0-preview").getText().contains("L0 = 50 mm"));
        assertThat(browser.find("#s0-preview").getText()).contains("78.69");
        browser.screenshot("specimen-form");
        assertThat(browser.consoleErrors()).isEmpty();
        browser.find("#specimen-form button[type=submit]").click();
        browser.waiting().until(d -> browser.path().startsWith("/lab/specimens/") && !browser.path().endsWith("new"));
        assertThat(browser.find("#s0").getText()).startsWith("78.69");
        assertThat(new java.math.BigDecimal(browser.find("#l0").getText())).isEqualByComparingTo("50");
        browser.screenshot("specimen");
        assertThat(browser.consoleErrors()).isEmpty();

        browser.find("#register-test").click();
        fillTestForm(bench, bench.extensometer());
        browser.screenshot("test-run-form");
        browser.find("#test-run-form button[type=submit]").click();
        browser.waiting().until(d -> browser.path().matches("/lab/tests/[0-9a-f-]{36}"));
        String runPath = browser.path();
        assertThat(browser.consoleErrors()).isEmpty();

        Path curve = Files.createTempFile("ledger-curve-", ".csv");
        Files.write(curve, SyntheticCurves.rambergOsgood(200_000, 300, 10, 78.697, 50, 0.05, 20_000));
        browser.find("#curve-file").sendKeys(curve.toString());
        browser.find("#curve-upload button[type=submit]").click();
        browser.waiting().until(d -> !browser.all("#stress-strain").isEmpty());
        Files.delete(curve);
        assertThat(browser.find("path.curve").getAttribute("d").length()).isGreaterThan(1000);
        assertThat(browser.all("line.construction.elastic")).hasSize(1);
        assertThat(browser.all("line.construction.offset")).isNotEmpty();
        assertThat(browser.find("#property-Rp0\\.2").getText()).contains("determined").contains("MPa");
        assertThat(browser.find("#property-Rm").getText()).contains("determined");
        assertThat(browser.all("g.marker").stream().map(m -> m.getText()).toList()).contains("Rp0.2", "Fm");
        browser.screenshot("test-run-result");
        assertThat(browser.consoleErrors()).isEmpty();

        browser.find("#proofOffsets").clear();
        browser.find("#proofOffsets").sendKeys("0.2 1.0");
        browser.find("#reason").sendKeys("the order asks for the 1 % proof strength as well");
        browser.find("#reanalyse-form button[type=submit]").click();
        browser.waiting().until(d -> d.getCurrentUrl().contains("analysis="));
        assertThat(browser.find("#result-title").getText()).contains("analysis 2");
        assertThat(browser.all("line.construction.offset")).hasSize(2);
        assertThat(browser.consoleErrors()).isEmpty();

        browser.find("#compare-form button[type=submit]").click();
        browser.waiting().until(d -> browser.path().equals("/lab/compare"));
        assertThat(browser.all("#compare-table tbody tr").size()).isGreaterThan(5);
        assertThat(browser.all("#compare-table tr.differs")).isNotEmpty();
        browser.screenshot("compare");
        assertThat(browser.consoleErrors()).isEmpty();

        browser.width(820);
        browser.open(runPath);
        browser.screenshot("test-run-tablet");
        assertThat(browser.consoleErrors()).isEmpty();
    }

    @Test
    void equipmentPageMarksStatusAndExpiredCalibrationNeedsTheManager() {
        Bench bench = bench(TODAY.minusDays(60), TODAY.plusDays(300));
        String due = extensometer(TODAY.minusDays(350), TODAY.plusDays(10));
        String expired = extensometer(TODAY.minusDays(360), TODAY.minusDays(5));
        String dueAsset = asset(due);
        String expiredAsset = asset(expired);

        browser.signIn(TestAccounts.AUDITOR, TestAccounts.PASSWORD);
        browser.open("/lab/equipment");
        assertThat(browser.find("#instrument-" + asset(bench.extensometer()) + " .status-word").getText())
                .isEqualTo("valid");
        assertThat(browser.find("#instrument-" + dueAsset + " .status-word").getText()).isEqualTo("due soon");
        assertThat(browser.find("#instrument-" + expiredAsset + " .status-word").getText()).isEqualTo("expired");
        browser.screenshot("equipment");
        assertThat(browser.consoleErrors()).isEmpty();
        browser.signOut();

        String specimen = technician.post("/api/v1/specimens",
                SpecimenFixtures.roundBar(SpecimenFixtures.mark(), bench.heat(), bench.order())).id();
        browser.signIn(TestAccounts.TECHNICIAN, TestAccounts.PASSWORD);
        browser.open("/lab/tests/new?specimenId=" + specimen);
        fillTestForm(bench, expired);
        browser.find("#test-run-form button[type=submit]").click();
        browser.waiting().until(d -> !browser.all("#calibration-gate").isEmpty());
        assertThat(browser.find("#calibration-gate").getText()).contains(expiredAsset);
        assertThat(browser.all("#calibrationOverrideReason")).isEmpty();
        browser.screenshot("test-run-gate");
        assertThat(browser.consoleErrors()).isEmpty();
        browser.signOut();

        browser.signIn(TestAccounts.MANAGER, TestAccounts.PASSWORD);
        browser.open("/lab/tests/new?specimenId=" + specimen);
        fillTestForm(bench, expired);
        browser.find("#calibrationOverrideReason").sendKeys("extensometer verified in house this morning");
        browser.find("#test-run-form button[type=submit]").click();
        browser.waiting().until(d -> browser.path().matches("/lab/tests/[0-9a-f-]{36}"));
        assertThat(browser.find(".notice.warn").getText()).contains("extensometer verified in house");
        browser.screenshot("test-run-override");
        assertThat(browser.consoleErrors()).isEmpty();
    }

    private void fillTestForm(Bench bench, String extensometer) {
        new Select(browser.find("#machineId")).selectByValue(bench.machine());
        new Select(browser.find("#forceTransducerId")).selectByValue(bench.transducer());
        browser.find("#forceRangeN").sendKeys("100000");
        new Select(browser.find("#extensometerId")).selectByValue(extensometer);
    }

    record Bench(String heat, String order, String machine, String transducer, String extensometer) {
    }

    private Bench bench(LocalDate calibrated, LocalDate due) {
        String heat = SpecimenFixtures.registerHeat(technician);
        String order = SpecimenFixtures.order(manager, organisations.get(TestAccounts.CUSTOMER));
        String transducer = instrument(Map.of("assetId", assetPrefix("LC"), "kind", "FORCE_TRANSDUCER",
                "description", "Load cell of the 100 kN frame",
                "forceRanges", List.of(Map.of("upperLimitN", 10000), Map.of("upperLimitN", 100000))));
        calibrate(transducer, calibrated, due, Map.of("classes", List.of(Map.of("rangeN", 10000, "accuracyClass", "1"),
                Map.of("rangeN", 100000, "accuracyClass", "0.5"))));
        String machine = instrument(Map.of("assetId", assetPrefix("TM"), "kind", "TESTING_MACHINE",
                "description", "Electromechanical frame, 100 kN", "builtInTransducerIds", List.of(transducer)));
        calibrate(machine, calibrated, due, Map.of());
        return new Bench(heat, order, machine, transducer, extensometer(calibrated, due));
    }

    private String extensometer(LocalDate calibrated, LocalDate due) {
        String id = instrument(Map.of("assetId", assetPrefix("EX"), "kind", "EXTENSOMETER",
                "description", "Clip-on extensometer", "gaugeLengthMm", 50));
        calibrate(id, calibrated, due, Map.of("accuracyClass", "1"));
        return id;
    }

    private String instrument(Map<String, Object> body) {
        Api.Response r = manager.post("/api/v1/equipment", body);
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        return r.id();
    }

    private void calibrate(String instrument, LocalDate on, LocalDate due, Map<String, Object> classes) {
        Map<String, Object> body = new HashMap<>(classes);
        body.put("calibratedOn", on.toString());
        body.put("dueOn", due.toString());
        body.put("calibratingBody", "Invented Calibration Service");
        body.put("certificateReference", "CAL-" + UUID.randomUUID().toString().substring(0, 8));
        Api.Response r = manager.post("/api/v1/equipment/" + instrument + "/calibrations", body);
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
    }

    private String asset(String instrumentId) {
        return manager.get("/api/v1/equipment/" + instrumentId).text("assetId");
    }

    private static String assetPrefix(String prefix) {
        return prefix + "-" + UUID.randomUUID().toString().substring(0, 8);
    }
}
