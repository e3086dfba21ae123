package org.specimenledger.equipment;

import java.time.Period;
import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.boot.context.properties.bind.DefaultValue;

/**
 * Settings of the equipment register.
 *
 * @param maxCalibrationInterval the longest allowed span from calibration to due date; default 12
 *                               months (re-verification at most every 12 months [from memory]; ASTM E4
 *                               asks for annual verification)
 * @param dueSoonWithin          a calibration due within this span from today is reported as
 *                               {@code DUE_SOON}; default 30 days (laboratory common practice)
 */
@ConfigurationProperties("ledger.equipment")
record EquipmentSettings(
        @DefaultValue("P12M") Period maxCalibrationInterval,
        @DefaultValue("P30D") Period dueSoonWithin) {
}
