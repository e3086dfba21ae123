package org.specimenledger.web;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.UUID;
import org.specimenledger.certificates.CertificateReads;
import org.specimenledger.certificates.CertificateView;
import org.specimenledger.customers.CustomerDirectory;
import org.specimenledger.customers.OrderView;
import org.specimenledger.heats.HeatDirectory;
import org.specimenledger.heats.HeatView;
import org.specimenledger.shared.CurrentUser;
import org.springframework.format.annotation.DateTimeFormat;
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

    private static final int PAGE_SIZE = 50;

    private final CertificateReads certificates;
    private final CustomerDirectory customers;
    private final HeatDirectory heats;

    CertificatePortal(CertificateReads certificates, CustomerDirectory customers, HeatDirectory heats) {
        this.certificates = certificates;
        this.customers = customers;
        this.heats = heats;
    }

    @GetMapping("/portal")
    @PreAuthorize("hasRole('CUSTOMER')")
    String portal(@RequestParam(required = false) String number, @RequestParam(required = false) String order,
            @RequestParam(required = false) String heat,
            @RequestParam(required = false) @DateTimeFormat(iso = DateTimeFormat.ISO.DATE) LocalDate from,
            @RequestParam(required = false) @DateTimeFormat(iso = DateTimeFormat.ISO.DATE) LocalDate to,
            Model model) {
        model.addAttribute("number", number);
        model.addAttribute("order", order);
        model.addAttribute("heat", heat);
        model.addAttribute("from", from);
        model.addAttribute("to", to);
        model.addAttribute("found", search(number, order, heat, from, to));
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
     */
    private List<CertificateView> search(String number, String order, String heat, LocalDate from, LocalDate to) {
        List<UUID> orderIds = new ArrayList<>();
        orderIds.add(null);
        if (order != null && !order.isBlank()) {
            UUID organisation = CurrentUser.customerOrganisation().orElseThrow();
            orderIds = customers.allOrders().stream()
                    .filter(o -> o.customerId().equals(organisation))
                    .filter(o -> o.purchaseOrder().equalsIgnoreCase(order.trim())).map(OrderView::id)
                    .map(UUID.class::cast).toList();
        }
        List<UUID> heatIds = new ArrayList<>();
        heatIds.add(null);
        if (heat != null && !heat.isBlank()) {
            heatIds = heats.withNumber(heat).stream().map(HeatView::id).toList();
        }
        List<CertificateView> found = new ArrayList<>();
        for (UUID o : orderIds) {
            for (UUID h : heatIds) {
                found.addAll(certificates.list(number, o, h, from, to, 0, PAGE_SIZE).certificates());
            }
        }
        return found.stream().distinct().sorted(Comparator.comparing(CertificateView::issuedAt).reversed())
                .limit(PAGE_SIZE).toList();
    }
}
