package org.specimenledger.audit;

import io.swagger.v3.oas.annotations.Operation;
import jakarta.validation.constraints.Max;
import jakarta.validation.constraints.Min;
import java.util.List;
import org.specimenledger.shared.RecordNotFound;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.validation.annotation.Validated;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestHeader;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/** The ledger's signing key, signed checkpoints and Merkle proofs. */
@RestController
@RequestMapping("/api/v1/ledger")
@Validated
class LedgerController {

    static final MediaType PEM = MediaType.parseMediaType("application/x-pem-file");

    private final LedgerSigningKey key;
    private final Checkpoints checkpoints;
    private final LedgerProofs proofs;

    LedgerController(LedgerSigningKey key, Checkpoints checkpoints, LedgerProofs proofs) {
        this.key = key;
        this.checkpoints = checkpoints;
        this.proofs = proofs;
    }

    /** The checkpoint public key: PEM when asked for {@code application/x-pem-file}, JSON otherwise. */
    @GetMapping("/key")
    @PreAuthorize(AuditAccess.ANYONE)
    @Operation(summary = "The laboratory's Ed25519 checkpoint key (JSON, or PEM with Accept: application/x-pem-file)")
    ResponseEntity<?> key(@RequestHeader(value = "Accept", required = false) String accept) {
        if (accept != null && accept.contains(PEM.toString())) {
            return ResponseEntity.ok().contentType(PEM).body(key.publicKeyPem());
        }
        return ResponseEntity.ok().contentType(MediaType.APPLICATION_JSON)
                .body(new KeyView(LedgerSigningKey.ALGORITHM, key.keyId(), key.publicKeyPem()));
    }

    @GetMapping("/checkpoints")
    @PreAuthorize(AuditAccess.READERS)
    @Operation(summary = "List signed checkpoints in the order recorded")
    CheckpointPage checkpoints(@RequestParam(defaultValue = "0") @Min(0) long after,
            @RequestParam(defaultValue = "100") @Min(1) @Max(1000) int limit) {
        List<CheckpointView> page = checkpoints.page(after, limit);
        Long next = page.size() == limit ? page.get(page.size() - 1).id() : null;
        return new CheckpointPage(page, next);
    }

    @GetMapping("/checkpoints/latest")
    @PreAuthorize(AuditAccess.ANYONE)
    @Operation(summary = "The most recent signed checkpoint")
    CheckpointView latest() {
        return checkpoints.latest().orElseThrow(() -> new RecordNotFound("ledger checkpoint", "latest"));
    }

    @GetMapping("/proof/{seq}")
    @PreAuthorize(AuditAccess.READERS)
    @Operation(summary = "Inclusion proof of one event, against the latest checkpoint covering it or a given tree size")
    InclusionProof inclusion(@PathVariable long seq, @RequestParam(required = false) Long treeSize) {
        return proofs.inclusion(seq, treeSize);
    }

    @GetMapping("/consistency")
    @PreAuthorize(AuditAccess.READERS)
    @Operation(summary = "Consistency proof between two tree sizes (such as two checkpoints)")
    ConsistencyProof consistency(@RequestParam long from, @RequestParam long to) {
        return proofs.consistency(from, to);
    }

    /** @param keyId lower-case hex SHA-256 of the SubjectPublicKeyInfo DER */
    record KeyView(String algorithm, String keyId, String publicKeyPem) {
    }

    /** @param nextAfter pass as {@code after} for the next page; null on the last page */
    record CheckpointPage(List<CheckpointView> checkpoints, Long nextAfter) {
    }
}
