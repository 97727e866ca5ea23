package org.spectralsieve.optics;

/** Real refractive index n(λ) of a material in air, λ in nm. */
public sealed interface RefractiveIndex permits ConstantIndex, SellmeierIndex, TabulatedIndex, UnusableIndex {

    double at(double wavelengthNm);
}
