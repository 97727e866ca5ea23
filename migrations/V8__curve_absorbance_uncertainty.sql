-- A sample curve's measurement uncertainty: one standard deviation per point in decadic absorbance,
-- packed like the other curve arrays (little-endian float64, point_count values), NaN where a point's
-- uncertainty is unknown. NULL when the curve carries none at all (every curve stored before this column).
-- See docs/measurement-uncertainty.md.

ALTER TABLE curve ADD COLUMN absorbance_uncertainty BYTEA;
