package org.spectralsieve.weighting;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * Ultraviolet bands, nm, in two conventions (reference sheet §10). The same label means different
 * wavelengths in each, so figures name the numeric band ({@link #rangeText()}), never the label alone.
 */
public enum UvBand {
    /** CIE / ISO 21348: 100-280 nm (IUPAC Gold Book "ultraviolet"; EU Directive 2006/25/EC Art. 2). */
    UVC(Convention.CIE, "UVC", 100, 280),
    UVB(Convention.CIE, "UVB", 280, 315),
    UVA(Convention.CIE, "UVA", 315, 400),
    /**
     * Dermatology and sunscreen practice: 290/320 nm as the splits. Its UVC starts at 200 or 220 nm
     * depending on the text; 200 is taken, and like the CIE UVC it is averaged over the part a curve covers.
     */
    DERMATOLOGY_UVC(Convention.DERMATOLOGY, "UVC", 200, 290),
    DERMATOLOGY_UVB(Convention.DERMATOLOGY, "UVB", 290, 320),
    DERMATOLOGY_UVA(Convention.DERMATOLOGY, "UVA", 320, 400);

    /** Which set of band edges. */
    public enum Convention {
        /** UVC 100-280, UVB 280-315, UVA 315-400 nm (CIE / ISO 21348). */
        CIE,
        /** UVC (200)-290, UVB 290-320, UVA 320-400 nm (dermatology, sunscreen, older US practice). */
        DERMATOLOGY;

        /** The lower-case name used in URLs: "cie", "dermatology". */
        public String key() {
            return name().toLowerCase(Locale.ROOT);
        }

        /** UVC, UVB, UVA in this convention. */
        public List<UvBand> bands() {
            return Arrays.stream(UvBand.values()).filter(b -> b.convention == this).toList();
        }

        /** E.g. "cie: UVC 100-280 nm, UVB 280-315 nm, UVA 315-400 nm". */
        public String description() {
            return key() + ": " + String.join(", ", bands().stream().map(UvBand::rangeText).toList());
        }

        /** Looks a convention up by {@link #key()}, ignoring case and surrounding blanks. */
        public static Optional<Convention> named(String name) {
            String key = name == null ? "" : name.strip().toLowerCase(Locale.ROOT);
            return Arrays.stream(values()).filter(c -> c.key().equals(key)).findFirst();
        }
    }

    private final Convention convention;
    private final String label;
    private final double fromNm;
    private final double toNm;

    UvBand(Convention convention, String label, double fromNm, double toNm) {
        this.convention = convention;
        this.label = label;
        this.fromNm = fromNm;
        this.toNm = toNm;
    }

    public Convention convention() {
        return convention;
    }

    /** "UVA", "UVB" or "UVC". */
    public String label() {
        return label;
    }

    public double fromNm() {
        return fromNm;
    }

    public double toNm() {
        return toNm;
    }

    /**
     * The lower end of UVC lies below where curves start (and differs between texts), so UVC is averaged
     * over the part a curve covers; UVB and UVA need the whole band.
     */
    public boolean averagedOverCoveredPart() {
        return label.equals("UVC");
    }

    /** E.g. "290-320 nm". */
    public String wavelengthText() {
        return number(fromNm) + "-" + number(toNm) + " nm";
    }

    /** E.g. "UVB 290-320 nm". */
    public String rangeText() {
        return label + " " + wavelengthText();
    }

    private static String number(double nm) {
        return nm == Math.rint(nm) ? String.valueOf((long) nm) : String.valueOf(nm);
    }
}
