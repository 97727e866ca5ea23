package org.spectralsieve.ingest;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import java.util.zip.ZipEntry;
import java.util.zip.ZipException;
import java.util.zip.ZipInputStream;
import org.spectralsieve.importers.ImportException;

/**
 * The files of a batch: a folder on disk or a zip held in memory. Names are relative, '/'-separated
 * and never leave the upload: a zip entry or manifest row with {@code ..}, an absolute path or a drive
 * letter is refused (a zip naming such an entry is refused whole, as it was made to write elsewhere).
 */
abstract class BatchSource {

    static final String MANIFEST = "manifest.csv";
    private static final Pattern DRIVE = Pattern.compile("^[A-Za-z]:.*");

    final String name;

    BatchSource(String name) {
        this.name = name;
    }

    /** The bytes of a file named in the manifest; refusals name the file and the reason. */
    abstract byte[] read(String relative) throws ImportException;

    /** Every file but the manifest, relative to the manifest's folder. */
    abstract List<String> files();

    abstract byte[] manifest() throws ImportException;

    /** Null when the name is safe, else why not. */
    static String unsafe(String entry) {
        String n = entry.replace('\\', '/');
        if (n.startsWith("/") || DRIVE.matcher(n).matches()) {
            return "an absolute path";
        }
        for (String segment : n.split("/")) {
            if (segment.equals("..")) {
                return "a '..' segment that leads outside the upload";
            }
        }
        if (n.indexOf('\0') >= 0) {
            return "a NUL character";
        }
        return null;
    }

    static String normalise(String entry) {
        List<String> parts = new ArrayList<>();
        for (String segment : entry.replace('\\', '/').split("/")) {
            if (!segment.isEmpty() && !segment.equals(".")) {
                parts.add(segment);
            }
        }
        return String.join("/", parts);
    }

    /** A zip read whole into memory, within the entry count, per-file and total size limits. */
    static final class Zip extends BatchSource {
        private final Map<String, byte[]> entries = new LinkedHashMap<>();
        private final Map<String, Long> oversize = new LinkedHashMap<>();
        private final long maxFileBytes;
        private String base = "";

        Zip(String name, byte[] zip, ImportProperties limits) throws ImportException {
            super(name);
            this.maxFileBytes = limits.maxFileBytes();
            long total = 0;
            int count = 0;
            try (ZipInputStream in = new ZipInputStream(new ByteArrayInputStream(zip))) {
                for (ZipEntry e = in.getNextEntry(); e != null; e = in.getNextEntry()) {
                    if (++count > limits.maxZipEntries()) {
                        throw new ImportLimitException(name, ImportLimitException.Kind.COUNT, "sieve.imports.max-zip-entries",
                                "the zip has more than " + limits.maxZipEntries()
                                        + " entries (sieve.imports.max-zip-entries); split the batch");
                    }
                    String why = unsafe(e.getName());
                    if (why != null) {
                        throw new ImportLimitException(name, ImportLimitException.Kind.PATH, null, "entry '" + e.getName()
                                + "' has " + why + "; a batch zip may only hold paths inside itself, nothing was imported");
                    }
                    if (e.isDirectory()) {
                        continue;
                    }
                    // the declared size may lie (zip bombs), so the limit is enforced on the bytes actually read
                    byte[] bytes = readCapped(in, maxFileBytes);
                    String entryName = normalise(e.getName());
                    if (bytes == null) {
                        oversize.put(entryName, maxFileBytes);
                        total += maxFileBytes;
                    } else {
                        entries.put(entryName, bytes);
                        total += bytes.length;
                    }
                    if (total > limits.maxZipBytes()) {
                        throw new ImportLimitException(name, ImportLimitException.Kind.SIZE, "sieve.imports.max-zip-bytes",
                                "the zip unpacks to more than " + limits.maxZipBytes()
                                        + " bytes (sieve.imports.max-zip-bytes); split the batch");
                    }
                }
            } catch (ZipException e) {
                throw ImportException.ofSource(name, "not a readable zip archive: " + e.getMessage());
            } catch (IOException e) {
                throw ImportException.ofSource(name, "cannot read the zip archive: " + e.getMessage());
            }
            if (count == 0) {
                throw ImportException.ofSource(name, "not a zip archive, or an empty one (no entries found)");
            }
            findManifest();
        }

        /** manifest.csv at the top, or inside the one folder everything sits in (a zipped folder). */
        private void findManifest() throws ImportException {
            if (entries.containsKey(MANIFEST)) {
                return;
            }
            List<String> found = entries.keySet().stream()
                    .filter(k -> k.toLowerCase(Locale.ROOT).endsWith("/" + MANIFEST) && k.indexOf('/') == k.length() - MANIFEST.length() - 1)
                    .toList();
            if (found.size() != 1) {
                throw ImportException.ofSource(name, "no " + MANIFEST + " at the top of the zip (or inside its single folder);"
                        + " it lists file,material,thickness,… one row per file");
            }
            base = found.get(0).substring(0, found.get(0).length() - MANIFEST.length());
        }

        private static byte[] readCapped(InputStream in, long cap) throws IOException {
            ByteArrayOutputStream out = new ByteArrayOutputStream();
            byte[] buffer = new byte[1 << 16];
            long total = 0;
            for (int n = in.read(buffer); n >= 0; n = in.read(buffer)) {
                total += n;
                if (total > cap) {
                    return null;
                }
                out.write(buffer, 0, n);
            }
            return out.toByteArray();
        }

        @Override
        byte[] manifest() {
            return entries.get(base + MANIFEST);
        }

        @Override
        byte[] read(String relative) throws ImportException {
            String why = unsafe(relative);
            if (why != null) {
                throw ImportException.ofSource(relative, "the manifest names a path with " + why);
            }
            String key = base + normalise(relative);
            if (oversize.containsKey(key)) {
                throw new ImportLimitException(relative, ImportLimitException.Kind.SIZE, "sieve.imports.max-file-bytes",
                        "more than " + maxFileBytes + " bytes (sieve.imports.max-file-bytes)");
            }
            byte[] bytes = entries.get(key);
            if (bytes == null) {
                throw ImportException.ofSource(relative, "not in the zip (the manifest names it, the archive does not hold it)");
            }
            return bytes;
        }

        @Override
        List<String> files() {
            List<String> out = new ArrayList<>();
            for (String k : entries.keySet()) {
                if (k.startsWith(base) && !k.equals(base + MANIFEST)) {
                    out.add(k.substring(base.length()));
                }
            }
            out.addAll(oversize.keySet().stream().filter(k -> k.startsWith(base)).map(k -> k.substring(base.length())).toList());
            return out;
        }
    }

    /** A folder on disk; files are read when their row comes, never from outside the folder. */
    static final class Folder extends BatchSource {
        private final Path root;
        private final long maxFileBytes;

        Folder(Path folder, ImportProperties limits) throws ImportException {
            super(String.valueOf(folder.getFileName()));
            try {
                this.root = folder.toRealPath();
            } catch (IOException e) {
                throw ImportException.ofSource(String.valueOf(folder), "cannot open the folder: " + e.getMessage());
            }
            this.maxFileBytes = limits.maxFileBytes();
            if (!Files.isRegularFile(root.resolve(MANIFEST))) {
                throw ImportException.ofSource(name, "no " + MANIFEST + " in the folder; it lists file,material,thickness,…"
                        + " one row per file");
            }
        }

        @Override
        byte[] manifest() throws ImportException {
            return read(MANIFEST);
        }

        @Override
        byte[] read(String relative) throws ImportException {
            String why = unsafe(relative);
            if (why != null) {
                throw ImportException.ofSource(relative, "the manifest names a path with " + why);
            }
            Path file = root.resolve(normalise(relative));
            try {
                if (!Files.isRegularFile(file)) {
                    throw ImportException.ofSource(relative, "not in the folder (the manifest names it, the folder does not hold it)");
                }
                // a symbolic link could still point elsewhere: compare where it really is
                if (!file.toRealPath().startsWith(root)) {
                    throw ImportException.ofSource(relative, "is a link to a file outside the folder; not read");
                }
                long size = Files.size(file);
                if (size > maxFileBytes) {
                    throw new ImportLimitException(relative, ImportLimitException.Kind.SIZE, "sieve.imports.max-file-bytes",
                            size + " bytes, more than the " + maxFileBytes + " allowed (sieve.imports.max-file-bytes)");
                }
                return Files.readAllBytes(file);
            } catch (IOException e) {
                throw ImportException.ofSource(relative, "cannot read: " + e.getMessage());
            }
        }

        @Override
        List<String> files() {
            try (Stream<Path> all = Files.walk(root)) {
                return all.filter(p -> Files.isRegularFile(p, LinkOption.NOFOLLOW_LINKS))
                        .map(p -> root.relativize(p).toString().replace('\\', '/'))
                        .filter(n -> !n.equals(MANIFEST)).sorted().toList();
            } catch (IOException e) {
                return List.of();
            }
        }
    }
}
