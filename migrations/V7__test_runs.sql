-- Test runs, their raw curves and the analysis runs computed from them.
--
-- A test run records how one specimen was pulled: machine, force transducer and the range used,
-- extensometer, operator, date and time, temperature, standard and method, rates, mode. Its calibration
-- references point at the calibration records that governed each instrument on the test date. A specimen
-- may have several runs (retests); at most one is the valid one at any time.
--
-- The raw curve is the file exactly as the testing machine wrote it, with its SHA-256; the analysis run is
-- the computation from those bytes, with the software, method, parameters and snapshots that produced it.
-- Both are append-only, enforced here by triggers. The only thing that changes on a test run after
-- registration is its validity and its pointer to the current analysis (each change is in the ledger).

CREATE TABLE test_run (
    id                           uuid         PRIMARY KEY,
    specimen_id                  uuid         NOT NULL REFERENCES specimen (id),
    machine_id                   uuid         NOT NULL REFERENCES instrument (id),
    force_transducer_id          uuid         NOT NULL REFERENCES instrument (id),
    -- the range used, named by its upper limit in N: one of the transducer's ranges
    force_range_n                numeric      NOT NULL,
    extensometer_id              uuid         NOT NULL REFERENCES instrument (id),
    -- the calibration that governed each instrument on the test date (null only when none existed and a
    -- lab manager accepted the run anyway)
    machine_calibration_id       uuid         REFERENCES calibration (id),
    transducer_calibration_id    uuid         REFERENCES calibration (id),
    extensometer_calibration_id  uuid         REFERENCES calibration (id),
    operator                     text         NOT NULL CHECK (btrim(operator) <> ''),
    tested_at                    timestamptz  NOT NULL,
    -- the calendar day of the test where it was run (the offset the operator gave), which the calibration
    -- gate checks
    test_date                    date         NOT NULL,
    temperature_c                numeric      NOT NULL CHECK (temperature_c > -273.15),
    standard                     text         NOT NULL
        CHECK (standard IN ('ISO_6892_1', 'ASTM_E8', 'ASTM_E8M', 'ISO_37', 'OTHER')),
    control_method               text         CHECK (control_method IN ('A1', 'A2', 'B')),
    standard_reference           text,
    nominal_strain_rate_per_s    numeric      CHECK (nominal_strain_rate_per_s > 0),
    nominal_stress_rate_mpa_per_s numeric     CHECK (nominal_stress_rate_mpa_per_s > 0),
    crosshead_speed_mm_per_min   numeric      CHECK (crosshead_speed_mm_per_min > 0),
    mode                         text         NOT NULL CHECK (mode IN ('TENSILE', 'CYCLIC')),
    remarks                      text,
    -- the property symbols the run is meant to report (null: all of them), which sets the classes needed
    reported_properties          text,
    validity                     text         NOT NULL CHECK (validity IN ('VALID', 'INVALID')),
    invalidation_reason          text,
    invalidated_at               timestamptz,
    invalidated_by               text,
    calibration_override_reason  text,
    calibration_override_by      text,
    -- what the calibration gate found, one finding per line, as the manager saw it when accepting
    calibration_override_findings text,
    current_analysis_id          uuid,
    created_at                   timestamptz  NOT NULL,
    created_by                   text         NOT NULL,
    version                      bigint       NOT NULL DEFAULT 0,

    FOREIGN KEY (force_transducer_id, force_range_n) REFERENCES force_range (instrument_id, upper_limit_n),
    -- ISO 6892-1 names its control method (A1, A2 or B); the other standards take none
    CHECK ((standard = 'ISO_6892_1') = (control_method IS NOT NULL)),
    CHECK (standard <> 'OTHER' OR btrim(coalesce(standard_reference, '')) <> ''),
    CHECK ((validity = 'INVALID') = (invalidation_reason IS NOT NULL)),
    CHECK ((invalidation_reason IS NULL) = (invalidated_at IS NULL)),
    CHECK ((invalidation_reason IS NULL) = (invalidated_by IS NULL)),
    CHECK ((calibration_override_reason IS NULL) = (calibration_override_by IS NULL)),
    CHECK ((calibration_override_reason IS NULL) = (calibration_override_findings IS NULL)),
    CHECK (calibration_override_reason IS NULL OR btrim(calibration_override_reason) <> ''),
    -- without an accepted override every instrument had a governing calibration
    CHECK (calibration_override_reason IS NOT NULL OR (machine_calibration_id IS NOT NULL
        AND transducer_calibration_id IS NOT NULL AND extensometer_calibration_id IS NOT NULL))
);
CREATE INDEX test_run_specimen ON test_run (specimen_id, created_at);
CREATE INDEX test_run_date ON test_run (test_date);
-- one valid run per specimen: a retest invalidates the run it repeats
CREATE UNIQUE INDEX test_run_one_valid_per_specimen ON test_run (specimen_id) WHERE validity = 'VALID';

-- The registered facts of a test run never change; only validity and the current-analysis pointer do.
CREATE FUNCTION test_run_only_validity_and_pointer() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
    IF TG_OP = 'DELETE' THEN
        RAISE EXCEPTION 'DELETE on test_run is not allowed: a test run is invalidated, never removed'
            USING ERRCODE = 'insufficient_privilege';
    END IF;
    IF (to_jsonb(NEW) - ARRAY['validity', 'invalidation_reason', 'invalidated_at', 'invalidated_by',
                              'current_analysis_id', 'version'])
       IS DISTINCT FROM
       (to_jsonb(OLD) - ARRAY['validity', 'invalidation_reason', 'invalidated_at', 'invalidated_by',
                              'current_analysis_id', 'version']) THEN
        RAISE EXCEPTION 'UPDATE on test_run may change only its validity and its current analysis'
            USING ERRCODE = 'insufficient_privilege';
    END IF;
    RETURN NEW;
END;
$$;
CREATE TRIGGER test_run_registered_facts_fixed BEFORE UPDATE OR DELETE ON test_run
    FOR EACH ROW EXECUTE FUNCTION test_run_only_validity_and_pointer();
CREATE TRIGGER test_run_no_truncate BEFORE TRUNCATE ON test_run
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_recorded_history();

-- The raw curve file's description; one per test run (a corrected file needs a new test run).
CREATE TABLE raw_curve (
    id                  uuid         PRIMARY KEY,
    test_run_id         uuid         NOT NULL UNIQUE REFERENCES test_run (id),
    sha256              text         NOT NULL CHECK (sha256 ~ '^[0-9a-f]{64}$'),
    size_bytes          bigint       NOT NULL CHECK (size_bytes > 0),
    media_type          text         NOT NULL CHECK (btrim(media_type) <> ''),
    original_name       text,
    points              int          NOT NULL CHECK (points > 0),
    -- set when the same bytes were already stored for another test run and the upload confirmed it
    duplicate_of_test_run_id uuid    REFERENCES test_run (id),
    duplicate_reason    text,
    received_at         timestamptz  NOT NULL,
    received_by         text         NOT NULL,
    UNIQUE (id, test_run_id, sha256),
    UNIQUE (id, sha256, size_bytes),
    CHECK ((duplicate_of_test_run_id IS NULL) = (duplicate_reason IS NULL)),
    CHECK (duplicate_of_test_run_id IS NULL OR duplicate_of_test_run_id <> test_run_id)
);
CREATE INDEX raw_curve_sha256 ON raw_curve (sha256);

-- The bytes, behind the storage interface (they may move to an object store; the description stays).
-- The database itself checks the SHA-256 and size of what is stored.
CREATE TABLE raw_curve_content (
    raw_curve_id  uuid      PRIMARY KEY,
    sha256        text      NOT NULL,
    size_bytes    bigint    NOT NULL,
    content       bytea     NOT NULL,
    -- the bytes are exactly what the description says: same fingerprint, same size. Checked at commit, so
    -- the bytes may be written while the file is still being read and its description written after.
    FOREIGN KEY (raw_curve_id, sha256, size_bytes) REFERENCES raw_curve (id, sha256, size_bytes)
        DEFERRABLE INITIALLY DEFERRED,
    CHECK (octet_length(content) = size_bytes),
    CHECK (encode(sha256(content), 'hex') = sha256)
);
-- Stored as is, without compression: curve files are written once and read rarely, and compressing
-- tens of megabytes on the upload path costs more time than the disk it saves.
ALTER TABLE raw_curve_content ALTER COLUMN content SET STORAGE EXTERNAL;

-- One computation from a raw curve. Immutable; a re-analysis is a new row that names the one it replaces.
CREATE TABLE analysis_run (
    id                    uuid         PRIMARY KEY,
    test_run_id           uuid         NOT NULL REFERENCES test_run (id),
    -- 1, 2, 3... within the test run
    sequence              int          NOT NULL CHECK (sequence > 0),
    raw_curve_id          uuid         NOT NULL,
    input_sha256          text         NOT NULL,
    mode                  text         NOT NULL CHECK (mode IN ('TENSILE', 'CYCLIC')),
    -- from the build (application version, source commit), never typed
    software_version      text         NOT NULL CHECK (btrim(software_version) <> ''),
    software_commit       text         NOT NULL CHECK (btrim(software_commit) <> ''),
    method_version        text         NOT NULL CHECK (btrim(method_version) <> ''),
    parameters            jsonb        NOT NULL,
    -- what the reader found: points, channels, metadata, warnings
    input_summary         jsonb        NOT NULL,
    results               jsonb        NOT NULL,
    calibration_snapshot  jsonb        NOT NULL,
    geometry_snapshot     jsonb        NOT NULL,
    flags                 jsonb        NOT NULL,
    replaces_id           uuid         REFERENCES analysis_run (id),
    reason                text,
    created_at            timestamptz  NOT NULL,
    created_by            text         NOT NULL,
    UNIQUE (test_run_id, sequence),
    UNIQUE (id, test_run_id),
    -- the curve it was computed from is this test run's, and the fingerprint is that curve's
    FOREIGN KEY (raw_curve_id, test_run_id, input_sha256) REFERENCES raw_curve (id, test_run_id, sha256),
    CHECK ((sequence = 1) = (replaces_id IS NULL)),
    CHECK (replaces_id IS NULL OR btrim(coalesce(reason, '')) <> ''),
    CHECK (replaces_id IS NULL OR replaces_id <> id),
    CHECK (jsonb_typeof(flags) = 'array')
);
CREATE INDEX analysis_run_test_run ON analysis_run (test_run_id, sequence);

-- The current analysis of a test run is one of its own.
ALTER TABLE test_run ADD CONSTRAINT test_run_current_analysis_is_own
    FOREIGN KEY (current_analysis_id, id) REFERENCES analysis_run (id, test_run_id);

CREATE TRIGGER raw_curve_append_only BEFORE UPDATE OR DELETE ON raw_curve
    FOR EACH ROW EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER raw_curve_no_truncate BEFORE TRUNCATE ON raw_curve
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER raw_curve_content_append_only BEFORE UPDATE OR DELETE ON raw_curve_content
    FOR EACH ROW EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER raw_curve_content_no_truncate BEFORE TRUNCATE ON raw_curve_content
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER analysis_run_append_only BEFORE UPDATE OR DELETE ON analysis_run
    FOR EACH ROW EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER analysis_run_no_truncate BEFORE TRUNCATE ON analysis_run
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_recorded_history();
