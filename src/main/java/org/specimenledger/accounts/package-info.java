/** People who sign in: accounts, their roles, password hashing and the lookup Spring Security uses. */
package org.specimenledger.accounts;
