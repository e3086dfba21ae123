/** The service's plumbing: database start-up, security, problem responses and build identity. */
package org.specimenledger.system;
