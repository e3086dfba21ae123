package org.specimenledger.reliability;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Attribute;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.jsoup.nodes.TextNode;
import org.specimenledger.system.SecurityHeaders;

/**
 * Judges a page that shows text someone typed, the way a browser would build it: the HTML is parsed with jsoup
 * (an HTML5 parser) and the tree, not the source, is inspected. A page passes when the text arrives as a text
 * node, character for character; when nothing in the tree was made from it (no element the text would create as
 * markup, no {@code on…} event attribute, no {@code javascript:} URL, no inline script holding it); when the
 * source never carries it with its {@code <} unescaped; and when the answer has the pages' content security
 * policy and {@code nosniff}.
 */
final class PageChecks {

    /** URL schemes that run code or render markup when followed [CP: the usual XSS filter lists]. */
    private static final List<String> ACTIVE_SCHEMES = List.of("javascript:", "vbscript:", "data:text/html");

    /** Attributes a browser follows or loads as a URL (an input's value holding "javascript:" is only text). */
    private static final List<String> URL_ATTRIBUTES = List.of("href", "src", "action", "formaction", "xlink:href",
            "data", "poster", "background", "cite", "srcset");

    private PageChecks() {
    }

    /** Headers every page answer must carry, whatever it shows. Empty when fine. */
    static List<String> headerProblems(PageVisitor.Page page) {
        List<String> out = new ArrayList<>();
        String type = page.header("Content-Type");
        if (type == null || !type.toLowerCase(Locale.ROOT).startsWith("text/html")) {
            out.add(page + ": served as '" + type + "'");
        }
        String csp = page.header("Content-Security-Policy");
        if (csp == null) {
            out.add(page + ": no Content-Security-Policy header");
        } else if (!csp.equals(SecurityHeaders.PAGE_POLICY)) {
            out.add(page + ": Content-Security-Policy is '" + csp + "', not the pages' policy");
        }
        if (!"nosniff".equals(page.header("X-Content-Type-Options"))) {
            out.add(page + ": no X-Content-Type-Options: nosniff");
        }
        return out;
    }

    /**
     * Every problem of {@code page} with {@code text} (as stored) on it; {@code shown} when the page is one that
     * prints the field, so the text must be found there as a text node.
     */
    static List<String> problems(PageVisitor.Page page, String text, boolean shown) {
        List<String> out = new ArrayList<>();
        if (page.status() != 200) {
            out.add(page + ": answered " + page.status());
            return out;
        }
        out.addAll(headerProblems(page));
        out.addAll(treeProblems(page, Jsoup.parse(page.html()), text, shown));
        return out;
    }

    /** The same without the header checks, on a tree parsed once for many texts. */
    static List<String> treeProblems(PageVisitor.Page page, Document doc, String text, boolean shown) {
        List<String> out = new ArrayList<>();
        String label = page + " with " + HostileInputTest.describe(text);
        if (text.indexOf('<') >= 0 && page.html().contains(text)) {
            out.add(label + ": the source holds the text with its '<' unescaped");
        }
        for (Element e : doc.getAllElements()) {
            for (Attribute a : e.attributes()) {
                if (a.getKey().toLowerCase(Locale.ROOT).startsWith("on")) {
                    out.add(label + ": <" + e.tagName() + "> has an event attribute " + a.getKey());
                }
                String value = a.getValue().replaceAll("[\\s\\p{Cntrl}]", "").toLowerCase(Locale.ROOT);
                for (String scheme : ACTIVE_SCHEMES) {
                    if (URL_ATTRIBUTES.contains(a.getKey().toLowerCase(Locale.ROOT)) && value.startsWith(scheme)) {
                        out.add(label + ": <" + e.tagName() + " " + a.getKey() + "> is a " + scheme + " URL");
                    }
                }
            }
            if (e.tagName().equals("script")) {
                if (!e.hasAttr("src")) {
                    out.add(label + ": an inline script" + (e.data().contains(text) ? " holding the text" : ""));
                } else if (!e.attr("src").startsWith("/assets/")) {
                    out.add(label + ": a script from " + e.attr("src"));
                }
            }
        }
        for (Element made : elementsMadeBy(text)) {
            for (Element e : doc.getElementsByTag(made.tagName())) {
                if (e.attributes().equals(made.attributes()) && e.data().equals(made.data())
                        && (made.attributesSize() > 0 || !made.data().isEmpty())) {
                    out.add(label + ": the page has an element made from the text: " + e.outerHtml());
                }
            }
        }
        if (shown && !hasTextNode(doc, text)) {
            out.add(label + ": the text is not on the page as text");
        }
        return out;
    }

    /** The elements a browser would make from {@code text} if it were pasted into a page unescaped. */
    private static List<Element> elementsMadeBy(String text) {
        Element body = Jsoup.parseBodyFragment(text).body();
        List<Element> out = new ArrayList<>(body.getAllElements());
        out.remove(body);
        return out;
    }

    /**
     * Whether a text node holds {@code text}. Line ends are compared as the HTML parser leaves them: it turns
     * CR LF and a lone CR into LF before tokenising [S: WHATWG HTML, "preprocessing the input stream"].
     */
    static boolean hasTextNode(Document doc, String text) {
        String wanted = lineEnds(text);
        for (Element e : doc.getAllElements()) {
            for (TextNode t : e.textNodes()) {
                if (lineEnds(t.getWholeText()).contains(wanted)) {
                    return true;
                }
            }
        }
        return false;
    }

    private static String lineEnds(String s) {
        return s.replace("\r\n", "\n").replace('\r', '\n');
    }
}
