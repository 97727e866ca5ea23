-- The library's change counter: one row whose number every write transaction raises (materials,
-- samples, curves, source files, imported reference spectra), in the same transaction as its rows.
-- Each process keeps derived in-memory copies (the search store, the imported emitters and responses);
-- before answering from them it reads this one row and rebuilds when the number moved, so a change made
-- by another process on the same database (a command-line import while the server runs, another
-- application node on PostgreSQL) is seen by the next search. The UPDATE n = n + 1 takes the row's lock,
-- so concurrent writers are serialised on it and no two commits leave the same number.

CREATE TABLE library_generation (
    id  INTEGER PRIMARY KEY,
    n   BIGINT  NOT NULL,
    CONSTRAINT library_generation_one_row CHECK (id = 1),
    CONSTRAINT library_generation_not_negative CHECK (n >= 0)
);

INSERT INTO library_generation (id, n) VALUES (1, 0);
