package org.specimenledger.web;

import java.util.ArrayList;
import java.util.List;
import org.specimenledger.shared.Role;

/**
 * The navigation each role sees. Entries whose feature is not in service yet are listed without a link
 * ({@code href} null) so the place is visible and reserved; each names what it waits for. When such a
 * feature arrives, its entry gets its path here (see DEVELOPERS.md, "Pages").
 */
record Navigation(List<Entry> entries) {

    /** One entry; {@code href} null while the feature it opens is not built. */
    record Entry(String label, String href, String waitingFor) {
        public boolean available() {
            return href != null;
        }
    }

    static Navigation of(Role role) {
        List<Entry> e = new ArrayList<>();
        switch (role) {
            case TECHNICIAN, LAB_MANAGER -> {
                e.add(new Entry("Workbench", "/lab", null));
                e.add(new Entry("Register a specimen", "/lab/specimens/new", null));
                e.add(new Entry("Equipment", "/lab/equipment", null));
                if (role == Role.LAB_MANAGER) {
                    e.add(new Entry("Certificates", "/lab/certificates", null));
                }
                e.add(new Entry("Long-running work", "/lab/jobs", null));
            }
            case AUDITOR -> {
                e.add(new Entry("Audit desk", "/audit-desk", null));
                e.add(new Entry("Equipment", "/lab/equipment", null));
                e.add(new Entry("Trace a certificate", "/audit-desk/trace", null));
                e.add(new Entry("Ledger verification", "/lab/jobs", null));
            }
            case CUSTOMER -> {
                e.add(new Entry("Our certificates", "/portal", null));
                
                e.add(new Entry("Download tokens", null, "customer API tokens"));
            }
        }
        return new Navigation(List.copyOf(e));
    }

    /** Where a role starts after signing in. */
    static String startOf(Role role) {
        return switch (role) {
            case TECHNICIAN, LAB_MANAGER -> "/lab";
            case AUDITOR -> "/audit-desk";
            case CUSTOMER -> "/portal";
        };
    }
}
