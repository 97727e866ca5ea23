/**
 * Loads the illustrative demo library ({@code seed-materials/}: {@code catalogue.json} and
 * {@code curves/*.csv}) on first start, through the same importers as a user's files, when the library is
 * empty. Settings: {@code sieve.seed.load-on-empty} (default true) and {@code sieve.seed.location}
 * (default {@code classpath:seed-materials/}). How the demo curves were made: {@code seedmodel}.
 */
package org.spectralsieve.seed;
