package org.spectralsieve.search.text;

import java.util.Collection;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.TreeSet;
import org.apache.lucene.analysis.Analyzer;
import org.apache.lucene.analysis.LowerCaseFilter;
import org.apache.lucene.analysis.StopFilter;
import org.apache.lucene.analysis.TokenStream;
import org.apache.lucene.analysis.en.EnglishAnalyzer;
import org.apache.lucene.analysis.miscellaneous.PerFieldAnalyzerWrapper;
import org.apache.lucene.analysis.standard.StandardTokenizer;
import org.apache.lucene.document.Document;
import org.apache.lucene.document.Field;
import org.apache.lucene.document.NumericDocValuesField;
import org.apache.lucene.document.SortedDocValuesField;
import org.apache.lucene.document.StringField;
import org.apache.lucene.document.StoredField;
import org.apache.lucene.document.TextField;
import org.apache.lucene.facet.FacetsConfig;
import org.apache.lucene.facet.sortedset.SortedSetDocValuesFacetField;
import org.apache.lucene.index.Term;
import org.apache.lucene.util.BytesRef;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;

/**
 * The one place that says what the library's text index holds: one document per material in use, carrying
 * its own words and the words of its samples in use. The index is derived from the database and holds
 * nothing the database does not (docs/library-search.md).
 *
 * <p>Every word field is analysed as English (lower case, English stop words, Porter stems), so
 * {@code sheets} finds {@code sheet}; {@link #TYPED} repeats all of them without stems so that a word still
 * being typed matches as a prefix ({@code acryl} finds {@code acrylic}, {@code polycarb} finds
 * {@code polycarbonate}), which a stem cannot promise.
 */
public final class LibraryIndexSchema {

    /**
     * The layout of the fields below. Raise it whenever a field is added, removed, renamed or analysed
     * differently: an index on disk stamped with another version is rebuilt (docs/index-on-disk.md).
     */
    public static final int VERSION = 3;

    /** Stored only: the hit names its material by id, and nothing searches by it (the database does). */
    static final String ID = "id";
    /** Indexed whole, not stored: an update deletes the material's document by this term. */
    static final String ID_KEY = "id_key";
    /** Sorted doc values, the name in lower case: ties in score are listed by name, however documents were added. */
    static final String SORT_NAME = "sort_name";
    /** Numeric doc values: the last tie-break, by id, so equal names keep a stable order too. */
    static final String SORT_ID = "sort_id";
    /** Stored only: the hit's name, so that an answer is read from the index alone (no database read per hit). */
    static final String HIT_NAME = "hit_name";
    /** Stored only: the hit's class label, for the same reason. */
    static final String HIT_CLASS = "hit_class";
    /**
     * Stored only, one per sample in use: id, geometry, provenance, thickness and spectral-summary values, to
     * list the samples a hit matches.
     */
    static final String HIT_SAMPLE = "hit_sample";

    /** English text, boosted most: the words a user remembers a stock by. */
    static final String NAME = "name";
    /** English text, not a keyword: {@code glass} should find both "window glass" and "optical glass". */
    static final String CLASS_WORDS = "class";
    /** English text, one value per tag: tags are short user words, searched like any other word. */
    static final String TAGS = "tags";
    /** English text: free prose about the stock. */
    static final String DESCRIPTION = "description";
    /** English text, one value per sample: free prose about each measurement. */
    static final String NOTES = "notes";
    /** English text, one value per sample: "measured", "datasheet", "modelled" are words a user types too. */
    static final String PROVENANCE_WORDS = "provenance";
    /** English text, one value per sample: instrument names are several words ("bench spectrometer"). */
    static final String INSTRUMENT = "instrument";
    /** English text, one value per sample: a lot mark is split into its parts, so "2291" finds "L-2291". */
    static final String LOT = "lot";
    /**
     * Text of the thicknesses ({@code 3 mm}), one value per sample and stated stock size: a user types
     * "3 mm"; a number range is asked through the {@link #THICKNESS_FACET} bands instead.
     */
    static final String THICKNESS_WORDS = "thickness";
    /** Every word field again, lower-cased but not stemmed: the field prefix queries run on. */
    static final String TYPED = "typed";

    /** The word fields a typed word is looked up in, each with its weight: the name counts most. */
    static final List<WeightedField> WORD_FIELDS = List.of(
            new WeightedField(NAME, 4f), new WeightedField(CLASS_WORDS, 2f), new WeightedField(TAGS, 2f),
            new WeightedField(DESCRIPTION, 1f), new WeightedField(NOTES, 1f), new WeightedField(PROVENANCE_WORDS, 1f),
            new WeightedField(INSTRUMENT, 1f), new WeightedField(LOT, 1f), new WeightedField(THICKNESS_WORDS, 1f));

    /** Weight of a prefix match: below any whole word, so finished words rank above half-typed guesses. */
    static final float PREFIX_WEIGHT = 0.5f;

    /** Facet dimension, one value per material (sorted-set doc values: counted without a taxonomy index). */
    public static final String CLASS_FACET = "class";
    /** Facet dimension, one value per distinct sample geometry (multi-valued: a material may have both). */
    public static final String GEOMETRY_FACET = "geometry";
    /** Facet dimension, one value per distinct sample provenance (multi-valued). */
    public static final String PROVENANCE_FACET = "provenance";
    /** Facet dimension, one band per sample thickness and stated stock size (multi-valued). */
    public static final String THICKNESS_FACET = "thickness";

    /**
     * Facet dimension, the band of each sample's UV edge (cutoff wavelength at 50 %) on its stored curve
     * (multi-valued: samples at other thicknesses or of other lots differ); values {@link SpectralSummary#EDGE_BANDS}.
     */
    public static final String EDGE_FACET = "edge";
    /** Facet dimension, the band of each sample's luminous transmittance τv (multi-valued, like the edge). */
    public static final String LUMINOUS_FACET = "luminous";
    /** Facet dimensions, whether each sample passes, partly passes or blocks 254 / 365 / 405 nm (multi-valued). */
    public static final String AT_254_FACET = "at254";
    public static final String AT_365_FACET = "at365";
    public static final String AT_405_FACET = "at405";
    /** The dimensions read from the samples' curves ({@link SpectralSummary}), in the order the page shows them. */
    public static final List<String> SPECTRAL_FACETS = List.of(EDGE_FACET, LUMINOUS_FACET, AT_254_FACET, AT_365_FACET,
            AT_405_FACET);

    public static final List<String> FACETS = List.of(CLASS_FACET, GEOMETRY_FACET, PROVENANCE_FACET, THICKNESS_FACET,
            EDGE_FACET, LUMINOUS_FACET, AT_254_FACET, AT_365_FACET, AT_405_FACET);

    record WeightedField(String name, float weight) {
    }

    private LibraryIndexSchema() {
    }

    static FacetsConfig facetsConfig() {
        FacetsConfig config = new FacetsConfig();
        config.setMultiValued(GEOMETRY_FACET, true);
        config.setMultiValued(PROVENANCE_FACET, true);
        config.setMultiValued(THICKNESS_FACET, true);
        SPECTRAL_FACETS.forEach(dimension -> config.setMultiValued(dimension, true));
        return config;
    }

    /** English for the word fields, unstemmed words for {@link #TYPED}. */
    static Analyzer analyzer() {
        return new PerFieldAnalyzerWrapper(new EnglishAnalyzer(), java.util.Map.of(TYPED, typedWords()));
    }

    /** The same tokens and stop words as the English analyzer, without stems. */
    static Analyzer typedWords() {
        return new Analyzer() {
            @Override
            protected TokenStreamComponents createComponents(String fieldName) {
                StandardTokenizer source = new StandardTokenizer();
                TokenStream words = new StopFilter(new LowerCaseFilter(source), EnglishAnalyzer.ENGLISH_STOP_WORDS_SET);
                return new TokenStreamComponents(source, words);
            }
        };
    }

    /**
     * The thickness band a sheet falls in. The bands follow how a workshop shelves stock — films and foils
     * under 1 mm, thin sheet, the common 3–6 mm sheet and glazing, thick plate (common practice, no source).
     */
    public static String thicknessBand(double mm) {
        if (mm < 1) {
            return "under 1 mm";
        }
        if (mm < 3) {
            return "1-3 mm";
        }
        if (mm < 6) {
            return "3-6 mm";
        }
        return "6 mm and over";
    }

    /** The bands in shelf order, the values {@link #THICKNESS_FACET} may take. */
    public static final List<String> THICKNESS_BANDS = List.of("under 1 mm", "1-3 mm", "3-6 mm", "6 mm and over");

    /** The band of that label, or a refusal naming the labels there are. */
    public static String thicknessBandNamed(String label) {
        String band = label.strip();
        if (!THICKNESS_BANDS.contains(band)) {
            throw new IllegalArgumentException("thickness band '" + label + "' is not one of " + THICKNESS_BANDS);
        }
        return band;
    }

    /** The values a spectral facet dimension may take, in the order the page lists them. */
    public static List<String> spectralValues(String dimension) {
        return switch (dimension) {
            case EDGE_FACET -> SpectralSummary.EDGE_BANDS;
            case LUMINOUS_FACET -> SpectralSummary.LUMINOUS_BANDS;
            case AT_254_FACET, AT_365_FACET, AT_405_FACET -> SpectralSummary.AT_VALUES;
            default -> throw new IllegalArgumentException("no spectral facet " + dimension);
        };
    }

    /** The value of that spectral dimension, or a refusal naming the values there are. */
    public static String spectralValueNamed(String dimension, String value) {
        String v = value.strip();
        if (!spectralValues(dimension).contains(v)) {
            throw new IllegalArgumentException(dimension + " '" + value + "' is not one of " + spectralValues(dimension));
        }
        return v;
    }

    /** The value a sample's summary gives in a spectral dimension. */
    static String spectralValue(SpectralSummary summary, String dimension) {
        return switch (dimension) {
            case EDGE_FACET -> summary.edge();
            case LUMINOUS_FACET -> summary.luminous();
            case AT_254_FACET -> summary.at254();
            case AT_365_FACET -> summary.at365();
            case AT_405_FACET -> summary.at405();
            default -> throw new IllegalArgumentException("no spectral facet " + dimension);
        };
    }

    /**
     * The material's document, before {@link FacetsConfig#build} turns its facet fields into doc values: a
     * function of its input alone (the material, and the summaries of its samples' curves).
     */
    static Document document(IndexedMaterial input) {
        Material m = input.material();
        Document doc = new Document();
        doc.add(new StoredField(ID, m.id()));
        keyAndHitFields(doc, input);
        words(doc, NAME, List.of(m.name()));
        words(doc, CLASS_WORDS, List.of(m.materialClass().label()));
        words(doc, TAGS, m.tags());
        words(doc, DESCRIPTION, List.of(m.description()));
        List<SampleInfo> samples = m.samples();
        words(doc, NOTES, samples.stream().map(SampleInfo::notes).toList());
        words(doc, PROVENANCE_WORDS, samples.stream().map(s -> s.provenance().label()).distinct().toList());
        words(doc, INSTRUMENT, samples.stream().map(SampleInfo::instrument).distinct().toList());
        words(doc, LOT, samples.stream().map(SampleInfo::lot).distinct().toList());
        Set<Double> thicknesses = new TreeSet<>(m.thicknesses().stockMm());
        samples.forEach(s -> thicknesses.add(s.thicknessMm()));
        words(doc, THICKNESS_WORDS, thicknesses.stream().map(LibraryIndexSchema::millimetres).toList());

        doc.add(new SortedSetDocValuesFacetField(CLASS_FACET, m.materialClass().label()));
        facets(doc, GEOMETRY_FACET, samples.stream().map(s -> s.geometry().label()).toList());
        facets(doc, PROVENANCE_FACET, samples.stream().map(s -> s.provenance().label()).toList());
        facets(doc, THICKNESS_FACET, thicknesses.stream().map(LibraryIndexSchema::thicknessBand).toList());
        for (String dimension : SPECTRAL_FACETS) {
            facets(doc, dimension, input.summaries().values().stream().map(s -> spectralValue(s, dimension)).toList());
        }
        return doc;
    }

    /** The term an update deletes the material's document by. */
    static Term idTerm(long materialId) {
        return new Term(ID_KEY, Long.toString(materialId));
    }

    private static void keyAndHitFields(Document doc, IndexedMaterial input) {
        Material m = input.material();
        doc.add(new StringField(ID_KEY, Long.toString(m.id()), Field.Store.NO));
        doc.add(new SortedDocValuesField(SORT_NAME, new BytesRef(m.name().toLowerCase(Locale.ROOT))));
        doc.add(new NumericDocValuesField(SORT_ID, m.id()));
        doc.add(new StoredField(HIT_NAME, m.name()));
        doc.add(new StoredField(HIT_CLASS, m.materialClass().label()));
        for (SampleInfo s : m.samples()) {
            SpectralSummary summary = input.summary(s.id());
            List<String> spectral = SPECTRAL_FACETS.stream()
                    .map(dimension -> summary == null ? "" : spectralValue(summary, dimension)).toList();
            doc.add(new StoredField(HIT_SAMPLE, new StoredSample(s.id(), s.geometry().label(), s.provenance().label(),
                    s.thicknessMm(), spectral).encoded()));
        }
    }

    /**
     * A sample in use as a hit lists it: what the sample facets are matched against. {@code spectral} holds
     * its value in each of {@link #SPECTRAL_FACETS}, in that order, or "" for each when its curve could not
     * be read (it then matches no spectral choice).
     */
    record StoredSample(long id, String geometry, String provenance, double thicknessMm, List<String> spectral) {

        StoredSample {
            spectral = List.copyOf(spectral);
        }

        /** Its value in a spectral dimension ("" without a readable curve). */
        String spectralValue(String dimension) {
            return spectral.get(SPECTRAL_FACETS.indexOf(dimension));
        }

        String encoded() {
            return id + "\t" + geometry + "\t" + provenance + "\t" + thicknessMm + "\t" + String.join("\t", spectral);
        }

        static StoredSample decoded(String stored) {
            String[] parts = stored.split("\t", -1);
            return new StoredSample(Long.parseLong(parts[0]), parts[1], parts[2], Double.parseDouble(parts[3]),
                    List.of(parts).subList(4, parts.length));
        }
    }

    /** 3.0 → "3 mm", 0.175 → "0.175 mm": the way a thickness is written and typed. */
    static String millimetres(double mm) {
        String number = mm == Math.rint(mm) ? Long.toString((long) mm) : String.format(Locale.ROOT, "%s", mm);
        return number + " mm";
    }

    private static void words(Document doc, String field, Collection<String> values) {
        for (String value : values) {
            if (value != null && !value.isBlank()) {
                doc.add(new TextField(field, value, Field.Store.NO));
                doc.add(new TextField(TYPED, value, Field.Store.NO));
            }
        }
    }

    private static void facets(Document doc, String dimension, Collection<String> values) {
        new TreeSet<>(values).forEach(v -> doc.add(new SortedSetDocValuesFacetField(dimension, v)));
    }
}
