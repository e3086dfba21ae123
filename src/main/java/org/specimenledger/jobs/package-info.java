/** Background jobs: bulk work run on a bounded executor, with its state and progress kept in PostgreSQL. */
package org.specimenledger.jobs;
