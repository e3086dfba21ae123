/**
 * The printed inspection certificate: an immutable tree of everything shown on it and its rendering
 * to an archivable PDF with JasperReports templates from {@code report-templates/}.
 */
package org.specimenledger.certificates.document;
