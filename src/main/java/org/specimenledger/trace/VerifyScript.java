package org.specimenledger.trace;

import java.util.List;
import java.util.Map;
import java.util.UUID;

/**
 * Writes {@code VERIFY.txt}: the bundle's instructions, which are at the same time a bash script, so that
 * following the text literally and running it are the same thing. Comments explain each step; every other
 * line is a command using only bash, sha256sum, sed, grep, cut, wc and openssl (3.0 or later).
 */
final class VerifyScript {

    /** A raw curve file in the bundle and the records that must name its fingerprint. */
    record CurveFile(String path, UUID rawCurveId, List<UUID> analysisIds) {
    }

    /** A reference from one record to another that the script checks inside the proven texts. */
    record Link(String recordPath, String key, String value) {
    }

    private VerifyScript() {
    }

    static String write(AuditBundle b, Map<String, Long> recordEvents, List<CurveFile> curves, List<Link> links,
            String documentPath, String softwareVersion) {
        StringBuilder s = new StringBuilder();
        String what = b.root() != null && b.root().documentNumber() != null
                ? "document " + b.root().documentNumber()
                : b.trace().lines().size() + " analysis run(s)";
        s.append("""
                # Audit bundle for %s, exported %s by Specimen Ledger %s.
                #
                # This file is the instructions and a bash script at once: each line that is not a comment is a
                # command. Unpack the bundle, go into its folder and run:   bash VERIFY.txt
                # It needs only bash, sha256sum, sed, grep, cut, wc and openssl 3; nothing from the laboratory.
                # Each step prints OK; the first failure prints FAILED with the file concerned and exits with 1.
                #
                # A pass proves, given that the key in step 1 is the laboratory's (compare its id with the key the
                # laboratory publishes at GET /api/v1/ledger/key, or a copy you hold):
                #  - the checkpoint (tree size and Merkle root of the ledger) was signed with that key;
                #  - every file in events/ is, byte for byte, the ledger event at its position in that tree
                #    (RFC 6962 leaf and audit path, checked as RFC 9162 section 2.1.3.2 describes), so the record
                #    it holds was recorded then and cannot have been rewritten since without the root changing;
                #  - every file in records/ is exactly the state that its event recorded (the event's "after");
                #  - every raw curve file has the SHA-256 and size that the ledger recorded on upload, and each
                #    analysis names that fingerprint as its input; the references between the records hold;
                #  - document.pdf, when present, has the SHA-256 recorded by its issue event.
                # It does not prove: that the computed properties are right (replays/ holds this software's own
                # recomputation at export, unsigned; recompute from the curve and the parameters in the analysis
                # record to check independently); that no other events exist (later events, other records); that
                # the physical test was done as recorded. trace.json and replays/ are readable copies, unchecked.
                # Results relate only to the items tested; conformity decisions follow the stated decision rule;
                # local codes and the laboratory's accreditation govern their use.

                set -u
                cd "$(dirname "$0")" || exit 1
                fail() { echo "FAILED: $*"; exit 1; }
                ok() { echo "OK: $*"; }

                # 1. The signing key. Its id is the SHA-256 of the key's DER encoding.
                key_id=$(openssl pkey -pubin -in public-key.pem -outform DER | sha256sum | cut -c1-64)
                [ "$key_id" = "%s" ] || fail "public-key.pem is not the key %s"
                ok "public key id $key_id"

                # 2. The checkpoint: four lines (format, tree size, root hash, time), signed with Ed25519.
                openssl pkeyutl -verify -pubin -inkey public-key.pem -rawin -in checkpoint/signed-text.txt \\
                    -sigfile checkpoint/signature.bin >/dev/null || fail "checkpoint/signature.bin does not verify"
                size=$(sed -n 2p checkpoint/signed-text.txt)
                root=$(sed -n 3p checkpoint/signed-text.txt)
                ok "checkpoint of $size events with root $root is signed"

                # 3. Every event is a leaf of that tree. Leaf = SHA-256(0x00 || event bytes),
                #    node = SHA-256(0x01 || left || right); proofs/<seq>.txt holds the leaf index, the tree size
                #    and the audit path (one hash a line). The loop is RFC 9162 section 2.1.3.2, step by step.
                leaf_hash() { { printf '\\000'; cat "$1"; } | sha256sum | cut -c1-64; }
                unhex() { printf "$(printf '%%s' "$1" | sed 's/../\\\\x&/g')"; }
                node_hash() { { printf '\\001'; unhex "$1"; unhex "$2"; } | sha256sum | cut -c1-64; }
                included() {
                    local fn sn r p
                    fn=$(sed -n 1p "$2"); sn=$(( $(sed -n 2p "$2") - 1 )); r=$(leaf_hash "$1")
                    [ "$(sed -n 2p "$2")" = "$size" ] || return 1
                    for p in $(tail -n +3 "$2"); do
                        [ "$sn" -eq 0 ] && return 1
                        if [ $(( fn & 1 )) -eq 1 ] || [ "$fn" -eq "$sn" ]; then
                            r=$(node_hash "$p" "$r")
                            while [ $(( fn & 1 )) -eq 0 ] && [ "$fn" -ne 0 ]; do fn=$(( fn >> 1 )); sn=$(( sn >> 1 )); done
                        else
                            r=$(node_hash "$r" "$p")
                        fi
                        fn=$(( fn >> 1 )); sn=$(( sn >> 1 ))
                    done
                    [ "$sn" -eq 0 ] && [ "$r" = "$root" ]
                }
                """.formatted(what, b.trace().tracedAt(), softwareVersion, b.keyId(), b.keyId()));
        s.append("for seq in");
        b.events().forEach(e -> s.append(' ').append(e.event().seq()));
        s.append("""
                ; do
                    grep -q "\\"seq\\":$seq}\\$" "events/$seq.json" || fail "events/$seq.json does not name itself event $seq"
                    included "events/$seq.json" "proofs/$seq.txt" || fail "events/$seq.json is not in the signed tree"
                done
                ok "%d events are in the signed tree (the SHA-256 of each file is that event's hash in the chain)"

                # 4. Each record file is exactly the "after" of the event that recorded it.
                """.formatted(b.events().size()));
        recordEvents.forEach((path, seq) -> s.append("grep -qF -f <(printf '\"after\":'; cat ").append(path)
                .append("; printf ',\"before\":') events/").append(seq).append(".json || fail \"").append(path)
                .append(" is not the state recorded by event ").append(seq).append("\"\n"));
        s.append("ok \"").append(recordEvents.size()).append(" records are the states the ledger recorded\"\n\n");

        s.append("# 5. Each raw curve has the fingerprint and size recorded on upload; its analyses name it.\n");
        for (CurveFile c : curves) {
            String rec = "records/" + TraceService.RAW_CURVE + "-" + c.rawCurveId() + ".json";
            s.append("sha=$(sha256sum < ").append(c.path()).append(" | cut -c1-64)\n");
            s.append("grep -qF \"\\\"sha256\\\":\\\"$sha\\\"\" ").append(rec).append(" || fail \"").append(c.path())
                    .append(" does not have the SHA-256 recorded in ").append(rec).append("\"\n");
            s.append("grep -qF \"\\\"sizeBytes\\\":$(wc -c < ").append(c.path()).append("),\" ").append(rec)
                    .append(" || fail \"").append(c.path()).append(" does not have the size recorded in ").append(rec)
                    .append("\"\n");
            for (UUID a : c.analysisIds()) {
                String arec = "records/" + TraceService.ANALYSIS + "-" + a + ".json";
                s.append("grep -qF \"\\\"inputSha256\\\":\\\"$sha\\\"\" ").append(arec).append(" || fail \"")
                        .append(arec).append(" does not name the fingerprint of ").append(c.path()).append("\"\n");
            }
        }
        s.append("ok \"").append(curves.size()).append(" raw curve files match the ledger\"\n\n");

        s.append("# 6. The references between the records (analysis -> test run and curve, test run -> specimen,\n")
                .append("#    specimen -> heat, analysis -> calibrations, calibration -> instrument).\n");
        for (Link l : links) {
            s.append("grep -qF '\"").append(l.key()).append("\":\"").append(l.value()).append("\"' ")
                    .append(l.recordPath()).append(" || fail \"").append(l.recordPath()).append(" does not name ")
                    .append(l.key()).append(' ').append(l.value()).append("\"\n");
        }
        s.append("ok \"").append(links.size()).append(" references hold\"\n\n");

        if (documentPath != null && b.root() != null && b.root().issueEventSeq() != null) {
            s.append("# 7. The document is the one whose SHA-256 the issue event recorded.\n");
            s.append("grep -qF \"$(sha256sum < ").append(documentPath).append(" | cut -c1-64)\" events/")
                    .append(b.root().issueEventSeq()).append(".json || fail \"").append(documentPath)
                    .append(" is not the document recorded by event ").append(b.root().issueEventSeq()).append("\"\n");
            s.append("ok \"").append(documentPath).append(" is the issued document\"\n\n");
        }
        s.append("echo \"ALL CHECKS PASSED\"\n");
        return s.toString();
    }
}
