/**
 * Pure computation core that recomputes tensile properties (ISO 6892-1 symbols) and cyclic
 * loading–unloading energies from raw force–extension arrays, with evidence, rounding and
 * uncertainty; JDK only, no clock, logging, randomness or I/O.
 */
package org.specimenledger.analysis;
