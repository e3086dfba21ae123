-- Equipment: testing machines, force transducers and extensometers, and their calibration records.
-- An instrument is never deleted (it is retired from a date); a calibration record is never edited in
-- place or deleted: a wrong one is withdrawn with a reason and a corrected one is added.

CREATE TABLE instrument (
    id                 uuid         PRIMARY KEY,
    asset_id           text         NOT NULL CHECK (asset_id <> ''),
    kind               text         NOT NULL CHECK (kind IN ('TESTING_MACHINE', 'FORCE_TRANSDUCER', 'EXTENSOMETER')),
    description        text         NOT NULL,
    maker              text,
    model              text,
    serial_number      text,
    location           text,
    -- extensometer only: gauge length Le and travel, in mm
    gauge_length_mm    numeric      CHECK (gauge_length_mm > 0),
    travel_mm          numeric      CHECK (travel_mm > 0),
    retired_on         date,
    retirement_reason  text,
    created_at         timestamptz  NOT NULL,
    version            bigint       NOT NULL DEFAULT 0,
    CHECK ((kind = 'EXTENSOMETER') = (gauge_length_mm IS NOT NULL)),
    CHECK (kind = 'EXTENSOMETER' OR travel_mm IS NULL),
    CHECK ((retired_on IS NULL) = (retirement_reason IS NULL))
);
CREATE UNIQUE INDEX instrument_asset_id_unique ON instrument (lower(asset_id));
CREATE INDEX instrument_kind ON instrument (kind);

-- A force transducer's ranges, each named by its upper limit in N; the verified part starts at
-- lower_limit_n (ISO 7500-1 verifies from 20 % of the range upward [from memory]).
CREATE TABLE force_range (
    instrument_id  uuid     NOT NULL REFERENCES instrument (id),
    upper_limit_n  numeric  NOT NULL CHECK (upper_limit_n > 0),
    lower_limit_n  numeric  NOT NULL CHECK (lower_limit_n > 0),
    PRIMARY KEY (instrument_id, upper_limit_n),
    CHECK (lower_limit_n < upper_limit_n)
);

-- The force transducers built into a testing machine.
CREATE TABLE instrument_builtin_transducer (
    instrument_id   uuid  NOT NULL REFERENCES instrument (id),
    position        int   NOT NULL,
    transducer_id   uuid  NOT NULL REFERENCES instrument (id),
    PRIMARY KEY (instrument_id, position),
    UNIQUE (instrument_id, transducer_id),
    CHECK (transducer_id <> instrument_id)
);

CREATE TABLE calibration (
    id                     uuid         PRIMARY KEY,
    instrument_id          uuid         NOT NULL REFERENCES instrument (id),
    calibrated_on          date         NOT NULL,
    due_on                 date         NOT NULL,
    calibrating_body       text         NOT NULL,
    certificate_reference  text         NOT NULL CHECK (certificate_reference <> ''),
    -- the class of an extensometer (ISO 9513) or of a testing machine (ISO 7500-1); null for a force
    -- transducer, which is classed per range in calibration_range_class
    accuracy_class         text         CHECK (accuracy_class IN ('0.5', '1', '2', '3')),
    recorded_at            timestamptz  NOT NULL,
    withdrawn_at           timestamptz,
    withdrawal_reason      text,
    version                bigint       NOT NULL DEFAULT 0,
    CHECK (due_on > calibrated_on),
    CHECK ((withdrawn_at IS NULL) = (withdrawal_reason IS NULL))
);
CREATE INDEX calibration_instrument ON calibration (instrument_id, calibrated_on);
-- A certificate reference names one standing calibration of an instrument; once withdrawn, the same
-- certificate may be entered again correctly.
CREATE UNIQUE INDEX calibration_certificate_unique ON calibration (instrument_id, lower(certificate_reference))
    WHERE withdrawn_at IS NULL;

-- The ISO 7500-1 class a force transducer's range obtained. The foreign key to the range keeps a
-- range that a calibration refers to from being removed.
CREATE TABLE calibration_range_class (
    calibration_id  uuid     NOT NULL REFERENCES calibration (id),
    position        int      NOT NULL,
    instrument_id   uuid     NOT NULL,
    range_n         numeric  NOT NULL,
    accuracy_class  text     NOT NULL CHECK (accuracy_class IN ('0.5', '1', '2', '3')),
    PRIMARY KEY (calibration_id, position),
    UNIQUE (calibration_id, range_n),
    FOREIGN KEY (instrument_id, range_n) REFERENCES force_range (instrument_id, upper_limit_n)
);

-- Append-only in the database too: an instrument is retired, never deleted; a calibration record may
-- only receive its withdrawal (once), nothing else changes.
CREATE TRIGGER instrument_no_delete BEFORE DELETE ON instrument
    FOR EACH ROW EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER calibration_range_class_append_only BEFORE UPDATE OR DELETE ON calibration_range_class
    FOR EACH ROW EXECUTE FUNCTION refuse_change_of_recorded_history();

CREATE FUNCTION calibration_only_withdrawal() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
    IF TG_OP = 'DELETE' THEN
        RAISE EXCEPTION 'DELETE on calibration is not allowed: a calibration record is withdrawn, never removed'
            USING ERRCODE = 'insufficient_privilege';
    END IF;
    IF OLD.withdrawn_at IS NOT NULL
       OR NEW.id <> OLD.id
       OR NEW.instrument_id <> OLD.instrument_id
       OR NEW.calibrated_on <> OLD.calibrated_on
       OR NEW.due_on <> OLD.due_on
       OR NEW.calibrating_body <> OLD.calibrating_body
       OR NEW.certificate_reference <> OLD.certificate_reference
       OR NEW.accuracy_class IS DISTINCT FROM OLD.accuracy_class
       OR NEW.recorded_at <> OLD.recorded_at THEN
        RAISE EXCEPTION 'UPDATE on calibration may only withdraw a standing record'
            USING ERRCODE = 'insufficient_privilege';
    END IF;
    RETURN NEW;
END;
$$;

CREATE TRIGGER calibration_append_only BEFORE UPDATE OR DELETE ON calibration
    FOR EACH ROW EXECUTE FUNCTION calibration_only_withdrawal();
CREATE TRIGGER calibration_no_truncate BEFORE TRUNCATE ON calibration
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_recorded_history();
