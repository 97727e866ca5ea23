package org.spectralsieve.backup;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * What an archive says about itself ({@value #ENTRY}): its format and version, the schema version of the
 * database it was written from, each table's entry with its row count, columns and SHA-256, and every
 * curve's checksums. A restore trusts nothing in the entries that this does not vouch for.
 */
record ArchiveManifest(String format, int formatVersion, String createdAt, String application, String schemaVersion,
                       String sourceDatabase, List<TableEntry> tables, List<CurveChecksum> curves) {

    static final String ENTRY = "manifest.json";
    static final String FORMAT = "spectral-sieve-library-archive";
    static final int FORMAT_VERSION = 1;

    ArchiveManifest {
        Objects.requireNonNull(format, "format");
        Objects.requireNonNull(schemaVersion, "schemaVersion");
        tables = List.copyOf(tables);
        curves = List.copyOf(curves);
    }

    /** One table's entry: its rows as JSON lines, in primary-key order. */
    record TableEntry(String table, String entry, long rows, String sha256, long bytes, String identity,
                      List<Column> columns) {
        TableEntry {
            columns = List.copyOf(columns);
        }
    }

    record Column(String name, String type) {
    }

    /**
     * A curve's checksums: the one stored with it ({@code source_sha256}, of the file it was imported from)
     * and one of its stored arrays as they are, wavelengths, transmittance, below-detection flags and
     * per-point detection limits (when present) concatenated in that order.
     */
    record CurveChecksum(long sampleId, int points, String sourceSha256, String dataSha256) {
    }

    ObjectNode toJson() {
        ObjectNode root = RowCodec.JSON.createObjectNode();
        root.put("format", format);
        root.put("formatVersion", formatVersion);
        root.put("createdAt", createdAt);
        root.put("application", application);
        root.put("schemaVersion", schemaVersion);
        root.put("sourceDatabase", sourceDatabase);
        ArrayNode tableNodes = root.putArray("tables");
        for (TableEntry t : tables) {
            ObjectNode node = tableNodes.addObject();
            node.put("table", t.table());
            node.put("entry", t.entry());
            node.put("rows", t.rows());
            node.put("sha256", t.sha256());
            node.put("bytes", t.bytes());
            node.put("identity", t.identity());
            ArrayNode columns = node.putArray("columns");
            t.columns().forEach(c -> columns.addObject().put("name", c.name()).put("type", c.type()));
        }
        ArrayNode curveNodes = root.putArray("curves");
        for (CurveChecksum c : curves) {
            curveNodes.addObject().put("sampleId", c.sampleId()).put("points", c.points())
                    .put("sourceSha256", c.sourceSha256()).put("dataSha256", c.dataSha256());
        }
        return root;
    }

    /** @throws IllegalArgumentException saying which field is missing or of the wrong kind */
    static ArchiveManifest fromJson(JsonNode root) {
        if (root == null || !root.isObject()) {
            throw new IllegalArgumentException("the manifest is not a JSON object");
        }
        List<TableEntry> tables = new ArrayList<>();
        for (JsonNode t : array(root, "tables")) {
            List<Column> columns = new ArrayList<>();
            for (JsonNode c : array(t, "columns")) {
                columns.add(new Column(text(c, "name"), text(c, "type")));
            }
            JsonNode identity = t.get("identity");
            tables.add(new TableEntry(text(t, "table"), text(t, "entry"), whole(t, "rows"), text(t, "sha256"),
                    whole(t, "bytes"), identity == null || identity.isNull() ? null : identity.asString(), columns));
        }
        List<CurveChecksum> curves = new ArrayList<>();
        for (JsonNode c : array(root, "curves")) {
            curves.add(new CurveChecksum(whole(c, "sampleId"), Math.toIntExact(whole(c, "points")),
                    text(c, "sourceSha256"), text(c, "dataSha256")));
        }
        return new ArchiveManifest(text(root, "format"), Math.toIntExact(whole(root, "formatVersion")),
                optionalText(root, "createdAt"), optionalText(root, "application"), text(root, "schemaVersion"),
                optionalText(root, "sourceDatabase"), tables, curves);
    }

    private static JsonNode array(JsonNode node, String name) {
        JsonNode value = node.get(name);
        if (value == null || !value.isArray()) {
            throw new IllegalArgumentException("field '" + name + "' must be a list");
        }
        return value;
    }

    private static String text(JsonNode node, String name) {
        JsonNode value = node.get(name);
        if (value == null || !value.isString()) {
            throw new IllegalArgumentException("field '" + name + "' must be text");
        }
        return value.asString();
    }

    private static String optionalText(JsonNode node, String name) {
        JsonNode value = node.get(name);
        return value == null || value.isNull() ? "" : value.asString();
    }

    private static long whole(JsonNode node, String name) {
        JsonNode value = node.get(name);
        if (value == null || !value.isIntegralNumber()) {
            throw new IllegalArgumentException("field '" + name + "' must be a whole number");
        }
        return value.asLong();
    }
}
