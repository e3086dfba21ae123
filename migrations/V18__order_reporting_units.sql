-- The unit systems an order's certificate prints its results in. Stored results stay SI; this only
-- chooses the printed columns (analysis.units.ReportingUnits).
ALTER TABLE customer_order
    ADD COLUMN reporting_units text NOT NULL DEFAULT 'SI'
        CHECK (reporting_units IN ('SI', 'US_CUSTOMARY', 'SI_AND_US_CUSTOMARY'));
