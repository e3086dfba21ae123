package org.specimenledger.web;

import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.testing.ControlMethod;
import org.specimenledger.testing.TestMode;
import org.specimenledger.testing.TestRunRequests;
import org.specimenledger.testing.TestStandard;

/** The test registration form as typed; {@link #toRequest(List)} builds the feature's request. */
final class TestRunForm {

    private String specimenId = "";
    private String machineId = "";
    private String forceTransducerId = "";
    private String forceRangeN = "";
    private String extensometerId = "";
    private String testedAt = "";
    private String temperatureC = "23";
    private String standard = "ISO_6892_1";
    private String method = "B";
    private String standardReference = "";
    private String mode = "TENSILE";
    private String reportedProperties = "";
    private String remarks = "";
    private String calibrationOverrideReason = "";
    private String retestReason = "";

    TestRunRequests.TestRunRequest toRequest(List<FieldIssue> problems) {
        OffsetDateTime at = null;
        if (FormValues.text(testedAt) != null) {
            try {
                at = OffsetDateTime.parse(testedAt.trim());
            } catch (DateTimeParseException e) {
                problems.add(new FieldIssue("/testedAt",
                        "write date, time and offset, e.g. 2026-11-20T09:30:00+01:00"));
            }
        }
        List<String> properties = null;
        if (FormValues.text(reportedProperties) != null) {
            properties = new ArrayList<>(List.of(reportedProperties.trim().split("[\\s,;]+")));
        }
        TestStandard std = FormValues.enumOf(TestStandard.class, standard, "/standard", problems);
        return new TestRunRequests.TestRunRequest(
                FormValues.uuid(specimenId, "/specimenId", problems),
                FormValues.uuid(machineId, "/machineId", problems),
                FormValues.uuid(forceTransducerId, "/forceTransducerId", problems),
                FormValues.number(forceRangeN, "/forceRangeN", problems),
                FormValues.uuid(extensometerId, "/extensometerId", problems),
                null, at, FormValues.number(temperatureC, "/temperatureC", problems), std,
                std == TestStandard.ISO_6892_1 ? FormValues.enumOf(ControlMethod.class, method, "/method", problems) : null,
                FormValues.text(standardReference), null, null, null,
                FormValues.enumOf(TestMode.class, mode, "/mode", problems), FormValues.text(remarks), properties,
                FormValues.text(calibrationOverrideReason), FormValues.text(retestReason));
    }

    public String getSpecimenId() { return specimenId; }
    public void setSpecimenId(String v) { specimenId = v; }
    public String getMachineId() { return machineId; }
    public void setMachineId(String v) { machineId = v; }
    public String getForceTransducerId() { return forceTransducerId; }
    public void setForceTransducerId(String v) { forceTransducerId = v; }
    public String getForceRangeN() { return forceRangeN; }
    public void setForceRangeN(String v) { forceRangeN = v; }
    public String getExtensometerId() { return extensometerId; }
    public void setExtensometerId(String v) { extensometerId = v; }
    public String getTestedAt() { return testedAt; }
    public void setTestedAt(String v) { testedAt = v; }
    public String getTemperatureC() { return temperatureC; }
    public void setTemperatureC(String v) { temperatureC = v; }
    public String getStandard() { return standard; }
    public void setStandard(String v) { standard = v; }
    public String getMethod() { return method; }
    public void setMethod(String v) { method = v; }
    public String getStandardReference() { return standardReference; }
    public void setStandardReference(String v) { standardReference = v; }
    public String getMode() { return mode; }
    public void setMode(String v) { mode = v; }
    public String getReportedProperties() { return reportedProperties; }
    public void setReportedProperties(String v) { reportedProperties = v; }
    public String getRemarks() { return remarks; }
    public void setRemarks(String v) { remarks = v; }
    public String getCalibrationOverrideReason() { return calibrationOverrideReason; }
    public void setCalibrationOverrideReason(String v) { calibrationOverrideReason = v; }
    public String getRetestReason() { return retestReason; }
    public void setRetestReason(String v) { retestReason = v; }
}
