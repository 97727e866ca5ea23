package org.spectralsieve.spectra;

import java.io.StringReader;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import org.spectralsieve.importers.DelimitedValuesReader;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.SpectrumValues;
import org.spectralsieve.importers.jcamp.JcampReader;
import org.spectralsieve.ingest.Checksums;
import org.spectralsieve.ingest.FileImport;
import org.spectralsieve.ingest.ImportFormat;
import org.spectralsieve.ingest.ImportLimitException;
import org.spectralsieve.ingest.ImportProperties;
import org.spectralsieve.ingest.ImportRequestException;
import org.spectralsieve.ingest.ImportService;
import org.spectralsieve.ingest.IngestException;
import org.spectralsieve.library.FieldException;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.library.StoredText;
import org.spectralsieve.weighting.Emitter;

/**
 * Imports, retires and restores reference spectra (nothing is deleted: docs/undo.md). An import checks the name first (a slug, no built-in name, not
 * taken), then reads the file with the importers, checks that the spectrum can weight anything inside
 * the tool's range, stores it with its file in one transaction and refreshes the lookup, so the next
 * figure can use it. A refused import stores nothing.
 */
public final class SpectrumImportService {

    static final int MAX_TEXT = 4000;

    private final ReferenceSpectrumRepository repository;
    private final ImportedSpectrumLookup lookup;
    private final ImportProperties limits;

    public SpectrumImportService(ReferenceSpectrumRepository repository, ImportedSpectrumLookup lookup,
                                 ImportProperties limits) {
        this.repository = Objects.requireNonNull(repository, "repository");
        this.lookup = Objects.requireNonNull(lookup, "lookup");
        this.limits = Objects.requireNonNull(limits, "limits");
    }

    /**
     * @param description    shown in the listings; blank → the file's {@code # description:}, else none
     * @param provenanceNote where the numbers came from; blank → the file's {@code # source:} or
     *                       {@code # provenance:}, else none
     * @throws ImportException        the file cannot be read (file, line, field)
     * @throws IngestException        it reads but weights nothing inside the tool's range
     * @throws ImportLimitException   over the size or point limits (sieve.imports.*)
     * @throws ImportRequestException a bad, built-in or taken name, or a bad option or text field
     */
    public ImportedSpectrum importSpectrum(SpectrumKind kind, String name, String description, String provenanceNote,
                                           String fileName, byte[] bytes, SpectrumImportOptions options)
            throws ImportException {
        Objects.requireNonNull(kind, "kind");
        String checked = checkName(kind, name);
        String file = ImportService.cleanName(fileName);
        checkSize(file, bytes.length);
        List<String> warnings = new ArrayList<>();
        ImportFormat format = options.format().orElseGet(() -> detect(file, bytes));
        String text = FileImport.decodeText(file, bytes, warnings);
        SpectrumValues values = read(format, file, text, options);
        checkPoints(file, values.size());
        warnings.addAll(values.warnings());
        double[] used = usedRange(kind, values);
        if (kind == SpectrumKind.EMITTER && (used[0] > values.wavelengthsNm()[0]
                || used[1] < values.wavelengthsNm()[values.size() - 1])) {
            warnings.add("stored whole as imported (" + values.wavelengthsNm()[0] + "–"
                    + values.wavelengthsNm()[values.size() - 1] + " nm); an emitter counts only within "
                    + Emitter.TOOL_MIN_NM + "–" + Emitter.TOOL_MAX_NM + " nm, the range this tool evaluates, so "
                    + used[0] + "–" + used[1] + " nm is used");
        }
        NewReferenceSpectrum s;
        try {
            s = new NewReferenceSpectrum(kind, checked,
                    text("description", description, values, "description"),
                    text("provenance", provenanceNote, values, "source", "provenance"), values,
                    new SourceFile(file, format.mediaType(), format.label(), bytes, Checksums.sha256(bytes)));
        } catch (FieldException e) {
            // the request's own texts are checked in text(); what is left came from the file
            throw new IngestException(file, e.field(), e.getMessage());
        }
        ReferenceSpectrum stored;
        try {
            stored = repository.insert(s);
        } catch (SpectrumNameTakenException e) {
            throw taken(kind, checked);
        }
        lookup.refresh();
        return new ImportedSpectrum(stored, used[0], used[1], warnings);
    }

    /**
     * Retires an imported spectrum (even one a built-in of the same name now hides): it leaves the listings
     * and lookups, is kept with its file, and can be restored ({@link #restore}); its name is free for a new
     * import. This is what {@code DELETE} does: no ordinary path deletes a row.
     *
     * @throws ImportRequestException   for a built-in name: those cannot be retired
     * @throws UnknownSpectrumException when no spectrum of the kind in use has the name
     */
    public void delete(SpectrumKind kind, String name) {
        String key = name == null ? "" : name.strip().toLowerCase(Locale.ROOT);
        if (repository.retire(kind, key).isPresent()) {
            lookup.refresh();
            return;
        }
        if (lookup.isBuiltIn(kind, key)) {
            throw new ImportRequestException("name", "'" + key + "' is a built-in " + kind.label()
                    + " and cannot be retired; only imported ones can");
        }
        throw new UnknownSpectrumException(kind, key, "imported " + kind.plural() + ": " + importedNames(kind));
    }

    /**
     * Puts a retired spectrum back in use (the one with {@code id}, or the most recently retired of the name).
     *
     * @throws UnknownSpectrumException no retired spectrum of the kind has the name (and id)
     * @throws ImportRequestException   a spectrum in use has the name now; retire it or import under another
     */
    public ReferenceSpectrum restore(SpectrumKind kind, String name, Long id) {
        String key = name == null ? "" : name.strip().toLowerCase(Locale.ROOT);
        try {
            ReferenceSpectrum restored = repository.restore(kind, key, id).orElseThrow(() -> new UnknownSpectrumException(
                    kind, key, "no retired " + kind.label() + " has this name" + (id == null ? "" : " and id " + id)));
            lookup.refresh();
            return restored;
        } catch (SpectrumNameTakenException e) {
            throw new ImportRequestException("name", "an imported " + kind.label() + " named '" + key
                    + "' is in use; retire it first (DELETE /api/" + kind.plural() + "/" + key + ") to restore this one");
        }
    }

    private String importedNames(SpectrumKind kind) {
        List<String> names = repository.findAll().stream().filter(r -> r.kind() == kind).map(ReferenceSpectrum::name)
                .toList();
        return names.isEmpty() ? "none" : String.join(", ", names);
    }

    private String checkName(SpectrumKind kind, String raw) {
        String name = ImportedNames.check("name", raw);
        if (lookup.isBuiltInName(name)) {
            throw new ImportRequestException("name", "'" + name + "' is the name of a built-in "
                    + (lookup.isBuiltIn(SpectrumKind.EMITTER, name) ? "emitter" : "response")
                    + "; built-in names " + lookup.builtInNames() + " cannot be reused");
        }
        if (repository.find(kind, name).isPresent()) {
            throw taken(kind, name);
        }
        return name;
    }

    private static ImportRequestException taken(SpectrumKind kind, String name) {
        return new ImportRequestException("name", "an imported " + kind.label() + " named '" + name
                + "' already exists; retire it first (DELETE /api/" + kind.plural() + "/" + name
                + ") or choose another name");
    }

    /** JCAMP-DX by extension or a first line starting "##", as for curves; everything else is delimited. */
    static ImportFormat detect(String fileName, byte[] bytes) {
        String name = fileName.toLowerCase(Locale.ROOT);
        if (name.endsWith(".jdx") || name.endsWith(".dx") || name.endsWith(".jcamp")) {
            return ImportFormat.JCAMP_DX;
        }
        int i = 0;
        while (i < bytes.length && (Character.isWhitespace(bytes[i]) || (bytes[i] & 0xff) == 0xef
                || (bytes[i] & 0xff) == 0xbb || (bytes[i] & 0xff) == 0xbf)) {
            i++; // blanks and a UTF-8 byte-order mark
        }
        return i + 1 < bytes.length && bytes[i] == '#' && bytes[i + 1] == '#' ? ImportFormat.JCAMP_DX
                : ImportFormat.DELIMITED;
    }

    private static SpectrumValues read(ImportFormat format, String file, String text, SpectrumImportOptions options)
            throws ImportException {
        try {
            return format == ImportFormat.JCAMP_DX
                    ? new JcampReader().readValues(file, new StringReader(text), options.read())
                    : new DelimitedValuesReader().read(file, new StringReader(text), options.read());
        } catch (IllegalArgumentException e) {
            // the readers check their own results with IllegalArgumentException; for the user it is a bad file
            throw new ImportException(file, 0, null, "cannot be read as " + format.label() + ": " + e.getMessage(), e);
        }
    }

    /**
     * Where the spectrum will count, refusing one that counts nowhere: an emitter with no power between
     * 100 and 1100 nm, or a response with no weight there (every curve and emitter lies inside it).
     */
    private static double[] usedRange(SpectrumKind kind, SpectrumValues v) {
        double[] nm = v.wavelengthsNm();
        double[] y = v.values();
        boolean weights = false;
        for (int i = 1; i < nm.length && !weights; i++) {
            weights = nm[i] >= Emitter.TOOL_MIN_NM && nm[i - 1] <= Emitter.TOOL_MAX_NM && (y[i] > 0 || y[i - 1] > 0);
        }
        if (!weights) {
            throw new IngestException(v.sourceName(), v.valueColumn(), "no " + (kind == SpectrumKind.EMITTER
                    ? "power" : "weight") + " between " + Emitter.TOOL_MIN_NM + " and " + Emitter.TOOL_MAX_NM
                    + " nm, the range this tool evaluates (the file covers " + nm[0] + "–" + nm[nm.length - 1] + " nm)");
        }
        if (kind == SpectrumKind.RESPONSE) {
            return new double[] {nm[0], nm[nm.length - 1]};
        }
        return new double[] {Math.max(nm[0], Emitter.TOOL_MIN_NM), Math.min(nm[nm.length - 1], Emitter.TOOL_MAX_NM)};
    }

    /** The given text, else the first of the file's metadata keys that is present; at most 4000 characters. */
    private static String text(String field, String given, SpectrumValues v, String... metadataKeys) {
        String value = given == null ? "" : given.strip();
        String from = null;
        for (int i = 0; value.isEmpty() && i < metadataKeys.length; i++) {
            value = v.metadata().getOrDefault(metadataKeys[i], "").strip();
            from = metadataKeys[i];
        }
        if (value.length() > MAX_TEXT) {
            throw new ImportRequestException(field, "at most " + MAX_TEXT + " characters, got " + value.length());
        }
        try {
            return StoredText.paragraph(field, value, MAX_TEXT);
        } catch (FieldException e) {
            if (from != null && !value.isEmpty()) {
                throw new IngestException(v.sourceName(), from, e.getMessage());
            }
            throw new ImportRequestException(field, e.getMessage());
        }
    }

    private void checkSize(String file, long size) {
        if (size > limits.maxFileBytes()) {
            throw new ImportLimitException(file, ImportLimitException.Kind.SIZE, "sieve.imports.max-file-bytes",
                    "the file has " + size + " bytes, more than the " + limits.maxFileBytes()
                            + " allowed (sieve.imports.max-file-bytes)");
        }
    }

    private void checkPoints(String file, int points) {
        if (points > limits.maxPoints()) {
            throw new ImportLimitException(file, ImportLimitException.Kind.COUNT, "sieve.imports.max-points",
                    "the spectrum has " + points + " points, more than the " + limits.maxPoints()
                            + " allowed (sieve.imports.max-points); resample it coarser before importing");
        }
    }
}
