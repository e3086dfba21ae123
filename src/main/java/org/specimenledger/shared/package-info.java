/** Small types every feature shares: the named failures that become problem responses. */
package org.specimenledger.shared;
