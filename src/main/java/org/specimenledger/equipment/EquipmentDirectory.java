package org.specimenledger.equipment;

import java.util.List;
import java.time.LocalDate;
import java.util.Optional;
import java.util.UUID;
import org.specimenledger.shared.RecordNotFound;
import org.springframework.stereotype.Component;

/**
 * What other features may ask of the equipment register, by identifier — above all whether an
 * instrument was calibrated on the day of a test (a test on equipment whose calibration was not valid
 * on the test date is not a valid test, laboratory common practice).
 */
@Component
public class EquipmentDirectory {

    private final EquipmentService service;

    EquipmentDirectory(EquipmentService service) {
        this.service = service;
    }

    /** The instrument with its calibration standing today, if it exists. */
    public Optional<EquipmentView> find(UUID id) {
        return service.find(id);
    }

    /**
     * Which calibration governed the instrument on {@code date} and whether it was valid then (see
     * {@link CalibrationOnDate}).
     *
     * @throws RecordNotFound when no instrument has this id; a feature checking an id from a request body
     *                        should ask {@link #find(UUID)} first and report its own 422
     */
    public CalibrationOnDate calibrationOn(UUID equipmentId, LocalDate date) {
        return service.calibrationOn(equipmentId, date);
    }

    /** Every instrument with its calibration standing today. */
    public List<EquipmentView> all() {
        return service.list(null);
    }
}
