package org.specimenledger.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Base64;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.interactions.Actions;
import org.specimenledger.certificates.CertificateBench;
import org.specimenledger.specimens.SpecimenFixtures;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.beans.factory.annotation.Qualifier;
import org.springframework.web.bind.annotation.RequestMethod;
import org.springframework.web.bind.annotation.ResponseBody;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.method.HandlerMethod;
import org.springframework.web.servlet.mvc.method.RequestMappingInfo;
import org.springframework.web.servlet.mvc.method.annotation.RequestMappingHandlerMapping;
import tools.jackson.databind.JsonNode;

/**
 * Accessible basics of every page, in a real headless Chromium, for each role that may open the page, at 1280 px and
 * at a tablet's 768 px:
 * <ul>
 * <li>labels: every visible input, select and textarea has an accessible name (label, aria-label, aria-labelledby),
 * every button, link and summary has text (WCAG 2.1 SC 1.3.1, 2.4.4, 4.1.2);</li>
 * <li>contrast: text colour against the composited background of its ancestors is at least 4.5:1, 3:1 for large
 * text, with relative luminance and contrast ratio as WCAG 2.1 defines them (SC 1.4.3); in
 * {@code a11y/checks.js};</li>
 * <li>width: the page itself never scrolls sideways (SC 1.4.10 asks for 320 px; we check the two widths the
 * laboratory uses);</li>
 * <li>keyboard: Tab from the top reaches every interactive element of the main content in document order, each
 * with a focus indicator that differs from its unfocused look (SC 2.1.1, 2.4.3, 2.4.7); signing in, registering a
 * specimen, registering its test from the workbench and building a certificate draft are done with the keyboard
 * alone (Tab, typing, Space, Enter; no clicks);</li>
 * <li>print: with print media emulated navigation and buttons are hidden and the main content shown; the
 * certificate page is printed to PDF ({@code target/screenshots/certificate-print.pdf}) and read back.</li>
 * </ul>
 * The list of pages is checked against the controllers' GET routes that render a template, so a new page fails
 * here until it is added.
 */
class AccessibilityBrowserTest extends IntegrationTest {

    private static final String ANONYMOUS = "anonymous";
    private static final List<String> LAB = List.of(TestAccounts.TECHNICIAN, TestAccounts.MANAGER);
    private static final List<String> LAB_READERS = List.of(TestAccounts.TECHNICIAN, TestAccounts.MANAGER,
            TestAccounts.AUDITOR);

    /** Every page route and the roles that may open it (from the controllers' {@code @PreAuthorize}). */
    private static final Map<String, List<String>> PAGES = new LinkedHashMap<>();
    static {
        PAGES.put("/sign-in", List.of(ANONYMOUS));
        PAGES.put("/", List.of(TestAccounts.TECHNICIAN, TestAccounts.MANAGER, TestAccounts.AUDITOR, TestAccounts.CUSTOMER));
        PAGES.put("/lab", LAB);
        PAGES.put("/audit-desk", List.of(TestAccounts.AUDITOR));
        PAGES.put("/lab/specimens/new", LAB);
        PAGES.put("/lab/specimens/{id}", LAB);
        PAGES.put("/lab/tests/new", LAB);
        PAGES.put("/lab/tests/{id}", LAB);
        PAGES.put("/lab/compare", LAB);
        PAGES.put("/lab/equipment", LAB_READERS);
        PAGES.put("/lab/jobs", LAB_READERS);
        // the job is the auditor's: a technician reads only their own jobs
        PAGES.put("/lab/jobs/{id}", List.of(TestAccounts.MANAGER, TestAccounts.AUDITOR));
        PAGES.put("/lab/certificates", List.of(TestAccounts.MANAGER));
        PAGES.put("/lab/certificates/new", List.of(TestAccounts.MANAGER));
        PAGES.put("/lab/certificates/drafts/{id}", List.of(TestAccounts.MANAGER));
        PAGES.put("/lab/certificates/{number}", List.of(TestAccounts.MANAGER));
        PAGES.put("/audit-desk/trace", List.of(TestAccounts.AUDITOR, TestAccounts.MANAGER));
        PAGES.put("/portal", List.of(TestAccounts.CUSTOMER));
        PAGES.put("/portal/certificates/{number}", List.of(TestAccounts.CUSTOMER));
    }

    private static final Path ARTEFACTS = Path.of("target", "screenshots");
    private static Browser browser;

    @Autowired
    @Qualifier("requestMappingHandlerMapping")
    private RequestMappingHandlerMapping mappings;

    @BeforeAll
    static void startBrowser() {
        Assumptions.assumeTrue(Browser.available(), "chromium and chromium-driver are installed by .ci/run");
    }

    @BeforeEach
    void openBrowser() {
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
    void everyPageRouteOfTheControllersIsInTheList() {
        Set<String> routes = new TreeSet<>();
        for (Map.Entry<RequestMappingInfo, HandlerMethod> e : mappings.getHandlerMethods().entrySet()) {
            HandlerMethod h = e.getValue();
            Set<RequestMethod> methods = e.getKey().getMethodsCondition().getMethods();
            boolean get = methods.isEmpty() || methods.contains(RequestMethod.GET);
            // a page renders a template: a String view name, not a body (API, PDF, curve bytes, progress JSON)
            boolean page = h.getReturnType().getParameterType() == String.class
                    && !h.getBeanType().isAnnotationPresent(RestController.class)
                    && !h.hasMethodAnnotation(ResponseBody.class);
            if (get && page && h.getBeanType().getPackageName().startsWith("org.specimenledger")) {
                routes.addAll(e.getKey().getPatternValues());
            }
        }
        routes.removeIf(r -> r.equals("/error"));
        assertThat(routes).as("page routes of the controllers: add a new page to AccessibilityBrowserTest.PAGES")
                .containsExactlyInAnyOrderElementsOf(PAGES.keySet());
    }

    @Test
    void everyPageHasLabelsContrastWidthKeyboardAndPrintForEachRole() throws Exception {
        Map<String, String> urls = pageUrls();
        List<String> findings = new ArrayList<>();
        for (String role : List.of(ANONYMOUS, TestAccounts.TECHNICIAN, TestAccounts.MANAGER, TestAccounts.AUDITOR,
                TestAccounts.CUSTOMER)) {
            browser.driver.manage().deleteAllCookies();
            if (!role.equals(ANONYMOUS)) {
                browser.signIn(role, TestAccounts.PASSWORD);
            }
            for (Map.Entry<String, List<String>> page : PAGES.entrySet()) {
                if (!page.getValue().contains(role)) {
                    continue;
                }
                String where = page.getKey() + " as " + role;
                String name = "a11y-" + role + page.getKey().replaceAll("[^a-z]+", "-");
                browser.width(1280);
                browser.open(urls.get(page.getKey()));
                assertThat(browser.find("main").isDisplayed()).as(where).isTrue();
                findings.addAll(prefixed(where + " at 1280 px", pageChecks()));
                findings.addAll(prefixed(where, keyboardChecks()));
                findings.addAll(prefixed(where + " printed", printChecks()));
                browser.screenshot(name + "-1280");
                browser.width(768);
                findings.addAll(prefixed(where + " at 768 px", pageChecks()));
                browser.screenshot(name + "-768");
                assertThat(browser.consoleErrors()).as(where).isEmpty();
            }
        }
        assertThat(findings).as("accessibility findings").isEmpty();
    }

    @Test
    void certificatePagePrintsToPdf() throws Exception {
        String number = issuedCertificate(new CertificateBench(as(TestAccounts.TECHNICIAN), as(TestAccounts.MANAGER))
                .order(organisations.get(TestAccounts.CUSTOMER), passing(), 1));
        browser.signIn(TestAccounts.CUSTOMER, TestAccounts.PASSWORD);
        browser.open("/portal/certificates/" + number);
        browser.driver.executeCdpCommand("Emulation.setEmulatedMedia", Map.of("media", "print"));
        Map<String, Object> printed = browser.driver.executeCdpCommand("Page.printToPDF",
                Map.of("printBackground", false, "preferCSSPageSize", true));
        browser.driver.executeCdpCommand("Emulation.setEmulatedMedia", Map.of("media", ""));
        byte[] pdf = Base64.getDecoder().decode((String) printed.get("data"));
        Files.createDirectories(ARTEFACTS);
        Files.write(ARTEFACTS.resolve("certificate-print.pdf"), pdf);
        try (PDDocument doc = Loader.loadPDF(pdf)) {
            String text = new PDFTextStripper().getText(doc);
            assertThat(text).contains(number).contains("relate only to the items tested");
            assertThat(text).as("buttons and navigation are not printed").doesNotContain("Sign out");
        }
    }

    @Test
    void signInAndSpecimenRegistrationWorkWithTheKeyboardAlone() {
        CertificateBench.Order order = new CertificateBench(as(TestAccounts.TECHNICIAN), as(TestAccounts.MANAGER))
                .order(organisations.get(TestAccounts.CUSTOMER), passing(), 1);
        browser.open("/sign-in");
        tabTo("username");
        type(TestAccounts.TECHNICIAN);
        tabTo("password");
        type(TestAccounts.PASSWORD + Keys.ENTER);
        browser.waiting().until(d -> browser.path().equals("/lab"));

        browser.open("/lab/specimens/new");
        String mark = SpecimenFixtures.mark();
        tabTo("labIdentifier");
        type(mark);
        tabTo("heatId");
        chooseWithArrows(order.heatId());
        tabTo("orderId");
        chooseWithArrows(order.orderId());
        tabTo("d");
        type("10.00 10.01 10.00");
        tabTo("leMm");
        type("50");
        tabTo("lcMm");
        type("60" + Keys.ENTER);
        browser.waiting().until(d -> browser.path().startsWith("/lab/specimens/") && !browser.path().endsWith("new"));
        assertThat(browser.find("h1").getText()).contains(mark);
        browser.screenshot("a11y-specimen-registered-by-keyboard");
        assertThat(browser.consoleErrors()).isEmpty();
    }

    /**
     * A technician goes from the workbench to a new specimen, opens its test registration and registers the test with
     * Tab, typing (a closed select takes the typed start of an option, as Chromium's type-ahead does) and Enter only.
     */
    @Test
    void testRunRegistrationFromTheWorkbenchWorksWithTheKeyboardAlone() {
        CertificateBench bench = new CertificateBench(as(TestAccounts.TECHNICIAN), as(TestAccounts.MANAGER));
        CertificateBench.Order order = bench.order(organisations.get(TestAccounts.CUSTOMER), passing(), 1);
        String mark = SpecimenFixtures.mark();
        Api.Response specimen = as(TestAccounts.TECHNICIAN).post("/api/v1/specimens",
                SpecimenFixtures.roundBar(mark, order.heatId(), order.orderId()));
        assertThat(specimen.status()).as(specimen.toString()).isEqualTo(201);
        signInWithTheKeyboard(TestAccounts.TECHNICIAN, "/lab");

        tabToElement(browser.find("#main a[href='/lab/specimens/" + specimen.id() + "']"));
        type(Keys.ENTER);
        browser.waiting().until(d -> browser.path().equals("/lab/specimens/" + specimen.id()));
        tabTo("register-test");
        type(Keys.ENTER);
        browser.waiting().until(d -> browser.path().equals("/lab/tests/new"));
        tabTo("machineId");
        chooseByTyping(asset(bench.machineId()), bench.machineId());
        tabTo("forceTransducerId");
        chooseByTyping(asset(bench.transducerId()), bench.transducerId());
        tabTo("forceRangeN");
        type("100000");
        tabTo("extensometerId");
        chooseByTyping(asset(bench.extensometerId()), bench.extensometerId());
        tabTo("temperatureC");
        // replace the default temperature: select all with Ctrl+A, then type over it
        new Actions(browser.driver).keyDown(Keys.CONTROL).sendKeys("a").keyUp(Keys.CONTROL).sendKeys("21.5").perform();
        tabToElement(browser.find("#test-run-form button[type=submit]"));
        type(Keys.ENTER);
        waitForPath("/lab/tests/[0-9a-f-]{36}");
        String run = browser.path().substring("/lab/tests/".length());
        JsonNode registered = as(TestAccounts.TECHNICIAN).get("/api/v1/tests/" + run).json();
        assertThat(registered.get("specimenId").asString()).isEqualTo(specimen.id());
        assertThat(registered.get("machineId").asString()).isEqualTo(bench.machineId());
        assertThat(registered.get("extensometerId").asString()).isEqualTo(bench.extensometerId());
        assertThat(registered.get("temperatureC").decimalValue()).isEqualByComparingTo("21.5");
        browser.screenshot("a11y-test-run-registered-by-keyboard");
        assertThat(browser.consoleErrors()).isEmpty();
    }

    /**
     * A lab manager chooses an order, keeps its specimens, picks the guard-banded rule, asks for curve pages with
     * Space and builds the draft with Enter; the draft page's preview link is then one Tab stop away.
     */
    @Test
    void certificateDraftWorksWithTheKeyboardAlone() {
        CertificateBench bench = new CertificateBench(as(TestAccounts.TECHNICIAN), as(TestAccounts.MANAGER));
        CertificateBench.Order order = bench.order(organisations.get(TestAccounts.CUSTOMER), passing(), 2);
        String purchaseOrder = as(TestAccounts.MANAGER).get("/api/v1/orders/" + order.orderId()).json()
                .get("purchaseOrder").asString();
        signInWithTheKeyboard(TestAccounts.MANAGER, "/lab");

        browser.open("/lab/certificates");
        tabTo("orderId");
        chooseByTyping(purchaseOrder, order.orderId());
        tabToElement(browser.find("#choose-order button[type=submit]"));
        type(Keys.ENTER);
        browser.waiting().until(d -> browser.path().equals("/lab/certificates/new"));
        assertThat(browser.all("input[name=specimenIds]:checked")).hasSize(2);
        tabTo("decisionRule");
        chooseWithArrows("GUARD_BANDED");
        tabTo("productDescription");
        type("Hot-rolled round bar, 20 mm, typed");
        tabToElement(browser.find("#draft-form input[name=includeCurves]"));
        type(Keys.SPACE);
        assertThat(browser.find("#draft-form input[name=includeCurves]").isSelected()).isTrue();
        tabToElement(browser.find("#draft-form button[type=submit]"));
        type(Keys.ENTER);
        waitForPath("/lab/certificates/drafts/[0-9a-f-]{36}");
        String draftId = browser.path().substring("/lab/certificates/drafts/".length());
        JsonNode draft = as(TestAccounts.MANAGER).get("/api/v1/certificates/drafts/" + draftId).json();
        assertThat(draft.get("orderId").asString()).isEqualTo(order.orderId());
        assertThat(draft.get("decisionRule").asString()).isEqualTo("GUARD_BANDED");
        assertThat(draft.get("includeCurves").asBoolean()).isTrue();
        assertThat(draft.get("productDescription").asString()).isEqualTo("Hot-rolled round bar, 20 mm, typed");
        assertThat(draft.get("specimenIds")).hasSize(2);
        tabTo("preview-pdf");
        browser.screenshot("a11y-certificate-draft-by-keyboard");
        assertThat(browser.consoleErrors()).isEmpty();
    }

    /** Waits for a page whose path matches {@code regex}; a timeout names the page reached and what it shows. */
    private static void waitForPath(String regex) {
        try {
            browser.waiting().until(d -> browser.path().matches(regex));
        } catch (org.openqa.selenium.TimeoutException e) {
            browser.screenshot("a11y-keyboard-stuck");
            throw new AssertionError("expected a page at " + regex + ", still at " + browser.path() + ": "
                    + browser.find("main").getText(), e);
        }
    }

    private static void signInWithTheKeyboard(String username, String startPage) {
        browser.open("/sign-in");
        tabTo("username");
        type(username);
        tabTo("password");
        type(TestAccounts.PASSWORD + Keys.ENTER);
        browser.waiting().until(d -> browser.path().equals(startPage));
    }

    private String asset(String equipmentId) {
        return as(TestAccounts.TECHNICIAN).get("/api/v1/equipment/" + equipmentId).json().get("assetId").asString();
    }

    /**
     * The checks themselves, on a page made for them: they must pass what passes and name what fails. Reference
     * points: black on white is 21:1, the top of the WCAG 2.1 contrast-ratio range (WCAG 2.1, definition of
     * contrast ratio); #767676 on white is 4.54:1 and #777777 on white 4.48:1 (commonly cited; from memory, and
     * they follow from the same definitions).
     */
    @Test
    void theChecksFindWhatTheyLookFor() {
        browser.driver.get("data:text/html;charset=utf-8," + java.net.URLEncoder.encode("""
                <html><body style="background:#fff;margin:0"><main>
                <p id="black" style="color:#000">black</p>
                <p id="grey-passes" style="color:#767676">grey 767676</p>
                <p id="grey-fails" style="color:#777777">grey 777777</p>
                <p id="half-black" style="color:rgba(0,0,0,.5)">half black</p>
                <p id="large-passes" style="color:#949494;font-size:24px">large</p>
                <div style="background:rgba(0,0,0,.5)"><span id="on-half" style="color:#000">on half</span></div>
                <input id="nameless"><label>named <input id="wrapped"></label>
                <div id="wide" style="width:3000px">wide</div>
                </main></body></html>""", StandardCharsets.UTF_8).replace("+", "%20"));
        List<String> findings = pageChecks();
        // black over half-transparent black over white is 5.28:1: passes only when the alpha is composited
        assertThat(findings).noneMatch(f -> f.contains("#black") || f.contains("#grey-passes")
                || f.contains("#large-passes") || f.contains("#wrapped") || f.contains("#on-half"));
        // rgba(0,0,0,.5) over white is rgb(127.5, 127.5, 127.5): about 3.95:1
        assertThat(findings).anyMatch(f -> f.startsWith("contrast: p#grey-fails") && f.contains("4.48:1"))
                .anyMatch(f -> f.startsWith("contrast: p#half-black") && f.contains("3.9"))
                .anyMatch(f -> f.startsWith("label: input#nameless"))
                .anyMatch(f -> f.startsWith("width: ") && f.contains("div#wide"));
    }

    // ---- checks ----

    @SuppressWarnings("unchecked")
    private static List<String> pageChecks() {
        return (List<String>) browser.driver.executeScript(script("checks.js"));
    }

    /** Tab from the top of the page; every stop of the main content is reached in order and shows its focus. */
    @SuppressWarnings("unchecked")
    private static List<String> keyboardChecks() {
        List<String> stops = (List<String>) browser.driver.executeScript(script("tab-stops.js"));
        List<String> findings = new ArrayList<>();
        // start Tab at the top of the document: focusing the body moves the sequential focus starting point there
        browser.driver.executeScript("""
                window.scrollTo(0, 0); document.body.tabIndex = -1; document.body.focus();
                document.body.removeAttribute('tabindex');""");
        int total = ((Number) browser.driver.executeScript(
                "return document.querySelectorAll('a[href], button, input, select, textarea, summary, [tabindex]').length;"))
                .intValue();
        List<Integer> reached = new ArrayList<>();
        for (int i = 0; i < 2 * total + 10 && reached.size() < stops.size(); i++) {
            new Actions(browser.driver).sendKeys(Keys.TAB).perform();
            List<Object> now = (List<Object>) browser.driver.executeScript("""
                    var a = document.activeElement; if (!a || a === document.body) { return null; }
                    var s = getComputedStyle(a);
                    return [a.getAttribute('data-tab-stop'), a.tagName.toLowerCase() + (a.id ? '#' + a.id : '') + ' '
                      + s.outlineStyle + ' ' + s.outlineWidth + ' ' + s.outlineColor + ' | ' + s.boxShadow];""");
            if (now == null || now.get(0) == null) {
                continue;
            }
            int index = Integer.parseInt((String) now.get(0));
            if (!reached.contains(index)) {
                reached.add(index);
                if (stops.get(index).equals(now.get(1))) {
                    findings.add("focus: " + now.get(1) + " looks the same focused and unfocused");
                }
            }
        }
        List<Integer> expected = new ArrayList<>();
        for (int i = 0; i < stops.size(); i++) {
            expected.add(i);
        }
        if (!reached.equals(expected)) {
            findings.add("keyboard: Tab reached the main content's stops " + reached + ", expected " + expected
                    + " of " + stops);
        }
        return findings;
    }

    /** Print media: navigation and buttons hidden, main content shown. */
    @SuppressWarnings("unchecked")
    private static List<String> printChecks() {
        browser.driver.executeCdpCommand("Emulation.setEmulatedMedia", Map.of("media", "print"));
        try {
            return (List<String>) browser.driver.executeScript("""
                    var out = [];
                    document.querySelectorAll('nav, button, .button, .sign-out, .skip').forEach(function (e) {
                      if (e.getClientRects().length && getComputedStyle(e).visibility !== 'hidden') {
                        out.push('print: ' + e.tagName.toLowerCase() + (e.id ? '#' + e.id : '') + ' "'
                          + (e.innerText || '').trim().substring(0, 30) + '" is printed'); }
                    });
                    var main = document.querySelector('main');
                    if (!main || !main.getClientRects().length || !main.innerText.trim()) { out.push('print: main is not shown'); }
                    return out;""");
        } finally {
            browser.driver.executeCdpCommand("Emulation.setEmulatedMedia", Map.of("media", ""));
        }
    }

    // ---- keyboard helpers ----

    private static void tabTo(String id) {
        for (int i = 0; i < 60; i++) {
            new Actions(browser.driver).sendKeys(Keys.TAB).perform();
            if (id.equals(browser.driver.switchTo().activeElement().getAttribute("id"))) {
                return;
            }
        }
        throw new AssertionError("Tab never reached #" + id);
    }

    /** Tabs forward until {@code target} has the focus (the test finds the element; only the keyboard moves). */
    private static void tabToElement(WebElement target) {
        for (int i = 0; i < 80; i++) {
            new Actions(browser.driver).sendKeys(Keys.TAB).perform();
            if (target.equals(browser.driver.switchTo().activeElement())) {
                return;
            }
        }
        throw new AssertionError("Tab never reached " + target.getTagName() + " " + target.getText());
    }

    /**
     * Types the start of an option's text into the focused, closed select: Chromium's type-ahead picks the first
     * option starting with what was typed (for long lists, where the arrow keys would take hundreds of presses).
     */
    private static void chooseByTyping(String optionStart, String value) {
        WebElement select = browser.driver.switchTo().activeElement();
        assertThat(select.getTagName()).isEqualTo("select");
        new Actions(browser.driver).sendKeys(optionStart).perform();
        assertThat(select.getDomProperty("value")).as("chosen by typing '%s'", optionStart).isEqualTo(value);
    }

    private static void type(CharSequence keys) {
        new Actions(browser.driver).sendKeys(keys).perform();
    }

    /** A closed select changes its choice with the arrow keys (Chromium outside macOS). */
    private static void chooseWithArrows(String value) {
        WebElement select = browser.driver.switchTo().activeElement();
        for (int i = 0; i < 500 && !value.equals(select.getDomProperty("value")); i++) {
            new Actions(browser.driver).sendKeys(Keys.ARROW_DOWN).perform();
        }
        assertThat(select.getDomProperty("value")).as("chosen with the arrow keys").isEqualTo(value);
    }

    // ---- the records the pages show ----

    private Map<String, String> pageUrls() {
        Api technician = as(TestAccounts.TECHNICIAN);
        Api manager = as(TestAccounts.MANAGER);
        CertificateBench bench = new CertificateBench(technician, manager);
        CertificateBench.Order issued = bench.order(organisations.get(TestAccounts.CUSTOMER), passing(), 1);
        String number = issuedCertificate(issued);
        CertificateBench.Order drafted = bench.order(organisations.get(TestAccounts.CUSTOMER), passing(), 1);
        Api.Response draft = manager.post("/api/v1/certificates/drafts", Map.of("orderId", drafted.orderId(),
                "specimenIds", drafted.specimenIds(), "productDescription", "Hot-rolled round bar, 20 mm"));
        assertThat(draft.status()).as(draft.toString()).isEqualTo(201);
        String specimen = issued.specimenIds().get(0);
        String run = technician.get("/api/v1/tests?specimenId=" + specimen).json().get("items").get(0).get("id")
                .asString();
        Api.Response again = technician.post("/api/v1/tests/" + run + "/analyses",
                Map.of("reason", "a second analysis to compare"));
        assertThat(again.status()).as(again.toString()).isEqualTo(201);
        var analyses = technician.get("/api/v1/tests/" + run + "/analyses").json();
        Api.Response job = as(TestAccounts.AUDITOR).post("/api/v1/audit/verification-jobs", Map.of());
        assertThat(job.status()).as(job.toString()).isIn(201, 202);

        Map<String, String> urls = new LinkedHashMap<>();
        for (String route : PAGES.keySet()) {
            urls.put(route, route);
        }
        urls.put("/lab/specimens/{id}", "/lab/specimens/" + specimen);
        urls.put("/lab/tests/new", "/lab/tests/new?specimenId=" + specimen);
        urls.put("/lab/tests/{id}", "/lab/tests/" + run);
        urls.put("/lab/compare", "/lab/compare?left=" + analyses.get(0).get("id").asString() + "&right="
                + analyses.get(1).get("id").asString());
        urls.put("/lab/jobs/{id}", "/lab/jobs/" + job.id());
        urls.put("/lab/certificates/new", "/lab/certificates/new?orderId=" + drafted.orderId());
        urls.put("/lab/certificates/drafts/{id}", "/lab/certificates/drafts/" + draft.id());
        urls.put("/lab/certificates/{number}", "/lab/certificates/" + number);
        urls.put("/audit-desk/trace", "/audit-desk/trace?number=" + number);
        urls.put("/portal/certificates/{number}", "/portal/certificates/" + number);
        return urls;
    }

    private String issuedCertificate(CertificateBench.Order order) {
        Api manager = as(TestAccounts.MANAGER);
        Api.Response d = manager.post("/api/v1/certificates/drafts", Map.of("orderId", order.orderId(),
                "specimenIds", order.specimenIds(), "productDescription", "Hot-rolled round bar, 20 mm"));
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

    private static List<String> prefixed(String where, List<String> findings) {
        return findings.stream().map(f -> where + ": " + f).toList();
    }

    private static String script(String name) {
        try (InputStream in = AccessibilityBrowserTest.class.getResourceAsStream("/a11y/" + name)) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
