package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.regex.Pattern;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SampleRescaling;
import org.spectralsieve.requirement.EditDistance;
import org.spectralsieve.requirement.FixedLayer;
import org.spectralsieve.requirement.NominalThickness;

/**
 * Which library material and sample a fixed layer's words ("float glass", "clear-float-glass") name. One
 * deterministic rule, in order:
 * <ol>
 *   <li>a material whose slug equals the words (spaces read as hyphens);</li>
 *   <li>else one whose name equals them, ignoring case and punctuation;</li>
 *   <li>else the materials whose name words or slug words include every one of the words, keeping those
 *       with the fewest extra words (counted on the name or the slug, whichever has fewer). One left: that
 *       material; several: the one whose extra slug words only say "the ordinary kind" ("clear", "plain",
 *       "standard"…), so "float glass" is clear-float-glass rather than weathered-float-glass; if that does
 *       not single one out, ambiguous: the choices are listed and a slug is asked for; none: unknown, the
 *       materials with the most of the words, typing slips allowed, are suggested.</li>
 * </ol>
 * Words are lower-case runs of letters and digits ("Low-E coated float glass" → low, e, coated, float,
 * glass). The sample: among the material's regular-geometry samples (all samples if it has none), a
 * rescalable material's ({@link SampleRescaling}) closest in thickness by ratio (it is rescaled from there),
 * ties to the lower sample id; a fixed, diffuse or scattering material's sample measured at the asked
 * thickness by the one nominal-thickness rule shared with candidates ({@link NominalThickness}: a coated or
 * laminated part is named by its nominal thickness, 4.005 mm is "4 mm"), else the layer is refused, naming the
 * thicknesses measured.
 */
final class LayerMatcher {

    private static final Pattern NOT_WORD = Pattern.compile("[^\\p{L}\\p{N}]+");
    private static final int SUGGESTED = 5;

    /** Words that mark the ordinary, unmodified kind of a stock (common practice, no source). */
    private static final Set<String> PLAIN_QUALIFIERS = Set.of("clear", "plain", "standard", "ordinary", "general");

    /** The resolved material and the sample to use. */
    record Match(Material material, SampleInfo sample) {
    }

    private LayerMatcher() {
    }

    static Match resolve(FixedLayer layer, List<Material> materials) {
        Material material = material(layer.material(), materials);
        return new Match(material, sample(layer, material));
    }

    static Material material(String words, List<Material> materials) {
        String asSlug = words.strip().replace(' ', '-');
        for (Material m : materials) {
            if (m.slug().equalsIgnoreCase(asSlug)) {
                return m;
            }
        }
        List<String> wanted = words(words);
        for (Material m : materials) {
            if (words(m.name()).equals(wanted)) {
                return m;
            }
        }
        Set<String> need = new LinkedHashSet<>(wanted);
        int fewest = Integer.MAX_VALUE;
        List<Material> best = new ArrayList<>();
        for (Material m : materials) {
            int extra = extraWords(need, m);
            if (extra < fewest) {
                fewest = extra;
                best.clear();
            }
            if (extra == fewest && extra != Integer.MAX_VALUE) {
                best.add(m);
            }
        }
        if (best.size() == 1) {
            return best.get(0);
        }
        List<Material> plain = best.stream().filter(m -> onlyPlainQualifiers(need, m)).toList();
        if (plain.size() == 1) {
            return plain.get(0);
        }
        if (best.isEmpty()) {
            List<Material> near = closest(need, materials);
            throw new LayerResolutionException(LayerResolutionException.Reason.UNKNOWN, words,
                    "no library material matches the layer '" + words + "'" + (near.isEmpty() ? ""
                            : "; did you mean " + slugs(near) + "?") + " Write a material's slug or words of its name.",
                    near.stream().map(LayerMatcher::choice).toList());
        }
        best.sort(Comparator.comparing(Material::slug));
        throw new LayerResolutionException(LayerResolutionException.Reason.AMBIGUOUS, words,
                "the layer '" + words + "' matches " + best.size() + " materials equally well: " + slugs(best)
                        + "; write the slug of the one you mean", best.stream().map(LayerMatcher::choice).toList());
    }

    /**
     * Whether the slug's words beyond the needed ones only say "the ordinary kind" ("clear float glass" for
     * "float glass"), so that among equally close materials the unmodified stock is the one meant, not the
     * weathered, tinted or coated variant. The answer names the material used either way.
     */
    private static boolean onlyPlainQualifiers(Set<String> need, Material m) {
        Set<String> extra = new LinkedHashSet<>(Arrays.asList(m.slug().toLowerCase(Locale.ROOT).split("-")));
        extra.removeAll(need);
        return PLAIN_QUALIFIERS.containsAll(extra) && !extra.isEmpty();
    }

    /** Extra words beyond the needed ones, on the name or the slug, whichever has fewer; MAX_VALUE when neither has them all. */
    private static int extraWords(Set<String> need, Material m) {
        int extra = Integer.MAX_VALUE;
        for (List<String> words : List.of(words(m.name()), Arrays.asList(m.slug().toLowerCase(Locale.ROOT).split("-")))) {
            Set<String> have = new LinkedHashSet<>(words);
            if (have.containsAll(need)) {
                extra = Math.min(extra, have.size() - need.size());
            }
        }
        return extra;
    }

    /**
     * Materials whose words come closest: most of the layer's words found among the material's name or slug
     * words, each exactly or within a typing slip (one edit, two for words of seven letters or more, an
     * adjacent swap counting as one); then fewest extra words; then slug.
     */
    private static List<Material> closest(Set<String> need, List<Material> materials) {
        record Scored(Material material, int found, int extra) {
        }
        List<Scored> scored = new ArrayList<>();
        for (Material m : materials) {
            Set<String> have = new LinkedHashSet<>(words(m.name()));
            have.addAll(Arrays.asList(m.slug().toLowerCase(Locale.ROOT).split("-")));
            int found = 0;
            for (String word : need) {
                if (have.stream().anyMatch(w -> close(word, w))) {
                    found++;
                }
            }
            if (found > 0) {
                int extra = Math.min(words(m.name()).size(), m.slug().split("-").length) - found;
                scored.add(new Scored(m, found, extra));
            }
        }
        scored.sort(Comparator.comparingInt((Scored x) -> -x.found()).thenComparingInt(Scored::extra)
                .thenComparing(x -> x.material().slug()));
        return scored.stream().limit(SUGGESTED).map(Scored::material).toList();
    }

    private static boolean close(String written, String word) {
        int allowed = written.length() >= 7 ? 2 : written.length() >= 4 ? 1 : 0;
        return EditDistance.between(written, word, allowed) <= allowed;
    }

    static SampleInfo sample(FixedLayer layer, Material material) {
        List<SampleInfo> regular = material.samples().stream().filter(s -> s.geometry() == Geometry.REGULAR).toList();
        List<SampleInfo> pool = regular.isEmpty() ? material.samples() : regular;
        if (pool.isEmpty()) {
            throw new LayerResolutionException(LayerResolutionException.Reason.THICKNESS, layer.material(),
                    "the layer material " + material.slug() + " has no measured sample", List.of());
        }
        double asked = layer.thicknessMm();
        Comparator<SampleInfo> closest = Comparator.<SampleInfo>comparingDouble(
                s -> Math.abs(Math.log(s.thicknessMm() / asked))).thenComparingLong(SampleInfo::id);
        if (pool.stream().allMatch(s -> SampleRescaling.of(material, s).rescalable())) {
            return pool.stream().min(closest).orElseThrow();
        }
        return pool.stream().filter(s -> NominalThickness.same(s.thicknessMm(), asked)).min(closest)
                .orElseThrow(() -> new LayerResolutionException(LayerResolutionException.Reason.THICKNESS,
                        layer.material(), material.name() + " (" + material.slug() + ") is " + heldAsMeasured(material, pool)
                        + ", and was measured at " + thicknesses(pool) + " mm, not "
                        + plain(asked) + " mm; write one of those thicknesses",
                        pool.stream().map(s -> new LayerResolutionException.Choice(material.slug(), material.name(),
                                plain(s.thicknessMm()) + " mm")).toList()));
    }

    /** "a fixed part, used only as measured", or why a bulk material's samples are held at their measured thickness. */
    private static String heldAsMeasured(Material material, List<SampleInfo> pool) {
        return pool.stream().map(s -> SampleRescaling.of(material, s).reason()).filter(java.util.Objects::nonNull)
                .findFirst().map(reason -> "used only as measured (" + reason + ")")
                .orElse("a fixed part, used only as measured");
    }

    private static LayerResolutionException.Choice choice(Material m) {
        return new LayerResolutionException.Choice(m.slug(), m.name(), m.materialClass().label());
    }

    static List<String> words(String text) {
        List<String> words = new ArrayList<>();
        for (String w : NOT_WORD.split(text.toLowerCase(Locale.ROOT))) {
            if (!w.isEmpty()) {
                words.add(w);
            }
        }
        return words;
    }

    private static String slugs(List<Material> materials) {
        return String.join(", ", materials.stream().map(Material::slug).toList());
    }

    private static String thicknesses(List<SampleInfo> samples) {
        return String.join(", ", samples.stream().map(s -> plain(s.thicknessMm())).distinct().toList());
    }

    private static String plain(double mm) {
        return java.math.BigDecimal.valueOf(mm).stripTrailingZeros().toPlainString();
    }
}
