package org.spectralsieve.backup;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.function.UnaryOperator;
import java.util.zip.ZipEntry;
import java.util.zip.ZipFile;
import java.util.zip.ZipOutputStream;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.ObjectNode;

/** Test archives made from a good one: an entry altered, with or without the manifest brought in line. */
final class Archives {

    private Archives() {
    }

    static Map<String, byte[]> read(Path archive) throws IOException {
        Map<String, byte[]> entries = new LinkedHashMap<>();
        try (ZipFile zip = new ZipFile(archive.toFile())) {
            for (ZipEntry e : zip.stream().toList()) {
                try (InputStream in = zip.getInputStream(e)) {
                    entries.put(e.getName(), in.readAllBytes());
                }
            }
        }
        return entries;
    }

    static void write(Map<String, byte[]> entries, Path archive) throws IOException {
        try (OutputStream file = Files.newOutputStream(archive); ZipOutputStream zip = new ZipOutputStream(file)) {
            for (Map.Entry<String, byte[]> e : entries.entrySet()) {
                zip.putNextEntry(new ZipEntry(e.getKey()));
                zip.write(e.getValue());
                zip.closeEntry();
            }
        }
    }

    static JsonNode manifest(Map<String, byte[]> entries) {
        return RowCodec.JSON.readTree(entries.get(ArchiveManifest.ENTRY));
    }

    /** The name of the entry holding a table's rows. */
    static String entryOf(Map<String, byte[]> entries, String table) {
        for (JsonNode t : manifest(entries).path("tables")) {
            if (t.path("table").asString().equals(table)) {
                return t.path("entry").asString();
            }
        }
        throw new IllegalArgumentException("no table " + table);
    }

    /**
     * A copy of {@code good} with {@code table}'s entry rewritten by {@code edit}; when {@code vouch}, the
     * manifest's SHA-256 and size of that entry are recomputed, as a forger (or a bug) would leave them.
     */
    static Path altered(Path good, Path out, String table, UnaryOperator<String> edit, boolean vouch) throws IOException {
        Map<String, byte[]> entries = read(good);
        String name = entryOf(entries, table);
        byte[] changed = edit.apply(new String(entries.get(name), StandardCharsets.UTF_8)).getBytes(StandardCharsets.UTF_8);
        entries.put(name, changed);
        if (vouch) {
            ObjectNode manifest = (ObjectNode) manifest(entries);
            for (JsonNode t : manifest.path("tables")) {
                if (t.path("entry").asString().equals(name)) {
                    ((ObjectNode) t).put("sha256", HexFormat.of().formatHex(TableRows.sha256().digest(changed)));
                    ((ObjectNode) t).put("bytes", changed.length);
                }
            }
            entries.put(ArchiveManifest.ENTRY, RowCodec.JSON.writeValueAsBytes(manifest));
        }
        write(entries, out);
        return out;
    }
}
