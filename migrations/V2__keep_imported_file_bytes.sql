-- The original bytes of every imported file, kept with its sample, so that each stored curve can be
-- traced to (and read again from) exactly what was imported. One row per sample; deleting the sample
-- deletes its file.

CREATE TABLE source_file (
    sample_id    BIGINT PRIMARY KEY REFERENCES sample (id) ON DELETE CASCADE,
    file_name    VARCHAR(400) NOT NULL,
    media_type   VARCHAR(100) NOT NULL,
    -- the format the importer read it as: delimited, jcamp-dx, raw-counts, datasheet-points
    format       VARCHAR(20)  NOT NULL,
    size_bytes   BIGINT       NOT NULL,
    bytes        BYTEA        NOT NULL,
    sha256       CHAR(64)     NOT NULL,
    imported_at  TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT CURRENT_TIMESTAMP,
    CONSTRAINT source_file_size_matches CHECK (size_bytes >= 0)
);

-- A re-import is recognised by its checksum first (this index), then narrowed to the same material and
-- thickness through the sample row (sample_material_idx): material_id lives on sample, not on curve.
CREATE INDEX curve_source_sha256_idx ON curve (source_sha256);
