/** The laboratory's instruments (testing machines, force transducers, extensometers) and their calibration records. */
package org.specimenledger.equipment;
