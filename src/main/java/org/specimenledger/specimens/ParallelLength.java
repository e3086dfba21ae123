package org.specimenledger.specimens;

import java.util.ArrayList;
import java.util.List;

/**
 * Checks on the parallel length Lc against the gauge lengths. Lc shorter than L0 is refused (the gauge
 * marks must lie on the parallel length). The rest are warnings, kept with the specimen, not refusals.
 */
public final class ParallelLength {

    private ParallelLength() {
    }

    /** Whether Lc is long enough to carry the gauge marks: Lc ≥ L0. */
    public static boolean carriesGaugeLength(double lcMm, double l0Mm) {
        return lcMm >= l0Mm;
    }

    /**
     * Advice on a test piece that is allowed but not as recommended.
     *
     * <ul>
     * <li>Round machined pieces: ISO 6892-1 recommends Lc ≥ L0 + d/2 [M: ISO 6892-1 annex on round test
     * pieces, from memory].</li>
     * <li>Le longer than Lc: the extensometer's knife edges would sit outside the parallel length [CP].</li>
     * </ul>
     *
     * @param meanDiameterMm mean d for a round piece; ignored for other shapes (may be null)
     */
    public static List<String> warnings(SpecimenShape shape, double lcMm, double l0Mm, Double meanDiameterMm,
            double leMm) {
        List<String> out = new ArrayList<>();
        if (shape == SpecimenShape.ROUND && meanDiameterMm != null) {
            double recommended = l0Mm + meanDiameterMm / 2.0;
            if (lcMm < recommended) {
                out.add("Lc = " + CrossSection.shown(lcMm) + " mm is shorter than L0 + d/2 = "
                        + CrossSection.shown(recommended) + " mm, the parallel length ISO 6892-1 recommends for "
                        + "round test pieces");
            }
        }
        if (leMm > lcMm) {
            out.add("Le = " + CrossSection.shown(leMm) + " mm is longer than the parallel length Lc = "
                    + CrossSection.shown(lcMm) + " mm: the extensometer would reach beyond the parallel length");
        }
        return out;
    }
}
