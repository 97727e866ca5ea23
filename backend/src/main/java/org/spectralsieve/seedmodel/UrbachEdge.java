package org.spectralsieve.seedmodel;

/**
 * Fundamental absorption edge of a glass or crystal: an Urbach tail, exponential in photon energy,
 * α(E) = α_edge · exp((E − E_edge)/E_U). Why this form: the band-edge tail of glasses is exponential in
 * energy (Urbach's rule), which makes the edge steep and its 50 % point move with thickness as real edges do.
 *
 * @param edgeNm            wavelength where α equals {@code alphaAtEdgePerMm}
 * @param alphaAtEdgePerMm  α at the edge wavelength, 1/mm
 * @param urbachEnergyEv    E_U, the energy over which α changes by a factor e; smaller is steeper
 */
public record UrbachEdge(double edgeNm, double alphaAtEdgePerMm, double urbachEnergyEv) implements AbsorptionPart {

    public UrbachEdge {
        AbsorptionPart.requirePositive("edgeNm", edgeNm);
        AbsorptionPart.requirePositive("alphaAtEdgePerMm", alphaAtEdgePerMm);
        AbsorptionPart.requirePositive("urbachEnergyEv", urbachEnergyEv);
    }

    @Override
    public double alphaPerMm(double nm) {
        double exponent = (AbsorptionPart.photonEnergyEv(nm) - AbsorptionPart.photonEnergyEv(edgeNm)) / urbachEnergyEv;
        return Math.min(ALPHA_CAP_PER_MM, alphaAtEdgePerMm * Math.exp(Math.min(exponent, 50)));
    }
}
