package org.specimenledger.heats;

/** The form of the product a heat was delivered as; it decides which test pieces can be taken from it. */
public enum ProductForm {
    PLATE,
    BAR,
    TUBE,
    SHEET,
    WIRE,
    CASTING,
    OTHER
}
