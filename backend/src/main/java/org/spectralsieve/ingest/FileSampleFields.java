package org.spectralsieve.ingest;

import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Locale;
import org.spectralsieve.importers.ImportException;
import org.spectralsieve.importers.SampleMetadata;
import org.spectralsieve.library.NewSample;
import org.spectralsieve.library.Scaling;
import org.spectralsieve.optics.PhysicalRanges;

/**
 * The sample fields a user left empty, taken from what the file says about itself ({@link SampleMetadata}:
 * thickness, instrument, date of measurement). A value the user gives wins: the file may describe another
 * cut of the same sheet, and the person importing knows which specimen was measured. Where the two
 * disagree a warning says so, quoting the file, so a wrong form value does not pass unseen.
 */
final class FileSampleFields {

    /** Relative difference below which two thicknesses are the same number written differently (3 and 3.0). */
    private static final double SAME_THICKNESS = 1e-9;

    private FileSampleFields() {
    }

    /**
     * {@code given} with its empty thickness, instrument and date filled from the file; warnings added for
     * disagreements.
     *
     * @throws ImportException when the file's thickness is the one to use but lies outside 1 µm to 1 m
     */
    static SampleFields complete(FilePreview p, SampleFields given, List<String> warnings) throws ImportException {
        SampleMetadata file = SampleMetadata.of(p.metadata());
        Double thickness = given.thicknessMm();
        var fileThickness = file.thickness().filter(SampleMetadata.Thickness::usable);
        if (thickness != null) {
            fileThickness.filter(t -> Math.abs(t.mm() - given.thicknessMm()) > SAME_THICKNESS * t.mm())
                    .ifPresent(t -> warnings.add("thickness " + given.thicknessMm() + " mm as given is stored; the file"
                            + " says " + t.quoted() + " (" + t.mm() + " mm)"));
        } else if (fileThickness.isPresent()) {
            SampleMetadata.Thickness t = fileThickness.get();
            if (!PhysicalRanges.isThicknessMm(t.mm())) {
                throw new ImportException(p.fileName(), 0, t.key(), "the file's thickness " + t.asWritten() + " ("
                        + t.mm() + " mm) must be from " + PhysicalRanges.MIN_THICKNESS_MM + " mm (1 µm) to "
                        + (long) PhysicalRanges.MAX_THICKNESS_MM + " mm; give thicknessMm to override it");
            }
            thickness = t.mm();
        }
        String instrument = given.instrument();
        if (instrument == null) {
            instrument = file.instrument().orElse(null);
        } else if (file.instrument().isPresent() && !sameText(instrument, file.instrument().get())) {
            warnings.add("instrument '" + instrument + "' as given is stored; the file says '"
                    + file.instrument().get() + "'");
        }
        var measuredOn = given.measuredOn();
        if (measuredOn == null && file.date().isPresent() && !plausible(file.date().get())) {
            // a clock that was never set is common on instruments; the curve is still good
            warnings.add("the file's date " + file.dateAsWritten().orElseThrow() + " is not used: a measurement date"
                    + " must lie between " + NewSample.EARLIEST_MEASUREMENT + " and today");
        } else if (measuredOn == null) {
            measuredOn = file.date().orElse(null);
        } else if (file.date().isPresent() && !file.date().get().equals(measuredOn)) {
            warnings.add("date of measurement " + measuredOn + " as given is stored; the file says "
                    + file.dateAsWritten().orElseThrow() + " (" + file.date().get() + ")");
        }
        return new SampleFields(thickness, given.geometry(), given.provenance(), instrument, measuredOn, given.lot(),
                given.notes());
    }

    /**
     * Why a thickness is required when neither the user nor the file gave a usable one; it says what the
     * file does give, so that the message never claims the file has no thickness when it has one.
     */
    static String missingThickness(FilePreview p, Scaling scaling) {
        var unusable = SampleMetadata.of(p.metadata()).thickness();
        String why = scaling == Scaling.BULK
                ? "required for a bulk material: its curve is rescaled from this thickness"
                : "required; for a fixed material it is recorded, never rescaled";
        return unusable.map(t -> why + "; the file gives its thickness as '" + t.quoted() + "', which cannot be used: "
                + t.problem().orElse("unreadable")).orElse(why + " (the file gives no thickness)");
    }

    private static boolean plausible(LocalDate date) {
        return !date.isBefore(NewSample.EARLIEST_MEASUREMENT) && !date.isAfter(LocalDate.now(ZoneOffset.UTC));
    }

    private static boolean sameText(String a, String b) {
        return a.strip().replaceAll("\\s+", " ").toLowerCase(Locale.ROOT)
                .equals(b.strip().replaceAll("\\s+", " ").toLowerCase(Locale.ROOT));
    }
}
