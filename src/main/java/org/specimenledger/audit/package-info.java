/**
 * The ledger: one hash-chained, append-only sequence of audit events, written in the same transaction
 * as the change it records, with its Merkle tree, signed checkpoints, proofs, verification and search.
 */
package org.specimenledger.audit;
