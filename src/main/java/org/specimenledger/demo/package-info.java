/** An invented sample laboratory, seeded on the first start of the embedded mode so the service can be tried at once. */
package org.specimenledger.demo;
