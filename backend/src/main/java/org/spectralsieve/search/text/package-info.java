/**
 * Words and facets over the library: a Lucene index with one document per material in use
 * ({@link org.spectralsieve.search.text.LibraryIndexSchema} says what each field holds and why), kept in a
 * folder ({@code sieve.index.dir}) or in memory, and brought up to date from the database when the library's
 * change counter moves ({@link org.spectralsieve.search.text.LibraryTextSearch}, docs/index-on-disk.md);
 * facets are counted drill-sideways, so a value chosen in one dimension leaves that dimension's other counts
 * visible. Spectral-summary facets (UV edge band, τv band, 254 / 365 / 405 nm) come from each sample's stored
 * curve ({@link org.spectralsieve.search.text.SpectralSummary}, a pure function). An edge package: Lucene never
 * enters the core. Detail: {@code docs/library-search.md}.
 */
package org.spectralsieve.search.text;
