-- An addition's stored answer as bytes (deflated protobuf), not base64 text: a third smaller, and on PostgreSQL
-- small enough to stay in the row. New rows leave response empty; rows written before keep their text there and
-- response_bytes NULL.
ALTER TABLE additions ADD COLUMN response_bytes BLOB;
