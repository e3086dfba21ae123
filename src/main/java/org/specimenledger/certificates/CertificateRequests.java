package org.specimenledger.certificates;

import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotEmpty;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Size;
import java.util.List;
import java.util.UUID;

/** Request bodies of the certificate API. */
public final class CertificateRequests {

    private CertificateRequests() {
    }

    /**
     * A new draft, or the whole new content of an open draft (then {@code reason} is required).
     *
     * @param specimenIds            the specimens to report, in the order printed (each once, all of the order)
     * @param decisionRule           defaults to simple acceptance on the reported value
     * @param productDescription     the delivered product as printed, e.g. "hot-rolled plate 12 mm"
     * @param deviations             deviations from the test method, printed; empty when none
     * @param nonConformityStatement the statement printed with failing or undetermined lines (can also come with
     *                               the issue request)
     * @param includeCurves          whether each specimen gets an appendix page with its curve
     */
    public record DraftRequest(
            @NotNull UUID orderId,
            @NotEmpty @Size(max = 200) List<@NotNull UUID> specimenIds,
            DecisionRuleChoice decisionRule,
            @NotBlank @Size(max = 500) String productDescription,
            @Size(max = 4000) String deviations,
            @Size(max = 4000) String nonConformityStatement,
            Boolean includeCurves,
            @Size(max = 2000) String reason) {
    }

    /**
     * Issue: the lab manager re-enters their password as the signature.
     *
     * @param signatoryFunction printed under the name; defaults to "Laboratory manager"
     */
    public record IssueRequest(
            @NotBlank @Size(max = 200) String password,
            @Size(max = 200) String signatoryFunction,
            @Size(max = 4000) String nonConformityStatement) {
    }

    /** Why: required for a revision, a withdrawal and a change of a draft. */
    public record ReasonRequest(@NotBlank @Size(max = 2000) String reason) {
    }
}
