/**
 * Server-rendered pages for people (sign-in, start pages, the laboratory workbench, equipment), with
 * their own session-based security chain; they call the same feature services as the API.
 */
package org.specimenledger.web;
