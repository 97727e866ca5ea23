package org.spectralsieve.ingest;

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
import java.util.zip.ZipFile;
import java.util.Enumeration;
import org.spectralsieve.importers.ImportException;

/**
 * The files of a batch: a folder on disk or a zip held in memory. Names are relative, '/'-separated
 * and never leave the upload: a zip entry or manifest row with {@code ..}, an absolute path or a drive
 * letter is refused (a zip naming such an entry is refused whole, as it was made to write elsewhere).
 */
abstract class BatchSource implements AutoCloseable {

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

    /** Releases what the source holds open (a zip file, a temporary copy of an upload). */
    @Override
    public void close() {
    }

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

    /**
     * A zip, opened by its central directory: names, declared sizes and compressed sizes are checked before
     * a single byte is inflated, and an entry is inflated only when its manifest row comes, so a batch holds
     * at most one file in memory at a time. Refused whole, before inflating anything: more entries than
     * allowed, a path leaving the upload, a declared total beyond the per-request limit, or an entry whose
     * declared compression ratio is beyond {@code sieve.imports.max-zip-ratio} (no spectrum file compresses
     * like that; a zip bomb does). While inflating, an entry that holds more than it declared, or more than
     * its compressed size times the ratio, stops there and refuses the zip.
     */
    static final class Zip extends BatchSource {
        /** Entries smaller than this are not judged by ratio: a short file of zeros compresses far, and costs nothing. */
        static final long RATIO_FLOOR_BYTES = 64 * 1024;

        private final Map<String, ZipEntry> entries = new LinkedHashMap<>();
        private final Map<String, Long> oversize = new LinkedHashMap<>();
        private final ImportProperties limits;
        private final ZipFile zip;
        private final Path temporary;
        private long inflated;
        private String base = "";

        /** A zip received in memory: written to a temporary file so that its central directory can be read. */
        static Zip of(String name, byte[] bytes, ImportProperties limits) throws ImportException {
            Path file;
            try {
                file = Files.createTempFile("sieve-batch-", ".zip");
                Files.write(file, bytes);
            } catch (IOException e) {
                throw ImportException.ofSource(name, "cannot hold the upload for reading: " + e.getMessage());
            }
            try {
                return new Zip(name, file, true, limits);
            } catch (ImportException | RuntimeException e) {
                deleteQuietly(file);
                throw e;
            }
        }

        static Zip open(String name, Path file, ImportProperties limits) throws ImportException {
            return new Zip(name, file, false, limits);
        }

        private Zip(String name, Path file, boolean temporary, ImportProperties limits) throws ImportException {
            super(name);
            this.limits = limits;
            this.temporary = temporary ? file : null;
            try {
                this.zip = new ZipFile(file.toFile());
            } catch (ZipException e) {
                throw ImportException.ofSource(name, "not a readable zip archive: " + e.getMessage());
            } catch (IOException e) {
                throw ImportException.ofSource(name, "cannot read the zip archive: " + e.getMessage());
            }
            try {
                readDirectory();
                findManifest();
            } catch (ImportException | RuntimeException e) {
                close();
                throw e;
            }
        }

        private void readDirectory() throws ImportException {
            long declaredTotal = 0;
            int count = 0;
            Enumeration<? extends ZipEntry> all = zip.entries();
            while (all.hasMoreElements()) {
                ZipEntry e = all.nextElement();
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
                checkRatio(e.getName(), e.getSize(), e.getCompressedSize());
                String entryName = normalise(e.getName());
                long size = e.getSize() < 0 ? limits.maxFileBytes() : e.getSize();
                if (size > limits.maxFileBytes()) {
                    oversize.put(entryName, size);
                    continue;
                }
                entries.put(entryName, e);
                declaredTotal += size;
                if (declaredTotal > limits.maxZipBytes()) {
                    throw new ImportLimitException(name, ImportLimitException.Kind.SIZE, "sieve.imports.max-zip-bytes",
                            "the zip unpacks to more than " + limits.maxZipBytes()
                                    + " bytes (sieve.imports.max-zip-bytes); split the batch");
                }
            }
            if (count == 0) {
                throw ImportException.ofSource(name, "not a zip archive, or an empty one (no entries found)");
            }
        }

        private void checkRatio(String entry, long size, long compressed) {
            if (size > RATIO_FLOOR_BYTES && size > compressed * (double) limits.maxZipRatio()) {
                throw new ImportLimitException(name, ImportLimitException.Kind.RATIO, "sieve.imports.max-zip-ratio",
                        "entry '" + entry + "' would inflate " + compressed + " bytes to " + size + " (more than "
                                + limits.maxZipRatio() + " times; sieve.imports.max-zip-ratio), as only an archive made"
                                + " to exhaust the server does; nothing was imported");
            }
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

        /**
         * Inflates one entry, stopping at the first byte beyond what it declared, beyond its compressed size
         * times the allowed ratio, or beyond what the request may still inflate in total.
         */
        private byte[] inflate(String entryName, ZipEntry e) throws ImportException {
            long declared = e.getSize() < 0 ? limits.maxFileBytes() : e.getSize();
            long byRatio = Math.max(RATIO_FLOOR_BYTES, e.getCompressedSize() < 0 ? Long.MAX_VALUE
                    : e.getCompressedSize() * (long) limits.maxZipRatio());
            long cap = Math.min(declared, byRatio);
            ByteArrayOutputStream out = new ByteArrayOutputStream((int) Math.min(declared, 1 << 20));
            byte[] buffer = new byte[1 << 16];
            long total = 0;
            try (InputStream in = zip.getInputStream(e)) {
                for (int n = in.read(buffer); n >= 0; n = in.read(buffer)) {
                    total += n;
                    if (total > cap) {
                        throw new ImportLimitException(name, ImportLimitException.Kind.RATIO, "sieve.imports.max-zip-ratio",
                                "entry '" + entryName + "' holds more than it declares (" + declared + " bytes) or inflates"
                                        + " beyond " + limits.maxZipRatio() + " times its compressed size; reading stopped");
                    }
                    if (inflated + total > limits.maxZipBytes()) {
                        throw new ImportLimitException(name, ImportLimitException.Kind.SIZE, "sieve.imports.max-zip-bytes",
                                "the zip unpacks to more than " + limits.maxZipBytes()
                                        + " bytes (sieve.imports.max-zip-bytes); split the batch");
                    }
                    out.write(buffer, 0, n);
                }
            } catch (ZipException ex) {
                throw ImportException.ofSource(entryName, "cannot be inflated from the zip: " + ex.getMessage());
            } catch (IOException ex) {
                throw ImportException.ofSource(entryName, "cannot be read from the zip: " + ex.getMessage());
            }
            inflated += total;
            return out.toByteArray();
        }

        @Override
        byte[] manifest() throws ImportException {
            return inflate(base + MANIFEST, entries.get(base + MANIFEST));
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
                        "more than " + limits.maxFileBytes() + " bytes (sieve.imports.max-file-bytes)");
            }
            ZipEntry entry = entries.get(key);
            if (entry == null || key.equals(base + MANIFEST)) {
                throw ImportException.ofSource(relative, "not in the zip (the manifest names it, the archive does not hold it)");
            }
            return inflate(key, entry);
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

        @Override
        public void close() {
            try {
                zip.close();
            } catch (IOException e) {
                // read-only; nothing was written through it
            }
            if (temporary != null) {
                deleteQuietly(temporary);
            }
        }

        private static void deleteQuietly(Path file) {
            try {
                Files.deleteIfExists(file);
            } catch (IOException e) {
                file.toFile().deleteOnExit();
            }
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
