-- People who sign in, each with one role; a customer account belongs to one organisation.

CREATE TABLE account (
    id               uuid         PRIMARY KEY,
    username         text         NOT NULL,
    display_name     text         NOT NULL,
    password_hash    text         NOT NULL,
    role             text         NOT NULL CHECK (role IN ('TECHNICIAN', 'LAB_MANAGER', 'AUDITOR', 'CUSTOMER')),
    organisation_id  uuid         REFERENCES customer (id),
    enabled          boolean      NOT NULL DEFAULT true,
    created_at       timestamptz  NOT NULL,
    version          bigint       NOT NULL DEFAULT 0,
    CONSTRAINT account_username_unique UNIQUE (username),
    CHECK ((role = 'CUSTOMER') = (organisation_id IS NOT NULL))
);
