/** Customers (the organisations the laboratory tests for), their orders and the orders' requirements. */
package org.specimenledger.customers;
