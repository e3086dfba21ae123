package org.specimenledger.specimens;

import java.util.List;

/**
 * The shape of a test piece's cross-section in its parallel length, and the dimensions measured on it.
 * Symbols follow ISO 6892-1: before the test d (diameter), a (thickness, or wall thickness of a tube),
 * b (width), D (outer diameter of a tube); after fracture the same with the suffix u (du, au, bu, Du).
 */
public enum SpecimenShape {
    /** Round: diameter d. S0 = π·d²/4. */
    ROUND(List.of("d")),
    /** Flat (rectangular): thickness a and width b. S0 = a·b. */
    FLAT(List.of("a", "b")),
    /** Tube section or full tube: wall thickness a and outer diameter D. S0 = π·a·(D − a). */
    TUBE(List.of("a", "D")),
    /** Any other section: S0 is determined otherwise (e.g. from mass and length) and given directly. */
    OTHER(List.of());

    private final List<String> dimensions;

    SpecimenShape(List<String> dimensions) {
        this.dimensions = dimensions;
    }

    /** The dimension symbols measured at this stage, in the order they are listed and stored. */
    public List<String> dimensions(CrossSection.Stage stage) {
        return dimensions.stream().map(stage::symbol).toList();
    }

    /** Whether the cross-section is computed from measured dimensions (every shape but OTHER). */
    public boolean isMeasured() {
        return !dimensions.isEmpty();
    }
}
