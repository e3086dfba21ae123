package org.specimenledger.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.net.http.HttpHeaders;
import java.util.List;
import java.util.Map;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.interactive.action.PDActionJavaScript;
import org.apache.pdfbox.pdmodel.interactive.action.PDActionURI;
import org.apache.pdfbox.pdmodel.interactive.annotation.PDAnnotationLink;
import org.junit.jupiter.api.Test;
import org.specimenledger.system.SecurityHeaders;

/**
 * The rendering checks find what they look for: pages and PDFs made by hand to fail them are caught, and their
 * well-behaved twins pass, so a silent pass of {@link HostileTextRenderingTest} means something.
 */
class RenderingChecksTest {

    private static final String IMG = "\"><img src=x onerror=alert(1)>";

    private static PageVisitor.Page page(String body, boolean withPolicy) {
        Map<String, List<String>> h = withPolicy
                ? Map.of("Content-Type", List.of("text/html;charset=UTF-8"), "Content-Security-Policy",
                        List.of(SecurityHeaders.PAGE_POLICY), "X-Content-Type-Options", List.of("nosniff"))
                : Map.of("Content-Type", List.of("text/html;charset=UTF-8"));
        return new PageVisitor.Page("/made-up", 200, HttpHeaders.of(h, (a, b) -> true),
                "<!DOCTYPE html><html><head><title>t</title><script src=\"/assets/ledger.js\" defer></script></head>"
                        + "<body>" + body + "</body></html>");
    }

    @Test
    void anEscapedTextPasses() {
        String escaped = "<td>&quot;&gt;&lt;img src=x onerror=alert(1)&gt; and &lt;script&gt;alert(&#39;x&#39;)"
                + "&lt;/script&gt;</td><input value=\"&quot;&gt;&lt;img src=x onerror=alert(1)&gt;\">";
        assertThat(PageChecks.problems(page(escaped, true), IMG, true)).isEmpty();
        assertThat(PageChecks.problems(page(escaped, true), "<script>alert('x')</script>", true)).isEmpty();
    }

    @Test
    void markupMadeFromTheTextIsCaught() {
        assertThat(PageChecks.problems(page("<td>" + IMG + "</td>", true), IMG, true))
                .anyMatch(p -> p.contains("event attribute onerror"))
                .anyMatch(p -> p.contains("element made from the text"))
                .anyMatch(p -> p.contains("not on the page as text"));
        assertThat(PageChecks.problems(page("<input value=\"" + IMG + "\">", true), IMG, false))
                .anyMatch(p -> p.contains("event attribute onerror"));
        assertThat(PageChecks.problems(page("<p><script>alert('x')</script></p>", true),
                "<script>alert('x')</script>", false))
                .anyMatch(p -> p.contains("an inline script"))
                .anyMatch(p -> p.contains("'<' unescaped"));
        assertThat(PageChecks.problems(page("<script>var note = \"" + IMG.substring(2) + "\";</script>", true),
                IMG.substring(2), false)).anyMatch(p -> p.contains("inline script holding the text"));
        assertThat(PageChecks.problems(page("<a href=\" javascript:alert(1)\">x</a>", true), "javascript:alert(1)",
                false)).anyMatch(p -> p.contains("javascript: URL"));
        assertThat(PageChecks.problems(page("<p>{{7*7}} became 49</p>", true), "{{7*7}}${7*7}#{7*7}", true))
                .anyMatch(p -> p.contains("not on the page as text"));
    }

    @Test
    void aPageWithoutThePolicyIsCaught() {
        assertThat(PageChecks.problems(page("<p>x</p>", false), "x", true))
                .anyMatch(p -> p.contains("no Content-Security-Policy"))
                .anyMatch(p -> p.contains("nosniff"));
    }

    @Test
    void pdfActionsAreFoundAndAnInertPdfHasNone() throws Exception {
        assertThat(PdfActions.of(pdf(false))).isEmpty();
        assertThat(PdfActions.of(pdf(true)))
                .anyMatch(p -> p.contains("OpenAction"))
                .anyMatch(p -> p.contains("Link annotation"))
                .anyMatch(p -> p.contains("JavaScript action"))
                .anyMatch(p -> p.contains("URI action"));
    }

    @Test
    void csvCellsFollowTheFormulaRule() {
        assertThat(CsvCells.evaluated("=1+1")).isTrue();
        assertThat(CsvCells.evaluated("  @SUM(A1)")).isTrue();
        assertThat(CsvCells.evaluated("\uFF1D1")).isTrue();
        assertThat(CsvCells.evaluated("'=1+1")).isFalse();
        assertThat(CsvCells.evaluated("-2.5")).isFalse();
        assertThat(CsvCells.expected("-2+3")).isEqualTo("'-2+3");
        assertThat(CsvCells.expected("SP-1")).isEqualTo("SP-1");
    }

    private static byte[] pdf(boolean active) throws Exception {
        try (PDDocument d = new PDDocument()) {
            PDPage page = new PDPage();
            d.addPage(page);
            if (active) {
                d.getDocumentCatalog().setOpenAction(new PDActionJavaScript("app.alert(1)"));
                PDAnnotationLink link = new PDAnnotationLink();
                PDActionURI uri = new PDActionURI();
                uri.setURI("http://127.0.0.1/x");
                link.setAction(uri);
                page.getAnnotations().add(link);
            }
            ByteArrayOutputStream out = new ByteArrayOutputStream();
            d.save(out);
            return out.toByteArray();
        }
    }
}
