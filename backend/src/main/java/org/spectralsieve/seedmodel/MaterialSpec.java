package org.spectralsieve.seedmodel;

import java.util.List;
import java.util.regex.Pattern;

/**
 * One stock material of the demo catalogue, with the samples modelled for it.
 *
 * @param slug        lower-case identifier, also the file-name stem of its curves
 * @param name        invented stock name
 * @param materialClass one of the catalogue classes
 * @param description what the stock is and what the model gives it
 * @param tags        search tags
 * @param scaling     bulk (rescalable by thickness) or fixed (a construction)
 * @param index       refractive-index model, used for the Fresnel surfaces
 * @param samples     one to three samples
 */
public record MaterialSpec(String slug, String name, MaterialClass materialClass, String description,
                           List<String> tags, Scaling scaling, IndexSpec index, List<SampleSpec> samples) {

    private static final Pattern SLUG = Pattern.compile("[a-z0-9]+(-[a-z0-9]+)*");

    public MaterialSpec {
        tags = List.copyOf(tags);
        samples = List.copyOf(samples);
        if (slug == null || !SLUG.matcher(slug).matches()) {
            throw new IllegalArgumentException("slug must be lower-case words joined by '-', was '" + slug + "'");
        }
        if (samples.isEmpty() || samples.size() > 3) {
            throw new IllegalArgumentException("material " + slug + " needs 1–3 samples, has " + samples.size());
        }
        if (name == null || name.isBlank() || description == null || description.isBlank()) {
            throw new IllegalArgumentException("material " + slug + " needs a name and a description");
        }
    }

    /** Relative path of a sample's curve file inside the seed folder. */
    public String curveFile(SampleSpec sample) {
        return "curves/" + slug + "-" + sample.thicknessLabel() + "mm.csv";
    }
}
