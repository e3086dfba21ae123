/** Heats (casts): the producer's heat number, grade, product form, nominal size and chemical composition. */
package org.specimenledger.heats;
