package org.spectralsieve.ingest;

import java.util.Objects;
import org.spectralsieve.importers.jcamp.BlockOutline;

/**
 * One spectrum of a JCAMP-DX file as the preview lists it, so that a person can choose a block or import
 * each one as its own sample.
 *
 * @param number  the block number the {@code block} option takes and the blocks warning shows (a LINK file's
 *                outer block, which holds no data, is 0, so its spectra are 1, 2, …)
 * @param fromNm  the shortest wavelength in nm; null when the file's x unit is unknown
 * @param toNm    the longest wavelength in nm; null as {@code fromNm}
 * @param xUnits  the file's {@code ##XUNITS=} as written
 * @param yUnits  the file's {@code ##YUNITS=} as written
 * @param taken   true when the import with the same options would store this block
 * @param problem why this block cannot be read as a transmittance curve; null when it can
 */
public record FileBlock(int number, String title, int points, Double fromNm, Double toNm, String xUnits,
                        String yUnits, boolean taken, String problem) {

    public FileBlock {
        Objects.requireNonNull(title, "title");
        Objects.requireNonNull(xUnits, "xUnits");
        Objects.requireNonNull(yUnits, "yUnits");
    }

    static FileBlock of(BlockOutline o, boolean taken, String problem) {
        return new FileBlock(o.number(), o.title(), o.points(), o.hasRange() ? o.fromNm() : null,
                o.hasRange() ? o.toNm() : null, o.xUnits(), o.yUnits(), taken, problem);
    }

    public boolean readable() {
        return problem == null;
    }

    /** "block 3 'title'", as warnings and sample notes name a block. */
    public String label() {
        return "block " + number + (title.isBlank() ? " (untitled)" : " '" + title + "'");
    }
}
