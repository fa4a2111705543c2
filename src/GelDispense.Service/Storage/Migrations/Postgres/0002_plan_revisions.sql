-- Re-plans are append-only. Revision 0 is batches.plan, written once when the batch starts; every re-plan after an
-- out-of-window addition adds the next revision here, and batches.plan_revision points at the one in force.
CREATE TABLE plan_revisions (
    batch_id           TEXT NOT NULL REFERENCES batches (id),
    revision           BIGINT NOT NULL,
    plan               TEXT NOT NULL,
    scale_factor       DOUBLE PRECISION NOT NULL,
    cause_addition_id  TEXT NOT NULL,
    created_at         TEXT NOT NULL,
    PRIMARY KEY (batch_id, revision)
);

ALTER TABLE batches ADD COLUMN plan_revision BIGINT NOT NULL DEFAULT 0;

-- The plan revision each addition was judged against.
ALTER TABLE additions ADD COLUMN plan_revision BIGINT NOT NULL DEFAULT 0;
