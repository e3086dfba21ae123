/**
 * Conformity of reported tensile results with a material specification under a stated decision rule
 * (ILAC-G8:09/2019); pure JDK code with exact decimal comparisons.
 */
package org.specimenledger.analysis.conformity;
