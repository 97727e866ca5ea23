-- Undo without loss. Nothing is deleted by the ordinary paths any more: a sample, a material or an imported
-- reference spectrum is retired (hidden from listings, searches and the derived store, kept, restorable),
-- and a sample's or material's metadata is corrected as a new revision while every earlier one stays
-- readable. The curve never changes: it is the measurement; a revision changes how it is interpreted.

-- retired_at: null while in use; when it was retired otherwise. A retired material hides all its samples
-- without touching their own retired_at, so restoring it brings back exactly the samples it had in use.
ALTER TABLE material ADD COLUMN retired_at TIMESTAMP WITH TIME ZONE;
ALTER TABLE sample ADD COLUMN retired_at TIMESTAMP WITH TIME ZONE;

-- revision: the number of the revision the row holds now (1 as imported). The sample and material rows always
-- hold their current revision, so every existing read sees it with no join.
ALTER TABLE material ADD COLUMN revision INTEGER DEFAULT 1 NOT NULL;
ALTER TABLE sample ADD COLUMN revision INTEGER DEFAULT 1 NOT NULL;
ALTER TABLE material ADD CONSTRAINT material_revision_positive CHECK (revision >= 1);
ALTER TABLE sample ADD CONSTRAINT sample_revision_positive CHECK (revision >= 1);

-- Every revision of a corrected sample, the first included, as a full copy of the fields a correction may
-- change. Rows are only ever inserted. Written by the first correction, which copies revision 1 from the
-- sample row before changing it, in the same transaction; a sample never corrected has no rows here and
-- its sample row is its revision 1.
CREATE TABLE sample_revision (
    sample_id         BIGINT NOT NULL REFERENCES sample (id),
    revision          INTEGER NOT NULL,
    thickness_mm      DOUBLE PRECISION NOT NULL,
    geometry          VARCHAR(10)  NOT NULL,
    instrument        VARCHAR(200) NOT NULL DEFAULT '',
    measured_on       DATE,
    lot               VARCHAR(100) NOT NULL DEFAULT '',
    notes             VARCHAR(4000) NOT NULL DEFAULT '',
    detection_limit   DOUBLE PRECISION NOT NULL,
    -- why the values changed, in the user's words ('' for revision 1, as imported)
    reason            VARCHAR(1000) NOT NULL DEFAULT '',
    revised_at        TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT CURRENT_TIMESTAMP,
    PRIMARY KEY (sample_id, revision),
    CONSTRAINT sample_revision_thickness_positive CHECK (thickness_mm > 0),
    CONSTRAINT sample_revision_geometry_known CHECK (geometry IN ('regular', 'total')),
    CONSTRAINT sample_revision_detection_limit_fraction CHECK (detection_limit >= 0 AND detection_limit < 1)
);

-- The same for a material's refractive index and the thicknesses it is made in (columns as in material).
CREATE TABLE material_revision (
    material_id          BIGINT NOT NULL REFERENCES material (id),
    revision             INTEGER NOT NULL,
    index_kind           VARCHAR(20) NOT NULL,
    index_n              DOUBLE PRECISION,
    index_b              VARCHAR(400),
    index_c              VARCHAR(400),
    index_valid_from_nm  DOUBLE PRECISION,
    index_valid_to_nm    DOUBLE PRECISION,
    index_table_nm       VARCHAR(8000),
    index_table_n        VARCHAR(8000),
    stock_thicknesses_mm VARCHAR(2000) DEFAULT '' NOT NULL,
    made_min_mm          DOUBLE PRECISION,
    made_max_mm          DOUBLE PRECISION,
    reason               VARCHAR(1000) NOT NULL DEFAULT '',
    revised_at           TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT CURRENT_TIMESTAMP,
    PRIMARY KEY (material_id, revision),
    CONSTRAINT material_revision_index_known CHECK (index_kind IN ('constant', 'sellmeier', 'table'))
);

-- Imported emitters and responses: DELETE now retires. A retired spectrum gives up its name so that the
-- usual "retire, then import the right file under the same name" still works: the name is unique among the
-- spectra in use only. retired_key is 0 while in use and the row's own id once retired, so the unique
-- constraint below holds one in-use spectrum per (kind, name) and any number of retired ones.
ALTER TABLE reference_spectrum ADD COLUMN retired_at TIMESTAMP WITH TIME ZONE;
ALTER TABLE reference_spectrum ADD COLUMN retired_key BIGINT DEFAULT 0 NOT NULL;
ALTER TABLE reference_spectrum DROP CONSTRAINT reference_spectrum_name_unique;
ALTER TABLE reference_spectrum ADD CONSTRAINT reference_spectrum_name_unique UNIQUE (kind, name, retired_key);
ALTER TABLE reference_spectrum ADD CONSTRAINT reference_spectrum_retired_consistent CHECK (
    (retired_at IS NULL AND retired_key = 0) OR (retired_at IS NOT NULL AND retired_key = id));
