package org.specimenledger.testing;

import com.fasterxml.jackson.annotation.JsonProperty;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.specimenledger.analysis.AnalysisRejected;
import org.specimenledger.analysis.CyclicParameters;
import org.specimenledger.analysis.TensileParameters;
import org.specimenledger.analysis.TensileSpecimen;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RuleViolation;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.json.JsonMapper;

/**
 * Reads the JSON parts of an analysis request: the specimen geometry and the optional parameters.
 * Problems name the part and field, e.g. {@code /specimen/S0}.
 */
final class AnalysisRequestParts {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    private AnalysisRequestParts() {
    }

    /** Geometry as sent: ISO 6892-1 symbols, mm and mm². */
    record SpecimenPart(@JsonProperty("S0") Double s0, @JsonProperty("Le") Double le, @JsonProperty("L0") Double l0,
            @JsonProperty("Lu") Double lu, @JsonProperty("Su") Double su) {
    }

    /** Whether to run the tensile or the cyclic engine, and with which settings. */
    record Settings(String mode, TensileParameters tensile, CyclicParameters cyclic) {
        boolean isCyclic() {
            return "cyclic".equals(mode);
        }
    }

    static TensileSpecimen specimen(String json) {
        SpecimenPart part;
        try {
            part = JSON.readValue(json, SpecimenPart.class);
        } catch (JacksonException e) {
            throw new RuleViolation("/specimen" + pointerOf(e), "the specimen part must be JSON like {\"S0\": 78.54, "
                    + "\"Le\": 50, \"L0\": 50} with numbers in mm and mm²" + whereOf(e));
        }
        if (part == null) {
            throw new RuleViolation("/specimen", "the specimen part is empty");
        }
        List<FieldIssue> issues = new ArrayList<>();
        required(issues, "S0", part.s0(), "mm²");
        required(issues, "Le", part.le(), "mm");
        required(issues, "L0", part.l0(), "mm");
        optional(issues, "Lu", part.lu());
        optional(issues, "Su", part.su());
        if (!issues.isEmpty()) {
            throw new RuleViolation(issues);
        }
        try {
            return new TensileSpecimen(part.s0(), part.le(), part.l0(), part.lu(), part.su());
        } catch (AnalysisRejected e) {
            throw new RuleViolation("/specimen", e.getMessage());
        }
    }

    @SuppressWarnings("unchecked")
    static Settings settings(String json) {
        if (json == null || json.isBlank()) {
            return new Settings("tensile", TensileParameters.defaults(), CyclicParameters.defaults());
        }
        Map<String, Object> map;
        try {
            map = JSON.readValue(json, LinkedHashMap.class);
        } catch (JacksonException e) {
            throw new RuleViolation("/parameters" + pointerOf(e), "the parameters part must be a JSON object"
                    + whereOf(e));
        }
        if (map == null) {
            map = new LinkedHashMap<>();
        }
        Object mode = map.remove("mode");
        String m = mode == null ? "tensile" : String.valueOf(mode);
        if (!m.equals("tensile") && !m.equals("cyclic")) {
            throw new RuleViolation("/parameters/mode", "mode '" + m + "' is not known; use tensile or cyclic");
        }
        try {
            return m.equals("cyclic")
                    ? new Settings(m, TensileParameters.defaults(), CyclicParameters.fromMap(map))
                    : new Settings(m, TensileParameters.fromMap(map), CyclicParameters.defaults());
        } catch (AnalysisRejected | ClassCastException e) {
            throw new RuleViolation("/parameters", e.getMessage());
        }
    }

    private static void required(List<FieldIssue> issues, String name, Double value, String unit) {
        if (value == null) {
            issues.add(new FieldIssue("/specimen/" + name, name + " is required, in " + unit));
        } else {
            optional(issues, name, value);
        }
    }

    private static void optional(List<FieldIssue> issues, String name, Double value) {
        if (value != null && (!Double.isFinite(value) || value <= 0)) {
            issues.add(new FieldIssue("/specimen/" + name, name + " must be a positive number, got " + value));
        }
    }

    /** The JSON Pointer of the failing value inside a part, empty for the whole part. */
    private static String pointerOf(JacksonException e) {
        StringBuilder sb = new StringBuilder();
        for (JacksonException.Reference ref : e.getPath()) {
            sb.append('/').append(ref.getPropertyName() != null ? ref.getPropertyName() : ref.getIndex());
        }
        return sb.toString();
    }

    /**
     * Where the JSON broke, without the parser's own message (which names Java types): the field of a wrong
     * value, or the line and column of a syntax error.
     */
    private static String whereOf(JacksonException e) {
        if (!e.getPath().isEmpty()) {
            return "; the value at " + pointerOf(e) + " has the wrong type or form";
        }
        if (e.getLocation() != null && e.getLocation().getLineNr() > 0) {
            return "; the JSON breaks at line " + e.getLocation().getLineNr() + ", column "
                    + e.getLocation().getColumnNr();
        }
        return "";
    }
}
