-- Which sample a change of the counter concerned, when the write changed one sample's rows and nothing else of its
-- material (an import into an existing material, a sample added, corrected, retired or restored): the search store
-- then reads that sample again instead of its material's every sample (docs/search-under-load.md, ninth pass).
-- NULL when the write concerned the material as a whole (new, corrected, retired, restored), several samples at
-- once, or no material; rows written before this column existed are NULL too, which reads the material whole.
ALTER TABLE library_change ADD COLUMN sample_id BIGINT;
