package org.spectralsieve.seed;

import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.StringReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.jooq.DSLContext;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.spectralsieve.importers.DelimitedTextReader;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.ParsedSpectrum;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.ingest.CurveIngest;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.ingest.StateFields;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.MaterialClass;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.NewStateCurve;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.RefractiveIndexJson;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.library.StatedThicknessesJson;
import org.spectralsieve.states.MaterialState;
import org.springframework.core.io.Resource;
import org.springframework.core.io.ResourceLoader;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Loads the demo library from {@code seed-materials/}: the catalogue names materials and samples, and
 * every curve file goes through the same reader as a user's import. Each material and its samples are
 * stored in one transaction, so a broken entry leaves nothing behind.
 */
public class DemoLibraryLoader {

    private static final Logger log = LoggerFactory.getLogger(DemoLibraryLoader.class);

    private final JooqLibraryRepository library;
    private final DSLContext db;
    private final ResourceLoader resources;
    private final String location;

    public DemoLibraryLoader(JooqLibraryRepository library, DSLContext db, ResourceLoader resources, String location) {
        this.library = library;
        this.db = db;
        this.resources = resources;
        this.location = location.endsWith("/") ? location : location + "/";
    }

    /**
     * Stores the whole catalogue in one transaction: one commit (one write of the H2 file) instead of one per
     * material, and a start interrupted half way leaves an empty library, which the next start loads again
     * (a partly loaded one would count as not empty and never be completed).
     *
     * @return the number of samples stored
     */
    public int load() {
        JsonNode catalogue = readCatalogue();
        int samples = db.transactionResult(tx -> {
            int stored = 0;
            for (JsonNode material : catalogue.path("materials")) {
                stored += loadMaterial(material);
            }
            return stored;
        });
        log.info("Demo library loaded: {} materials, {} samples ({})", catalogue.path("materials").size(), samples,
                catalogue.path("notice").asString(""));
        return samples;
    }

    private JsonNode readCatalogue() {
        try (InputStream in = resource("catalogue.json").getInputStream()) {
            return JsonMapper.builder().build().readTree(in);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + location + "catalogue.json", e);
        }
    }

    private int loadMaterial(JsonNode m) {
        String slug = m.path("slug").asString("");
        NewMaterial material;
        List<SeedSample> samples = new ArrayList<>();
        try {
            material = new NewMaterial(slug, m.path("name").asString(""), MaterialClass.of(m.path("class").asString("")),
                    m.path("description").asString(""), strings(m.path("tags")), Scaling.parse(m.path("scaling").asString("")),
                    RefractiveIndexJson.fromJson(m.get("refractiveIndex")),
                    StatedThicknessesJson.fromJson(m.get("madeThicknesses")));
            for (JsonNode s : m.path("samples")) {
                samples.add(sample(s));
            }
        } catch (IllegalArgumentException e) {
            throw new IllegalStateException("catalogue.json, material '" + slug + "': " + e.getMessage(), e);
        }
        db.transaction(tx -> {
            long id = library.insertMaterial(material);
            for (SeedSample s : samples) {
                long sampleId = library.insertSample(id, s.sample(), s.file());
                s.states().forEach(state -> library.storeStateCurve(sampleId, state));
            }
        });
        return samples.size();
    }

    /**
     * A catalogue sample with the bytes of its curve file, kept like an imported file's, and its curves in other
     * states (docs/material-states.md).
     */
    private record SeedSample(NewSample sample, SourceFile file, List<NewStateCurve> states) {
    }

    private SeedSample sample(JsonNode s) {
        SeedSample own = ownCurve(s);
        List<NewStateCurve> states = new ArrayList<>();
        for (JsonNode st : s.path("states")) {
            states.add(stateCurve(st));
        }
        return new SeedSample(own.sample(), own.file(), states);
    }

    /** A state curve of a catalogue sample, its file read as the sample's is and kept with it. */
    private NewStateCurve stateCurve(JsonNode st) {
        String file = st.path("file").asString("");
        byte[] bytes = bytes(file);
        ParsedSpectrum parsed;
        try {
            parsed = new DelimitedTextReader().read(file, new StringReader(new String(bytes, StandardCharsets.UTF_8)));
        } catch (ImportException e) {
            throw new IllegalArgumentException(e.getMessage(), e);
        }
        double limit = st.path("detectionLimit").asDouble(0);
        try {
            MaterialState state = StateFields.parse(st.path("state").asString(""), text(st, "hours"), text(st, "source"),
                    text(st, "doseJPerCm2"), text(st, "doseNm"), text(st, "inkLoadPercent"), text(st, "statedDensity"));
            String sha256 = Checksums.sha256(bytes);
            return NewStateCurve.fromFile(state, CurveIngest.toCurve(parsed, limit),
                    st.path("thicknessMm").asDouble(Double.NaN), limit, st.path("notes").asString(""),
                    new SourceFile(file, "text/csv", "delimited", bytes, sha256));
        } catch (IllegalArgumentException | ImportRequestException e) {
            throw new IllegalArgumentException("state curve " + file + ": " + e.getMessage(), e);
        }
    }

    private static String text(JsonNode node, String field) {
        JsonNode v = node.get(field);
        return v == null || v.isNull() ? null : v.isNumber() ? v.asString() : v.asString("");
    }

    private SeedSample ownCurve(JsonNode s) {
        String file = s.path("file").asString("");
        byte[] bytes = bytes(file);
        ParsedSpectrum parsed;
        try {
            parsed = new DelimitedTextReader().read(file, new StringReader(new String(bytes, StandardCharsets.UTF_8)));
        } catch (ImportException e) {
            throw new IllegalArgumentException(e.getMessage(), e);
        }
        double limit = s.path("detectionLimit").asDouble(0);
        String sha256 = Checksums.sha256(bytes);
        NewSample sample;
        try {
            sample = new NewSample(s.path("thicknessMm").asDouble(Double.NaN), Geometry.parse(s.path("geometry").asString("")),
                Provenance.parse(s.path("provenance").asString("")), s.path("instrument").asString(""), null,
                s.path("lot").asString(""), s.path("notes").asString(""), limit, CurveIngest.toCurve(parsed, limit),
                file, sha256);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("sample " + file + ": " + e.getMessage(), e);
        }
        return new SeedSample(sample, new SourceFile(file, "text/csv", "delimited", bytes, sha256), List.of());
    }

    private byte[] bytes(String file) {
        try (InputStream in = resource(file).getInputStream()) {
            return in.readAllBytes();
        } catch (IOException e) {
            throw new IllegalArgumentException("cannot read curve file " + location + file, e);
        }
    }

    private Resource resource(String relative) {
        return resources.getResource(location + relative);
    }

    private static List<String> strings(JsonNode array) {
        List<String> list = new ArrayList<>();
        array.forEach(item -> list.add(item.asString()));
        return list;
    }
}
