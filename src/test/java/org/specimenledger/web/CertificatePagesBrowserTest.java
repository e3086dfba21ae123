package org.specimenledger.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.security.MessageDigest;
import java.util.Base64;
import java.util.HashMap;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.StaleElementReferenceException;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.Select;
import org.specimenledger.certificates.CertificateBench;
import org.specimenledger.certificates.document.CertificateDocument;
import org.specimenledger.certificates.document.PdfReadBack;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import tools.jackson.databind.JsonNode;

/**
 * The certificate pages in a real headless Chromium against the whole service and a real PostgreSQL: a customer
 * finds their certificate, downloads the PDF (the bytes the browser receives equal the stored ones) and cannot
 * open another organisation's certificate by typing its URL; a lab manager drafts and issues a certificate with
 * the password re-entered; an auditor traces a line down to its raw curve (the curve's bytes hash to the SHA-256
 * the page shows) and runs a ledger verification job whose progress page polls to the end. Every page is read for
 * console errors; screenshots go to {@code target/screenshots/}.
 */
class CertificatePagesBrowserTest extends IntegrationTest {

    private static Browser browser;
    private static CertificateBench bench;

    @BeforeAll
    static void startBrowser() {
        Assumptions.assumeTrue(Browser.available(), "chromium and chromium-driver are installed by .ci/run");
    }

    @BeforeEach
    void openBrowser() {
        if (bench == null) {
            bench = new CertificateBench(as(TestAccounts.TECHNICIAN), as(TestAccounts.MANAGER));
        }
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
    void customerFindsAndDownloadsTheirCertificateButNotAnotherOrganisations() throws Exception {
        String ours = issuedFor(TestAccounts.CUSTOMER);
        String theirs = issuedFor(TestAccounts.OTHER_CUSTOMER);
        byte[] stored = as(TestAccounts.MANAGER).getBytes("/api/v1/certificates/" + ours + "/pdf").body();

        browser.signIn(TestAccounts.CUSTOMER, TestAccounts.PASSWORD);
        assertThat(browser.path()).isEqualTo("/portal");
        browser.find("#number").sendKeys(ours);
        browser.find("#certificate-search button[type=submit]").click();
        browser.waiting().until(d -> browser.all("#certificates tbody tr").size() == 1);
        assertThat(browser.find("#certificate-" + ours + "-rev0").getText()).contains("valid");
        assertThat(browser.all("[data-number='" + theirs + "']")).isEmpty();
        browser.screenshot("portal-search");
        assertThat(browser.consoleErrors()).isEmpty();

        browser.find("#certificate-" + ours + "-rev0 a").click();
        browser.waiting().until(d -> browser.path().equals("/portal/certificates/" + ours));
        assertThat(browser.find("#verification-code").getText()).matches("[0-9a-f]{32}");
        assertThat(browser.find("#pdf-sha256").getText()).isEqualTo(sha256(stored));
        assertThat(browser.find(".cautions").getText()).contains("relate only to the items tested");
        browser.screenshot("portal-certificate");
        assertThat(browser.consoleErrors()).isEmpty();

        byte[] downloaded = fetchInBrowser(browser.find("#revision-0 a.pdf").getAttribute("href"));
        assertThat(downloaded).isEqualTo(stored);

        browser.open("/portal/certificates/" + theirs);
        assertThat(browser.find("h1").getText()).isEqualTo("Not found");
        assertThat(browser.driver.getPageSource()).doesNotContain(theirs + " revision");
        browser.screenshot("portal-other-organisation");
        PageSession session = new PageSession(port);
        session.signIn(TestAccounts.CUSTOMER, TestAccounts.PASSWORD);
        assertThat(session.get("/portal/certificates/" + theirs).statusCode()).isEqualTo(404);
        assertThat(session.get("/portal/certificates/" + theirs + "/pdf").statusCode()).isEqualTo(404);
        String search = session.get("/portal?number=" + theirs).body();
        assertThat(search).doesNotContain("id=\"certificate-" + theirs).contains("No certificate matches");
        assertThat(session.get("/portal?from=not-a-date").statusCode()).as("a mistyped date").isEqualTo(400);
    }

    @Test
    void managerDraftsAndIssuesACertificateWithThePasswordReentered() {
        CertificateBench.Order order = bench.order(organisations.get(TestAccounts.CUSTOMER), passing(), 2);
        browser.signIn(TestAccounts.MANAGER, TestAccounts.PASSWORD);
        browser.open("/lab/certificates");
        new Select(browser.find("#orderId")).selectByValue(order.orderId());
        browser.screenshot("certificate-desk");
        assertThat(browser.consoleErrors()).isEmpty();
        browser.find("#choose-order button[type=submit]").click();
        browser.waiting().until(d -> browser.path().equals("/lab/certificates/new"));
        assertThat(browser.all("input[name=specimenIds]:checked")).hasSize(2);
        browser.find("#productDescription").sendKeys("Hot-rolled round bar, 20 mm");
        browser.screenshot("certificate-draft-form");
        assertThat(browser.consoleErrors()).isEmpty();
        browser.find("#draft-form button[type=submit]").click();
        browser.waiting().until(d -> browser.path().startsWith("/lab/certificates/drafts/"));
        assertThat(browser.all("#lines tbody tr")).hasSizeGreaterThanOrEqualTo(4);
        assertThat(browser.find("#line-1 .verdict").getText()).isEqualTo("pass");
        assertThat(browser.find("#signature-meaning").getText()).isEqualTo("reviewed and approved for release");
        browser.screenshot("certificate-draft");
        assertThat(browser.consoleErrors()).isEmpty();

        // the preview link of the draft page answers with the PDF, marked as a preview, fetched by the browser itself
        String draftPath = browser.path();
        WebElement previewLink = browser.find("#preview-pdf");
        assertThat(previewLink.getText()).isEqualTo("Preview as PDF");
        assertThat(previewLink.getAttribute("href")).endsWith(draftPath + "/preview");
        Map<String, Object> preview = fetchWithHeaders(previewLink.getAttribute("href"));
        assertThat(preview.get("status")).isEqualTo(200L);
        assertThat(preview.get("type")).isEqualTo("application/pdf");
        assertThat(preview.get("preview")).isEqualTo("true");
        byte[] previewPdf = Base64.getDecoder().decode((String) preview.get("body"));
        assertThat(new String(previewPdf, 0, 5, java.nio.charset.StandardCharsets.US_ASCII)).isEqualTo("%PDF-");
        assertThat(PdfReadBack.text(previewPdf)).contains(CertificateDocument.PREVIEW_HEADER,
                "Hot-rolled round bar, 20 mm").doesNotContainPattern("IC-\\d{4}-\\d{5}");
        assertThat(browser.consoleErrors()).isEmpty();

        browser.find("#password").sendKeys("not-the-password");
        browser.find("#issue-form button[type=submit]").click();
        browser.waiting().until(d -> !browser.all(".problems").isEmpty());
        assertThat(browser.find(".problems").getText()).containsIgnoringCase("password");

        browser.find("#password").sendKeys(TestAccounts.PASSWORD);
        browser.find("#issue-form button[type=submit]").click();
        browser.waiting().until(d -> browser.path().matches("/lab/certificates/[A-Z]+-\\d{4}-\\d{5}"));
        String number = browser.find("#number").getText();
        assertThat(browser.find("#status").getText()).contains("valid");
        browser.screenshot("certificate-issued");
        assertThat(browser.consoleErrors()).isEmpty();
        JsonNode issued = as(TestAccounts.MANAGER).get("/api/v1/certificates/" + number).json();
        assertThat(issued.get("orderId").asString()).isEqualTo(order.orderId());
        assertThat(issued.get("issuedBy").asString()).isEqualTo(TestAccounts.MANAGER);

        browser.find("#revise-reason").sendKeys("the product description lacked the delivery condition");
        browser.find("#revise-form button[type=submit]").click();
        browser.waiting().until(d -> browser.path().startsWith("/lab/certificates/drafts/"));
        assertThat(browser.driver.getPageSource()).contains("revision 0 because the product description");
        browser.find("#password").sendKeys(TestAccounts.PASSWORD);
        browser.find("#issue-form button[type=submit]").click();
        browser.waiting().until(d -> browser.path().equals("/lab/certificates/" + number));
        assertThat(browser.all("#revisions tbody tr")).hasSize(2);
        assertThat(browser.find("#revisions tbody tr:last-child").getText()).contains("superseded");
        assertThat(browser.consoleErrors()).isEmpty();
    }

    @Test
    void aLineThatDoesNotPassNeedsTheNonConformityStatementAndAWithdrawalNeedsAReason() {
        // Rm at least 600 MPa: the bench's curves reach about 412 MPa, so the Rm lines fail
        CertificateBench.Order order = bench.order(organisations.get(TestAccounts.CUSTOMER),
                List.of(CertificateBench.requirement("Rm", "600", null, "MPa")), 1);
        browser.signIn(TestAccounts.MANAGER, TestAccounts.PASSWORD);
        browser.open("/lab/certificates/new?orderId=" + order.orderId());
        browser.find("#productDescription").sendKeys("Hot-rolled round bar, 20 mm");
        browser.find("#draft-form button[type=submit]").click();
        browser.waiting().until(d -> browser.path().startsWith("/lab/certificates/drafts/"));
        assertThat(browser.find("#not-all-pass").getText()).contains("non-conformity statement");
        assertThat(browser.find("#line-1 .verdict").getText()).isEqualTo("fail");
        browser.find("#password").sendKeys(TestAccounts.PASSWORD);
        browser.find("#issue-form button[type=submit]").click();
        browser.waiting().until(d -> !browser.all(".problems").isEmpty());
        assertThat(browser.find(".problems").getText()).contains("/nonConformityStatement");
        browser.screenshot("certificate-draft-not-conforming");
        assertThat(browser.consoleErrors()).isEmpty();
        // the refused issue answered at the form's address; the draft's own page is the one without "/issue"
        String draftPath = browser.path().replaceFirst("/issue$", "");
        browser.find("#rebuild-reason").sendKeys("re-read the current analyses before signing");
        browser.find("#rebuild-form button[type=submit]").click();
        browser.waiting().until(d -> browser.path().equals(draftPath) && !browser.all("#line-1").isEmpty());
        assertThat(browser.find("#line-1 .verdict").getText()).isEqualTo("fail");

        browser.find("#nonConformityStatement").sendKeys("Rm below the ordered minimum; released for the customer's review");
        browser.find("#password").sendKeys(TestAccounts.PASSWORD);
        browser.find("#issue-form button[type=submit]").click();
        browser.waiting().until(d -> browser.path().matches("/lab/certificates/[A-Z]+-\\d{4}-\\d{5}"));
        String number = browser.find("#number").getText();

        browser.find("#withdraw-form button[type=submit]").click();
        assertThat(browser.path()).isEqualTo("/lab/certificates/" + number);
        assertThat(browser.find("#status").getText()).contains("valid");
        browser.find("#withdraw-reason").sendKeys("issued against the wrong purchase order");
        browser.find("#withdraw-form button[type=submit]").click();
        browser.waiting().ignoring(StaleElementReferenceException.class)
                .until(d -> browser.find("#status").getText().contains("withdrawn"));
        assertThat(browser.driver.getPageSource()).contains("issued against the wrong purchase order");
        browser.screenshot("certificate-withdrawn");
        assertThat(browser.consoleErrors()).isEmpty();

        browser.open("/lab/certificates/new?orderId=" + order.orderId());
        browser.find("#productDescription").sendKeys("Hot-rolled round bar, 20 mm");
        browser.find("#draft-form button[type=submit]").click();
        browser.waiting().until(d -> browser.path().startsWith("/lab/certificates/drafts/"));
        String discarded = browser.path();
        browser.find("#discard-reason").sendKeys("opened by mistake");
        browser.find("#discard-form button[type=submit]").click();
        browser.waiting().until(d -> browser.path().equals("/lab/certificates"));
        assertThat(browser.all("#drafts a[href='" + discarded + "']")).isEmpty();
    }

    @Test
    void managerStartsAReanalysisOfAnOrderAndFollowsItsProgress() {
        CertificateBench.Order order = bench.order(organisations.get(TestAccounts.CUSTOMER), passing(), 2);
        browser.signIn(TestAccounts.MANAGER, TestAccounts.PASSWORD);
        browser.open("/lab/jobs");
        new Select(browser.find("#reanalysis-order")).selectByValue(order.orderId());
        browser.find("#reanalysis-reason").sendKeys("engine update: recompute this order");
        browser.find("#reanalysis-form button[type=submit]").click();
        browser.waiting().until(d -> browser.path().matches("/lab/jobs/[0-9a-f-]{36}"));
        browser.waiting().ignoring(StaleElementReferenceException.class).until(d -> browser.find("#job-progress").getAttribute("data-state").equals("FINISHED"));
        assertThat(browser.find("#job-bar").getAttribute("value")).isEqualTo("2");
        assertThat(browser.find("#job-outcome").getText()).isEqualTo("2 items succeeded, 0 failed");
        browser.screenshot("job-reanalysis");
        assertThat(browser.consoleErrors()).isEmpty();
    }

    @Test
    void auditorTracesALineToItsRawCurveAndVerifiesTheLedger() throws Exception {
        String number = issuedFor(TestAccounts.CUSTOMER);
        browser.signIn(TestAccounts.AUDITOR, TestAccounts.PASSWORD);
        browser.open("/audit-desk/trace");
        browser.find("#number").sendKeys(number);
        browser.find("#trace-form button[type=submit]").click();
        browser.waiting().until(d -> !browser.all("#trace").isEmpty());
        assertThat(browser.all("details.trace-line").size()).isGreaterThanOrEqualTo(2);
        browser.find("#trace-line-1 > summary").click();
        browser.find("#trace-line-1 .trace-curve > summary").click();
        assertThat(browser.find("#trace-line-1 .replay-word").getText()).isEqualTo("replay identical");
        String shown = browser.find("#trace-line-1 .curve-sha256").getText();
        byte[] curve = fetchInBrowser(browser.find("#trace-line-1 a.curve-download").getAttribute("href"));
        assertThat(sha256(curve)).isEqualTo(shown);
        assertThat(browser.all("#trace-line-1 .trace-curve tr.event")).isNotEmpty();
        assertThat(browser.find("#latest-checkpoint").getText()).contains("events");
        browser.screenshot("trace-certificate");
        assertThat(browser.consoleErrors()).isEmpty();

        browser.find("#verify-ledger button[type=submit]").click();
        browser.waiting().until(d -> browser.path().matches("/lab/jobs/[0-9a-f-]{36}"));
        String jobPath = browser.path();
        browser.waiting().ignoring(StaleElementReferenceException.class).until(d -> browser.find("#job-progress").getAttribute("data-state").equals("FINISHED"));
        assertThat(browser.find("#job-outcome").getText()).startsWith("✓ chain intact");
        assertThat(browser.find("#job-bar").getAttribute("value")).isEqualTo("1");
        browser.screenshot("job-ledger-verification");
        assertThat(browser.consoleErrors()).isEmpty();
        browser.open("/lab/jobs");
        browser.find("#jobs a[href='" + jobPath + "']").click();
        browser.waiting().ignoring(StaleElementReferenceException.class).until(d -> browser.find("#job-progress").getAttribute("data-state").equals("FINISHED"));
        browser.screenshot("jobs");
        assertThat(browser.consoleErrors()).isEmpty();
    }

    private String issuedFor(String customer) {
        CertificateBench.Order order = bench.order(organisations.get(customer), passing(), 2);
        Api manager = as(TestAccounts.MANAGER);
        Map<String, Object> draft = new HashMap<>();
        draft.put("orderId", order.orderId());
        draft.put("specimenIds", order.specimenIds());
        draft.put("productDescription", "Hot-rolled round bar, 20 mm");
        Api.Response d = manager.post("/api/v1/certificates/drafts", draft);
        assertThat(d.status()).as(d.toString()).isEqualTo(201);
        Api.Response issued = manager.post("/api/v1/certificates/drafts/" + d.id() + "/issue",
                Map.of("password", TestAccounts.PASSWORD));
        assertThat(issued.status()).as(issued.toString()).isEqualTo(201);
        return issued.json().get("number").asString();
    }

    /** Requirements the bench's curves pass: Rp0.2 ≥ 280 MPa, Rm 380 … 500 MPa. */
    private static List<Map<String, Object>> passing() {
        return List.of(CertificateBench.requirement("Rp0.2", "280", null, "MPa"),
                CertificateBench.requirement("Rm", "380", "500", "MPa"));
    }

    /** The bytes the browser itself receives for a link, with its session cookie (fetch, read as base64). */
    private static byte[] fetchInBrowser(String href) {
        Object b64 = browser.driver.executeAsyncScript("""
                var done = arguments[arguments.length - 1];
                fetch(arguments[0], {credentials: 'same-origin'}).then(r => r.arrayBuffer()).then(buf => {
                  var s = ''; var bytes = new Uint8Array(buf);
                  for (var i = 0; i < bytes.length; i++) { s += String.fromCharCode(bytes[i]); }
                  done(btoa(s));
                }).catch(e => done('error ' + e));""", href);
        return Base64.getDecoder().decode((String) b64);
    }

    /** Fetches {@code href} in the page's session: status, content type, the Draft-Preview header, body in base64. */
    @SuppressWarnings("unchecked")
    private static Map<String, Object> fetchWithHeaders(String href) {
        return (Map<String, Object>) browser.driver.executeAsyncScript("""
                var done = arguments[arguments.length - 1];
                fetch(arguments[0], {credentials: 'same-origin'}).then(r => r.arrayBuffer().then(buf => {
                  var s = ''; var bytes = new Uint8Array(buf);
                  for (var i = 0; i < bytes.length; i++) { s += String.fromCharCode(bytes[i]); }
                  done({status: r.status, type: r.headers.get('Content-Type'),
                        preview: r.headers.get('Draft-Preview'), body: btoa(s)});
                })).catch(e => done({status: -1, error: '' + e}));""", href);
    }

    private static String sha256(byte[] bytes) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
    }
}
