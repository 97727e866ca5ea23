/**
 * The stored library: domain records ({@code Material}, {@code SampleInfo}, {@code SampleCurve}, …) and
 * {@link org.spectralsieve.library.JooqLibraryRepository}, the only code that reads or writes its tables.
 *
 * <p>The database is the single source of truth. A curve is one row of packed little-endian float64 arrays
 * ({@link org.spectralsieve.library.PackedArrays}), so it round-trips bit-exact and loads in one read. The
 * jOOQ classes in {@code library.db} are generated at build time from the Flyway migrations on H2 (never
 * committed); {@link org.spectralsieve.library.LibraryConfiguration} renders names unquoted so the same
 * model serves PostgreSQL, which folds names to lower case where H2 keeps upper case. Schema: the
 * top-level {@code migrations/} folder, the only source of it. Units: thickness in mm, wavelengths in nm,
 * transmittance as fractions.
 */
package org.spectralsieve.library;
