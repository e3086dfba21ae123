package org.specimenledger.demo;

import java.math.BigDecimal;
import java.time.LocalDate;
import java.util.List;
import java.util.UUID;
import org.specimenledger.accounts.AccountService;
import org.specimenledger.accounts.AccountService.NewAccount;
import org.specimenledger.customers.CustomerRequests.CustomerRequest;
import org.specimenledger.customers.CustomerRequests.OrderRequest;
import org.specimenledger.customers.CustomerRequests.RequirementRequest;
import org.specimenledger.customers.CustomerService;
import org.specimenledger.shared.Role;
import org.springframework.stereotype.Component;

/**
 * The demo laboratory's records. Every name here is invented, and so is every number that is not a
 * requirement quoted from a standard (the S355/S235 limits follow EN 10025-2 as DOMAIN.md quotes it).
 * The test runs, their curves ({@link DemoCurves}) and analyses go through the same services as the API.
 */
@Component
class DemoRecords {

    static final String PASSWORD = "demo-password";

    private final CustomerService customers;
    private final AccountService accounts;
    private final DemoTestRuns testRuns;
    private final DemoCertificates certificates;

    DemoRecords(CustomerService customers, AccountService accounts, DemoTestRuns testRuns,
            DemoCertificates certificates) {
        this.customers = customers;
        this.accounts = accounts;
        this.testRuns = testRuns;
        this.certificates = certificates;
    }

    void seed() {
        UUID girders = customers.register(new CustomerRequest("Northgate Girder Fabrication Ltd",
                "Unit 7, Furnace Lane, Northgate NG4 2XT", null)).id();
        UUID extrusions = customers.register(new CustomerRequest("Alder Valley Extrusions",
                "14 Millrace Road, Alder Valley AV9 3QP", null)).id();

        UUID s355 = customers.placeOrder(girders, new OrderRequest("NGF-PO-2026-0412", "EN 10025-2 S355J2+N",
                LocalDate.of(2026, 11, 2), List.of(
                        range("ReH", "355", null, "MPa", null, "16"),
                        range("ReH", "345", null, "MPa", "16", "40"),
                        range("Rm", "470", "630", "MPa", "3", "100"),
                        range("A", "22", null, "%", "3", "40")), null)).id();
        customers.placeOrder(girders, new OrderRequest("NGF-PO-2026-0419", "EN 10025-2 S235JR",
                LocalDate.of(2026, 11, 9), List.of(
                        range("ReH", "235", null, "MPa", null, "16"),
                        range("Rm", "360", "510", "MPa", null, "100"),
                        range("A", "26", null, "%", "3", "40")), null));
        // An invented in-house aluminium specification of the demo customer, not a published one.
        UUID aluminium = customers.placeOrder(extrusions, new OrderRequest("AVE-7731",
                "AVE internal spec 6082-T6 bar, rev. C",
                LocalDate.of(2026, 11, 16), List.of(
                        range("Rp0.2", "250", null, "MPa", null, null),
                        range("Rm", "295", null, "MPa", null, null),
                        range("A", "8", null, "%", null, null)), null)).id();
        // Invented in-house specifications of the demo customers, for the other demo test pieces.
        UUID pins = customers.placeOrder(girders, new OrderRequest("NGF-PO-2026-0436",
                "NGF internal spec alloy steel pins, rev. A", LocalDate.of(2026, 11, 12), List.of(
                        range("Rp0.2", "750", null, "MPa", null, null),
                        range("Rm", "900", "1100", "MPa", null, null),
                        range("A", "10", null, "%", null, null)), null)).id();
        UUID brackets = customers.placeOrder(girders, new OrderRequest("NGF-PO-2026-0440",
                "NGF internal spec cast brackets, rev. B", LocalDate.of(2026, 11, 13), List.of(
                        range("Rm", "180", null, "MPa", null, null)), null)).id();
        UUID seals = customers.placeOrder(extrusions, new OrderRequest("AVE-7745",
                "AVE internal spec seal strip for frame profiles, rev. A", LocalDate.of(2026, 11, 17), List.of(),
                null)).id();

        account("demo-technician", "Ines Varga (demo technician)", Role.TECHNICIAN, null);
        account("demo-manager", "Tomas Okafor (demo lab manager)", Role.LAB_MANAGER, null);
        account("demo-auditor", "Priya Lindqvist (demo auditor)", Role.AUDITOR, null);
        account("demo-customer", "Northgate quality office (demo)", Role.CUSTOMER, girders);
        account("demo-customer-2", "Alder Valley quality office (demo)", Role.CUSTOMER, extrusions);

        DemoTestRuns.Tested tested = testRuns.seed(new DemoTestRuns.Orders(s355, pins, aluminium, brackets, seals));
        certificates.seed(new DemoTestRuns.Orders(s355, pins, aluminium, brackets, seals), tested);
    }

    private void account(String username, String name, Role role, UUID organisation) {
        accounts.open(new NewAccount(username, name, PASSWORD, role, organisation));
    }

    private static RequirementRequest range(String property, String min, String max, String unit,
            String thicknessFrom, String thicknessTo) {
        return new RequirementRequest(property, decimal(min), decimal(max), unit, decimal(thicknessFrom),
                decimal(thicknessTo));
    }

    private static BigDecimal decimal(String value) {
        return value == null ? null : new BigDecimal(value);
    }
}
