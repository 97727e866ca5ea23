package org.spectralsieve.seedmodel;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SortedMap;
import java.util.TreeMap;
import org.spectralsieve.importers.DelimitedTextWriter;
import tools.jackson.databind.SerializationFeature;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * Writes the demo library — {@code catalogue.json} and {@code curves/*.csv} — deterministically, so the
 * committed files can be checked against a fresh rendering byte for byte.
 *
 * <p>Run: {@code java -cp <classpath> org.spectralsieve.seedmodel.DemoLibraryWriter [folder]}, folder
 * defaulting to {@code seed-materials}; see seed-materials/README.md for the full command.
 */
public final class DemoLibraryWriter {

    public static final String CATALOGUE_FILE = "catalogue.json";

    private static final JsonMapper JSON = JsonMapper.builder().enable(SerializationFeature.INDENT_OUTPUT).build();

    private DemoLibraryWriter() {
    }

    public static void main(String[] args) throws IOException {
        Path folder = Path.of(args.length > 0 ? args[0] : "seed-materials");
        Map<String, String> files = render();
        writeTo(folder, files);
        System.out.println("wrote " + files.size() + " files to " + folder.toAbsolutePath().normalize());
    }

    /** Every file of the library, relative path → content, in path order. */
    public static SortedMap<String, String> render() {
        SortedMap<String, String> files = new TreeMap<>();
        ObjectNode root = JSON.createObjectNode();
        root.put("scenario", DemoCatalogue.SCENARIO);
        root.put("notice", DemoCatalogue.NOTICE);
        ArrayNode materials = root.putArray("materials");
        for (MaterialSpec material : DemoCatalogue.materials()) {
            materials.add(materialNode(material));
            for (SampleSpec sample : material.samples()) {
                files.put(material.curveFile(sample), curveFile(material, sample));
                for (StateSpec state : DemoCatalogue.statesOf(material, sample)) {
                    files.put(state.curveFile(material, sample), stateCurveFile(material, state));
                }
            }
        }
        files.put(CATALOGUE_FILE, JSON.writeValueAsString(root) + "\n");
        return files;
    }

    /** Writes the files, replacing older curve files so the folder holds exactly the rendered library. */
    public static void writeTo(Path folder, Map<String, String> files) throws IOException {
        Path curves = folder.resolve("curves");
        Files.createDirectories(curves);
        try (var old = Files.list(curves)) {
            for (Path p : old.filter(p -> p.toString().endsWith(".csv")).toList()) {
                Files.delete(p);
            }
        }
        for (Map.Entry<String, String> e : files.entrySet()) {
            Files.writeString(folder.resolve(e.getKey()), e.getValue(), StandardCharsets.UTF_8);
        }
    }

    static String curveFile(MaterialSpec material, SampleSpec sample) {
        ModelledCurve curve = SampleModeller.model(material.index(), sample);
        Map<String, String> meta = new LinkedHashMap<>();
        meta.put("material", material.slug());
        meta.put("thickness_mm", sample.thicknessLabel());
        meta.put("geometry", sample.geometry().label());
        meta.put("provenance", "modelled");
        meta.put("instrument", DemoCatalogue.INSTRUMENT);
        meta.put("lot", sample.lot());
        meta.put("detection_limit", Double.toString(sample.detectionLimit()));
        meta.put("note", DemoCatalogue.NOTICE);
        return DelimitedTextWriter.write(meta, curve.wavelengthsNm(), curve.transmittances(), curve.upperBounds());
    }

    /** A state curve's file: as a sample's, its metadata naming the state as well. */
    static String stateCurveFile(MaterialSpec material, StateSpec state) {
        SampleSpec modelled = state.modelled();
        ModelledCurve curve = SampleModeller.model(material.index(), modelled);
        Map<String, String> meta = new LinkedHashMap<>();
        meta.put("material", material.slug());
        meta.put("thickness_mm", modelled.thicknessLabel());
        meta.put("state", state.state());
        if (state.hours() != null) {
            meta.put("exposure_hours", plain(state.hours()));
            meta.put("exposure_source", state.source());
        }
        if (state.inkLoadPercent() != null) {
            meta.put("ink_load_percent", plain(state.inkLoadPercent()));
        }
        if (state.statedDensity() != null) {
            meta.put("stated_density", plain(state.statedDensity()));
        }
        meta.put("geometry", modelled.geometry().label());
        meta.put("provenance", "modelled");
        meta.put("instrument", DemoCatalogue.INSTRUMENT);
        meta.put("lot", modelled.lot());
        meta.put("detection_limit", Double.toString(modelled.detectionLimit()));
        meta.put("note", DemoCatalogue.NOTICE);
        return DelimitedTextWriter.write(meta, curve.wavelengthsNm(), curve.transmittances(), curve.upperBounds());
    }

    private static String plain(double v) {
        return java.math.BigDecimal.valueOf(v).stripTrailingZeros().toPlainString();
    }

    /** {"unit": "um", "stock": [25, 50], "range": [25, 125]}: the shape StatedThicknessesJson reads. */
    private static ObjectNode madeNode(MadeIn made) {
        ObjectNode node = JSON.createObjectNode();
        node.put("unit", made.unit());
        ArrayNode stock = node.putArray("stock");
        made.stock().forEach(stock::add);
        if (made.range() != null) {
            ArrayNode range = node.putArray("range");
            range.add(made.range()[0]);
            range.add(made.range()[1]);
        }
        return node;
    }

    private static ObjectNode materialNode(MaterialSpec m) {
        ObjectNode node = JSON.createObjectNode();
        node.put("slug", m.slug());
        node.put("name", m.name());
        node.put("class", m.materialClass().label());
        node.put("description", m.description());
        ArrayNode tags = node.putArray("tags");
        m.tags().forEach(tags::add);
        node.put("scaling", m.scaling().label());
        node.set("refractiveIndex", indexNode(m.index()));
        MadeIn.of(m.slug()).ifPresent(made -> node.set("madeThicknesses", madeNode(made)));
        ArrayNode samples = node.putArray("samples");
        for (SampleSpec s : m.samples()) {
            ObjectNode sample = samples.addObject();
            sample.put("file", m.curveFile(s));
            sample.put("thicknessMm", s.thicknessMm());
            sample.put("geometry", s.geometry().label());
            sample.put("provenance", "modelled");
            sample.put("instrument", DemoCatalogue.INSTRUMENT);
            sample.put("lot", s.lot());
            sample.put("notes", DemoCatalogue.NOTICE);
            sample.put("detectionLimit", s.detectionLimit());
            List<StateSpec> states = DemoCatalogue.statesOf(m, s);
            if (!states.isEmpty()) {
                ArrayNode list = sample.putArray("states");
                for (StateSpec st : states) {
                    ObjectNode entry = list.addObject();
                    entry.put("file", st.curveFile(m, s));
                    entry.put("state", st.state());
                    if (st.hours() != null) {
                        entry.put("hours", st.hours());
                        entry.put("source", st.source());
                    }
                    if (st.inkLoadPercent() != null) {
                        entry.put("inkLoadPercent", st.inkLoadPercent());
                    }
                    if (st.statedDensity() != null) {
                        entry.put("statedDensity", st.statedDensity());
                    }
                    entry.put("thicknessMm", st.modelled().thicknessMm());
                    entry.put("detectionLimit", st.modelled().detectionLimit());
                    entry.put("notes", DemoCatalogue.NOTICE + "; " + st.why());
                }
            }
        }
        return node;
    }

    private static ObjectNode indexNode(IndexSpec index) {
        ObjectNode node = JSON.createObjectNode();
        if (index instanceof IndexSpec.Constant c) {
            node.put("kind", "constant");
            node.put("n", c.n());
        } else if (index instanceof IndexSpec.Sellmeier s) {
            node.put("kind", "sellmeier");
            ArrayNode b = node.putArray("b");
            s.index().b().forEach(b::add);
            ArrayNode c = node.putArray("c");
            s.index().cMicronsSquared().forEach(c::add);
            node.put("validFromNm", s.index().validFromNm());
            node.put("validToNm", s.index().validToNm());
        } else if (index instanceof IndexSpec.Table t) {
            node.put("kind", "table");
            ArrayNode nm = node.putArray("wavelengthsNm");
            t.wavelengthsNm().forEach(nm::add);
            ArrayNode n = node.putArray("n");
            t.n().forEach(n::add);
        }
        return node;
    }
}
