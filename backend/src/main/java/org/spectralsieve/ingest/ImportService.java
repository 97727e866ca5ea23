package org.spectralsieve.ingest;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.library.FieldException;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.NewMaterial;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.library.Provenance;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.library.SourceFile;
import org.spectralsieve.library.StoredBlocks;
import org.spectralsieve.library.StoredImport;
import org.spectralsieve.optics.ConstantIndex;
import org.spectralsieve.optics.PhysicalRanges;
import org.spectralsieve.optics.RefractiveIndex;

/**
 * Previews and stores single files. A store writes the material (when new), the sample, its curve and
 * the original bytes in one transaction, so a refused or failed import leaves nothing behind; a file
 * already stored for the same material and thickness (same SHA-256) is recognised and not stored again.
 * After every commit the search store is dropped so that searches see the new curve.
 */
public final class ImportService {

    /** Assumed when a new material comes without an index: typical of glasses and plastics (common practice, no source). */
    public static final double DEFAULT_INDEX = 1.5;

    static final int MAX_INSTRUMENT = NewSample.MAX_INSTRUMENT;
    static final int MAX_LOT = NewSample.MAX_LOT;
    static final int MAX_NOTES = NewSample.MAX_NOTES;

    private static final String THICKNESS_RANGE = "must be a thickness from " + PhysicalRanges.MIN_THICKNESS_MM
            + " mm (1 µm) to " + (long) PhysicalRanges.MAX_THICKNESS_MM + " mm";

    private final JooqLibraryRepository library;
    private final Runnable afterCommit;
    private final ImportProperties limits;
    private final FileImport reader;

    /** @param afterCommit run after each committed import (the search service's refresh) */
    public ImportService(JooqLibraryRepository library, Runnable afterCommit, ImportProperties limits) {
        this.library = Objects.requireNonNull(library, "library");
        this.afterCommit = Objects.requireNonNull(afterCommit, "afterCommit");
        this.limits = Objects.requireNonNull(limits, "limits");
        this.reader = new FileImport(limits.maxPoints());
    }

    public ImportProperties limits() {
        return limits;
    }

    /** Reads the file as {@link #store} would, without storing anything. */
    public FilePreview preview(String fileName, byte[] bytes, ImportOptions options) throws ImportException {
        String name = cleanName(fileName);
        checkSize(name, bytes.length);
        return reader.read(name, bytes, options);
    }

    /**
     * @throws ImportException        the file cannot be read (file, line, field)
     * @throws IngestException        it reads but cannot be a curve
     * @throws ImportLimitException   beyond a configured limit
     * @throws ImportRequestException a sample or material field is missing or wrong
     * @throws NotFoundException      the existing material does not exist
     */
    public ImportResult store(String fileName, byte[] bytes, ImportOptions options, ImportTarget target,
                              SampleFields fields) throws ImportException {
        Objects.requireNonNull(target, "target");
        Objects.requireNonNull(fields, "fields");
        if (options.eachBlock()) {
            String name = cleanName(fileName);
            checkSize(name, bytes.length);
            return storeBlocks(reader.readEachBlock(name, bytes, options), bytes, target, fields);
        }
        FilePreview preview = preview(fileName, bytes, options);
        if (preview.blocks().size() > 1) {
            // the blocks of one file share its checksum: only the block path tells them apart
            return storeBlocks(List.of(preview), bytes, target, fields);
        }
        List<String> warnings = new ArrayList<>(preview.warnings());
        Destination to = destination(target, warnings);
        Long existingId = to.existingId();
        NewMaterial newMaterial = to.newMaterial();
        Scaling scaling = to.scaling();
        NewSample sample = sample(preview, fields, scaling, warnings);
        SourceFile source = new SourceFile(preview.fileName(), preview.format().mediaType(), preview.format().label(), bytes,
                preview.sha256());
        StoredImport stored = library.storeImport(existingId, newMaterial, sample, source);
        if (stored.duplicate()) {
            warnings.add("this file (SHA-256 " + preview.sha256().substring(0, 12) + "…) is already stored for this"
                    + " material at " + sample.thicknessMm() + " mm as sample " + stored.sampleId() + "; nothing was added");
        } else {
            afterCommit.run();
        }
        return new ImportResult(stored.materialId(), stored.materialSlug(), stored.newMaterial(),
                library.findSample(stored.sampleId()).orElseThrow(), stored.duplicate(), preview, warnings);
    }

    /** The material an import goes to: an existing one (its id) or a new one to create, and its scaling. */
    private record Destination(Long existingId, NewMaterial newMaterial, Scaling scaling) {
    }

    private Destination destination(ImportTarget target, List<String> warnings) {
        if (target instanceof ImportTarget.ExistingMaterial e) {
            // only its scaling is needed here: the material's samples are not read (an import's cost does not grow with them)
            Material m = library.findMaterialWithoutSamples(e.materialId())
                    .orElseThrow(() -> new NotFoundException("material", e.materialId()));
            return new Destination(m.id(), null, m.scaling());
        }
        ImportTarget.NewMaterial n = (ImportTarget.NewMaterial) target;
        // a second material of the same name is almost always a re-import aimed at the wrong target
        library.findMaterialIdByName(n.name()).ifPresent(id -> {
            throw new ImportRequestException("materialName", "a material named '" + n.name()
                    + "' already exists (id " + id + "); store under it with materialId=" + id + " or choose another name");
        });
        return new Destination(null, newMaterial(n, warnings), n.scaling());
    }

    /**
     * Stores curves read from the blocks of one JCAMP-DX file (one chosen block, or each block), each as its
     * own sample of the same material, in one transaction. When the file holds several spectra each
     * sample's notes start with its block number and title, so that the samples can be told apart.
     */
    private ImportResult storeBlocks(List<FilePreview> previews, byte[] bytes, ImportTarget target, SampleFields fields)
            throws ImportException {
        List<String> warnings = new ArrayList<>();
        Destination to = destination(target, warnings);
        List<NewSample> samples = new ArrayList<>();
        List<List<String>> perBlock = new ArrayList<>();
        for (FilePreview p : previews) {
            List<String> w = new ArrayList<>(p.warnings());
            samples.add(sample(p, BlockNotes.withBlockNote(fields, p), to.scaling(), w));
            perBlock.add(w);
        }
        warnings.addAll(0, BlockNotes.mergeWarnings(previews, perBlock));
        FilePreview first = previews.get(0);
        SourceFile source = new SourceFile(first.fileName(), first.format().mediaType(), first.format().label(), bytes,
                first.sha256());
        StoredBlocks stored = library.storeBlocks(to.existingId(), to.newMaterial(), samples, source);
        List<ImportResult.BlockSample> blocks = new ArrayList<>();
        for (int i = 0; i < previews.size(); i++) {
            FilePreview p = previews.get(i);
            StoredBlocks.Stored s = stored.samples().get(i);
            FileBlock b = p.block().orElseThrow(() -> new IllegalStateException("a block preview without its block"));
            if (s.duplicate()) {
                warnings.add(b.label() + " of this file (SHA-256 " + p.sha256().substring(0, 12) + "…) is already stored"
                        + " for this material at " + samples.get(i).thicknessMm() + " mm as sample " + s.sampleId()
                        + "; it was not added again");
            }
            blocks.add(new ImportResult.BlockSample(b.number(), b.title(),
                    library.findSample(s.sampleId()).orElseThrow(), s.duplicate(), p.pointCount()));
        }
        if (!stored.allDuplicates()) {
            afterCommit.run();
        }
        return new ImportResult(stored.materialId(), stored.materialSlug(), stored.newMaterial(), blocks.get(0).sample(),
                stored.allDuplicates(), first, warnings, blocks);
    }

    private static NewMaterial newMaterial(ImportTarget.NewMaterial n, List<String> warnings) {
        RefractiveIndex index = n.refractiveIndex();
        if (index == null) {
            index = new ConstantIndex(DEFAULT_INDEX);
            warnings.add("no refractive index given for '" + n.name() + "': a constant n = " + DEFAULT_INDEX
                    + " is assumed (typical of glasses and plastics); it only sets the surface reflection used when"
                    + " rescaling to another thickness");
        }
        try {
            return new NewMaterial(JooqLibraryRepository.slugFor(n.name()), n.name(), n.materialClass(), n.description(),
                    List.of(), n.scaling(), index, n.thicknesses());
        } catch (FieldException e) {
            throw new ImportRequestException(e.field().equals("name") ? "materialName" : e.field(), e.getMessage());
        } catch (IllegalArgumentException e) {
            throw new ImportRequestException("materialName", e.getMessage());
        }
    }

    private static NewSample sample(FilePreview p, SampleFields given, Scaling scaling, List<String> warnings)
            throws ImportException {
        SampleFields f = FileSampleFields.complete(p, given, warnings);
        double thickness = thickness(p, f, given.thicknessMm() == null, scaling);
        String instrument = f.instrument() != null ? f.instrument() : "";
        Provenance provenance = f.provenance() != null ? f.provenance() : p.provenance();
        if (p.format() == ImportFormat.DATASHEET_POINTS && provenance != Provenance.DATASHEET) {
            warnings.add("points read off a datasheet graph stored with provenance '" + provenance.label() + "' as asked");
        }
        try {
            return new NewSample(thickness, f.geometry() == null ? Geometry.REGULAR : f.geometry(), provenance,
                    limited("instrument", instrument, MAX_INSTRUMENT), f.measuredOn(), limited("lot", f.lot(), MAX_LOT),
                    limited("notes", f.notes(), MAX_NOTES), p.detectionLimit(), p.curve(), p.fileName(), p.sha256());
        } catch (FieldException e) {
            // what the file says is the file's fault (named with the file); what the request says, the request's
            boolean fromFile = e.field().equals("wavelength") || e.field().equals("detectionLimit")
                    || e.field().equals("instrument") && given.instrument() == null
                    || e.field().equals("measuredOn") && given.measuredOn() == null;
            if (fromFile) {
                throw new IngestException(p.fileName(), e.field(), e.getMessage());
            }
            throw new ImportRequestException(e.field(), e.getMessage());
        }
    }

    /** The given thickness, else the file's (already filled in by {@link FileSampleFields}), else refused. */
    private static double thickness(FilePreview p, SampleFields f, boolean fromFile, Scaling scaling) {
        if (f.thicknessMm() == null) {
            throw new ImportRequestException("thicknessMm", FileSampleFields.missingThickness(p, scaling));
        }
        double t = f.thicknessMm();
        if (!fromFile && !PhysicalRanges.isThicknessMm(t)) {
            throw new ImportRequestException("thicknessMm", THICKNESS_RANGE + ", got " + t);
        }
        return t;
    }

    private static String limited(String field, String value, int max) {
        if (value != null && value.length() > max) {
            throw new ImportRequestException(field, "at most " + max + " characters, got " + value.length());
        }
        return value;
    }

    private void checkSize(String name, long size) {
        if (size > limits.maxFileBytes()) {
            throw new ImportLimitException(name, ImportLimitException.Kind.SIZE, "sieve.imports.max-file-bytes",
                    "the file has " + size + " bytes, more than the " + limits.maxFileBytes()
                            + " allowed (sieve.imports.max-file-bytes)");
        }
    }

    /** The last path segment of an upload name, as browsers on some systems send the whole path. */
    public static String cleanName(String fileName) {
        String name = fileName == null ? "" : fileName.strip();
        name = name.substring(Math.max(name.lastIndexOf('/'), name.lastIndexOf('\\')) + 1);
        // control and bidirectional control characters could disguise the name where it is shown
        name = name.replaceAll("[\\p{Cntrl}\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]", "");
        if (name.isEmpty()) {
            name = "upload";
        }
        return name.length() > SourceFile.MAX_NAME ? name.substring(name.length() - SourceFile.MAX_NAME) : name;
    }
}
