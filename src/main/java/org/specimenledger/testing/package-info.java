/**
 * Tensile tests as the laboratory runs them: test runs through the calibration gate, their raw curves kept
 * byte for byte, the analysis runs computed from them and their replay, and the stateless analysis preview.
 */
package org.specimenledger.testing;
