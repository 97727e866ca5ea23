package org.spectralsieve.search.text;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.Arrays;
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
import org.apache.lucene.document.Document;
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
import org.apache.lucene.index.StoredFields;
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
import org.apache.lucene.search.Sort;
import org.apache.lucene.search.SortField;
import org.apache.lucene.search.TermQuery;
import org.apache.lucene.store.ByteBuffersDirectory;

/**
 * One read-only view of the library's text index, as committed at one {@code generation}: a query never sees
 * half a change, because {@link LibraryTextSearch} commits the documents of a change together with its number
 * and only then opens a new view. The view's reader is counted: the view installed for new queries holds one
 * reference, each query one more while it reads ({@link #tryAcquire}, {@link #release}), so a view replaced
 * while a query reads it is closed when that query ends.
 *
 * <p>A hit is read from the index alone (stored fields), so a view answers for exactly the library it was
 * built from, whether that was built by this process or found on disk at start.
 */
final class LibraryTextIndex {

    /** Values counted per facet dimension: more than any dimension has (classes are the widest, a few dozen). */
    private static final int FACET_VALUES = 100;

    /**
     * Best score first; equal scores by name as a reader sorts, then id. Scores are constant per field
     * (see {@link #wordsQuery}), so they do not depend on which documents share a segment, and an index
     * updated change by change lists exactly what a fresh rebuild lists.
     */
    private static final Sort ORDER = new Sort(SortField.FIELD_SCORE,
            new SortField(LibraryIndexSchema.SORT_NAME, SortField.Type.STRING),
            new SortField(LibraryIndexSchema.SORT_ID, SortField.Type.LONG));

    private final DirectoryReader reader;
    private final IndexSearcher searcher;
    private final SortedSetDocValuesReaderState facetState; // null while the library is empty: no facets to read
    private final FacetsConfig config = LibraryIndexSchema.facetsConfig();
    private final Analyzer english = LibraryIndexSchema.analyzer();
    private final Analyzer typed = LibraryIndexSchema.typedWords();
    private final long generation;

    /** Takes over the caller's reference to {@code reader}: released when this view is replaced and unused. */
    LibraryTextIndex(DirectoryReader reader, long generation) throws IOException {
        this.reader = reader;
        this.searcher = new IndexSearcher(reader);
        this.facetState = reader.numDocs() == 0 ? null : new DefaultSortedSetDocValuesReaderState(reader, config);
        this.generation = generation;
    }

    /** Materials of equal score are listed in this order: by name as a reader sorts, whatever the database's collation. */
    private static final Comparator<IndexedMaterial> BY_NAME = Comparator
            .comparing((IndexedMaterial m) -> m.material().name().toLowerCase(Locale.ROOT))
            .thenComparingLong(m -> m.material().id());

    /** Indexes the materials, read at {@code generation}, in memory (a view of its own, nothing kept on disk). */
    static LibraryTextIndex build(List<IndexedMaterial> unordered, long generation) {
        try {
            ByteBuffersDirectory directory = new ByteBuffersDirectory();
            try (IndexWriter writer = new IndexWriter(directory, writerConfig())) {
                addAll(writer, unordered);
            }
            return new LibraryTextIndex(DirectoryReader.open(directory), generation);
        } catch (IOException e) {
            throw new UncheckedIOException("the in-memory text index could not be built", e);
        }
    }

    /** The writer settings of the text index, on disk or in memory. */
    static IndexWriterConfig writerConfig() {
        return new IndexWriterConfig(LibraryIndexSchema.analyzer());
    }

    /** Adds one document per material (in {@link #BY_NAME} order, so a rebuilt index reads in name order). */
    static void addAll(IndexWriter writer, List<IndexedMaterial> materials) throws IOException {
        FacetsConfig config = LibraryIndexSchema.facetsConfig();
        for (IndexedMaterial m : materials.stream().sorted(BY_NAME).toList()) {
            writer.addDocument(config.build(LibraryIndexSchema.document(m)));
        }
    }

    /**
     * Replaces the documents of the changed materials: deleted, and added again for those still in use
     * ({@code inUse}); uncommitted until the caller commits.
     */
    static void replace(IndexWriter writer, java.util.Collection<Long> changed, List<IndexedMaterial> inUse)
            throws IOException {
        for (long id : changed) {
            writer.deleteDocuments(LibraryIndexSchema.idTerm(id)); // applies to documents added before it only
        }
        addAll(writer, inUse);
    }

    long generation() {
        return generation;
    }

    /** One more reference for a query, or false when this view was closed meanwhile (replaced and unused). */
    boolean tryAcquire() {
        return reader.tryIncRef();
    }

    /** Gives back a query's reference (or, once, the installed view's). */
    void release() {
        try {
            reader.decRef();
        } catch (IOException e) {
            throw new UncheckedIOException("the text index view could not be closed", e);
        }
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
            StoredFields stored = searcher.storedFields();
            for (ScoreDoc sd : searcher.search(drillDown, all).scoreDocs) {
                ids.add(stored.document(sd.doc).getField(LibraryIndexSchema.ID).numericValue().longValue());
            }
            return Set.copyOf(ids);
        } catch (IOException e) {
            throw new UncheckedIOException("the text index could not be read", e);
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
            DrillSideways.DrillSidewaysResult result = sideways.search(drillDown, null, null, query.limit(), ORDER, true);
            List<LibraryAnswer.Hit> hits = new ArrayList<>();
            StoredFields stored = searcher.storedFields();
            for (ScoreDoc sd : result.hits.scoreDocs) {
                Document doc = stored.document(sd.doc);
                hits.add(new LibraryAnswer.Hit(doc.getField(LibraryIndexSchema.ID).numericValue().longValue(),
                        doc.get(LibraryIndexSchema.HIT_NAME), doc.get(LibraryIndexSchema.HIT_CLASS), sd.score,
                        matchingSamples(doc.getValues(LibraryIndexSchema.HIT_SAMPLE), query)));
            }
            return new LibraryAnswer(searcher.count(drillDown), hits, counts(result.facets), generation);
        } catch (IOException e) {
            throw new UncheckedIOException("the text index could not be read", e);
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

    private static List<Long> matchingSamples(String[] stored, LibraryQuery query) {
        List<String> geometries = query.chosen(LibraryIndexSchema.GEOMETRY_FACET);
        List<String> provenances = query.chosen(LibraryIndexSchema.PROVENANCE_FACET);
        return Arrays.stream(stored).map(LibraryIndexSchema.StoredSample::decoded)
                .filter(s -> geometries.isEmpty() || geometries.contains(s.geometry()))
                .filter(s -> provenances.isEmpty() || provenances.contains(s.provenance()))
                .filter(s -> query.thicknessBands().isEmpty()
                        || query.thicknessBands().contains(LibraryIndexSchema.thicknessBand(s.thicknessMm())))
                .filter(s -> meetsSpectralChoices(s, query))
                .map(LibraryIndexSchema.StoredSample::id)
                .toList();
    }

    /** Whether a sample has a chosen value in every spectral dimension with a choice (no readable curve: no). */
    private static boolean meetsSpectralChoices(LibraryIndexSchema.StoredSample sample, LibraryQuery query) {
        for (String dimension : LibraryIndexSchema.SPECTRAL_FACETS) {
            if (!query.spectral(dimension).isEmpty() && !query.spectral(dimension).contains(sample.spectralValue(dimension))) {
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
