-- Inspection certificates 3.1 (EN 10204): drafts, issued documents, their lines, PDF bytes, status changes
-- and the per-year counter that numbers them.
--
-- A draft is the only thing that changes: while OPEN a lab manager may change it (each change in the
-- ledger); issuing turns it into an immutable certificate row with its lines and its PDF, and the draft
-- row then refuses every further change. An issued certificate never changes in place: superseding (by a
-- revision) and withdrawal are new rows in certificate_status_change, which is append-only as well, so the
-- history of a certificate's status is its rows in order.

CREATE TABLE certificate_draft (
    id                         uuid         PRIMARY KEY,
    order_id                   uuid         NOT NULL REFERENCES customer_order (id),
    customer_id                uuid         NOT NULL REFERENCES customer (id),
    -- the specimens chosen, in the order printed (uuid[] keeps the order and the set together)
    specimen_ids               uuid[]       NOT NULL CHECK (cardinality(specimen_ids) > 0),
    decision_rule              text         NOT NULL
        CHECK (decision_rule IN ('SIMPLE_ACCEPTANCE', 'SIMPLE_ACCEPTANCE_FULL_PRECISION', 'GUARD_BANDED')),
    product_description        text         NOT NULL CHECK (btrim(product_description) <> ''),
    deviations                 text,
    non_conformity_statement   text,
    include_curves             boolean      NOT NULL,
    -- the lines as built from the analyses at the last change; issuing rebuilds them and refuses when they differ
    lines                      jsonb        NOT NULL,
    -- a revision draft names the certificate it will replace and why (ISO/IEC 17025:2017 7.8.8)
    revises_certificate_id     uuid,
    revision_reason            text,
    state                      text         NOT NULL CHECK (state IN ('OPEN', 'ISSUED', 'DISCARDED')),
    issued_certificate_id      uuid,
    created_at                 timestamptz  NOT NULL,
    created_by                 text         NOT NULL,
    changed_at                 timestamptz  NOT NULL,
    version                    bigint       NOT NULL DEFAULT 0,
    CHECK ((revises_certificate_id IS NULL) = (revision_reason IS NULL)),
    CHECK ((state = 'ISSUED') = (issued_certificate_id IS NOT NULL))
);
CREATE INDEX certificate_draft_order ON certificate_draft (order_id);

CREATE FUNCTION certificate_draft_open_only() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
    IF TG_OP = 'DELETE' THEN
        RAISE EXCEPTION 'DELETE on certificate_draft is not allowed: a draft is discarded, never removed'
            USING ERRCODE = 'restrict_violation';
    END IF;
    IF OLD.state <> 'OPEN' THEN
        RAISE EXCEPTION 'certificate draft % is %: it can no longer change', OLD.id, OLD.state
            USING ERRCODE = 'restrict_violation';
    END IF;
    RETURN NEW;
END $$;
CREATE TRIGGER certificate_draft_changes_while_open BEFORE UPDATE OR DELETE ON certificate_draft
    FOR EACH ROW EXECUTE FUNCTION certificate_draft_open_only();
CREATE TRIGGER certificate_draft_no_truncate BEFORE TRUNCATE ON certificate_draft
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_recorded_history();

-- Gap-free numbering: one row per year, locked (SELECT ... FOR UPDATE) by the issuing transaction, so a
-- rolled-back issue gives its number back. A database sequence would burn numbers on rollback.
CREATE TABLE certificate_counter (
    year         int     PRIMARY KEY CHECK (year BETWEEN 2000 AND 9999),
    last_serial  int     NOT NULL CHECK (last_serial >= 0)
);

CREATE TABLE certificate (
    id                        uuid         PRIMARY KEY,
    number                    text         NOT NULL,
    revision                  int          NOT NULL CHECK (revision >= 0),
    -- the year and serial of revision 0; a revision keeps its number and counts up the revision
    number_year               int          NOT NULL,
    number_serial             int          NOT NULL CHECK (number_serial > 0),
    draft_id                  uuid         NOT NULL UNIQUE REFERENCES certificate_draft (id),
    order_id                  uuid         NOT NULL REFERENCES customer_order (id),
    customer_id               uuid         NOT NULL REFERENCES customer (id),
    replaces_id               uuid         UNIQUE REFERENCES certificate (id),
    revision_reason           text,
    decision_rule             text         NOT NULL,
    decision_rule_statement   text         NOT NULL,
    product_description       text         NOT NULL,
    deviations                text,
    non_conformity_statement  text,
    all_lines_pass            boolean      NOT NULL,
    issued_at                 timestamptz  NOT NULL,
    issue_date                date         NOT NULL,
    issued_by                 text         NOT NULL,
    signatory_name            text         NOT NULL,
    signatory_function        text         NOT NULL,
    signature_meaning         text         NOT NULL,
    -- 128 random bits, hex: printed on the certificate, answered anonymously by /verify/{code}
    verification_code         text         NOT NULL UNIQUE CHECK (verification_code ~ '^[0-9a-f]{32}$'),
    -- the issue event in the audit trail and the signed checkpoint covering it
    ledger_seq                bigint       NOT NULL UNIQUE,
    ledger_hash               text         NOT NULL,
    -- ledger_checkpoint.id (no foreign key: that table is created by a later-numbered migration)
    checkpoint_id             bigint       NOT NULL,
    checkpoint_root           text         NOT NULL,
    pdf_sha256                text         NOT NULL CHECK (pdf_sha256 ~ '^[0-9a-f]{64}$'),
    pdf_bytes                 int          NOT NULL CHECK (pdf_bytes > 0),
    UNIQUE (number, revision),
    UNIQUE (number_year, number_serial, revision),
    CHECK ((revision = 0) = (replaces_id IS NULL)),
    CHECK ((replaces_id IS NULL) = (revision_reason IS NULL)),
    CHECK (all_lines_pass OR btrim(coalesce(non_conformity_statement, '')) <> '')
);
CREATE INDEX certificate_order ON certificate (order_id);
CREATE INDEX certificate_customer ON certificate (customer_id, issued_at);
CREATE INDEX certificate_issued ON certificate (issue_date);
CREATE INDEX certificate_pdf_sha256 ON certificate (pdf_sha256);

-- One line per specimen and property: the stored, rounded result of a recorded analysis, in SI with its unit
-- and the rounding rule that made the reported text, against the order's requirement, with the verdict.
CREATE TABLE certificate_line (
    certificate_id        uuid     NOT NULL REFERENCES certificate (id),
    position              int      NOT NULL,
    specimen_id           uuid     NOT NULL REFERENCES specimen (id),
    specimen_label        text     NOT NULL,
    heat_id               uuid     NOT NULL REFERENCES heat (id),
    heat_number           text     NOT NULL,
    test_run_id           uuid     NOT NULL REFERENCES test_run (id),
    analysis_run_id       uuid     NOT NULL REFERENCES analysis_run (id),
    property              text     NOT NULL,
    status                text     NOT NULL,
    value                 double precision,
    unit                  text     NOT NULL,
    reported              text,
    rounding              text,
    expanded_uncertainty  double precision,
    requirement_min       numeric,
    requirement_max       numeric,
    requirement_unit      text,
    thickness_min_mm      numeric,
    thickness_max_mm      numeric,
    verdict               text,
    verdict_reason        text,
    flags                 text[]   NOT NULL,
    PRIMARY KEY (certificate_id, position)
);
CREATE INDEX certificate_line_specimen ON certificate_line (specimen_id);
CREATE INDEX certificate_line_heat ON certificate_line (heat_id);

CREATE TABLE certificate_pdf (
    certificate_id  uuid   PRIMARY KEY REFERENCES certificate (id),
    content         bytea  NOT NULL,
    sha256          text   NOT NULL,
    CHECK (sha256 = encode(sha256(content), 'hex'))
);

-- Status after issue, one append-only row per change: SUPERSEDED (by the named revision) or WITHDRAWN.
-- Both are final, so a certificate has at most one row here (the unique key makes a second one fail).
CREATE TABLE certificate_status_change (
    certificate_id   uuid         PRIMARY KEY REFERENCES certificate (id),
    status           text         NOT NULL CHECK (status IN ('SUPERSEDED', 'WITHDRAWN')),
    superseded_by    uuid         REFERENCES certificate (id) DEFERRABLE INITIALLY DEFERRED,
    reason           text         NOT NULL CHECK (btrim(reason) <> ''),
    changed_at       timestamptz  NOT NULL,
    changed_by       text         NOT NULL,
    CHECK ((status = 'SUPERSEDED') = (superseded_by IS NOT NULL))
);

CREATE TRIGGER certificate_append_only BEFORE UPDATE OR DELETE ON certificate
    FOR EACH ROW EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER certificate_no_truncate BEFORE TRUNCATE ON certificate
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER certificate_line_append_only BEFORE UPDATE OR DELETE ON certificate_line
    FOR EACH ROW EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER certificate_line_no_truncate BEFORE TRUNCATE ON certificate_line
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER certificate_pdf_append_only BEFORE UPDATE OR DELETE ON certificate_pdf
    FOR EACH ROW EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER certificate_pdf_no_truncate BEFORE TRUNCATE ON certificate_pdf
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER certificate_status_change_append_only BEFORE UPDATE OR DELETE ON certificate_status_change
    FOR EACH ROW EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER certificate_status_change_no_truncate BEFORE TRUNCATE ON certificate_status_change
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_recorded_history();
