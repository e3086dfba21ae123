/**
 * Trace and proof: from an analysis run (and, once certificates exist, from a certificate line) to
 * everything its numbers rest on, with the ledger events of every record, and the audit bundle that lets
 * an auditor check it with standard tools alone.
 */
package org.specimenledger.trace;
