package org.spectralsieve.seedmodel;

import java.util.List;

/**
 * A material's absorption coefficient as a sum of named parts, α(λ) = Σ αᵢ(λ) in 1/mm.
 *
 * @param parts the contributions; at least one
 */
public record Absorption(List<AbsorptionPart> parts) {

    public Absorption {
        parts = List.copyOf(parts);
        if (parts.isEmpty()) {
            throw new IllegalArgumentException("an absorption model needs at least one part");
        }
    }

    public static Absorption of(AbsorptionPart... parts) {
        return new Absorption(List.of(parts));
    }

    public double alphaPerMm(double nm) {
        double sum = 0;
        for (AbsorptionPart part : parts) {
            sum += part.alphaPerMm(nm);
        }
        return sum;
    }

    /** Internal transmittance K = exp(−α·d) of a layer {@code thicknessMm} thick. */
    public double internalTransmittance(double nm, double thicknessMm) {
        return Math.exp(-alphaPerMm(nm) * thicknessMm);
    }
}
