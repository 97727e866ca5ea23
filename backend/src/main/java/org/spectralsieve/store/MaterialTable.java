package org.spectralsieve.store;

import java.util.Arrays;
import java.util.List;
import org.spectralsieve.requirement.MadeThicknesses;

/**
 * The store's materials in flat arrays: material m's curves are {@code curves[start[m]] .. curves[start[m + 1] − 1]}
 * in curve order, and {@code made[m]} is its made thicknesses.
 *
 * <p>Why: at a million curves a search over a thickness range works out the spans of the ~30k curves its screens
 * keep, material by material, and the walk to each material's curve array and to its {@link StoredMaterial}
 * (two objects scattered over the heap) was most of that work (JFR profile, docs/store-scan.md). Here the
 * curves of a material lie next to those of its neighbours, and the made thicknesses are one array read (the
 * same object the material holds). About 4 bytes per curve and 8 per material, once per store.
 */
record MaterialTable(int[] start, int[] curves, MadeThicknesses[] made) {

    static MaterialTable of(int[] materialOfCurve, int size, List<StoredMaterial> materials) {
        int count = materials.size();
        int[] start = new int[count + 1];
        for (int c = 0; c < size; c++) {
            start[materialOfCurve[c] + 1]++;
        }
        for (int m = 0; m < count; m++) {
            start[m + 1] += start[m];
        }
        int[] filled = Arrays.copyOf(start, count);
        int[] curves = new int[size];
        for (int c = 0; c < size; c++) {
            curves[filled[materialOfCurve[c]]++] = c;
        }
        MadeThicknesses[] made = new MadeThicknesses[count];
        for (int m = 0; m < count; m++) {
            made[m] = materials.get(m).made();
        }
        return new MaterialTable(start, curves, made);
    }
}
