package org.specimenledger.web;

import jakarta.servlet.http.HttpServletResponse;
import java.net.URLEncoder;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.specimenledger.certificates.CertificateReads;
import org.specimenledger.certificates.CertificateView;
import org.specimenledger.customers.CustomerDirectory;
import org.specimenledger.customers.OrderView;
import org.specimenledger.heats.HeatDirectory;
import org.specimenledger.heats.HeatView;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.FieldIssue;
import org.springframework.http.ResponseEntity;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestParam;

/**
 * The customer's portal: their organisation's certificates, searched by number, purchase order, heat number and
 * issue date, each with its status, verification code and the PDF exactly as stored. The organisation is applied
 * by the certificates feature's own reads ({@link CertificateReads}), never here: another organisation's number
 * is "not found" whatever URL is typed.
 */
@Controller
class CertificatePortal {

    static final int PAGE_SIZE = 50;
    static final int MAX_PAGE_SIZE = 500;

    private final CertificateReads certificates;
    private final CustomerDirectory customers;
    private final HeatDirectory heats;

    CertificatePortal(CertificateReads certificates, CustomerDirectory customers, HeatDirectory heats) {
        this.certificates = certificates;
        this.customers = customers;
        this.heats = heats;
    }

    /**
     * One page of the search. {@code page} counts from 1 and {@code size} is 1 to {@value #MAX_PAGE_SIZE}
     * (default {@value #PAGE_SIZE}); a value that is neither, or a date that is not one, is answered 400 with the
     * search form naming each problem, never a 500. The previous and next links keep every filter.
     */
    @GetMapping("/portal")
    @PreAuthorize("hasRole('CUSTOMER')")
    String portal(@RequestParam(required = false) String number, @RequestParam(required = false) String order,
            @RequestParam(required = false) String heat, @RequestParam(required = false) String from,
            @RequestParam(required = false) String to, @RequestParam(required = false) String page,
            @RequestParam(required = false) String size, Model model, HttpServletResponse response) {
        model.addAttribute("number", number);
        model.addAttribute("order", order);
        model.addAttribute("heat", heat);
        model.addAttribute("from", from);
        model.addAttribute("to", to);
        model.addAttribute("size", size);
        List<FieldIssue> problems = new ArrayList<>();
        LocalDate fromDate = FormValues.date(from, "/from", problems);
        LocalDate toDate = FormValues.date(to, "/to", problems);
        int pageNumber = whole(problems, "/page", page, 1, Integer.MAX_VALUE, 1);
        int pageSize = whole(problems, "/size", size, 1, MAX_PAGE_SIZE, PAGE_SIZE);
        model.addAttribute("problems", problems);
        if (!problems.isEmpty()) {
            response.setStatus(400);
            model.addAttribute("found", List.of());
            return "portal";
        }
        CertificateReads.Page found = certificates.search(search(number, order, heat, fromDate, toDate),
                pageNumber - 1, pageSize);
        model.addAttribute("found", found.certificates());
        model.addAttribute("paging", Paging.of(found, query(number, order, heat, from, to, size)));
        return "portal";
    }

    @GetMapping("/portal/certificates/{number}")
    @PreAuthorize("hasRole('CUSTOMER')")
    String certificate(@PathVariable String number, Model model) {
        List<CertificateView> revisions = certificates.revisions(number);
        List<CertificateView> newestFirst = new ArrayList<>(revisions);
        java.util.Collections.reverse(newestFirst);
        model.addAttribute("revisions", newestFirst);
        model.addAttribute("c", revisions.get(revisions.size() - 1));
        model.addAttribute("order", customers.order(revisions.get(0).orderId()).orElse(null));
        return "portal-certificate";
    }

    @GetMapping("/portal/certificates/{number}/pdf")
    @PreAuthorize("hasRole('CUSTOMER')")
    ResponseEntity<byte[]> pdf(@PathVariable String number, @RequestParam(required = false) Integer revision) {
        return CertificatePdf.download(certificates.pdf(number, revision));
    }

    /**
     * The filters as the customer typed them: a purchase order or heat number that names nothing of theirs gives
     * an empty list rather than every certificate; a heat number shared by several producers searches each.
     * Everything else (organisation, slicing, counting) is the certificates feature's, in SQL.
     */
    private CertificateReads.Search search(String number, String order, String heat, LocalDate from, LocalDate to) {
        List<UUID> orderIds = null;
        if (order != null && !order.isBlank()) {
            UUID organisation = CurrentUser.customerOrganisation().orElseThrow();
            orderIds = customers.allOrders().stream()
                    .filter(o -> o.customerId().equals(organisation))
                    .filter(o -> o.purchaseOrder().equalsIgnoreCase(order.trim())).map(OrderView::id)
                    .map(UUID.class::cast).toList();
        }
        List<UUID> heatIds = null;
        if (heat != null && !heat.isBlank()) {
            heatIds = heats.withNumber(heat).stream().map(HeatView::id).toList();
        }
        return new CertificateReads.Search(number, orderIds, heatIds, from, to);
    }

    /** A whole number in {@code min..max}; blank is {@code absent}; anything else is a problem at {@code pointer}. */
    private static int whole(List<FieldIssue> problems, String pointer, String text, int min, int max, int absent) {
        if (text == null || text.isBlank()) {
            return absent;
        }
        try {
            int value = Integer.parseInt(text.trim());
            if (value >= min && value <= max) {
                return value;
            }
        } catch (NumberFormatException e) {
            // reported below, as for a number out of range
        }
        problems.add(new FieldIssue(pointer, "must be a whole number from " + min
                + (max == Integer.MAX_VALUE ? "" : " to " + max) + "; was '" + text + "'"));
        return absent;
    }

    /** The filters as typed (blank ones left out), for the previous and next links. */
    private static Map<String, String> query(String number, String order, String heat, String from,
            String to, String size) {
        Map<String, String> q = new LinkedHashMap<>();
        for (String[] p : new String[][] {{"number", number}, {"order", order}, {"heat", heat}, {"from", from},
                {"to", to}, {"size", size}}) {
            if (p[1] != null && !p[1].isBlank()) {
                q.put(p[0], p[1].trim());
            }
        }
        return q;
    }

    /**
     * Where this page sits in the whole result: "n–m of N", and links to the neighbouring pages with the same
     * filters (null at either end).
     */
    record Paging(long first, long last, long total, int page, int pages, String previous, String next) {

        static Paging of(CertificateReads.Page found, Map<String, String> filters) {
            long first = found.certificates().isEmpty() ? 0 : (long) found.page() * found.size() + 1;
            long last = found.certificates().isEmpty() ? 0 : first + found.certificates().size() - 1;
            int pages = (int) Math.max(1, (found.total() + found.size() - 1) / found.size());
            int shown = found.page() + 1;
            String previous = shown > 1 ? link(filters, Math.min(shown - 1, pages)) : null;
            String next = (long) (found.page() + 1) * found.size() < found.total() ? link(filters, shown + 1) : null;
            return new Paging(first, last, found.total(), shown, pages, previous, next);
        }

        /** Form-encoded as the search form itself sends them (a '+' typed in a number stays a '+'). */
        private static String link(Map<String, String> filters, int page) {
            StringBuilder out = new StringBuilder("/portal?");
            filters.forEach((name, value) -> out.append(name).append('=')
                    .append(URLEncoder.encode(value, StandardCharsets.UTF_8)).append('&'));
            return out.append("page=").append(page).toString();
        }
    }
}
