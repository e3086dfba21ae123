/** Specimens (test pieces): identity, heat and order, measured geometry with S0 and L0, and after-fracture measurements. */
package org.specimenledger.specimens;
