-- The Merkle tree over the ledger and signed checkpoints of its head (DEVELOPERS.md, "The ledger").

-- Hashes of the tree's perfect, aligned subtrees (RFC 6962 §2.1): level 0 holds the leaf of event
-- seq = position + 1, SHA-256(0x00 || canonical UTF-8); level l, position p is the subtree over leaves
-- [p * 2^l, (p + 1) * 2^l), written when its last leaf is appended. Any root or proof is built from
-- O(log^2 n) of these rows, so nothing re-reads the canonical texts.
CREATE TABLE ledger_tree_node (
    level     smallint NOT NULL CHECK (level BETWEEN 0 AND 62),
    position  bigint   NOT NULL CHECK (position >= 0),
    hash      bytea    NOT NULL CHECK (octet_length(hash) = 32),
    PRIMARY KEY (level, position)
);

CREATE TRIGGER ledger_tree_node_no_update BEFORE UPDATE OR DELETE ON ledger_tree_node
    FOR EACH ROW EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER ledger_tree_node_no_truncate BEFORE TRUNCATE ON ledger_tree_node
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_recorded_history();

-- Events recorded before this migration get their leaves and subtrees here, in chain order.
DO $$
DECLARE
    ev    record;
    idx   bigint;
    lvl   int;
    h     bytea;
    left_ bytea;
BEGIN
    FOR ev IN SELECT seq, canonical FROM audit_event ORDER BY seq LOOP
        idx := ev.seq - 1;
        h := sha256('\x00'::bytea || convert_to(ev.canonical, 'UTF8'));
        INSERT INTO ledger_tree_node (level, position, hash) VALUES (0, idx, h);
        lvl := 0;
        WHILE ((idx >> lvl) & 1) = 1 LOOP
            SELECT n.hash INTO STRICT left_ FROM ledger_tree_node n
             WHERE n.level = lvl AND n.position = (idx >> lvl) - 1;
            h := sha256('\x01'::bytea || left_ || h);
            lvl := lvl + 1;
            INSERT INTO ledger_tree_node (level, position, hash) VALUES (lvl, idx >> lvl, h);
        END LOOP;
    END LOOP;
END;
$$;

-- Signed tree heads. The signature is Ed25519 over the text
--   "specimen-ledger checkpoint v1\n" || tree_size || "\n" || root_hash || "\n" || recorded_at as
--   YYYY-MM-DDTHH:MM:SS.ffffffZ || "\n"
-- with the key whose SubjectPublicKeyInfo DER has SHA-256 key_id.
CREATE TABLE ledger_checkpoint (
    id           bigint       GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
    tree_size    bigint       NOT NULL CHECK (tree_size >= 0),
    root_hash    char(64)     NOT NULL CHECK (root_hash ~ '^[0-9a-f]{64}$'),
    recorded_at  timestamptz  NOT NULL,
    reason       text         NOT NULL CHECK (btrim(reason) <> ''),
    key_id       char(64)     NOT NULL CHECK (key_id ~ '^[0-9a-f]{64}$'),
    signature    bytea        NOT NULL CHECK (octet_length(signature) = 64)
);

CREATE INDEX ledger_checkpoint_size ON ledger_checkpoint (tree_size, id);

CREATE TRIGGER ledger_checkpoint_no_update BEFORE UPDATE OR DELETE ON ledger_checkpoint
    FOR EACH ROW EXECUTE FUNCTION refuse_change_of_recorded_history();
CREATE TRIGGER ledger_checkpoint_no_truncate BEFORE TRUNCATE ON ledger_checkpoint
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_recorded_history();

-- Search of the ledger by actor, action and time (entity type and id have their index since V1).
CREATE INDEX audit_event_actor ON audit_event (actor, seq);
CREATE INDEX audit_event_action ON audit_event (action, seq);
CREATE INDEX audit_event_occurred ON audit_event (occurred_at, seq);
