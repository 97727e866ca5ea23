package org.spectralsieve.search;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.AbstractList;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.apache.lucene.index.DirectoryReader;
import org.apache.lucene.index.IndexWriter;
import org.apache.lucene.store.ByteBuffersDirectory;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.search.vector.CurveVectorIndex;
import org.spectralsieve.search.vector.CurveVectorSearcher;
import org.spectralsieve.search.vector.VectorFilter;
import org.spectralsieve.similarity.CurveSignature;
import org.spectralsieve.similarity.SimilarCurves;
import org.spectralsieve.store.SpectralStore;

/**
 * The vector index of one spectral store, in memory, built once per store (the store is replaced whole when
 * the library changes, so the index never lags it). It nominates {@link CurveVectorSearcher#candidatesFor}
 * candidates; {@link SimilarSamples} ranks them exactly.
 */
final class SimilarCandidates {

    private final CurveVectorSearcher searcher;

    private SimilarCandidates(CurveVectorSearcher searcher) {
        this.searcher = searcher;
    }

    /** {@code signed}: the store's curves as candidates, in curve order (id = sample id). */
    static SimilarCandidates build(SpectralStore store, List<SimilarCurves.Candidate> signed) {
        List<CurveVectorIndex.Entry> entries = new AbstractList<>() {
            @Override
            public CurveVectorIndex.Entry get(int curve) {
                // provenance is not in the store: a provenance filter needs the database's index (later)
                return new CurveVectorIndex.Entry(store.sampleId(curve), signed.get(curve).signature(),
                        store.material(curve).materialClass(), (store.isTotalGeometry(curve) ? Geometry.TOTAL : Geometry.REGULAR).label(), null);
            }

            @Override
            public int size() {
                return store.size();
            }
        };
        try {
            ByteBuffersDirectory directory = new ByteBuffersDirectory();
            try (IndexWriter writer = new IndexWriter(directory, CurveVectorIndex.writerConfig(CurveVectorIndex.Storage.FLOAT))) {
                CurveVectorIndex.write(writer, entries);
            }
            return new SimilarCandidates(new CurveVectorSearcher(DirectoryReader.open(directory)));
        } catch (IOException e) {
            throw new UncheckedIOException("the in-memory similar-curves index could not be built", e);
        }
    }

    /** The nominated candidates for {@code limit} hits, nearest vector first. */
    List<SimilarCurves.Candidate> nominate(CurveSignature query, int limit, List<SimilarCurves.Candidate> signed,
            Map<Long, Integer> curveOfSample) {
        return nominate(query, limit, VectorFilter.NONE, signed, curveOfSample);
    }

    /** As above, among the curves {@code filter} admits only (Lucene filters the graph search itself). */
    List<SimilarCurves.Candidate> nominate(CurveSignature query, int limit, VectorFilter filter,
            List<SimilarCurves.Candidate> signed, Map<Long, Integer> curveOfSample) {
        long[] ids = searcher.nearest(query, CurveVectorSearcher.candidatesFor(limit), filter);
        List<SimilarCurves.Candidate> out = new ArrayList<>(ids.length);
        for (long id : ids) {
            out.add(signed.get(curveOfSample.get(id)));
        }
        return out;
    }
}
