package org.specimenledger.demo;

import java.math.BigDecimal;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.specimenledger.equipment.EquipmentRequests.CalibrationRequest;
import org.specimenledger.equipment.EquipmentRequests.ForceRangeRequest;
import org.specimenledger.equipment.EquipmentRequests.InstrumentRequest;
import org.specimenledger.equipment.EquipmentRequests.RangeClassRequest;
import org.specimenledger.equipment.EquipmentService;
import org.specimenledger.equipment.InstrumentKind;
import org.specimenledger.heats.HeatRequests.HeatRequest;
import org.specimenledger.heats.HeatService;
import org.specimenledger.heats.ProductForm;
import org.specimenledger.specimens.GaugeLength;
import org.specimenledger.specimens.Orientation;
import org.specimenledger.specimens.SpecimenRequests.AfterFractureRequest;
import org.specimenledger.specimens.SpecimenRequests.GaugeLengthRequest;
import org.specimenledger.specimens.SpecimenRequests.SpecimenRequest;
import org.specimenledger.specimens.SpecimenService;
import org.specimenledger.specimens.SpecimenShape;
import org.specimenledger.specimens.SpecimenView;
import org.specimenledger.testing.ControlMethod;
import org.specimenledger.testing.CurveIntake;
import org.specimenledger.testing.TestMode;
import org.specimenledger.testing.TestRunRequests.TestRunRequest;
import org.specimenledger.testing.TestRunService;
import org.specimenledger.testing.TestStandard;
import org.springframework.stereotype.Component;

/**
 * The demo laboratory's bench and its first week of tests: two frames with their load cells, four
 * extensometers (one a spare whose calibration has run out), heats and one specimen of each shape, and a test
 * run of each kind with its generated curve, so the first start already shows computed results, flags and a
 * retest. All names and numbers are invented.
 */
@Component
class DemoTestRuns {

    /** The demo orders the pieces belong to. */
    record Orders(UUID structuralSteel, UUID alloyPins, UUID aluminium, UUID castBrackets, UUID sealStrip) {
    }

    private static final LocalDate CALIBRATED = LocalDate.of(2026, 6, 15);
    private static final LocalDate DUE = LocalDate.of(2027, 6, 14);
    private static final String CALIBRATOR = "Harrowgate Metrology Services (demo)";
    private static final String OPERATOR = "demo-technician";

    private final HeatService heats;
    private final SpecimenService specimens;
    private final EquipmentService equipment;
    private final TestRunService runs;
    private final CurveIntake intake;

    DemoTestRuns(HeatService heats, SpecimenService specimens, EquipmentService equipment, TestRunService runs,
            CurveIntake intake) {
        this.heats = heats;
        this.specimens = specimens;
        this.equipment = equipment;
        this.runs = runs;
        this.intake = intake;
    }

    /** The demo specimens that were pulled in tension, for the demo certificates. */
    record Tested(UUID structuralSteel, UUID alloyPins, UUID aluminium, UUID castBrackets) {
    }

    Tested seed(Orders orders) {
        // the bench
        UUID bigCell = instrument("LC-01", InstrumentKind.FORCE_TRANSDUCER, "Load cell of the 250 kN frame",
                List.of(range("10000"), range("100000"), range("250000")), null, null, null);
        calibrate(bigCell, "HMS-26-0611", null, List.of(rangeClass("10000", "1"), rangeClass("100000", "0.5"),
                rangeClass("250000", "0.5")));
        UUID bigFrame = instrument("TM-01", InstrumentKind.TESTING_MACHINE, "Electromechanical frame, 250 kN",
                null, null, null, List.of(bigCell));
        calibrate(bigFrame, "HMS-26-0610", "0.5", null);
        UUID smallCell = instrument("LC-02", InstrumentKind.FORCE_TRANSDUCER, "Load cell of the 5 kN table frame",
                List.of(range("500"), range("5000")), null, null, null);
        calibrate(smallCell, "HMS-26-0613", null, List.of(rangeClass("500", "1"), rangeClass("5000", "1")));
        UUID smallFrame = instrument("TM-02", InstrumentKind.TESTING_MACHINE, "Table-top frame, 5 kN, for polymers",
                null, null, null, List.of(smallCell));
        calibrate(smallFrame, "HMS-26-0612", null, null);
        UUID clip50 = instrument("EXT-01", InstrumentKind.EXTENSOMETER, "Clip-on extensometer, 50 mm", null,
                new BigDecimal("50"), new BigDecimal("10"), null);
        calibrate(clip50, "HMS-26-0614", "1", null);
        UUID clip25 = instrument("EXT-02", InstrumentKind.EXTENSOMETER, "Clip-on extensometer, 25 mm", null,
                new BigDecimal("25"), new BigDecimal("5"), null);
        calibrate(clip25, "HMS-26-0615", "1", null);
        UUID longTravel = instrument("EXT-03", InstrumentKind.EXTENSOMETER,
                "Long-travel extensometer, 50 mm, for elastomers", null, new BigDecimal("50"), new BigDecimal("600"),
                null);
        calibrate(longTravel, "HMS-26-0616", "2", null);
        // the spare, its calibration run out in the spring: choosing it for a test is refused by the gate
        UUID spare = instrument("EXT-07", InstrumentKind.EXTENSOMETER, "Spare clip-on extensometer, 50 mm", null,
                new BigDecimal("50"), new BigDecimal("10"), null);
        equipment.recordCalibration(spare, new CalibrationRequest(LocalDate.of(2025, 4, 2), LocalDate.of(2026, 4, 1),
                CALIBRATOR, "HMS-25-0388", "1", null, null));

        // heats and pieces
        UUID plate = heat("E24-3381", "Eastmoor Steelworks (demo)", "S355J2+N", ProductForm.PLATE, "12",
                Map.of("C", "0.16", "Si", "0.24", "Mn", "1.42", "P", "0.014", "S", "0.006"));
        UUID bar = heat("K24-1175", "Kestrel Forge (demo)", "42CrMo4+QT", ProductForm.BAR, "40",
                Map.of("C", "0.41", "Si", "0.22", "Mn", "0.78", "Cr", "1.05", "Mo", "0.21"));
        UUID extrusion = heat("A24-0902", "Alder Valley Extrusions, press 2 (demo)", "6082-T6", ProductForm.TUBE, "2",
                Map.of("Mg", "0.82", "Si", "1.02", "Mn", "0.55", "Fe", "0.31"));
        UUID casting = heat("C24-0147", "Northgate Foundry (demo)", "EN-GJL-250", ProductForm.CASTING, "30",
                Map.of("C", "3.25", "Si", "1.95", "Mn", "0.62"));
        UUID compound = heat("R24-0917", "Moorside Compounds (demo)", "EPDM 70 Shore A, batch compound",
                ProductForm.OTHER, "2", null);

        SpecimenView flat = specimen("DL-26-0112-A", plate, orders.structuralSteel(), SpecimenShape.FLAT,
                Map.of("a", List.of("12.08", "12.10"), "b", List.of("25.02", "25.00", "25.04")), null, null,
                proportional(), "50", "125", "plate edge, quarter width");
        specimens.recordAfterFracture(flat.id(), new AfterFractureRequest(new BigDecimal("123.5"),
                Map.of("au", List.of(decimal("7.92"), decimal("7.96")), "bu", List.of(decimal("19.8"))), null, null,
                new BigDecimal("38"), null, null));
        SpecimenView round = specimen("DL-26-0118-A", bar, orders.alloyPins(), SpecimenShape.ROUND,
                Map.of("d", List.of("10.00", "10.01", "9.99")), null, null, proportional(), "50", "60",
                "mid-radius");
        SpecimenView tube = specimen("DL-26-0121-A", extrusion, orders.aluminium(), SpecimenShape.TUBE,
                Map.of("a", List.of("2.00", "2.01", "1.99"), "D", List.of("20.02", "19.98")), null, null,
                proportional(), "50", "80", "full section, profile end");
        specimens.recordAfterFracture(tube.id(), new AfterFractureRequest(new BigDecimal("66.6"),
                Map.of("au", List.of(decimal("1.86")), "Du", List.of(decimal("19.31"))), null, null,
                new BigDecimal("12"), null, null));
        SpecimenView cast = specimen("DL-26-0124-A", casting, orders.castBrackets(), SpecimenShape.OTHER, null,
                "48.6", "from mass, length and density of the machined piece (irregular section)", proportional(), "25",
                "45", "bracket web");
        SpecimenView strip = specimen("DL-26-0126-A", compound, orders.sealStrip(), SpecimenShape.FLAT,
                Map.of("a", List.of("2.00", "2.02"), "b", List.of("25.0")), null, null,
                new GaugeLengthRequest(GaugeLength.Basis.FIXED, null, null, new BigDecimal("50")), "50", "60",
                "strip cut along the extrusion direction");

        // the runs: one of each kind, and a retest
        upload(run(flat, bigFrame, bigCell, "250000", clip50, at(19, 9, 10), "21.4", TestStandard.ISO_6892_1,
                ControlMethod.A1, TestMode.TENSILE, null), DemoCurves.structuralSteel(area(flat), le(flat), flat.labIdentifier()));
        upload(run(round, bigFrame, bigCell, "100000", clip50, at(20, 11, 0), "22.0", TestStandard.ISO_6892_1,
                ControlMethod.A2, TestMode.TENSILE, null), DemoCurves.alloySteel(area(round), le(round), round.labIdentifier()));
        // the first pull of the tube is repeated; the retest invalidates it with its reason
        run(tube, bigFrame, bigCell, "100000", clip50, at(23, 14, 5), "21.8", TestStandard.ISO_6892_1,
                ControlMethod.A1, TestMode.TENSILE, null);
        UUID retest = run(tube, bigFrame, bigCell, "100000", clip50, at(23, 15, 20), "21.9", TestStandard.ISO_6892_1,
                ControlMethod.A1, TestMode.TENSILE, "the extensometer knife edge slipped at about 0.4 % strain; the "
                        + "piece was unloaded undamaged and pulled again");
        upload(retest, DemoCurves.aluminiumAlloy(area(tube), le(tube), tube.labIdentifier()));
        upload(run(cast, bigFrame, bigCell, "10000", clip25, at(24, 10, 30), "21.1", TestStandard.ISO_6892_1,
                ControlMethod.A1, TestMode.TENSILE, null), DemoCurves.brittleCast(area(cast), le(cast), cast.labIdentifier()));
        upload(run(strip, smallFrame, smallCell, "500", longTravel, at(26, 13, 45), "23.0", TestStandard.ISO_37,
                null, TestMode.CYCLIC, null), DemoCurves.elastomerCycles(area(strip), le(strip), strip.labIdentifier()));
        return new Tested(flat.id(), round.id(), tube.id(), cast.id());
    }

    private UUID run(SpecimenView s, UUID machine, UUID cell, String rangeN, UUID extensometer, OffsetDateTime at,
            String temperature, TestStandard standard, ControlMethod method, TestMode mode, String retestReason) {
        boolean methodA = method != null && method != ControlMethod.B;
        return runs.register(new TestRunRequest(s.id(), machine, cell, new BigDecimal(rangeN), extensometer, OPERATOR,
                at, new BigDecimal(temperature), standard, method, standard == TestStandard.ISO_37 ? "ISO 37:2017"
                        : "ISO 6892-1:2019", methodA ? new BigDecimal("0.00025") : null, null,
                mode == TestMode.CYCLIC ? new BigDecimal("500") : null, mode,
                mode == TestMode.CYCLIC ? "three loading–unloading cycles to 100 % strain" : null, null, null,
                retestReason)).id();
    }

    private void upload(UUID run, byte[] curve) {
        intake.receive(run, curve, "text/csv", "run-" + run.toString().substring(0, 8) + ".csv");
    }

    private UUID instrument(String asset, InstrumentKind kind, String description, List<ForceRangeRequest> ranges,
            BigDecimal gauge, BigDecimal travel, List<UUID> transducers) {
        return equipment.register(new InstrumentRequest(asset, kind, description, null, null, "DEMO-" + asset,
                "Hall A (demo)", ranges, gauge, travel, transducers, null)).id();
    }

    private void calibrate(UUID instrument, String reference, String cls, List<RangeClassRequest> classes) {
        equipment.recordCalibration(instrument, new CalibrationRequest(CALIBRATED, DUE, CALIBRATOR, reference, cls,
                classes, null));
    }

    private UUID heat(String number, String producer, String grade, ProductForm form, String thickness,
            Map<String, String> composition) {
        Map<String, BigDecimal> c = composition == null ? null : composition.entrySet().stream()
                .collect(java.util.stream.Collectors.toMap(Map.Entry::getKey, e -> decimal(e.getValue())));
        return heats.register(new HeatRequest(number, producer, grade, form, decimal(thickness), c, null)).id();
    }

    private SpecimenView specimen(String mark, UUID heat, UUID order, SpecimenShape shape,
            Map<String, List<String>> readings, String s0, String s0Method, GaugeLengthRequest gauge, String le,
            String lc, String position) {
        Map<String, List<BigDecimal>> r = readings == null ? null : readings.entrySet().stream()
                .collect(java.util.stream.Collectors.toMap(Map.Entry::getKey,
                        e -> e.getValue().stream().map(DemoTestRuns::decimal).toList()));
        return specimens.register(new SpecimenRequest(mark, heat, order, Orientation.LONGITUDINAL, position, shape, r,
                s0 == null ? null : decimal(s0), s0Method, gauge, decimal(le), decimal(lc), null));
    }

    private static GaugeLengthRequest proportional() {
        return new GaugeLengthRequest(GaugeLength.Basis.PROPORTIONAL, new BigDecimal("5.65"), true, null);
    }

    private static ForceRangeRequest range(String upper) {
        return new ForceRangeRequest(new BigDecimal(upper), null);
    }

    private static RangeClassRequest rangeClass(String rangeN, String cls) {
        return new RangeClassRequest(new BigDecimal(rangeN), cls);
    }

    private static OffsetDateTime at(int dayOfNovember, int hour, int minute) {
        return OffsetDateTime.of(2026, 11, dayOfNovember, hour, minute, 0, 0, ZoneOffset.ofHours(1));
    }

    private static double area(SpecimenView s) {
        return s.s0Mm2().doubleValue();
    }

    private static double le(SpecimenView s) {
        return s.leMm().doubleValue();
    }

    private static BigDecimal decimal(String v) {
        return new BigDecimal(v);
    }
}
