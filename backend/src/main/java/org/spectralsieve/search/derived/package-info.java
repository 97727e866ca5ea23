/**
 * How an index derived from the library is kept, whatever it indexes: in a folder on disk (or in memory),
 * stamped in each commit with the library generation, the database's identity and the index's schema
 * version, and judged against the database before use — fresh, behind (update from the change log) or to be
 * rebuilt. An edge package (Lucene). Detail: {@code docs/index-on-disk.md}.
 */
package org.spectralsieve.search.derived;
