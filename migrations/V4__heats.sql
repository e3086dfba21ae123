-- Heats (casts): the melt a product was made from, identified by the producer's heat number, with its
-- grade, product form, nominal size and, when the mill certificate gives it, the chemical composition.

CREATE TABLE heat (
    id                    uuid         PRIMARY KEY,
    heat_number           text         NOT NULL CHECK (btrim(heat_number) <> ''),
    producer              text         NOT NULL CHECK (btrim(producer) <> ''),
    grade                 text         NOT NULL CHECK (btrim(grade) <> ''),
    product_form          text         NOT NULL
        CHECK (product_form IN ('PLATE', 'BAR', 'TUBE', 'SHEET', 'WIRE', 'CASTING', 'OTHER')),
    -- nominal thickness, or diameter for round products: what a specification's thickness ranges refer to
    nominal_thickness_mm  numeric      NOT NULL CHECK (nominal_thickness_mm > 0),
    created_at            timestamptz  NOT NULL,
    version               bigint       NOT NULL DEFAULT 0
);
-- A heat number is the producer's: two mills may use the same number, one mill never twice.
CREATE UNIQUE INDEX heat_number_unique_per_producer ON heat (lower(producer), lower(heat_number));

-- Mass % per element symbol (the symbol's case matters: Co is cobalt, CO is not an element).
CREATE TABLE heat_composition (
    heat_id       uuid     NOT NULL REFERENCES heat (id) ON DELETE CASCADE,
    element       text     NOT NULL CHECK (element ~ '^[A-Z][a-z]{0,2}$'),
    mass_percent  numeric  NOT NULL CHECK (mass_percent >= 0 AND mass_percent <= 100),
    PRIMARY KEY (heat_id, element)
);

-- The rows of one heat may not add up to more than 100 %. Checked at commit, after the application has
-- replaced the whole set, so that an intermediate state inside the transaction does not count.
CREATE FUNCTION heat_composition_at_most_100_percent() RETURNS trigger
LANGUAGE plpgsql AS $$
BEGIN
    IF (SELECT coalesce(sum(mass_percent), 0) FROM heat_composition WHERE heat_id = NEW.heat_id) > 100 THEN
        RAISE EXCEPTION 'composition of heat % adds up to more than 100 %%', NEW.heat_id
            USING ERRCODE = 'check_violation';
    END IF;
    RETURN NULL;
END;
$$;

CREATE CONSTRAINT TRIGGER heat_composition_sum_check AFTER INSERT OR UPDATE ON heat_composition
    DEFERRABLE INITIALLY DEFERRED
    FOR EACH ROW EXECUTE FUNCTION heat_composition_at_most_100_percent();
