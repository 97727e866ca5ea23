-- The thicknesses a material exists in, which bound every rescaling to another thickness: stock
-- thicknesses (comma-separated mm, written with Double.toString so they read back exactly; empty when none
-- are stated) and/or a continuous range it is made in (both ends or neither). A material stating neither
-- is judged by the application's assumed rule (see docs/thickness.md).

ALTER TABLE material ADD COLUMN stock_thicknesses_mm VARCHAR(2000) DEFAULT '' NOT NULL;
ALTER TABLE material ADD COLUMN made_min_mm DOUBLE PRECISION;
ALTER TABLE material ADD COLUMN made_max_mm DOUBLE PRECISION;
ALTER TABLE material ADD CONSTRAINT material_made_range_ordered CHECK (
    (made_min_mm IS NULL AND made_max_mm IS NULL)
    OR (made_min_mm > 0 AND made_max_mm >= made_min_mm));
