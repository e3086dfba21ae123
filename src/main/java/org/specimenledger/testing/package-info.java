/**
 * Tensile tests as the laboratory runs them: the adapter between stored records and the pure
 * {@code curve} and {@code analysis} core, starting with the stateless analysis preview.
 */
package org.specimenledger.testing;
