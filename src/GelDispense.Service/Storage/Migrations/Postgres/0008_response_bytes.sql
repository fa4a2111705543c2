-- An addition's stored answer as bytes: it is deflated protobuf, and held as base64 text it was a third larger
-- (the load harness's 8-component demo: 3,923 characters on average, 2,934 bytes now). EXTERNAL: the bytes are
-- compressed already, so an answer past the 2 KB TOAST threshold goes out of line without PostgreSQL trying pglz on
-- it first, as it did on every base64 answer in vain. A small recipe's answer (about 1.6 KB) now stays in the row.
-- New rows leave response empty; rows written before keep their text there and response_bytes NULL.
ALTER TABLE additions ADD COLUMN response_bytes BYTEA;
ALTER TABLE additions ALTER COLUMN response_bytes SET STORAGE EXTERNAL;
