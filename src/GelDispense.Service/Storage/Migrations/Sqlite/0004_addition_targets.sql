-- The target and acceptance band each addition was judged against, so the record (and the LIMS export) keeps them
-- after a re-plan moves the batch's current targets. Additions recorded before this migration hold 0.
ALTER TABLE additions ADD COLUMN target_mass_g REAL NOT NULL DEFAULT 0;
ALTER TABLE additions ADD COLUMN acceptance_g REAL NOT NULL DEFAULT 0;
