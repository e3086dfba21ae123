/**
 * Printing stored SI results in the units an order asks for: SI, US customary (ksi, lbf, in) or both.
 * Stored values stay SI; conversion happens only when a value is turned into its reported string, in
 * decimal arithmetic from the exact defining factors, and the rounding increment is chosen in the
 * printed unit (a rounded MPa value is never converted). JDK only.
 */
package org.specimenledger.analysis.units;
