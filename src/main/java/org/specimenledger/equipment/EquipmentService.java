package org.specimenledger.equipment;

import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.UUID;
import java.util.stream.Collectors;
import org.specimenledger.audit.Ledger;
import org.specimenledger.shared.ChangeReason;
import org.specimenledger.shared.DuplicateRecord;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.RuleViolation;
import org.specimenledger.shared.StateConflict;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Registers, changes and retires instruments and records and withdraws their calibrations; each write
 * is one ledger event in the same transaction.
 */
@Service
public class EquipmentService {

    private final InstrumentRepository instruments;
    private final CalibrationRepository calibrations;
    private final EquipmentSettings settings;
    private final Ledger ledger;
    private final Clock clock;

    EquipmentService(InstrumentRepository instruments, CalibrationRepository calibrations, EquipmentSettings settings,
            Ledger ledger, Clock clock) {
        this.instruments = instruments;
        this.calibrations = calibrations;
        this.settings = settings;
        this.ledger = ledger;
        this.clock = clock;
    }

    /** Registers an instrument; its asset identifier must be unique in the laboratory, whatever its case. */
    @Transactional
    public EquipmentView register(EquipmentRequests.InstrumentRequest request) {
        List<ForceRange> ranges = InstrumentRules.checked(request, this::kindOf);
        String assetId = request.assetId().trim();
        if (instruments.existsByAssetIdIgnoreCase(assetId)) {
            throw new DuplicateRecord("/assetId", "an instrument with asset identifier '" + assetId
                    + "' already exists");
        }
        Instrument instrument = new Instrument(request.kind(), now());
        apply(instrument, request, assetId, ranges);
        instruments.saveAndFlush(instrument);
        EquipmentView view = view(instrument);
        ledger.record("equipment.registered", "equipment", instrument.id(), request.reason(), null, view);
        return view;
    }

    /**
     * Changes an instrument's description and data (reason required). Its kind cannot change; force
     * ranges may be added, but a range a calibration refers to may be neither removed nor altered.
     */
    @Transactional
    EquipmentView change(UUID id, EquipmentRequests.InstrumentRequest request) {
        String reason = ChangeReason.required(request.reason());
        Instrument instrument = found(id);
        if (request.kind() != instrument.kind()) {
            throw new RuleViolation("/kind", "the kind of an instrument cannot change: " + instrument.assetId()
                    + " is a " + instrument.kind());
        }
        List<ForceRange> ranges = InstrumentRules.checked(request, this::kindOf);
        String assetId = request.assetId().trim();
        if (instruments.existsByAssetIdIgnoreCaseAndIdNot(assetId, id)) {
            throw new DuplicateRecord("/assetId", "an instrument with asset identifier '" + assetId
                    + "' already exists");
        }
        keepReferencedRanges(instrument, ranges);
        EquipmentView before = view(instrument);
        apply(instrument, request, assetId, ranges);
        instruments.saveAndFlush(instrument);
        EquipmentView after = view(instrument);
        ledger.record("equipment.changed", "equipment", id, reason, before, after);
        return after;
    }

    /** Retires an instrument from a date on (reason required); it stays in the register. */
    @Transactional
    EquipmentView retire(UUID id, EquipmentRequests.RetirementRequest request) {
        String reason = ChangeReason.required(request.reason());
        Instrument instrument = found(id);
        EquipmentView before = view(instrument);
        instrument.retire(request.retiredOn(), reason);
        instruments.saveAndFlush(instrument);
        EquipmentView after = view(instrument);
        ledger.record("equipment.retired", "equipment", id, reason, before, after);
        return after;
    }

    @Transactional(readOnly = true)
    List<EquipmentView> list(InstrumentKind kind) {
        List<Instrument> found = kind == null ? instruments.findAllByOrderByAssetIdAsc()
                : instruments.findAllByKindOrderByAssetIdAsc(kind);
        Map<UUID, List<CalibrationView>> byInstrument = calibrations
                .findAllByInstrumentIdIn(found.stream().map(Instrument::id).toList()).stream()
                .map(CalibrationView::of)
                .collect(Collectors.groupingBy(CalibrationView::equipmentId));
        LocalDate today = today();
        return found.stream()
                .map(i -> EquipmentView.of(i, byInstrument.getOrDefault(i.id(), List.of()), today,
                        settings.dueSoonWithin()))
                .toList();
    }

    @Transactional(readOnly = true)
    EquipmentView get(UUID id) {
        return view(found(id));
    }

    /**
     * Records a calibration of an instrument as its certificate states it. A retired instrument takes
     * only calibrations made before its retirement (history entered late).
     */
    @Transactional
    public CalibrationView recordCalibration(UUID instrumentId, EquipmentRequests.CalibrationRequest request) {
        Instrument instrument = found(instrumentId);
        CalibrationRules.Checked checked = CalibrationRules.checked(instrument.id(), instrument.kind(),
                instrument.forceRanges(), request, today(), settings.maxCalibrationInterval());
        if (instrument.retiredOn() != null && !request.calibratedOn().isBefore(instrument.retiredOn())) {
            throw new StateConflict("instrument " + instrument.assetId() + " was retired on " + instrument.retiredOn()
                    + "; it cannot take a calibration made on " + request.calibratedOn());
        }
        String reference = request.certificateReference().trim();
        if (calibrations.existsByInstrumentIdAndCertificateReferenceIgnoreCaseAndWithdrawnAtIsNull(instrumentId,
                reference)) {
            throw new DuplicateRecord("/certificateReference", "instrument " + instrument.assetId()
                    + " already has a calibration with certificate reference '" + reference + "'");
        }
        Calibration calibration = calibrations.saveAndFlush(new Calibration(instrumentId, request.calibratedOn(),
                request.dueOn(), request.calibratingBody().trim(), reference, checked.accuracyClass(),
                checked.rangeClasses(), now()));
        CalibrationView view = CalibrationView.of(calibration);
        ledger.record("calibration.recorded", "calibration", calibration.id(), request.reason(), null, view);
        return view;
    }

    /** Takes a wrong calibration record out of force (reason required); it stays in the history. */
    @Transactional
    CalibrationView withdrawCalibration(UUID instrumentId, UUID calibrationId,
            EquipmentRequests.WithdrawalRequest request) {
        String reason = ChangeReason.required(request.reason());
        found(instrumentId);
        Calibration calibration = calibrations.findByIdAndInstrumentId(calibrationId, instrumentId)
                .orElseThrow(() -> new RecordNotFound("calibration", calibrationId));
        CalibrationView before = CalibrationView.of(calibration);
        calibration.withdraw(reason, now());
        calibrations.saveAndFlush(calibration);
        CalibrationView after = CalibrationView.of(calibration);
        ledger.record("calibration.withdrawn", "calibration", calibrationId, reason, before, after);
        return after;
    }

    /** All calibration records of an instrument, withdrawn ones included, oldest calibration first. */
    @Transactional(readOnly = true)
    List<CalibrationView> calibrations(UUID instrumentId) {
        found(instrumentId);
        return calibrationsOf(instrumentId);
    }

    @Transactional(readOnly = true)
    CalibrationOnDate calibrationOn(UUID instrumentId, LocalDate date) {
        Instrument instrument = found(instrumentId);
        return CalibrationTimeline.on(date, calibrationsOf(instrumentId), instrument.retiredOn());
    }

    @Transactional(readOnly = true)
    Optional<EquipmentView> find(UUID id) {
        return id == null ? Optional.empty() : instruments.findById(id).map(this::view);
    }

    private void keepReferencedRanges(Instrument instrument, List<ForceRange> wanted) {
        List<Calibration> history = calibrations.findAllByInstrumentIdOrderByCalibratedOnAscRecordedAtAsc(
                instrument.id());
        for (ForceRange have : instrument.forceRanges()) {
            Optional<Calibration> referring = history.stream()
                    .filter(c -> c.rangeClasses().stream().anyMatch(rc -> have.hasUpperLimit(rc.rangeN())))
                    .findFirst();
            if (referring.isEmpty()) {
                continue;
            }
            Optional<ForceRange> kept = wanted.stream().filter(w -> w.hasUpperLimit(have.upperLimitN())).findFirst();
            String name = "force range " + have.upperLimitN().toPlainString() + " N";
            if (kept.isEmpty()) {
                throw new StateConflict(name + " of " + instrument.assetId() + " is referred to by calibration "
                        + referring.get().certificateReference() + " and cannot be removed");
            }
            if (!kept.get().sameLimitsAs(have)) {
                throw new StateConflict(name + " of " + instrument.assetId() + " is referred to by calibration "
                        + referring.get().certificateReference() + "; its lower limit "
                        + have.lowerLimitN().toPlainString() + " N cannot change");
            }
        }
    }

    private static void apply(Instrument instrument, EquipmentRequests.InstrumentRequest r, String assetId,
            List<ForceRange> ranges) {
        instrument.describe(assetId, r.description().trim(), trimmed(r.maker()), trimmed(r.model()),
                trimmed(r.serialNumber()), trimmed(r.location()));
        instrument.setForceRanges(ranges);
        instrument.setExtensometerData(r.gaugeLengthMm(), r.travelMm());
        instrument.setBuiltInTransducers(r.builtInTransducerIds() == null ? List.of() : r.builtInTransducerIds());
    }

    private Optional<InstrumentKind> kindOf(UUID id) {
        return instruments.findById(id).map(Instrument::kind);
    }

    private Instrument found(UUID id) {
        return instruments.findById(id).orElseThrow(() -> new RecordNotFound("equipment", id));
    }

    private EquipmentView view(Instrument instrument) {
        return EquipmentView.of(instrument, calibrationsOf(instrument.id()), today(), settings.dueSoonWithin());
    }

    private List<CalibrationView> calibrationsOf(UUID instrumentId) {
        return calibrations.findAllByInstrumentIdOrderByCalibratedOnAscRecordedAtAsc(instrumentId).stream()
                .map(CalibrationView::of).toList();
    }

    private LocalDate today() {
        return LocalDate.now(clock);
    }

    /** Microseconds, as PostgreSQL keeps them, so the view recorded now equals the one read back later. */
    private Instant now() {
        return clock.instant().truncatedTo(ChronoUnit.MICROS);
    }

    private static String trimmed(String s) {
        return s == null || s.isBlank() ? null : s.trim();
    }
}
