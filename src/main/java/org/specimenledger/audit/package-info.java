/**
 * The ledger: one hash-chained, append-only sequence of audit events, written in the same transaction
 * as the change it records, and the queries over it.
 */
package org.specimenledger.audit;
