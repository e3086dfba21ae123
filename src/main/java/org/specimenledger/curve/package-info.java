/**
 * Reading raw tensile test curves: turns the bytes of an uploaded force–extension file into canonical
 * arrays (N, mm, s) with the SHA-256 of the exact bytes, or rejects the file naming line and column.
 *
 * <p>Pure computation core: only the JDK and fastdoubleparser; no framework, clock, randomness or
 * I/O beyond the {@link java.io.InputStream} handed to {@link org.specimenledger.curve.CurveReader}.
 */
package org.specimenledger.curve;
