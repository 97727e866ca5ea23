package org.spectralsieve.search.text;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.Locale;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.apache.lucene.analysis.Analyzer;
import org.apache.lucene.analysis.TokenStream;
import org.apache.lucene.analysis.tokenattributes.CharTermAttribute;
import org.apache.lucene.facet.DrillDownQuery;
import org.apache.lucene.facet.DrillSideways;
import org.apache.lucene.facet.FacetResult;
import org.apache.lucene.facet.Facets;
import org.apache.lucene.facet.FacetsConfig;
import org.apache.lucene.facet.LabelAndValue;
import org.apache.lucene.facet.sortedset.DefaultSortedSetDocValuesReaderState;
import org.apache.lucene.facet.sortedset.SortedSetDocValuesReaderState;
import org.apache.lucene.index.DirectoryReader;
import org.apache.lucene.index.IndexWriter;
import org.apache.lucene.index.IndexWriterConfig;
import org.apache.lucene.index.Term;
import org.apache.lucene.search.BooleanClause;
import org.apache.lucene.search.BooleanQuery;
import org.apache.lucene.search.BoostQuery;
import org.apache.lucene.search.ConstantScoreQuery;
import org.apache.lucene.search.DisjunctionMaxQuery;
import org.apache.lucene.search.IndexSearcher;
import org.apache.lucene.search.MatchAllDocsQuery;
import org.apache.lucene.search.PrefixQuery;
import org.apache.lucene.search.Query;
import org.apache.lucene.search.ScoreDoc;
import org.apache.lucene.search.TermQuery;
import org.apache.lucene.store.ByteBuffersDirectory;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;

/**
 * One built, read-only text index of the library as read at one {@code generation}: replaced whole when
 * the library changes, never updated in place, so a query never sees half a change. Held in memory
 * ({@link ByteBuffersDirectory}); an old one is left to the garbage collector rather than closed, because a
 * query that started on it may still be reading.
 */
final class LibraryTextIndex {

    /** Values counted per facet dimension: more than any dimension has (classes are the widest, a few dozen). */
    private static final int FACET_VALUES = 100;

    private final IndexSearcher searcher;
    private final SortedSetDocValuesReaderState facetState; // null while the library is empty: no facets to read
    private final FacetsConfig config = LibraryIndexSchema.facetsConfig();
    private final Analyzer english = LibraryIndexSchema.analyzer();
    private final Analyzer typed = LibraryIndexSchema.typedWords();
    private final Map<Long, IndexedMaterial> materials;
    private final long generation;

    private LibraryTextIndex(DirectoryReader reader, Map<Long, IndexedMaterial> materials, long generation) throws IOException {
        this.searcher = new IndexSearcher(reader);
        this.facetState = reader.numDocs() == 0 ? null : new DefaultSortedSetDocValuesReaderState(reader, config);
        this.materials = materials;
        this.generation = generation;
    }

    /** Materials of equal score are listed in this order: by name as a reader sorts, whatever the database's collation. */
    private static final Comparator<IndexedMaterial> BY_NAME = Comparator
            .comparing((IndexedMaterial m) -> m.material().name().toLowerCase(Locale.ROOT))
            .thenComparingLong(m -> m.material().id());

    /** Indexes the materials, read at {@code generation}; documents go in {@link #BY_NAME} order, which ties keep. */
    static LibraryTextIndex build(List<IndexedMaterial> unordered, long generation) {
        List<IndexedMaterial> materials = unordered.stream().sorted(BY_NAME).toList();
        try {
            ByteBuffersDirectory directory = new ByteBuffersDirectory();
            FacetsConfig config = LibraryIndexSchema.facetsConfig();
            Map<Long, IndexedMaterial> byId = new LinkedHashMap<>();
            try (IndexWriter writer = new IndexWriter(directory, new IndexWriterConfig(LibraryIndexSchema.analyzer()))) {
                for (IndexedMaterial m : materials) {
                    writer.addDocument(config.build(LibraryIndexSchema.document(m)));
                    byId.put(m.material().id(), m);
                }
            }
            return new LibraryTextIndex(DirectoryReader.open(directory), Map.copyOf(byId), generation);
        } catch (IOException e) {
            throw new UncheckedIOException("the in-memory text index could not be built", e);
        }
    }

    long generation() {
        return generation;
    }

    /**
     * The ids of every material the words and chosen facet values admit (no limit): the candidates a
     * requirement written with words is judged on. Empty for an empty library.
     */
    Set<Long> admitted(LibraryQuery query) {
        if (facetState == null) {
            return Set.of();
        }
        try {
            DrillDownQuery drillDown = new DrillDownQuery(config, wordsQuery(query.words()));
            for (String dimension : LibraryIndexSchema.FACETS) {
                for (String value : query.chosen(dimension)) {
                    drillDown.add(dimension, value);
                }
            }
            Set<Long> ids = new HashSet<>();
            int all = Math.max(1, searcher.getIndexReader().maxDoc());
            for (ScoreDoc sd : searcher.search(drillDown, all).scoreDocs) {
                ids.add(searcher.storedFields().document(sd.doc).getField(LibraryIndexSchema.ID).numericValue().longValue());
            }
            return Set.copyOf(ids);
        } catch (IOException e) {
            throw new UncheckedIOException("the in-memory text index could not be read", e);
        }
    }

    LibraryAnswer search(LibraryQuery query) {
        if (facetState == null) {
            return new LibraryAnswer(0, List.of(), Map.of(), generation);
        }
        try {
            DrillDownQuery drillDown = new DrillDownQuery(config, wordsQuery(query.words()));
            for (String dimension : LibraryIndexSchema.FACETS) {
                for (String value : query.chosen(dimension)) {
                    drillDown.add(dimension, value);
                }
            }
            DrillSideways sideways = new DrillSideways(searcher, config, facetState);
            DrillSideways.DrillSidewaysResult result = sideways.search(drillDown, query.limit());
            List<LibraryAnswer.Hit> hits = new ArrayList<>();
            for (ScoreDoc sd : result.hits.scoreDocs) {
                long id = searcher.storedFields().document(sd.doc).getField(LibraryIndexSchema.ID).numericValue().longValue();
                IndexedMaterial indexed = materials.get(id);
                Material m = indexed.material();
                hits.add(new LibraryAnswer.Hit(m.id(), m.name(), m.materialClass().label(), sd.score,
                        matchingSamples(indexed, query)));
            }
            return new LibraryAnswer(searcher.count(drillDown), hits, counts(result.facets), generation);
        } catch (IOException e) {
            throw new UncheckedIOException("the in-memory text index could not be read", e);
        }
    }

    private static Map<String, List<LibraryAnswer.FacetCount>> counts(Facets facets) throws IOException {
        Map<String, List<LibraryAnswer.FacetCount>> out = new LinkedHashMap<>();
        for (String dimension : LibraryIndexSchema.FACETS) {
            List<LibraryAnswer.FacetCount> values = new ArrayList<>();
            FacetResult result = topChildren(facets, dimension);
            if (result != null) {
                for (LabelAndValue lv : result.labelValues) {
                    values.add(new LibraryAnswer.FacetCount(lv.label, lv.value.longValue()));
                }
            }
            out.put(dimension, values);
        }
        return out;
    }

    /** Null when no material has a value in the dimension (Lucene refuses a dimension it never saw). */
    private static FacetResult topChildren(Facets facets, String dimension) throws IOException {
        try {
            return facets.getTopChildren(FACET_VALUES, dimension);
        } catch (IllegalArgumentException neverIndexed) {
            return null;
        }
    }

    private static List<Long> matchingSamples(IndexedMaterial indexed, LibraryQuery query) {
        return indexed.material().samples().stream()
                .filter(s -> query.geometries().isEmpty() || query.geometries().contains(s.geometry()))
                .filter(s -> query.provenances().isEmpty() || query.provenances().contains(s.provenance()))
                .filter(s -> query.thicknessBands().isEmpty()
                        || query.thicknessBands().contains(LibraryIndexSchema.thicknessBand(s.thicknessMm())))
                .filter(s -> meetsSpectralChoices(indexed.summary(s.id()), query))
                .map(SampleInfo::id)
                .toList();
    }

    /** Whether a sample's summary has a chosen value in every spectral dimension with a choice (none: no curve, no). */
    private static boolean meetsSpectralChoices(SpectralSummary summary, LibraryQuery query) {
        for (String dimension : LibraryIndexSchema.SPECTRAL_FACETS) {
            if (!query.spectral(dimension).isEmpty()
                    && (summary == null || !query.spectral(dimension).contains(LibraryIndexSchema.spectralValue(summary, dimension)))) {
                return false;
            }
        }
        return true;
    }

    /**
     * Every typed word must match somewhere (each added word narrows): as a whole word, stemmed, in any
     * word field, or as the start of a word. Stop words are dropped; no words matches every material.
     *
     * <p>A word scores by where it is found (the field's weight), not by how rare it is there: the fields
     * are a few words long and BM25's frequency and length statistics over them follow accidents of the
     * library (a field only two materials fill looks "common"), so the ranking would not say why.
     */
    private Query wordsQuery(String words) throws IOException {
        List<String> tokens = tokens(typed, LibraryIndexSchema.TYPED, words);
        if (tokens.isEmpty()) {
            return new MatchAllDocsQuery();
        }
        BooleanQuery.Builder all = new BooleanQuery.Builder();
        for (String token : tokens) {
            List<Query> ways = new ArrayList<>();
            for (String stem : tokens(english, LibraryIndexSchema.NAME, token)) {
                for (LibraryIndexSchema.WeightedField field : LibraryIndexSchema.WORD_FIELDS) {
                    ways.add(new BoostQuery(new ConstantScoreQuery(new TermQuery(new Term(field.name(), stem))),
                            field.weight()));
                }
            }
            ways.add(new BoostQuery(new PrefixQuery(new Term(LibraryIndexSchema.TYPED, token)),
                    LibraryIndexSchema.PREFIX_WEIGHT));
            // the best way a word matches counts, plus a little for each other field it is in
            all.add(new DisjunctionMaxQuery(ways, 0.1f), BooleanClause.Occur.MUST);
        }
        return all.build();
    }

    private static List<String> tokens(Analyzer analyzer, String field, String text) throws IOException {
        List<String> out = new ArrayList<>();
        try (TokenStream stream = analyzer.tokenStream(field, text)) {
            CharTermAttribute term = stream.addAttribute(CharTermAttribute.class);
            stream.reset();
            while (stream.incrementToken()) {
                out.add(term.toString());
            }
            stream.end();
        }
        return out;
    }
}
