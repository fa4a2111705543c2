-- An addition's stored answer as bytes (deflated protobuf), not base64 text: a quarter smaller (the PostgreSQL
-- script says why it matters more there). New rows leave response empty; rows written before keep their text there
-- and response_bytes NULL.
ALTER TABLE additions ADD COLUMN response_bytes BLOB;
