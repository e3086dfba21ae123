/**
 * Inspection certificates 3.1 (EN 10204): drafts built from the valid test runs' current analyses, conformity
 * lines under a stated decision rule, issue with a re-entered password as the signature, gap-free numbering,
 * the stored PDF and its SHA-256, revision, withdrawal and anonymous verification.
 */
package org.specimenledger.certificates;
