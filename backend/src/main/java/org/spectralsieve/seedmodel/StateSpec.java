package org.spectralsieve.seedmodel;

import java.math.BigDecimal;
import java.util.Objects;
import java.util.regex.Pattern;

/**
 * A modelled curve of one demo sample in another state than as supplied (docs/material-states.md): aged after
 * {@code hours} under {@code source}, or printed black at {@code inkLoadPercent} and/or {@code statedDensity}. The
 * sample's own curve stays its as-supplied state (new, or a film's clear base); this is an extra curve of the same
 * piece, modelled with the absorption the state adds.
 *
 * @param materialSlug      the demo material whose sample it belongs to
 * @param sampleThicknessMm which of its samples (by its modelled thickness)
 * @param fileTag           what the curve file's name adds after the sample's ({@code aged-2000h})
 * @param state             {@code aged} or {@code printed}
 * @param hours             aged: hours under {@code source}; null otherwise
 * @param inkLoadPercent    printed: ink load in %, or null
 * @param statedDensity     printed: the density the print is stated at, or null
 * @param modelled          the piece in that state, layer by layer
 * @param why               what the state's model changes and the trade reasoning behind it
 */
public record StateSpec(String materialSlug, double sampleThicknessMm, String fileTag, String state, Double hours,
                        String source, Double inkLoadPercent, Double statedDensity, SampleSpec modelled, String why) {

    private static final Pattern TAG = Pattern.compile("[a-z0-9]+(-[a-z0-9]+)*");

    public StateSpec {
        Objects.requireNonNull(materialSlug, "materialSlug");
        if (fileTag == null || !TAG.matcher(fileTag).matches()) {
            throw new IllegalArgumentException("fileTag must be lower-case words joined by '-', was '" + fileTag + "'");
        }
        if (state.equals("aged") == (hours == null) || state.equals("printed") == (inkLoadPercent == null && statedDensity == null)
                || !(state.equals("aged") || state.equals("printed"))) {
            throw new IllegalArgumentException("state " + state + " of " + materialSlug + ": an aged curve states hours,"
                    + " a printed one its ink load or density");
        }
    }

    static StateSpec aged(String slug, double sampleMm, double hours, String source, SampleSpec modelled, String why) {
        return new StateSpec(slug, sampleMm, "aged-" + BigDecimal.valueOf(hours).stripTrailingZeros().toPlainString()
                + "h", "aged", hours, source, null, null, modelled, why);
    }

    static StateSpec printed(String slug, double sampleMm, double inkLoadPercent, Double statedDensity,
                             SampleSpec modelled, String why) {
        return new StateSpec(slug, sampleMm, "printed-" + BigDecimal.valueOf(inkLoadPercent).stripTrailingZeros()
                .toPlainString() + "pc", "printed", null, null, inkLoadPercent, statedDensity, modelled, why);
    }

    /** Relative path of the state's curve file: the sample's, with the tag before ".csv". */
    public String curveFile(MaterialSpec material, SampleSpec sample) {
        String own = material.curveFile(sample);
        return own.substring(0, own.length() - ".csv".length()) + "-" + fileTag + ".csv";
    }
}
