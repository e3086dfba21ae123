-- Specimens (test pieces): which heat and order each comes from, its measured geometry with the
-- cross-section S0 and gauge length L0 computed from it, and what was measured after fracture.
-- The mean of each dimension is stored beside the readings, and S0, L0 with the formula and rule used,
-- so that a certificate value can be traced back to the micrometer readings.

CREATE TABLE specimen (
    id                    uuid         PRIMARY KEY,
    lab_identifier        text         NOT NULL CHECK (btrim(lab_identifier) <> ''),
    heat_id               uuid         NOT NULL REFERENCES heat (id),
    order_id              uuid         NOT NULL REFERENCES customer_order (id),
    -- the order's customer, copied at registration (an order never changes customer)
    customer_id           uuid         NOT NULL REFERENCES customer (id),
    orientation           text         NOT NULL CHECK (orientation IN ('LONGITUDINAL', 'TRANSVERSE', 'OTHER')),
    sampling_position     text,
    shape                 text         NOT NULL CHECK (shape IN ('ROUND', 'FLAT', 'TUBE', 'OTHER')),

    -- means of the original readings, mm: round d; flat a (thickness), b (width); tube a (wall), D (outer)
    mean_d_mm             numeric      CHECK (mean_d_mm > 0),
    mean_a_mm             numeric      CHECK (mean_a_mm > 0),
    mean_b_mm             numeric      CHECK (mean_b_mm > 0),
    mean_outer_d_mm       numeric      CHECK (mean_outer_d_mm > 0),
    s0_mm2                numeric      NOT NULL CHECK (s0_mm2 > 0),
    s0_formula            text         NOT NULL,
    s0_method             text,

    l0_basis              text         NOT NULL CHECK (l0_basis IN ('PROPORTIONAL', 'FIXED')),
    l0_k                  numeric      CHECK (l0_k IN (5.65, 11.3)),
    l0_round_to_five_mm   boolean,
    l0_calculated_mm      numeric      NOT NULL CHECK (l0_calculated_mm > 0),
    l0_mm                 numeric      NOT NULL CHECK (l0_mm > 0),
    l0_rule               text         NOT NULL,
    le_mm                 numeric      NOT NULL CHECK (le_mm > 0),
    lc_mm                 numeric      NOT NULL,

    -- after fracture (all null until recorded)
    lu_mm                 numeric      CHECK (lu_mm > 0),
    mean_du_mm            numeric      CHECK (mean_du_mm > 0),
    mean_au_mm            numeric      CHECK (mean_au_mm > 0),
    mean_bu_mm            numeric      CHECK (mean_bu_mm > 0),
    mean_outer_du_mm      numeric      CHECK (mean_outer_du_mm > 0),
    su_mm2                numeric      CHECK (su_mm2 > 0),
    su_formula            text,
    su_method             text,
    fracture_distance_mm  numeric      CHECK (fracture_distance_mm >= 0),
    fracture_zone         text         CHECK (fracture_zone IN ('INSIDE_MIDDLE_THIRD', 'OUTSIDE_MIDDLE_THIRD')),
    fracture_recorded_at  timestamptz,

    created_at            timestamptz  NOT NULL,
    version               bigint       NOT NULL DEFAULT 0,

    -- each shape has exactly its dimensions
    CHECK ((shape = 'ROUND') = (mean_d_mm IS NOT NULL)),
    CHECK ((shape IN ('FLAT', 'TUBE')) = (mean_a_mm IS NOT NULL)),
    CHECK ((shape = 'FLAT') = (mean_b_mm IS NOT NULL)),
    CHECK ((shape = 'TUBE') = (mean_outer_d_mm IS NOT NULL)),
    CHECK ((shape = 'OTHER') = (s0_method IS NOT NULL)),
    -- a tube wall below half the outer diameter
    CHECK (shape <> 'TUBE' OR mean_a_mm < mean_outer_d_mm / 2),
    -- proportional: k and the rounding choice; k = 5.65 only from 15 mm calculated L0 (ISO 6892-1)
    CHECK ((l0_basis = 'PROPORTIONAL') = (l0_k IS NOT NULL)),
    CHECK ((l0_basis = 'PROPORTIONAL') = (l0_round_to_five_mm IS NOT NULL)),
    CHECK (l0_basis <> 'PROPORTIONAL' OR l0_k <> 5.65 OR l0_calculated_mm >= 15),
    CHECK (l0_basis <> 'FIXED' OR l0_mm = l0_calculated_mm),
    -- the gauge marks lie on the parallel length
    CHECK (lc_mm >= l0_mm),
    -- after-fracture measurements come together, with the dimensions of the shape
    CHECK ((lu_mm IS NULL) = (su_mm2 IS NULL)),
    CHECK ((lu_mm IS NULL) = (su_formula IS NULL)),
    CHECK ((lu_mm IS NULL) = (fracture_recorded_at IS NULL)),
    CHECK ((mean_du_mm IS NOT NULL) = (lu_mm IS NOT NULL AND shape = 'ROUND')),
    CHECK ((mean_au_mm IS NOT NULL) = (lu_mm IS NOT NULL AND shape IN ('FLAT', 'TUBE'))),
    CHECK ((mean_bu_mm IS NOT NULL) = (lu_mm IS NOT NULL AND shape = 'FLAT')),
    CHECK ((mean_outer_du_mm IS NOT NULL) = (lu_mm IS NOT NULL AND shape = 'TUBE')),
    CHECK ((su_method IS NOT NULL) = (lu_mm IS NOT NULL AND shape = 'OTHER')),
    CHECK (shape <> 'TUBE' OR mean_au_mm IS NULL OR mean_au_mm < mean_outer_du_mm / 2),
    -- fracturing does not add cross-section
    CHECK (su_mm2 IS NULL OR su_mm2 <= s0_mm2),
    CHECK (lu_mm IS NOT NULL OR (fracture_distance_mm IS NULL AND fracture_zone IS NULL))
);
CREATE UNIQUE INDEX specimen_lab_identifier_unique ON specimen (lower(lab_identifier));
CREATE INDEX specimen_heat ON specimen (heat_id);
CREATE INDEX specimen_order ON specimen (order_id);
CREATE INDEX specimen_customer ON specimen (customer_id);

-- Every reading as taken, digits as given; position orders them (per dimension in the shape's order).
CREATE TABLE specimen_reading (
    specimen_id  uuid     NOT NULL REFERENCES specimen (id) ON DELETE CASCADE,
    position     int      NOT NULL CHECK (position >= 0),
    dimension    text     NOT NULL CHECK (dimension IN ('d', 'a', 'b', 'D')),
    value_mm     numeric  NOT NULL CHECK (value_mm > 0),
    PRIMARY KEY (specimen_id, position)
);

CREATE TABLE specimen_fracture_reading (
    specimen_id  uuid     NOT NULL REFERENCES specimen (id) ON DELETE CASCADE,
    position     int      NOT NULL CHECK (position >= 0),
    dimension    text     NOT NULL CHECK (dimension IN ('du', 'au', 'bu', 'Du')),
    value_mm     numeric  NOT NULL CHECK (value_mm > 0),
    PRIMARY KEY (specimen_id, position)
);
