-- The LIMS list's "changed after T" filter (updated_at > T, in event order) had no index to start from: the first page
-- walked every batch changed before T. updated_at is not monotone in event order (a writer reads the clock before it
-- takes its sequence number, and replicas' clocks differ), so T alone cannot say where in the event order to start.
-- high_water_at is the latest updated_at of this batch and of every batch whose latest event came before it, so it is
-- monotone in last_event_seq: the first batch in event order that can have changed after T is the first one whose
-- high water is after T, one index probe away. event_sequence.high_water_at is the running maximum itself.
-- It is written right after the event counter is bumped; SQLite has one writer at a time, so the running maximum is
-- in sequence order.
ALTER TABLE event_sequence ADD COLUMN high_water_at TEXT NOT NULL DEFAULT '';
ALTER TABLE batches ADD COLUMN high_water_at TEXT NOT NULL DEFAULT '';

UPDATE batches SET high_water_at = w.high_water_at
FROM (SELECT id, MAX(updated_at) OVER (ORDER BY last_event_seq) AS high_water_at FROM batches) AS w
WHERE w.id = batches.id;
UPDATE event_sequence SET high_water_at = COALESCE((SELECT MAX(updated_at) FROM batches), '') WHERE id = 1;

CREATE INDEX batches_by_high_water ON batches (high_water_at, last_event_seq);
