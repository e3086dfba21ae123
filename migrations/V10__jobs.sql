-- Background jobs: bulk work a user starts and comes back to (a batch of curve files, a re-analysis of many
-- test runs, a verification of the ledger). A job row is the job's progress display: its kind, who started
-- it, its state, how far it is and, at the end, what came of it. The work a job does is recorded where it
-- belongs, each write with its own ledger event; the submission and the end of a job are ledgered too.

CREATE TABLE job (
    id            uuid         PRIMARY KEY,
    kind          text         NOT NULL CHECK (btrim(kind) <> ''),
    owner         text         NOT NULL CHECK (btrim(owner) <> ''),
    description   text         NOT NULL,
    state         text         NOT NULL CHECK (state IN ('QUEUED', 'RUNNING', 'FINISHED', 'FAILED')),
    done          integer      NOT NULL CHECK (done >= 0),
    total         integer      NOT NULL CHECK (total >= 0),
    succeeded     integer      NOT NULL CHECK (succeeded >= 0),
    failed        integer      NOT NULL CHECK (failed >= 0),
    -- per item outcomes and the job's own answer, as JSON; grows while the job runs
    summary       jsonb        NOT NULL,
    failure       text,
    submitted_at  timestamptz  NOT NULL,
    started_at    timestamptz,
    finished_at   timestamptz,
    version       bigint       NOT NULL,
    CHECK (done <= total OR total = 0),
    CHECK ((state IN ('FINISHED', 'FAILED')) = (finished_at IS NOT NULL))
);

CREATE INDEX job_by_owner ON job (owner, submitted_at DESC, id);
CREATE INDEX job_by_time ON job (submitted_at DESC, id);
