-- Bookkeeping for indexes derived from the library and kept on disk (the Lucene text index; docs/index-on-disk.md).
-- Neither table is library content: a backup leaves both out, and a restore leaves them to the target database.

-- Which database this is. An index on disk records the identity it was built from, because two databases can
-- stand at the same change counter (two test databases, a restored backup, a database file replaced under an
-- old index folder): the counter alone cannot tell their indexes apart. One row, written by the first process
-- that needs it (a random UUID made in Java: H2 and PostgreSQL have no common function for one).
CREATE TABLE library_identity (
    id    INTEGER     PRIMARY KEY,
    uuid  VARCHAR(36) NOT NULL,
    CONSTRAINT library_identity_one_row CHECK (id = 1)
);

-- Which material each change of the counter (library_generation.n) concerned, written in the same transaction
-- as the raise, so an index built at generation g can bring itself to generation h by re-indexing only the
-- materials of the changes g+1..h. A ring of slots (slot = generation modulo the ring's size, 10000): a row is
-- overwritten by the change 10000 later, so the log stays bounded without deleting rows. A change that
-- concerns no material (an imported emitter or response) has material_id NULL; a generation with no row here
-- (a path that raises the counter without saying what it changed, a restore, a row overwritten since) cannot
-- be explained, and the index is then rebuilt whole.
CREATE TABLE library_change (
    slot         INTEGER PRIMARY KEY,
    generation   BIGINT  NOT NULL,
    material_id  BIGINT,
    CONSTRAINT library_change_slot_not_negative CHECK (slot >= 0)
);

CREATE INDEX library_change_by_generation ON library_change (generation);
