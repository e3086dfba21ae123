package org.specimenledger.web;

import java.util.Comparator;
import java.util.List;
import org.specimenledger.equipment.CalibrationStatus;
import org.specimenledger.equipment.EquipmentDirectory;
import org.specimenledger.equipment.EquipmentView;
import org.specimenledger.shared.Access;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;

/**
 * Instruments with their calibration standing today: valid, due within the due-soon window (30 days by
 * default, {@code ledger.equipment.due-soon-within}), expired, none or retired. Each status is shown as
 * a word and a shape, never by colour alone. Those needing attention come first.
 */
@Controller
class EquipmentPage {

    private final EquipmentDirectory equipment;

    EquipmentPage(EquipmentDirectory equipment) {
        this.equipment = equipment;
    }

    /** A status as shown: the CSS class, the word and the symbol beside it. */
    record Standing(String css, String word, String symbol) {
        static Standing of(CalibrationStatus s) {
            return switch (s) {
                case VALID -> new Standing("status-valid", "valid", "✓");
                case DUE_SOON -> new Standing("status-due", "due soon", "!");
                case EXPIRED -> new Standing("status-expired", "expired", "✕");
                case NONE -> new Standing("status-expired", "not calibrated", "✕");
                case RETIRED -> new Standing("status-retired", "retired", "–");
            };
        }
    }

    record Row(EquipmentView instrument, Standing standing) {
    }

    @GetMapping("/lab/equipment")
    @PreAuthorize(Access.LAB_READERS)
    String equipment(Model model) {
        List<Row> rows = equipment.all().stream()
                .sorted(Comparator.comparing((EquipmentView e) -> order(e.calibrationStatus()))
                        .thenComparing(EquipmentView::assetId))
                .map(e -> new Row(e, Standing.of(e.calibrationStatus()))).toList();
        model.addAttribute("rows", rows);
        return "equipment";
    }

    private static int order(CalibrationStatus s) {
        return switch (s) {
            case EXPIRED, NONE -> 0;
            case DUE_SOON -> 1;
            case VALID -> 2;
            case RETIRED -> 3;
        };
    }
}
