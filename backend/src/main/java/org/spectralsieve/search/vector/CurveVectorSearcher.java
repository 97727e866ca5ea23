package org.spectralsieve.search.vector;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.List;
import java.util.Set;
import org.apache.lucene.index.IndexReader;
import org.apache.lucene.index.LeafReaderContext;
import org.apache.lucene.index.NumericDocValues;
import org.apache.lucene.index.ReaderUtil;
import org.apache.lucene.search.BooleanClause;
import org.apache.lucene.search.BooleanQuery;
import org.apache.lucene.search.IndexSearcher;
import org.apache.lucene.search.KnnFloatVectorQuery;
import org.apache.lucene.search.Query;
import org.apache.lucene.search.ScoreDoc;
import org.apache.lucene.search.TermInSetQuery;
import org.apache.lucene.search.TopDocs;
import org.apache.lucene.util.BytesRef;
import org.spectralsieve.similarity.CurveSignature;

/**
 * Nominates the samples whose index vectors are nearest a query's, by Lucene's HNSW search over one
 * {@link IndexReader}. Approximate twice over (the graph, and the vector standing in for the exact metric):
 * its answer is a candidate set for the exact ranking, never the ranking.
 */
public final class CurveVectorSearcher {

    private final IndexSearcher searcher;

    public CurveVectorSearcher(IndexReader reader) {
        // no executor: one query runs on the calling thread; a 2-core box serves several requests at once
        this.searcher = new IndexSearcher(reader);
        this.searcher.setQueryCache(null); // filters differ per request; caching them costs more than it saves
    }

    /**
     * How many candidates the exact ranking gets for {@code limit} hits: twenty times the limit, at least 400.
     * The exact top ten is a dense neighbourhood (its 10th and 11th distances differ by a few per cent) that the
     * vector orders only roughly, and on a million curves the graph's own top ten of 200 held 0.93 of the true
     * nearest vectors, of 400 0.96 (docs/similar-curves.md). 400 exact distances cost about two milliseconds.
     */
    public static int candidatesFor(int limit) {
        return Math.max(400, 20 * limit);
    }

    public int size() {
        return searcher.getIndexReader().numDocs();
    }

    /** The sample ids of the {@code k} nearest vectors passing {@code filter}, nearest first. */
    public long[] nearest(CurveSignature query, int k, VectorFilter filter) {
        return nearest(CurveVectors.of(query), k, filter);
    }

    public long[] nearest(float[] vector, int k, VectorFilter filter) {
        try {
            TopDocs top = searcher.search(new KnnFloatVectorQuery(CurveVectorIndex.VECTOR, vector, k, filter(filter)), k);
            long[] ids = new long[top.scoreDocs.length];
            List<LeafReaderContext> leaves = searcher.getIndexReader().leaves();
            for (int n = 0; n < ids.length; n++) {
                ScoreDoc sd = top.scoreDocs[n];
                LeafReaderContext leaf = leaves.get(ReaderUtil.subIndex(sd.doc, leaves));
                NumericDocValues sample = leaf.reader().getNumericDocValues(CurveVectorIndex.SAMPLE);
                if (sample == null || !sample.advanceExact(sd.doc - leaf.docBase)) {
                    throw new IllegalStateException("vector document " + sd.doc + " has no sample id");
                }
                ids[n] = sample.longValue();
            }
            return ids;
        } catch (IOException e) {
            throw new UncheckedIOException("the similar-curves vector index could not be read", e);
        }
    }

    private static Query filter(VectorFilter filter) {
        if (filter == null || filter.isEmpty()) {
            return null;
        }
        BooleanQuery.Builder all = new BooleanQuery.Builder();
        add(all, CurveVectorIndex.CLASS, filter.classes());
        add(all, CurveVectorIndex.GEOMETRY, filter.geometries());
        add(all, CurveVectorIndex.PROVENANCE, filter.provenances());
        return all.build();
    }

    private static void add(BooleanQuery.Builder all, String field, Set<String> values) {
        if (!values.isEmpty()) {
            all.add(new TermInSetQuery(field, values.stream().sorted().map(BytesRef::new).toList()), BooleanClause.Occur.FILTER);
        }
    }
}
