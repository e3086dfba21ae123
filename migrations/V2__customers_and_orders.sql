-- Customers (the organisations the laboratory tests for) and their orders with the requirements
-- that the material specification sets.

CREATE TABLE customer (
    id          uuid         PRIMARY KEY,
    name        text         NOT NULL,
    address     text         NOT NULL,
    created_at  timestamptz  NOT NULL,
    version     bigint       NOT NULL DEFAULT 0
);
CREATE UNIQUE INDEX customer_name_unique ON customer (lower(name));

CREATE TABLE customer_order (
    id                      uuid         PRIMARY KEY,
    customer_id             uuid         NOT NULL REFERENCES customer (id),
    purchase_order          text         NOT NULL,
    material_specification  text         NOT NULL,
    received_on             date,
    created_at              timestamptz  NOT NULL,
    version                 bigint       NOT NULL DEFAULT 0,
    CONSTRAINT customer_order_po_unique UNIQUE (customer_id, purchase_order)
);

CREATE TABLE order_requirement (
    order_id          uuid     NOT NULL REFERENCES customer_order (id) ON DELETE CASCADE,
    position          int      NOT NULL,
    property          text     NOT NULL,
    min_value         numeric,
    max_value         numeric,
    unit              text     NOT NULL,
    thickness_min_mm  numeric,
    thickness_max_mm  numeric,
    PRIMARY KEY (order_id, position),
    CHECK (min_value IS NOT NULL OR max_value IS NOT NULL),
    CHECK (min_value IS NULL OR max_value IS NULL OR min_value <= max_value)
);
