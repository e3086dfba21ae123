-- The ledger: an append-only, hash-chained sequence of audit events.
-- The database itself refuses to change or remove an event, whoever asks.

CREATE TABLE audit_event (
    seq            bigint       PRIMARY KEY CHECK (seq > 0),
    occurred_at    timestamptz  NOT NULL,
    actor          text         NOT NULL,
    actor_role     text         NOT NULL,
    action         text         NOT NULL,
    entity_type    text         NOT NULL,
    entity_id      text         NOT NULL,
    reason         text,
    before_state   jsonb,
    after_state    jsonb,
    previous_hash  char(64)     NOT NULL,
    hash           char(64)     NOT NULL UNIQUE,
    -- the exact UTF-8 text whose SHA-256 is hash (see DEVELOPERS.md, "The ledger")
    canonical      text         NOT NULL
);

CREATE INDEX audit_event_entity ON audit_event (entity_type, entity_id, seq);

-- One row: the last event's sequence and hash. Writers lock it, which keeps the chain linear.
CREATE TABLE audit_chain_head (
    id         int      PRIMARY KEY CHECK (id = 1),
    last_seq   bigint   NOT NULL,
    last_hash  char(64) NOT NULL
);
INSERT INTO audit_chain_head (id, last_seq, last_hash) VALUES (1, 0, repeat('0', 64));

CREATE FUNCTION refuse_change_of_recorded_history() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
    RAISE EXCEPTION '% on % is not allowed: recorded history is append-only', TG_OP, TG_TABLE_NAME
        USING ERRCODE = 'insufficient_privilege';
END;
$$;

CREATE TRIGGER audit_event_no_update BEFORE UPDATE OR DELETE ON audit_event
    FOR EACH ROW EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER audit_event_no_truncate BEFORE TRUNCATE ON audit_event
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_recorded_history();
